"""stocktank.material_balance (see the module docs of the Rust crate for formulas and references)."""

from typing import List

__all__: List[str] = []

"""Relative permeability: Corey (1954) / Brooks–Corey (1964) curves.

Saturations are fractions of pore volume. See :class:`CoreyOilWater` and :class:`CoreyGasOil`.
"""

from ._core import CoreyGasOil, CoreyOilWater

__all__ = ["CoreyOilWater", "CoreyGasOil"]

"""Pickle support for the compiled classes: rebuild an object from its keyword arguments."""

from typing import Any, Dict


def rebuild(cls: Any, kwargs: Dict[str, Any]) -> Any:
    """Call ``cls(**kwargs)``; the target of every compiled class's ``__reduce__``."""
    return cls(**kwargs)

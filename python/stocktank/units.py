"""Units: conversions between field and metric units, and unit systems for whole functions.

Every factor is derived in the Rust core from exact definitions (NIST SP 811, 2008; the
2019 SI): 1 ft = 0.3048 m, 1 acre = 43,560 ft2, 1 bbl = 42 US gal, 1 lbm = 0.45359237 kg,
1 psi = 1 lbf/in2, 1 atm = 101.325 kPa, degR = degF + 459.67, K = degC + 273.15.

>>> from stocktank.units import convert
>>> round(convert(1.0, "acre-ft", "bbl"), 2)
7758.37

Standard volumes convert geometrically (1 sm3 = 35.3147 scf), as the trade does; to move a
gas volume between base conditions use :func:`rebase_gas_volume`. Gauge units (psig, barg,
kPag) are relative to one standard atmosphere.

Metric inputs and outputs for whole functions
---------------------------------------------
A :class:`UnitSystem` maps each *role* (what a number means, e.g. ``"oil_volume"`` or
``"pressure"``) to a unit. Field units are the library's own; :data:`METRIC` is the SPE
metric choice (kPa, degC, m, m2, sm3, rm3/sm3, sm3/sm3, kg/m3, mPa.s, 1/kPa). Functions
declared in the table of :mod:`stocktank.metric` are wrapped so that every declared argument
is converted from the system's unit to the field unit before the call and every declared
result back after it: ``stocktank.metric.ooip(...)`` takes m2 and m and returns sm3. Build
your own namespace with ``UnitSystem(area="km2", oil_volume="e6m3").namespace()``.
"""

import functools
import inspect
import math
import types
from typing import Any, Callable, Dict, Mapping, Optional, Tuple, Union

from ._core import ALL_UNITS, InvalidOptionError, convert_units, rebase_gas_volume, unit_factor, unit_quantity

__all__ = [
    "convert",
    "unit_factor",
    "unit_quantity",
    "rebase_gas_volume",
    "UNITS",
    "FIELD",
    "METRIC",
    "UnitSystem",
]

#: Every unit name known to :func:`convert`.
UNITS: Tuple[str, ...] = tuple(ALL_UNITS.split(", "))


def convert(value: Any, from_unit: str, to_unit: str) -> Any:
    """Convert ``value`` (scalar or array-like) from ``from_unit`` to ``to_unit``.

    Both units must measure the same quantity (see :data:`UNITS`); NaN stays NaN. Returns a
    float for a scalar, a float64 ndarray otherwise.
    """
    return convert_units(value, from_unit, to_unit)


#: Field unit of each role (the library's own units).
FIELD: Dict[str, str] = {
    "pressure": "psia",
    "temperature": "degF",
    "absolute_temperature": "degR",
    "length": "ft",
    "area": "acre",
    "rock_volume": "acre-ft",
    "oil_volume": "STB",
    "gas_volume": "scf",
    "reservoir_volume": "rb",
    "oil_fvf": "rb/STB",
    "gas_fvf": "rcf/scf",
    "gas_oil_ratio": "scf/STB",
    "density": "lbm/ft3",
    "viscosity": "cp",
    "compressibility": "1/psi",
    "permeability": "md",
}

#: SPE metric units of each role.
METRIC: Dict[str, str] = {
    "pressure": "kPa",
    "temperature": "degC",
    "absolute_temperature": "K",
    "length": "m",
    "area": "m2",
    "rock_volume": "m3",
    "oil_volume": "sm3",
    "gas_volume": "sm3",
    "reservoir_volume": "rm3",
    "oil_fvf": "rm3/sm3",
    "gas_fvf": "rm3/sm3",
    "gas_oil_ratio": "sm3/sm3",
    "density": "kg/m3",
    "viscosity": "mPa.s",
    "compressibility": "1/kPa",
    "permeability": "md",
}

#: A role, or (role, name of the argument in the wrapped signature).
ArgSpec = Union[str, Tuple[str, str]]


class UnitSystem:
    """A choice of unit per role; starts from :data:`METRIC` unless ``base`` is given.

    >>> UnitSystem(area="km2").units["area"]
    'km2'
    """

    def __init__(self, base: Optional[Mapping[str, str]] = None, **units: str) -> None:
        chosen = dict(METRIC if base is None else base)
        for role, unit in units.items():
            if role not in FIELD:
                raise ValueError(f"unknown role `{role}`; expected one of: {', '.join(FIELD)}")
            chosen[role] = unit
        for role, unit in chosen.items():
            try:
                unit_factor(unit, FIELD[role])
            except InvalidOptionError as e:
                # unit_factor's message names its own `from_unit`; name the role instead.
                raise InvalidOptionError(f"invalid unit for role `{role}`: {e}") from e
        self.units: Dict[str, str] = chosen

    def __repr__(self) -> str:
        return f"UnitSystem({self.units!r})"

    def to_field(self, value: Any, role: str) -> Any:
        """Convert ``value`` from this system's unit of ``role`` to the field unit."""
        return _convert_any(value, self.units[role], FIELD[role])

    def from_field(self, value: Any, role: str) -> Any:
        """Convert ``value`` from the field unit of ``role`` to this system's unit."""
        return _convert_any(value, FIELD[role], self.units[role])

    def wrap(self, func: Callable[..., Any], args: Mapping[str, ArgSpec], returns: Any = None) -> Callable[..., Any]:
        """Wrap ``func`` (field units) so that it takes and returns this system's units.

        ``args`` maps a field argument name to its role, or to ``(role, new_name)`` to rename
        an argument whose name carries a field unit (e.g. ``temperature_f``). ``returns`` is a
        role, a tuple of roles (one per returned element, ``None`` for unitless) or ``None``.
        """
        return _wrap(self, func, args, returns)

    def wrap_class(self, cls: Any, init: Mapping[str, ArgSpec], methods: Mapping[str, Tuple[Mapping[str, ArgSpec], Any]], properties: Mapping[str, str]) -> Any:
        """A proxy class of ``cls`` whose constructor, listed methods and listed properties use
        this system's units; the field-unit object is its ``field`` attribute and every other
        attribute is passed through unchanged."""
        system = self
        make = self.wrap(cls, init, None)

        class Proxy:
            __doc__ = f"{cls.__name__} in units {system.units}; the field-unit object is ``.field``.\n\n{cls.__doc__ or ''}"

            def __init__(self, *a: Any, **kw: Any) -> None:
                self.field = make(*a, **kw)

            def __repr__(self) -> str:
                return f"{type(self).__name__}[{', '.join(f'{r}={u}' for r, u in system.units.items() if r in used)}]({self.field!r})"

            def __eq__(self, other: object) -> bool:
                return isinstance(other, Proxy) and self.field == other.field

            def __getattr__(self, name: str) -> Any:
                return getattr(self.__dict__["field"], name)

        used = set(r if isinstance(r, str) else r[0] for r in init.values()) | set(properties.values())
        for name, (args, returns) in methods.items():
            w = self.wrap(getattr(cls, name), args, returns)

            def method(self: Any, *a: Any, _w: Any = w, **kw: Any) -> Any:
                return _w(self.field, *a, **kw)

            method.__name__ = name
            method.__doc__ = w.__doc__
            setattr(Proxy, name, method)
        for name, role in properties.items():
            setattr(Proxy, name, property(lambda self, _n=name, _r=role: system.from_field(getattr(self.field, _n), _r)))
        Proxy.__name__ = Proxy.__qualname__ = cls.__name__
        return Proxy

    def namespace(self) -> types.SimpleNamespace:
        """Every function of the table of :mod:`stocktank.metric`, wrapped for this system."""
        from .metric import _build

        return _build(self)


def _convert_any(value: Any, from_unit: str, to_unit: str) -> Any:
    if value is None or from_unit == to_unit:
        return value
    if hasattr(value, "params") and hasattr(value, "kind"):  # a Distribution
        s, o = unit_factor(from_unit, to_unit)
        return _scale_distribution(value, s, o)
    return convert_units(value, from_unit, to_unit)


def _scale_distribution(d: Any, s: float, o: float) -> Any:
    """The distribution of ``x * s + o`` (s > 0) for ``x`` distributed as ``d``."""
    from ._core import Distribution

    if o != 0.0 and d.kind == "lognormal":
        raise ValueError("a lognormal distribution cannot be converted between units with an offset")
    p = dict(d.params())
    if d.kind == "lognormal":
        p["mu"] = p["mu"] + math.log(s)
        for k in ("low", "high"):
            if k in p:
                p[k] = p[k] * s
    else:
        for k in ("value", "low", "mode", "high", "mean"):
            if k in p:
                p[k] = p[k] * s + o
        if "sd" in p:
            p["sd"] = p["sd"] * s
    return Distribution(d.kind, **p)


def _wrap(system: UnitSystem, func: Callable[..., Any], args: Mapping[str, ArgSpec], returns: Any) -> Callable[..., Any]:
    sig = inspect.signature(func)
    roles: Dict[str, str] = {}
    rename: Dict[str, str] = {}  # new name -> field name
    params = []
    for p in sig.parameters.values():
        spec = args.get(p.name)
        name = p.name
        if isinstance(spec, tuple):
            roles[p.name], name = spec
        elif spec is not None:
            roles[p.name] = spec
        rename[name] = p.name
        params.append(p.replace(name=name))
    unknown = set(args) - set(sig.parameters)
    if unknown:
        raise TypeError(f"{func.__name__} has no argument(s) {sorted(unknown)}")
    new_sig = sig.replace(parameters=params)

    def convert_out(out: Any) -> Any:
        if returns is None:
            return out
        if isinstance(returns, tuple):
            return tuple(o if r is None else system.from_field(o, r) for o, r in zip(out, returns))
        return system.from_field(out, returns)

    @functools.wraps(func)
    def wrapper(*a: Any, **kw: Any) -> Any:
        bound = new_sig.bind(*a, **kw)
        pos: list = []
        call: Dict[str, Any] = {}
        for name, value in bound.arguments.items():
            field = rename[name]
            role = roles.get(field)
            value = system.to_field(value, role) if role else value
            if sig.parameters[field].kind is inspect.Parameter.POSITIONAL_ONLY:
                pos.append(value)
            else:
                call[field] = value
        return convert_out(func(*pos, **call))

    lines = []
    for field, role in roles.items():
        new = next(n for n, f in rename.items() if f == field)
        lines.append(f"    {new}: {system.units[role]}  (field: {field} in {FIELD[role]})")
    if returns is not None:
        rs = returns if isinstance(returns, tuple) else (returns,)
        lines.append("    returns: " + ", ".join("unitless" if r is None else system.units[r] for r in rs))
    wrapper.__doc__ = (
        f"{func.__name__} in units {system.units}.\n\nConverted arguments and results:\n"
        + "\n".join(lines)
        + "\n\nField-unit documentation:\n\n"
        + (func.__doc__ or "")
    )
    wrapper.__signature__ = new_sig  # type: ignore[attr-defined]
    wrapper.__wrapped__ = func  # type: ignore[attr-defined]
    return wrapper

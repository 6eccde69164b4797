"""The library in SPE metric units: same functions, metric inputs and outputs.

>>> import stocktank
>>> n_sm3 = stocktank.metric.ooip(2.59e6, 15.24, 1.0, 0.2, 0.25, 1.2)   # m2, m, -, -, -, rm3/sm3

Units (see :data:`stocktank.units.METRIC`): pressure kPa, temperature degC (absolute
temperatures such as Tpc in K), length m, area m2,
rock volume m3, oil and gas volumes sm3, FVFs rm3/sm3, GOR sm3/sm3, density kg/m3, viscosity
mPa.s, compressibility 1/kPa, permeability md. Fractions stay fractions.

How it works: :data:`TABLE` declares, per function, which argument and which result is which
quantity (a *role*); each function here is generated from its line in the table, converting
declared inputs to field units, calling the field-unit function, and converting the declared
results back. Another unit choice: ``stocktank.units.UnitSystem(area="km2").namespace()``.
Adding a function is one line in :data:`TABLE`. Description classes (``Gas``, ``Oil``, ``Water``) get a proxy
whose constructor and methods use metric units (:data:`CLASSES`): ``stocktank.metric.Gas(0.7)
.z(p=20000.0, t=90.0)`` with kPa and degC; the field-unit object is ``.field``. Not yet
converted: pseudo-pressure, Eg and Bg in rb/Mscf (use ``.field`` and :func:`stocktank.units
.convert`). Results are screening estimates.
"""

import types
from typing import Any, Dict, List, Mapping, Tuple

from . import gas as _gas
from . import oil as _oil
from . import volumetrics as _vol
from . import water as _water
from .units import METRIC, ArgSpec, UnitSystem

#: function name -> (field-unit function, {argument: role or (role, metric name)}, result role(s)).
TABLE: Dict[str, Tuple[Any, Mapping[str, ArgSpec], Any]] = {
    # volumetrics
    "ooip": (_vol.ooip, {"area": "area", "thickness": "length", "boi": "oil_fvf"}, "oil_volume"),
    "ogip": (_vol.ogip, {"area": "area", "thickness": "length", "bgi": "gas_fvf"}, "gas_volume"),
    "ooip_from_rock_volume": (_vol.ooip_from_rock_volume, {"gross_rock_volume": "rock_volume", "boi": "oil_fvf"}, "oil_volume"),
    "ogip_from_rock_volume": (_vol.ogip_from_rock_volume, {"gross_rock_volume": "rock_volume", "bgi": "gas_fvf"}, "gas_volume"),
    "ooip_layers": (_vol.ooip_layers, {"area": "area", "thickness": "length", "boi": "oil_fvf"}, ("oil_volume", "oil_volume")),
    "ogip_layers": (_vol.ogip_layers, {"area": "area", "thickness": "length", "bgi": "gas_fvf"}, ("gas_volume", "gas_volume")),
    "dissolved_gas_in_place": (_vol.dissolved_gas_in_place, {"ooip": "oil_volume", "rsi": "gas_oil_ratio"}, "gas_volume"),
    "gas_cap_ratio": (_vol.gas_cap_ratio, {"gas_cap_gas": "gas_volume", "bgi": "gas_fvf", "ooip": "oil_volume", "boi": "oil_fvf"}, None),
    "arps_solution_gas_drive": (_vol.arps_solution_gas_drive, {"bob": "oil_fvf", "k_md": ("permeability", "k"), "mu_ob": "viscosity", "pb": "pressure", "pa": "pressure"}, None),
    "arps_water_drive": (_vol.arps_water_drive, {"boi": "oil_fvf", "k_md": ("permeability", "k"), "mu_wi": "viscosity", "mu_oi": "viscosity", "pi": "pressure", "pa": "pressure"}, None),
    "gas_recovery_factor_pz": (_vol.gas_recovery_factor_pz, {"pi": "pressure", "pa": "pressure"}, None),
    "fractional_flow": (_vol.fractional_flow, {"mu_o": "viscosity", "mu_w": "viscosity"}, None),
    "welge_front": (_vol.welge_front, {"mu_o": "viscosity", "mu_w": "viscosity"}, None),
    "displacement_efficiency": (_vol.displacement_efficiency, {"mu_o": "viscosity", "mu_w": "viscosity"}, None),
    # gas
    "bg": (_gas.bg, {"p_psia": ("pressure", "p"), "t_f": ("temperature", "t"), "p_sc": "pressure", "t_sc": "temperature"}, "gas_fvf"),
    "gas_density": (_gas.gas_density, {"p_psia": ("pressure", "p"), "t_f": ("temperature", "t")}, "density"),
    "viscosity_lee_gonzalez_eakin": (_gas.viscosity_lee_gonzalez_eakin, {"t_f": ("temperature", "t"), "density_lbm_ft3": ("density", "density")}, "viscosity"),
    "pseudo_critical": (_gas.pseudo_critical, {}, ("absolute_temperature", "pressure")),
    "pseudo_critical_kay": (_gas.pseudo_critical_kay, {}, ("absolute_temperature", "pressure", None)),
    "wichert_aziz": (_gas.wichert_aziz, {"tpc_r": ("absolute_temperature", "tpc"), "ppc_psia": ("pressure", "ppc")}, ("absolute_temperature", "pressure")),
    "recombined_gas_sg": (_gas.recombined_gas_sg, {"separator_gor": "gas_oil_ratio", "stock_tank_gor": "gas_oil_ratio", "p_sc": "pressure", "t_sc": "temperature"}, None),
    "gas_equivalent": (_gas.gas_equivalent, {"p_sc": "pressure", "t_sc": "temperature"}, "gas_oil_ratio"),
    # oil
    "bubble_point": (_oil.bubble_point, {"rs": "gas_oil_ratio", "temperature_f": ("temperature", "temperature")}, "pressure"),
    "solution_gor": (_oil.solution_gor, {"p": "pressure", "temperature_f": ("temperature", "temperature")}, "gas_oil_ratio"),
    "bo_saturated": (_oil.bo_saturated, {"rs": "gas_oil_ratio", "temperature_f": ("temperature", "temperature")}, "oil_fvf"),
    "bo_undersaturated": (_oil.bo_undersaturated, {"p": "pressure", "pb": "pressure", "bob": "oil_fvf", "rsb": "gas_oil_ratio", "temperature_f": ("temperature", "temperature")}, "oil_fvf"),
    "co_undersaturated": (_oil.co_undersaturated, {"p": "pressure", "rsb": "gas_oil_ratio", "temperature_f": ("temperature", "temperature")}, "compressibility"),
    "oil_density": (_oil.oil_density, {"rs": "gas_oil_ratio", "bo": "oil_fvf", "p_sc": "pressure", "t_sc": "temperature"}, "density"),
    "dead_oil_viscosity": (_oil.dead_oil_viscosity, {"temperature_f": ("temperature", "temperature")}, "viscosity"),
    "live_oil_viscosity": (_oil.live_oil_viscosity, {"mu_od": "viscosity", "rs": "gas_oil_ratio"}, "viscosity"),
    "undersaturated_oil_viscosity": (_oil.undersaturated_oil_viscosity, {"p": "pressure", "pb": "pressure", "mu_ob": "viscosity"}, "viscosity"),
    # water (Bw in rm3/sm3 shares the oil FVF role: both are reservoir over stock-tank volume)
    "water_bw": (_water.water_bw, {"p": "pressure", "t": "temperature", "p_sc": "pressure", "t_sc": "temperature"}, "oil_fvf"),
    "water_density": (_water.water_density, {"p": "pressure", "t": "temperature"}, "density"),
    "water_density_sc": (_water.water_density_sc, {}, "density"),
    "water_rsw": (_water.water_rsw, {"p": "pressure", "t": "temperature"}, "gas_oil_ratio"),
    "water_compressibility": (_water.water_compressibility, {"p": "pressure", "t": "temperature"}, "compressibility"),
    "water_viscosity": (_water.water_viscosity, {"p": "pressure", "t": "temperature"}, "viscosity"),
}

#: Description classes: name -> (class, constructor arguments, {method: (arguments, result)},
#: {property: role}). Methods not listed keep field units (reach them via ``.field``).
_GAS_PT = {"p_psia": ("pressure", "p"), "t_f": ("temperature", "t")}
_GAS_PT_SC = dict(_GAS_PT, p_sc="pressure", t_sc="temperature")
CLASSES: Dict[str, Tuple[Any, Mapping[str, ArgSpec], Dict[str, Tuple[Mapping[str, ArgSpec], Any]], Dict[str, str]]] = {
    "Gas": (
        _gas.Gas,
        {"tpc_r": ("absolute_temperature", "tpc"), "ppc_psia": ("pressure", "ppc")},
        {
            "z": (_GAS_PT, None),
            "bg": (_GAS_PT_SC, "gas_fvf"),
            "density": (_GAS_PT, "density"),
            "viscosity": (_GAS_PT, "viscosity"),
            "cg": (_GAS_PT, "compressibility"),
        },
        {"tpc_r": "absolute_temperature", "ppc_psia": "pressure"},
    ),
    "Oil": (
        _oil.Oil,
        {
            "temperature_f": ("temperature", "temperature"),
            "gor": "gas_oil_ratio",
            "pb": "pressure",
            "bob": "oil_fvf",
            "mu_ob": "viscosity",
            "separator_p": "pressure",
            "separator_t": "temperature",
            "p_sc": "pressure",
            "t_sc": "temperature",
        },
        {
            "rs": ({"p": "pressure"}, "gas_oil_ratio"),
            "bo": ({"p": "pressure"}, "oil_fvf"),
            "viscosity": ({"p": "pressure"}, "viscosity"),
            "bubble_point": ({}, "pressure"),
            "rsi": ({}, "gas_oil_ratio"),
        },
        {"temperature_f": "temperature", "gor": "gas_oil_ratio", "pb": "pressure"},
    ),
    "Water": (
        _water.Water,
        {"p_sc": "pressure", "t_sc": "temperature"},
        {
            "bw": ({"p": "pressure", "t": "temperature"}, "oil_fvf"),
            "density": ({"p": "pressure", "t": "temperature"}, "density"),
            "viscosity": ({"p": "pressure", "t": "temperature"}, "viscosity"),
            "compressibility": ({"p": "pressure", "t": "temperature"}, "compressibility"),
            "rsw": ({"p": "pressure", "t": "temperature"}, "gas_oil_ratio"),
        },
        {},
    ),
}

#: Functions whose units depend on an option; wrapped by hand below.
_SPECIAL = ("probabilistic_in_place",)


def _probabilistic(system: UnitSystem) -> Any:
    def probabilistic_in_place(fluid: str = "oil", **kw: Any) -> Dict[str, Any]:
        vol_role = "oil_volume" if fluid == "oil" else "gas_volume"
        fvf_role = "oil_fvf" if fluid == "oil" else "gas_fvf"
        roles = {"area": "area", "thickness": "length", "fvf": fvf_role}
        call = {k: (system.to_field(v, roles[k]) if k in roles else v) for k, v in kw.items()}
        out = _vol.probabilistic_in_place(fluid, **call)
        conv = lambda x: system.from_field(x, vol_role)  # noqa: E731
        out["unit"] = system.units[vol_role]
        out["in_place"] = conv(out["in_place"])
        if out["recoverable"] is not None:
            out["recoverable"] = conv(out["recoverable"])
        for key in ("summary", "recoverable_summary"):
            s = out[key]
            if s is not None:
                for q in ("p90", "p50", "p10", "mean", "sd"):
                    s[q] = conv(s[q])
        for name, role in roles.items():
            out["inputs"][name] = system.from_field(out["inputs"][name], role)
        for row in out["tornado"]:
            for q in ("volume_at_low", "volume_at_high", "swing"):
                row[q] = conv(row[q])
            if row["input"] in roles:
                for q in ("input_low", "input_high"):
                    row[q] = system.from_field(row[q], roles[row["input"]])
        return out

    probabilistic_in_place.__doc__ = (
        f"Monte Carlo in place in units {system.units}: area, thickness and fvf distributions in "
        "this system's units (Distribution objects or numbers), volumes returned in its oil or gas "
        "volume unit. P90 is the LOW value.\n\nField-unit documentation:\n\n"
        + (_vol.probabilistic_in_place.__doc__ or "")
    )
    return probabilistic_in_place


def _build(system: UnitSystem) -> types.SimpleNamespace:
    ns = types.SimpleNamespace()
    for name, (func, args, returns) in TABLE.items():
        setattr(ns, name, system.wrap(func, args, returns))
    for name, (cls, init, methods, props) in CLASSES.items():
        setattr(ns, name, system.wrap_class(cls, init, methods, props))
    ns.probabilistic_in_place = _probabilistic(system)
    ns.units = dict(system.units)
    return ns


_metric = _build(UnitSystem(METRIC))
globals().update({k: v for k, v in vars(_metric).items() if k != "units"})

#: The metric unit of each role.
UNITS: Dict[str, str] = dict(METRIC)

__all__: List[str] = sorted(list(TABLE) + list(_SPECIAL) + list(CLASSES)) + ["TABLE", "CLASSES", "UNITS"]

"""In-place volumes, their uncertainty, recovery factors and displacement efficiency.

Field units: area in acres, thickness in ft, fractions for net-to-gross, porosity, water
saturation and recovery factor, Boi in rb/STB, Bgi in rcf/scf, oil in STB, gas in scf,
pressures in psia, viscosities in cp. Metric users: see :mod:`stocktank.metric`.

Probabilistic volumes follow the trade's convention: **P90 is the LOW value** (exceeded with
90% probability, the 10th percentile of the trials) and P10 the HIGH value.

Methods and references (details in the Rust crate docs):

- volumetric in place: Craft & Hawkins (1959), ch. 1; 7758.37 bbl and 43,560 ft3 per acre-ft
  from the exact unit definitions (NIST SP 811, 2008);
- Monte Carlo: inversion sampling, PERT as a beta (Malcolm et al. 1959), rank correlation by
  Iman & Conover (1982), percentiles by linear interpolation (Hyndman & Fan 1996, def. 7);
- recovery: Arps et al. (1967), API Bulletin D14; p/z gas recovery (Craft & Hawkins 1959);
- displacement: Buckley & Leverett (1942), Welge (1952).

All results are screening estimates, not a reserves evaluation.
"""

from typing import Any, Dict, List, Optional, Tuple

import numpy as np

from ._core import (
    Distribution,
    _arps_solution_gas_validity,
    _arps_water_drive_validity,
    arps_solution_gas_drive,
    arps_water_drive,
    dissolved_gas_in_place,
    fractional_flow,
    gas_cap_ratio,
    gas_recovery_factor_pz,
    gravity_number,
    ogip,
    ogip_from_rock_volume,
    ooip,
    ooip_from_rock_volume,
    probabilistic_in_place,
    recoverable,
    recovery_factor,
    remaining_recoverable,
    summarize,
    waterflood_displacement,
    welge_front,
)

__all__ = [
    "Distribution",
    "ooip",
    "ogip",
    "ooip_from_rock_volume",
    "ogip_from_rock_volume",
    "ooip_layers",
    "ogip_layers",
    "dissolved_gas_in_place",
    "gas_cap_ratio",
    "recoverable",
    "recovery_factor",
    "remaining_recoverable",
    "arps_solution_gas_drive",
    "arps_water_drive",
    "arps_solution_gas_validity",
    "arps_water_drive_validity",
    "gas_recovery_factor_pz",
    "gravity_number",
    "fractional_flow",
    "welge_front",
    "waterflood_displacement",
    "displacement_efficiency",
    "probabilistic_in_place",
    "summarize",
    "tornado_table",
]


def _layers(func: Any, area: Any, thickness: Any, net_to_gross: Any, porosity: Any, sw: Any, fvf: Any) -> Tuple[float, np.ndarray]:
    each = np.atleast_1d(np.asarray(func(area, thickness, net_to_gross, porosity, sw, fvf), dtype=np.float64))
    return float(each.sum()), each


def ooip_layers(area: Any, thickness: Any, net_to_gross: Any, porosity: Any, sw: Any, boi: Any) -> Tuple[float, np.ndarray]:
    """Oil in place of several layers or zones: ``(total STB, per-layer STB)``.

    Each argument is one value per layer (or a scalar shared by all): area in acres, gross
    thickness in ft, net-to-gross, porosity and water saturation as fractions, Boi in rb/STB.
    A bad value raises an error naming the argument and the layer index.
    """
    return _layers(ooip, area, thickness, net_to_gross, porosity, sw, boi)


def ogip_layers(area: Any, thickness: Any, net_to_gross: Any, porosity: Any, sw: Any, bgi: Any) -> Tuple[float, np.ndarray]:
    """Free gas in place of several layers or zones: ``(total scf, per-layer scf)``.

    As :func:`ooip_layers` with Bgi in rcf/scf.
    """
    return _layers(ogip, area, thickness, net_to_gross, porosity, sw, bgi)


def arps_solution_gas_validity(porosity: Any, sw: Any, k_md: Any, mu_ob: Any, pb: Any, pa: Any) -> Any:
    """True where the inputs lie in the solution-gas-drive data range of Arps et al. (1967).

    Ranges (approximate, from memory of API Bulletin D14; verify before relying on them):
    porosity 0.092-0.466, Sw 0.16-0.50, k 6-940 md, mu_ob 0.3-6 cp, pb/pa 1.1-30.
    """
    out = _arps_solution_gas_validity(porosity, sw, k_md, mu_ob, pb, pa)
    return bool(out) if np.ndim(out) == 0 else np.asarray(out) > 0.5


def arps_water_drive_validity(porosity: Any, sw: Any, k_md: Any, mu_wi: Any, mu_oi: Any, pi: Any, pa: Any) -> Any:
    """True where the inputs lie in the water-drive data range of Arps et al. (1967).

    Ranges (approximate, from memory of API Bulletin D14; verify before relying on them):
    porosity 0.111-0.35, Sw 0.052-0.47, k 11-4040 md, mu_oi/mu_wi 0.5-200, pi/pa 1-10.
    """
    out = _arps_water_drive_validity(porosity, sw, k_md, mu_wi, mu_oi, pi, pa)
    return bool(out) if np.ndim(out) == 0 else np.asarray(out) > 0.5


def displacement_efficiency(relperm: Any, pv_injected: Any, *, mu_o: float, mu_w: float, swi: Optional[float] = None, gravity: float = 0.0, errors: str = "raise") -> Any:
    """Displacement efficiency (fraction of the initial oil) after ``pv_injected`` pore volumes.

    Buckley-Leverett (1942) with the Welge (1952) tangent; viscosities in cp; ``swi``
    defaults to the connate water saturation of ``relperm``; ``gravity`` is the gravity
    number in cp (see :func:`gravity_number`).
    """
    return waterflood_displacement(relperm, pv_injected, mu_o=mu_o, mu_w=mu_w, swi=swi, gravity=gravity, errors=errors)[0]


def tornado_table(result: Dict[str, Any]) -> Any:
    """The tornado rows of :func:`probabilistic_in_place` as a pandas DataFrame (needs pandas).

    Columns: input, input_low (its P90), input_high (its P10), volume_at_low, volume_at_high,
    swing, rank_correlation; sorted by decreasing swing. Volumes in the result's ``unit``.
    """
    import pandas as pd

    rows: List[Dict[str, Any]] = list(result["tornado"])
    return pd.DataFrame(rows)

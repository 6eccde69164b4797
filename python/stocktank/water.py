"""stocktank.water: formation water (brine) properties in field units.

Bw (rb/STB) and density (lbm/ft3) by McCain (1990); gas solubility Rsw (scf/STB) by
McCain (1991); compressibility (1/psi) by Osif (1988), with the Dodson and Standing (1944)
dissolved-gas factor, or with gas release by McCain (1991); viscosity (cp) by Meehan (1980,
default) or McCain (1991). Pressure ``p`` in psia, temperature ``t`` in degF, salinity as
weight percent of brine (``salinity_wt_pct``, NaCl equivalent); ppm means mg of solids per
kg of brine (wt% = ppm / 10,000).

Every function broadcasts like numpy, returns a float for scalar inputs, and takes
``errors="raise"|"coerce"``. The ``*_in_range`` functions say where the inputs lie inside the
published ranges. The module docs of the Rust crate (``stocktank::water``) list the ranges,
published accuracies and the measured deviations from IAPWS-95. Screening estimates: defer to
measured water analyses and laboratory PVT data.
"""

from typing import TYPE_CHECKING, Any, List

import numpy as np

from ._core import (
    Water,
    salinity_mg_per_l_to_wt_pct,
    salinity_ppm_to_wt_pct,
    salinity_wt_pct_to_ppm,
    water_bw,
    water_bw_in_range,
    water_compressibility,
    water_compressibility_in_range,
    water_compressibility_with_gas_release,
    water_density,
    water_density_sc,
    water_density_sc_in_range,
    water_rsw,
    water_rsw_in_range,
    water_viscosity,
    water_viscosity_in_range,
)

__all__: List[str] = [
    "Water",
    "water_bw",
    "water_density",
    "water_density_sc",
    "water_rsw",
    "water_compressibility",
    "water_compressibility_with_gas_release",
    "water_viscosity",
    "salinity_ppm_to_wt_pct",
    "salinity_wt_pct_to_ppm",
    "salinity_mg_per_l_to_wt_pct",
    "water_bw_in_range",
    "water_density_sc_in_range",
    "water_rsw_in_range",
    "water_compressibility_in_range",
    "water_viscosity_in_range",
    "water_table",
]

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd


def water_table(water: Water, p: Any, t: Any, *, errors: str = "raise") -> "pd.DataFrame":
    """All properties of ``water`` on broadcast pressures and temperatures, as a DataFrame.

    Parameters
    ----------
    water : Water
        The brine description.
    p : array_like
        Pressure, psia.
    t : array_like
        Temperature, degF (broadcast against ``p``).
    errors : {"raise", "coerce"}
        As for the ``Water`` methods.

    Returns
    -------
    pandas.DataFrame
        One row per broadcast element (C order), columns with units in their names:
        ``p_psia``, ``t_f``, ``bw_rb_per_stb``, ``rsw_scf_per_stb``, ``density_lbm_per_ft3``,
        ``cw_per_psi`` (no free gas), ``viscosity_cp`` and ``in_range`` (inside every published
        range). Screening estimates.
    """
    import pandas as pd

    pb, tb = np.broadcast_arrays(np.asarray(p, dtype=np.float64), np.asarray(t, dtype=np.float64))
    pf, tf = pb.ravel(), tb.ravel()
    return pd.DataFrame(
        {
            "p_psia": pf,
            "t_f": tf,
            "bw_rb_per_stb": np.atleast_1d(water.bw(pf, tf, errors=errors)),
            "rsw_scf_per_stb": np.atleast_1d(water.rsw(pf, tf, errors=errors)),
            "density_lbm_per_ft3": np.atleast_1d(water.density(pf, tf, errors=errors)),
            "cw_per_psi": np.atleast_1d(water.compressibility(pf, tf, errors=errors)),
            "viscosity_cp": np.atleast_1d(water.viscosity(pf, tf, errors=errors)),
            "in_range": np.atleast_1d(water.in_range(pf, tf)),
        }
    )

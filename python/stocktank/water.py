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

from typing import List

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
]

"""Natural-gas properties in field units (psia, degF, rcf/scf, lbm/ft3, cp, 1/psi).

Pseudo-critical properties from gravity (Sutton 1985; Standing 1977) or composition
(Kay 1936, Riazi–Daubert 1987 for C7+), the Wichert–Aziz (1972) and Carr–Kobayashi–Burrows
(1954) corrections for impurities, Z-factor by Dranchuk–Abou-Kassem (1975),
Hall–Yarborough (1973) or the explicit Papay (1968), Bg and Eg, density, compressibility
from the analytic dZ/dp, viscosity by Lee–Gonzalez–Eakin (1966) or Carr–Kobayashi–Burrows
(1954), real-gas pseudo-pressure (Al-Hussainy, Ramey and Crawford 1966), and the
recombination of wet gas / gas condensate.

Every function broadcasts array-likes like a numpy ufunc; scalars give a float. The
description object :class:`Gas` is immutable, comparable and picklable. Results are
screening estimates; defer to measured laboratory PVT data.
"""

from typing import Dict

import numpy as np
import numpy.typing as npt

from ._core import (
    Gas,
    bg,
    condensate_molar_mass,
    gas_density,
    gas_equivalent,
    pseudo_critical,
    pseudo_critical_in_range,
    pseudo_critical_kay,
    pseudo_reduced_compressibility,
    recombined_gas_sg,
    viscosity_lee_gonzalez_eakin,
    wichert_aziz,
    z_factor,
    z_factor_in_range,
)

__all__ = [
    "Gas",
    "bg",
    "condensate_molar_mass",
    "gas_density",
    "gas_equivalent",
    "gas_property_table",
    "pseudo_critical",
    "pseudo_critical_in_range",
    "pseudo_critical_kay",
    "pseudo_reduced_compressibility",
    "recombined_gas_sg",
    "viscosity_lee_gonzalez_eakin",
    "wichert_aziz",
    "z_factor",
    "z_factor_in_range",
]


def gas_property_table(
    gas: Gas,
    p_psia: npt.ArrayLike,
    t_f: float,
    *,
    p_sc: float = 14.696,
    t_sc: float = 60.0,
) -> Dict[str, npt.NDArray[np.float64]]:
    """Properties of ``gas`` at each pressure (psia) of ``p_psia`` and temperature ``t_f`` (degF).

    Returns a dict of equal-length float64 arrays whose keys carry the units:
    ``pressure_psia``, ``temperature_f``, ``z``, ``bg_rcf_per_scf``, ``bg_rb_per_mscf``,
    ``eg_scf_per_rcf``, ``density_lbm_ft3``, ``viscosity_cp``, ``cg_per_psi`` and
    ``pseudo_pressure_psia2_per_cp`` (from p = 0). Standard conditions ``p_sc`` (psia) and
    ``t_sc`` (degF) apply to the volume factors. Pass it to ``pandas.DataFrame`` for a table.
    """
    p = np.atleast_1d(np.asarray(p_psia, dtype=np.float64))
    return {
        "pressure_psia": p,
        "temperature_f": np.full_like(p, float(t_f)),
        "z": np.asarray(gas.z(p, t_f)),
        "bg_rcf_per_scf": np.asarray(gas.bg(p, t_f, p_sc=p_sc, t_sc=t_sc)),
        "bg_rb_per_mscf": np.asarray(gas.bg_rb_per_mscf(p, t_f, p_sc=p_sc, t_sc=t_sc)),
        "eg_scf_per_rcf": np.asarray(gas.eg(p, t_f, p_sc=p_sc, t_sc=t_sc)),
        "density_lbm_ft3": np.asarray(gas.density(p, t_f)),
        "viscosity_cp": np.asarray(gas.viscosity(p, t_f)),
        "cg_per_psi": np.asarray(gas.cg(p, t_f)),
        "pseudo_pressure_psia2_per_cp": np.asarray(gas.pseudo_pressure(p, t_f)),
    }

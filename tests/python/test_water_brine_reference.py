"""Brine (NaCl solution) properties against an outside reference: the aqueous sodium
chloride property fits of Melinder (2010) as implemented by CoolProp's incompressible-fluid
backend (``INCOMP::MNA[x]``, x = mass fraction of NaCl; CoolProp from PyPI). Melinder, A.
(2010). Properties of Secondary Working Fluids for Indirect Systems. IIR, Paris.

The reference is at atmospheric pressure (the backend ignores pressure), so the checks run
at 14.696 psia. Measured deviations (library / CoolProp - 1), CoolProp 8:

=======================================  ===========================  ===================
quantity                                 grid                         deviation
=======================================  ===========================  ===================
density at 60 degF, McCain (1990)        0 to 23 wt%                  -0.034% .. +0.005%
density, McCain (1990)                   5 to 20 wt%, 50 to 104 degF  -0.19% .. +0.07%
viscosity, Meehan (1980)                 5 to 20 wt%, 68 to 104 degF  -4.2% .. +3.5%
=======================================  ===========================  ===================
"""

import numpy as np
import pytest

import stocktank as stk

CoolProp = pytest.importorskip("CoolProp.CoolProp")

KG_M3_PER_LBM_FT3 = 0.45359237 / 0.3048**3  # NIST SP 811 exact definitions


def melinder(prop: str, t_f: float, wt_pct: float) -> float:
    """CoolProp INCOMP::MNA (Melinder 2010) property of an NaCl solution at t_f degF, 1 atm."""
    t_k = (t_f - 32.0) / 1.8 + 273.15
    return CoolProp.PropsSI(prop, "T", t_k, "P", 101325.0, "INCOMP::MNA[%g]" % (wt_pct / 100.0))


@pytest.mark.parametrize("s", [0.0, 5.0, 10.0, 15.0, 20.0, 23.0])
def test_density_at_60f_against_melinder(s):
    # McCain's (1990) standard-condition brine density fits Melinder's NaCl data within
    # 0.05 % from fresh water to 23 wt% (the upper end of Melinder's fit).
    lib = stk.water_density_sc(s) * KG_M3_PER_LBM_FT3
    assert lib == pytest.approx(melinder("D", 60.0, s), rel=5e-4)


@pytest.mark.parametrize("t_f", [50.0, 68.0, 86.0, 104.0])
@pytest.mark.parametrize("s", [5.0, 10.0, 15.0, 20.0])
def test_density_with_temperature_against_melinder(s, t_f):
    # rho_sc(S) / Bw(p, T): McCain's Bw is a pure-water fit said to hold for brines because
    # the salt changes thermal expansion and compression in opposite directions; against
    # Melinder's NaCl solutions at 1 atm it holds within 0.2 % up to 104 degF.
    lib = stk.water_density(14.696, t_f, s) * KG_M3_PER_LBM_FT3
    assert lib == pytest.approx(melinder("D", t_f, s), rel=3e-3)


@pytest.mark.parametrize("t_f", [68.0, 86.0, 104.0])
@pytest.mark.parametrize("s", [5.0, 10.0, 15.0, 20.0])
def test_meehan_viscosity_against_melinder(s, t_f):
    # Meehan (1980) at 1 atm: -4.2 % .. +3.5 % on this grid (its accuracy is not at hand; 5 %
    # is the usual claim for brine-viscosity correlations, common practice, no source).
    lib = stk.water_viscosity(14.696, t_f, s)
    ref = melinder("V", t_f, s) * 1000.0  # Pa s -> cp
    assert lib == pytest.approx(ref, rel=0.05)


def test_salting_out_direction_matches_melinder():
    # Denser and more viscous with salt at fixed temperature, as in the reference.
    s = np.array([0.0, 5.0, 10.0, 15.0, 20.0])
    rho = stk.water_density(14.696, 86.0, s)
    ref = np.array([melinder("D", 86.0, x) for x in s])
    assert np.all(np.diff(rho) > 0) and np.all(np.diff(ref) > 0)

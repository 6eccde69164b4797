"""Gas Z-factor and pseudo-critical corrections against independent implementations.

The Z-factor equations are written out here from the papers as recalled (from memory) and
solved with scipy.optimize.brentq on a scan for the lowest-density root, independently of the
library's Newton solver and its starting-guess table:

* Dranchuk, P.M., Abou-Kassem, J.H. (1975). Calculation of Z factors for natural gases using
  equations of state. J. Can. Pet. Technol. 14(3), 34-36 (eleven constants, from memory).
* Hall, K.R., Yarborough, L. (1973). A new equation of state for Z-factor calculations.
  Oil & Gas Journal 71(25), 82-92 (from memory).
* Papay, J. (1968), explicit form as quoted by Ahmed (2006), Reservoir Engineering Handbook
  (from memory).
* Wichert, E., Aziz, K. (1972). Calculate Z's for sour gases. Hydrocarbon Processing 51(5),
  119-122 (from memory).

Gas viscosity of methane against CoolProp (PyPI) reference correlations for methane.
"""

import numpy as np
import pytest

import stocktank as st

optimize = pytest.importorskip("scipy.optimize")

DAK = [0.3265, -1.0700, -0.5339, 0.01569, -0.05165, 0.5475, -0.7361, 0.1844, 0.1056, 0.6134, 0.7210]


def z_dak_reference(ppr, tpr):
    a = DAK

    def f(rho):
        z = 0.27 * ppr / (rho * tpr)
        rhs = (
            1.0
            + (a[0] + a[1] / tpr + a[2] / tpr**3 + a[3] / tpr**4 + a[4] / tpr**5) * rho
            + (a[5] + a[6] / tpr + a[7] / tpr**2) * rho**2
            - a[8] * (a[6] / tpr + a[7] / tpr**2) * rho**5
            + a[9] * (1.0 + a[10] * rho**2) * rho**2 / tpr**3 * np.exp(-a[10] * rho**2)
        )
        return rhs - z

    grid = np.linspace(1e-8, 3.5, 4000)
    vals = [f(r) for r in grid]
    for i in range(grid.size - 1):
        if vals[i] * vals[i + 1] < 0.0:
            rho = optimize.brentq(f, grid[i], grid[i + 1], xtol=1e-15, rtol=1e-15)
            return 0.27 * ppr / (rho * tpr)
    raise AssertionError("no root")


def z_hy_reference(ppr, tpr):
    t = 1.0 / tpr
    a = 0.06125 * t * np.exp(-1.2 * (1.0 - t) ** 2)

    def f(y):
        return (
            -a * ppr
            + (y + y * y + y**3 - y**4) / (1.0 - y) ** 3
            - (14.76 * t - 9.76 * t * t + 4.58 * t**3) * y * y
            + (90.7 * t - 242.2 * t * t + 42.4 * t**3) * y ** (2.18 + 2.82 * t)
        )

    y = optimize.brentq(f, 1e-12, 0.999999, xtol=1e-15, rtol=1e-15)
    return a * ppr / y


TPR = [1.05, 1.1, 1.2, 1.3, 1.5, 1.7, 2.0, 2.5, 3.0]
PPR = [0.2, 0.5, 1.0, 2.0, 3.0, 5.0, 8.0, 10.0, 15.0]


@pytest.mark.parametrize("tpr", TPR)
def test_dak_and_hall_yarborough_against_independent_root_finding(tpr):
    # Measured: agreement to 2e-15 (DAK) and 4e-14 (HY) relative over the whole grid.
    for ppr in PPR:
        assert st.z_factor(ppr, tpr, method="dak") == pytest.approx(z_dak_reference(ppr, tpr), rel=1e-10)
        zh = st.z_factor(ppr, tpr, method="hall_yarborough")
        assert zh == pytest.approx(z_hy_reference(ppr, tpr), rel=1e-10)


def test_papay_explicit_form():
    ppr, tpr = np.meshgrid(np.linspace(0.2, 8.0, 9), np.linspace(1.2, 3.0, 7))
    ref = 1.0 - 3.52 * ppr / 10 ** (0.9813 * tpr) + 0.274 * ppr**2 / 10 ** (0.8157 * tpr)
    np.testing.assert_allclose(st.z_factor(ppr, tpr, method="papay"), ref, rtol=1e-13)


def test_standing_katz_chart_readings():
    # Standing-Katz chart readings (from memory, about +-0.02): Z(Ppr 3, Tpr 1.5) = 0.77; the
    # Tpr 1.2 curve bottoms out between about 0.52 and 0.6 around Ppr 2-2.5; at Ppr 15 the Tpr 1.5 curve
    # is near 1.5 (repulsion dominates).
    for method in ("dak", "hall_yarborough"):
        assert st.z_factor(3.0, 1.5, method=method) == pytest.approx(0.77, abs=0.02)
        assert 0.52 < st.z_factor(2.2, 1.2, method=method) < 0.62
        assert st.z_factor(15.0, 1.5, method=method) == pytest.approx(1.5, abs=0.05)


def test_wichert_aziz_and_impurity_mixing_written_out():
    # Wichert & Aziz (1972): eps = 120 (A^0.9 - A^1.6) + 15 (B^0.5 - B^4), A = yCO2 + yH2S,
    # B = yH2S; Tpc' = Tpc - eps; Ppc' = Ppc Tpc' / (Tpc + B (1 - B) eps).
    for tpc, ppc, co2, h2s in [(380.0, 670.0, 0.1, 0.2), (420.0, 650.0, 0.05, 0.0), (360.0, 700.0, 0.0, 0.3)]:
        a, b = co2 + h2s, h2s
        eps = 120.0 * (a**0.9 - a**1.6) + 15.0 * (b**0.5 - b**4)
        t2 = tpc - eps
        got = st.wichert_aziz(tpc, ppc, co2, h2s)
        assert got[0] == pytest.approx(t2, rel=1e-14)
        assert got[1] == pytest.approx(ppc * t2 / (tpc + b * (1 - b) * eps), rel=1e-14)
    # The description object: the hydrocarbon part's gravity through Sutton (1985), the
    # impurities by Kay's rule with their critical constants, then Wichert-Aziz.
    g, co2, h2s, n2 = 0.72, 0.05, 0.02, 0.01
    yi = co2 + h2s + n2
    m_imp = n2 * 28.0134 + co2 * 44.010 + h2s * 34.082
    ghc = (g - m_imp / 28.9647) / (1 - yi)
    tc = {"n2": 227.16, "co2": 547.58, "h2s": 672.12}  # GPSA (1987), from memory
    pc = {"n2": 493.1, "co2": 1071.0, "h2s": 1300.0}
    tpc = (1 - yi) * (169.2 + 349.5 * ghc - 74.0 * ghc**2) + n2 * tc["n2"] + co2 * tc["co2"] + h2s * tc["h2s"]
    ppc = (1 - yi) * (756.8 - 131.0 * ghc - 3.6 * ghc**2) + n2 * pc["n2"] + co2 * pc["co2"] + h2s * pc["h2s"]
    t2, p2 = st.wichert_aziz(tpc, ppc, co2, h2s)
    gas = st.Gas(g, co2=co2, h2s=h2s, n2=n2)
    assert gas.tpc_r == pytest.approx(t2, rel=1e-13)
    assert gas.ppc_psia == pytest.approx(p2, rel=1e-13)


@pytest.mark.parametrize("t_f", [100.0, 200.0, 300.0])
def test_carr_kobayashi_burrows_viscosity_against_coolprop_methane(t_f):
    # CoolProp's methane viscosity (reference correlation) at 2,000-8,000 psia, inside the
    # Dempsey (1965) fit's range (Ppr 1-20). Measured with Kay's methane criticals:
    # -4.8 % .. +2.6 %. Below Ppr 1 the fit does not return to mu1 (at 1 atm it reads
    # about 4-12 % low for methane); that is outside its range (see the validity function).
    CP = pytest.importorskip("CoolProp.CoolProp")
    gas = st.Gas.from_composition(c1=1.0, viscosity_method="carr_kobayashi_burrows")
    for p in [2000.0, 5000.0, 8000.0]:
        ref = CP.PropsSI("V", "T", (t_f - 32) / 1.8 + 273.15, "P", p * 6894.757293168, "Methane") * 1000.0
        assert gas.viscosity(p, t_f) == pytest.approx(ref, rel=0.06)

"""Gas properties against sources outside stocktank (each named beside the check).

Z-factor and viscosity references: CoolProp (PyPI) HEOS with GERG-2008 mixing, stored in
data/gas_reference_coolprop.csv by data/make_gas_reference.py (a few points are recomputed
live here to prove the file matches CoolProp). cg and m(p) are checked against numerical
differentiation and scipy quadrature of the same quantities.
"""

import math
import pathlib

import numpy as np
import pandas as pd
import pytest
from scipy import integrate

import stocktank as st

DATA = pathlib.Path(__file__).with_name("data") / "gas_reference_coolprop.csv"
COMPONENTS = ["n2", "co2", "h2s", "c1", "c2", "c3", "ic4", "nc4", "ic5", "nc5", "c6"]


def reference() -> pd.DataFrame:
    return pd.read_csv(DATA, comment="#")


def composition(rows: pd.DataFrame) -> dict:
    first = rows.iloc[0]
    return {c: float(first[c]) for c in COMPONENTS if first[c] > 0}


def kay_gas(y: dict, z_method: str) -> st.Gas:
    return st.Gas.from_composition(**y, z_method=z_method)


def sutton_gas(y: dict, z_method: str) -> st.Gas:
    sg = st.Gas.from_composition(**y).gas_sg
    return st.Gas(sg, co2=y.get("co2", 0.0), h2s=y.get("h2s", 0.0), n2=y.get("n2", 0.0), z_method=z_method)


def z_deviation_table() -> pd.DataFrame:
    rows = []
    for name, g in reference().groupby("mixture", sort=False):
        y = composition(g)
        for label, make in [("kay", kay_gas), ("sutton", sutton_gas)]:
            for method in ["dak", "hall_yarborough"]:
                gas = make(y, method)
                z = gas.z(g.p_psia.to_numpy(), g.t_f.to_numpy())
                dev = 100.0 * (z / g.z.to_numpy() - 1.0)
                rows.append(
                    dict(
                        mixture=name,
                        gas_sg=round(gas.gas_sg, 4),
                        pseudo_critical=label,
                        method=method,
                        mean_pct=dev.mean(),
                        mean_abs_pct=np.abs(dev).mean(),
                        max_abs_pct=np.abs(dev).max(),
                    )
                )
    return pd.DataFrame(rows)


def test_reference_file_matches_coolprop_live():
    # CoolProp (PyPI), HEOS backend with GERG-2008 mixing: recompute three stored points.
    CP = pytest.importorskip("CoolProp.CoolProp")
    names = {"n2": "Nitrogen", "co2": "CarbonDioxide", "c1": "Methane", "c2": "Ethane", "c3": "Propane"}
    df = reference()
    for mixture, t, p in [("co2_15", 200.0, 3000.0), ("lean", 100.0, 500.0), ("co2_15", 300.0, 10000.0)]:
        row = df[(df.mixture == mixture) & (df.t_f == t) & (df.p_psia == p)].iloc[0]
        comps = [c for c in names if row[c] > 0]
        state = CP.AbstractState("HEOS", "&".join(names[c] for c in comps))
        state.set_mole_fractions([row[c] for c in comps])
        state.update(CP.PT_INPUTS, p * 6894.757293168, (t + 459.67) / 1.8)
        assert state.compressibility_factor() == pytest.approx(row.z, rel=1e-8)


def test_z_against_gerg2008_mixtures():
    # Reference: CoolProp GERG-2008 mixtures at 100-300 degF and 500-10,000 psia.
    # Tolerances: DAK reproduces the Standing-Katz chart with 0.49 % mean absolute error
    # (Dranchuk & Abou-Kassem 1975), Hall-Yarborough similarly; the chart with Kay
    # pseudo-criticals describes sweet natural gases within about 1-3 %, Wichert-Aziz sour
    # gases within about 1 % mean (Wichert & Aziz 1972, from memory). Gravity-based
    # pseudo-criticals add the error of the gravity correlation for a composition unlike
    # its data (Sutton 1985), largest for rich gas near Tpr 1.3.
    table = z_deviation_table()
    print("\n" + table.to_string(float_format=lambda v: f"{v:+.2f}"))
    kay = table[table.pseudo_critical == "kay"]
    assert (kay.mean_abs_pct < 1.5).all(), kay
    assert (kay.max_abs_pct < 3.0).all(), kay
    sutton = table[table.pseudo_critical == "sutton"]
    assert (sutton.mean_abs_pct < 3.0).all(), sutton
    assert (sutton.max_abs_pct < 10.0).all(), sutton


def test_viscosity_against_coolprop():
    # Reference: CoolProp viscosity (methane: reference correlation; mixtures: extended
    # corresponding states), at CoolProp's own density so only the viscosity correlation is
    # tested. Lee-Gonzalez-Eakin (1966): a few percent typical, up to about 9 % at high
    # density (from memory); its data range is 100-340 degF and up to 8000 psia.
    df = reference()
    df = df[df.p_psia <= 8000.0]
    lines = []
    for name, g in df.groupby("mixture", sort=False):
        gas = st.Gas.from_composition(**composition(g))
        m = gas.molar_mass
        rho = g.p_psia * m / (g.z * 10.7316 * (g.t_f + 459.67))
        mu = st.viscosity_lee_gonzalez_eakin(g.t_f.to_numpy(), rho.to_numpy(), m)
        dev = 100.0 * (mu / g.viscosity_cp.to_numpy() - 1.0)
        dev = dev[np.isfinite(dev)]
        lines.append((name, np.abs(dev).mean(), np.abs(dev).max()))
        if name == "methane":
            assert np.abs(dev).mean() < 4.0 and np.abs(dev).max() < 10.0
        elif name in ("lean", "sour", "nitrogen_12"):
            assert np.abs(dev).mean() < 4.0 and np.abs(dev).max() < 12.0
    print("\nLGE vs CoolProp (mean abs %, max abs %):", lines)


def test_cg_against_numerical_derivative():
    # cg = 1/p - d ln Z / dp; central difference of our own Z (common practice, no source).
    for method in ["dak", "hall_yarborough"]:
        gas = st.Gas(0.72, co2=0.05, z_method=method)
        for p in [300.0, 1500.0, 4000.0, 9000.0]:
            for t in [120.0, 250.0]:
                h = 1e-3 * p
                dlnz = (math.log(gas.z(p + h, t)) - math.log(gas.z(p - h, t))) / (2 * h)
                assert gas.cg(p, t) == pytest.approx(1.0 / p - dlnz, rel=1e-6)


def test_pseudo_pressure_against_scipy_quad():
    # m(p) = 2 int_0^p p / (mu Z) dp, reference scipy.integrate.quad of the same integrand.
    gas = st.Gas(0.68, n2=0.02)
    t = 210.0
    p = np.array([4000.0, 250.0, 1200.0, 2500.0, 6000.0])
    m = gas.pseudo_pressure(p, t)

    def integrand(x: float) -> float:
        return 2.0 * x / (gas.viscosity(x, t) * gas.z(x, t))

    for pk, mk in zip(p, m):
        ref, _ = integrate.quad(integrand, 1e-9, pk, epsabs=0.0, epsrel=1e-12, limit=200)
        assert mk == pytest.approx(ref, rel=1e-9)


def test_dak_and_hall_yarborough_agree():
    # Both fit the Standing-Katz chart to about 0.5 % mean (DAK 1975; Hall & Yarborough
    # 1973), so they agree to about 0.5 % on average over the chart (Ppr 0.2-15,
    # Tpr 1.05-3). Pointwise the fits part most where the chart is steepest, around the Z
    # minimum at Ppr 1.5-2 near Tpr 1.1 (measured: 1.6 % max for Tpr >= 1.2, 5.6 % for
    # Tpr >= 1.1, 11 % at Tpr 1.05).
    for tpr_min, max_rel in [(1.05, 0.12), (1.1, 0.06), (1.2, 0.02), (1.3, 0.01)]:
        ppr, tpr = np.meshgrid(np.linspace(0.2, 15.0, 60), np.linspace(tpr_min, 3.0, 40))
        a = st.z_factor(ppr, tpr, method="dak")
        b = st.z_factor(ppr, tpr, method="hall_yarborough")
        rel = np.abs(a / b - 1.0)
        print(f"\nDAK vs HY, Tpr >= {tpr_min}: mean {100 * rel.mean():.3f} %, max {100 * rel.max():.3f} %")
        assert rel.mean() < 0.005
        assert rel.max() < max_rel


def test_component_table_against_coolprop_critical_points():
    # Critical constants of the Kay table against CoolProp's pure-fluid EOS critical points.
    CP = pytest.importorskip("CoolProp.CoolProp")
    names = {
        "n2": "Nitrogen", "co2": "CarbonDioxide", "h2s": "HydrogenSulfide", "c1": "Methane",
        "c2": "Ethane", "c3": "Propane", "ic4": "IsoButane", "nc4": "n-Butane",
        "ic5": "Isopentane", "nc5": "n-Pentane", "c6": "n-Hexane",
    }
    for key, fluid in names.items():
        tpc, ppc, sg = st.pseudo_critical_kay(**{key: 1.0})
        tc_r = CP.PropsSI("Tcrit", fluid) * 1.8
        pc_psia = CP.PropsSI("pcrit", fluid) / 6894.757293168
        m = CP.PropsSI("molar_mass", fluid) * 1000.0
        assert tpc == pytest.approx(tc_r, rel=5e-3), key
        # n-hexane: 436.9 psia in the GPSA table vs 441.5 psia in CoolProp; sources differ
        # by about 1 %.
        assert ppc == pytest.approx(pc_psia, rel=1.2e-2), key
        assert sg * 28.9647 == pytest.approx(m, rel=1e-3), key


def test_c7plus_riazi_daubert_against_coolprop_n_alkanes():
    # Riazi-Daubert (1987) Tc, Pc of a fraction vs CoolProp's n-heptane and n-octane
    # critical points; the correlation's stated accuracy is a few percent.
    CP = pytest.importorskip("CoolProp.CoolProp")
    for fluid, sg in [("n-Heptane", 0.6880), ("n-Octane", 0.7068)]:  # SG 60/60 degF, GPSA (from memory)
        m = CP.PropsSI("molar_mass", fluid) * 1000.0
        tpc, ppc, _ = st.pseudo_critical_kay(c7plus=1.0, c7plus_mw=m, c7plus_sg=sg)
        assert tpc == pytest.approx(CP.PropsSI("Tcrit", fluid) * 1.8, rel=0.05)
        assert ppc == pytest.approx(CP.PropsSI("pcrit", fluid) / 6894.757293168, rel=0.06)


def test_facts_of_the_trade():
    # Standard conditions 14.696 psia and 60 degF (common practice, no source): an ideal gas
    # there has Bg = 1 rcf/scf; 60 degF is 15.56 degC.
    assert st.bg(14.696, 60.0, 1.0) == pytest.approx(1.0, rel=1e-15)
    assert (60.0 - 32.0) / 1.8 == pytest.approx(15.56, abs=5e-3)
    # The 14.65 psia base (some regulators; common practice, no source) gives more scf.
    assert st.bg(1000.0, 150.0, 0.9, p_sc=14.65) < st.bg(1000.0, 150.0, 0.9)
    # Molar volume 379.4-379.5 scf/lbmol at 14.696 psia, 60 degF (common practice, no source),
    # seen through the gas equivalent of condensate: GE = 350.2 SG V_m / M.
    ge = st.gas_equivalent(1.0, 1.0)
    assert ge / 350.17 == pytest.approx(379.5, abs=0.2)
    # Recombination constants 4584 and 132,800 of the textbook formula (Craft & Hawkins
    # 1959; Gold, McCain & Jennings 1989) at 14.7 psia and 60 degF.
    r, g, api, mw = 30_000.0, 0.65, 50.0, 130.0
    sg_o = 141.5 / (api + 131.5)
    textbook = (r * g + 4584.0 * sg_o) / (r + 132_800.0 * sg_o / mw)
    ours = st.recombined_gas_sg(r, g, api, condensate_mw=mw, p_sc=14.7)
    assert ours == pytest.approx(textbook, rel=1e-3)
    # Cragoe (1929): M = 6084 / (API - 5.9).
    assert st.condensate_molar_mass(50.0) == pytest.approx(6084.0 / 44.1, rel=1e-12)
    # Dry air at standard conditions: 0.0763 lbm/ft3 (common practice, no source).
    assert st.gas_density(14.696, 60.0, 1.0, 1.0) == pytest.approx(0.0763, abs=2e-4)


def test_sutton_and_standing_polynomials():
    # Direct evaluation of the published polynomials: Sutton (1985), Standing (1977).
    g = 0.8
    tpc, ppc = st.pseudo_critical(g)
    assert tpc == pytest.approx(169.2 + 349.5 * g - 74.0 * g * g, rel=1e-15)
    assert ppc == pytest.approx(756.8 - 131.0 * g - 3.6 * g * g, rel=1e-15)
    tpc, ppc = st.pseudo_critical(g, method="standing_natural")
    assert tpc == pytest.approx(168 + 325 * g - 12.5 * g * g)
    tpc, ppc = st.pseudo_critical(g, method="standing_condensate")
    assert ppc == pytest.approx(706 - 51.7 * g - 11.1 * g * g)

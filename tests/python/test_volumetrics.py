"""Volumetrics from Python, checked against scipy/numpy and closed forms (sources named)."""

import pickle
import threading
import time

import numpy as np
import pytest
from scipy import integrate, optimize, stats

import stocktank as st
from stocktank import Distribution as D

C_OIL = 43560.0 / (42 * 231 / 1728)  # bbl per acre-ft from NIST SP 811 definitions


# ---- deterministic -----------------------------------------------------------------------


def test_ooip_ogip_formulas_and_broadcasting():
    # N = 7758 A h phi (1 - Sw) / Boi (Craft and Hawkins 1959, ch. 1).
    n = st.ooip(640.0, [[50.0], [60.0]], 1.0, [0.2, 0.25], 0.25, 1.2)
    assert isinstance(n, np.ndarray) and n.shape == (2, 2)
    want = C_OIL * 640 * np.array([[50.0], [60.0]]) * np.array([0.2, 0.25]) * 0.75 / 1.2
    np.testing.assert_allclose(n, want, rtol=1e-14)
    assert isinstance(st.ooip(640, 50, 1, 0.2, 0.25, 1.2), float)
    assert st.ogip(1, 1, 1, 1, 0, 1) == 43560.0
    total, each = st.ooip_layers([100, 200], [10, 20], [0.8, 0.6], 0.2, 0.3, 1.2)
    assert total == pytest.approx(each.sum()) and each.shape == (2,)
    assert st.dissolved_gas_in_place(1e6, 600) == 6e8


def test_fact_37_percent():
    # 37% of 1,000,000 STB is 370,000 STB (common practice, no source).
    assert st.recoverable(1e6, 0.37) == pytest.approx(370_000.0)
    assert st.recovery_factor(370_000.0, 1e6) == pytest.approx(0.37)
    assert st.remaining_recoverable(1e6, 0.37, 70_000) == pytest.approx(300_000.0)


def test_bad_input_names_argument_value_index():
    with pytest.raises(st.InvalidArgumentError, match=r"`porosity` = 1.3 at index 1"):
        st.ooip(640, 50, 1, [0.2, 1.3], 0.25, 1.2)
    with pytest.raises(st.InvalidArgumentError, match=r"`sw` = -0.1"):
        st.ooip(640, 50, 1, 0.2, -0.1, 1.2)
    with pytest.raises(st.InvalidArgumentError, match=r"`area` = -1"):
        st.ogip(-1, 50, 1, 0.2, 0.2, 0.004)
    with pytest.raises(st.InvalidArgumentError, match=r"`thickness`"):
        st.ooip(1, -50, 1, 0.2, 0.2, 1.1)
    out = st.ooip(640, 50, 1, [0.2, 1.3], 0.25, 1.2, errors="coerce")
    assert np.isfinite(out[0]) and np.isnan(out[1])
    with pytest.raises(st.InvalidArgumentError, match="p10.*P90 is the low value"):
        D.lognormal(p90=50, p10=20)
    with pytest.raises(st.InvalidArgumentError, match="mode"):
        D.triangular(1, 5, 3)
    with pytest.raises(st.InvalidArgumentError, match="sd"):
        D.normal(0.2, -1.0)
    with pytest.raises(st.InvalidArgumentError, match="high"):
        D.uniform(2, 1)
    with pytest.raises(st.InvalidOptionError, match="kind"):
        D("weibull", value=1)
    base = dict(area=D.uniform(100, 200), thickness=10.0, porosity=D.uniform(0.1, 0.2), sw=D.uniform(0.2, 0.4), fvf=1.2, trials=1000)
    with pytest.raises(st.InvalidArgumentError, match="positive definite"):
        st.probabilistic_in_place(**base, correlation={("porosity", "sw"): -0.9, ("area", "porosity"): 0.9, ("area", "sw"): 0.9})
    with pytest.raises(st.InvalidArgumentError, match="porosity"):
        st.probabilistic_in_place(**{**base, "porosity": D.normal(0.2, 0.05)})
    with pytest.raises(st.InvalidOptionError, match="correlation"):
        st.probabilistic_in_place(**base, correlation={("porosity", "permeability"): 0.5})


# ---- distributions and Monte Carlo ------------------------------------------------------

SCIPY = [
    (D.uniform(2, 5), stats.uniform(2, 3)),
    (D.triangular(1, 2, 6), stats.triang((2 - 1) / 5, loc=1, scale=5)),
    # PERT = beta(1 + 4 (m - a)/(c - a), 1 + 4 (c - m)/(c - a)) on [a, c] (Malcolm et al. 1959)
    (D.pert(1, 2, 6), stats.beta(1 + 4 * 1 / 5, 1 + 4 * 4 / 5, loc=1, scale=5)),
    (D.normal(10, 2), stats.norm(10, 2)),
    (D.normal(0.2, 0.05, low=0.15, high=0.3), stats.truncnorm(-1, 2, loc=0.2, scale=0.05)),
    (D.normal(0.2, 0.05, low=0.33), stats.truncnorm(2.6, np.inf, loc=0.2, scale=0.05)),
    (D.lognormal(mu=1.0, sigma=0.4), stats.lognorm(0.4, scale=np.e)),
    (D.lognormal(mean=100.0, sd=30.0), stats.lognorm(np.sqrt(np.log(1.09)), scale=100 / np.sqrt(1.09))),
]


@pytest.mark.parametrize("ours,ref", SCIPY)
def test_moments_against_scipy(ours, ref):
    assert ours.mean() == pytest.approx(ref.mean(), rel=1e-9)
    assert ours.variance() == pytest.approx(ref.var(), rel=1e-7)
    x = ours.sample(300_000, seed=5)
    se = np.sqrt(ref.var() / x.size)
    assert abs(x.mean() - ref.mean()) < 5 * se
    assert x.var(ddof=1) == pytest.approx(ref.var(), rel=0.02)
    # Kolmogorov-Smirnov against scipy's distribution function.
    assert stats.kstest(x[:50_000], ref.cdf).pvalue > 1e-4


def test_truncated_lognormal_moments_against_scipy():
    d = D.lognormal(mu=1.0, sigma=0.4, low=2.0, high=4.0)
    ref = stats.lognorm(0.4, scale=np.e)
    z = ref.cdf(4) - ref.cdf(2)
    m1 = integrate.quad(lambda x: x * ref.pdf(x), 2, 4)[0] / z
    m2 = integrate.quad(lambda x: x * x * ref.pdf(x), 2, 4)[0] / z
    assert d.mean() == pytest.approx(m1, rel=1e-9)
    assert d.variance() == pytest.approx(m2 - m1 * m1, rel=1e-7)


def test_p90_p10_specification_round_trip():
    d = D.lognormal(p90=10.0, p10=40.0)
    x = d.sample(400_000, seed=2)
    p = np.percentile(x, [10, 90])  # P90 = 10th percentile (low), P10 = 90th (high)
    assert p[0] == pytest.approx(10.0, rel=0.01) and p[1] == pytest.approx(40.0, rel=0.01)
    n = D.normal(p90=80.0, p10=120.0)
    assert n.mean() == pytest.approx(100.0) and np.sqrt(n.variance()) == pytest.approx(20 / stats.norm.ppf(0.9))


def test_lognormal_product_percentiles_closed_form():
    # Product of independent lognormals is lognormal: P90 = exp(mu - z sigma) with
    # z = scipy.stats.norm.ppf(0.9); compared with the simulation.
    r = st.probabilistic_in_place(
        "gas",
        area=D.lognormal(mu=7.0, sigma=0.3),
        thickness=D.lognormal(mu=3.0, sigma=0.2),
        porosity=0.2,
        sw=0.3,
        fvf=D.lognormal(mu=np.log(0.004), sigma=0.05),
        trials=400_000,
        seed=8,
    )
    mu = np.log(43560 * 0.2 * 0.7) + 7.0 + 3.0 - np.log(0.004)
    sg = np.sqrt(0.3**2 + 0.2**2 + 0.05**2)
    ref = stats.lognorm(sg, scale=np.exp(mu))
    s = r["summary"]
    assert s["p90"] == pytest.approx(ref.ppf(0.1), rel=0.006)
    assert s["p50"] == pytest.approx(ref.ppf(0.5), rel=0.005)
    assert s["p10"] == pytest.approx(ref.ppf(0.9), rel=0.006)
    assert s["mean"] == pytest.approx(ref.mean(), rel=0.005)
    assert s["p90"] < s["p50"] < s["p10"]  # P90 is the LOW value (common practice, no source)
    # Summary percentiles equal numpy's linear percentiles of the returned trials.
    np.testing.assert_allclose([s["p90"], s["p50"], s["p10"]], np.percentile(r["in_place"], [10, 50, 90]), rtol=1e-13)


def inputs(**over):
    kw = dict(
        area=D.triangular(800, 1000, 1500),
        thickness=D.pert(20, 35, 60),
        net_to_gross=D.uniform(0.6, 0.9),
        porosity=D.normal(0.2, 0.03, low=0.05, high=0.35),
        sw=D.normal(0.3, 0.05, low=0.1, high=0.6),
        fvf=D.lognormal(mean=1.3, sd=0.05),
    )
    kw.update(over)
    return kw


def test_reproducible_by_seed_and_correlation_hits_target():
    corr = {("porosity", "sw"): -0.6, ("area", "thickness"): 0.4, ("net_to_gross", "porosity"): 0.5}
    a = st.probabilistic_in_place("oil", **inputs(), correlation=corr, trials=100_000, seed=11)
    b = st.probabilistic_in_place("oil", **inputs(), correlation=corr, trials=100_000, seed=11)
    c = st.probabilistic_in_place("oil", **inputs(), correlation=corr, trials=100_000, seed=12)
    np.testing.assert_array_equal(a["in_place"], b["in_place"])
    assert not np.array_equal(a["in_place"], c["in_place"])
    x = a["inputs"]
    for (p, q), r in corr.items():
        assert stats.spearmanr(x[p], x[q]).statistic == pytest.approx(r, abs=0.02)
    assert abs(stats.spearmanr(x["area"], x["sw"]).statistic) < 0.02
    # Correlated inputs keep their distributions (Kolmogorov-Smirnov against scipy).
    assert stats.kstest(x["porosity"][:50_000], stats.truncnorm(-5, 5, loc=0.2, scale=0.03).cdf).pvalue > 1e-4
    assert stats.kstest(x["area"][:50_000], stats.triang(0.2 / 0.7, loc=800, scale=700).cdf).pvalue > 1e-4
    # The volume of each trial is the formula of that trial's inputs.
    n = C_OIL * x["area"] * x["thickness"] * x["net_to_gross"] * x["porosity"] * (1 - x["sw"]) / x["fvf"]
    np.testing.assert_allclose(a["in_place"], n, rtol=1e-13)


def test_tornado_and_recoverable():
    r = st.probabilistic_in_place("oil", **inputs(area=D.uniform(100, 3000)), recovery_factor=D.pert(0.2, 0.3, 0.45), trials=50_000, seed=3)
    t = st.tornado_table(r)
    assert t["input"].iloc[0] == "area" and (np.diff(t["swing"]) <= 0).all()
    sw = t.set_index("input").loc["sw"]
    assert sw["volume_at_high"] < sw["volume_at_low"] and sw["rank_correlation"] < 0
    np.testing.assert_allclose(r["recoverable"], r["in_place"] * r["inputs"]["recovery_factor"], rtol=1e-15)
    assert r["recoverable_summary"]["p50"] == pytest.approx(np.median(r["recoverable"]))


def test_tornado_rank_correlation_is_scipy_spearman_on_first_200k():
    # scipy.stats.spearmanr on the first 200,000 trials, for correlated inputs (ranks taken
    # from the re-pairing) and independent ones (ranked again) alike.
    corr = {("porosity", "sw"): -0.6, ("area", "thickness"): 0.4, ("sw", "fvf"): 0.2}
    r = st.probabilistic_in_place("oil", **inputs(), correlation=corr, trials=250_000, seed=8)
    m = 200_000
    for row in r["tornado"]:
        want = stats.spearmanr(r["inputs"][row["input"]][:m], r["in_place"][:m]).statistic
        assert row["rank_correlation"] == pytest.approx(want, abs=1e-12)


def test_distribution_class_behaviour():
    d = D.normal(0.2, 0.03, low=0.0, high=0.4)
    assert pickle.loads(pickle.dumps(d)) == d
    assert d == D("normal", mean=0.2, sd=0.03, low=0.0, high=0.4)
    assert "normal" in repr(d) and d.kind == "normal"
    assert D.fixed(3.0).support() == (3.0, 3.0)
    for x in (D.uniform(1, 2), D.pert(1, 2, 3), D.lognormal(p90=1, p10=3, high=5)):
        assert pickle.loads(pickle.dumps(x)) == x


def test_gil_released_during_monte_carlo():
    ticks = []
    done = threading.Event()

    def work():
        st.probabilistic_in_place("oil", **inputs(), correlation={("porosity", "sw"): -0.5}, trials=600_000, seed=1)
        done.set()

    t = threading.Thread(target=work)
    t.start()
    while not done.is_set():
        ticks.append(time.perf_counter())
        time.sleep(0.005)
    t.join()
    assert len(ticks) > 5  # the main thread kept running while the simulation ran


# ---- recovery correlations ---------------------------------------------------------------


def arps_sgd_ref(phi, sw, bob, k_md, mu_ob, pb, pa):
    # Arps et al. (1967), API Bulletin D14, solution-gas drive, percent; k in darcy.
    return 41.815 * (phi * (1 - sw) / bob) ** 0.1611 * (k_md / 1000 / mu_ob) ** 0.0979 * sw**0.3722 * (pb / pa) ** 0.1741 / 100


def arps_wd_ref(phi, sw, boi, k_md, mu_wi, mu_oi, pi, pa):
    # Arps et al. (1967), API Bulletin D14, water drive, percent; k in darcy.
    return 54.898 * (phi * (1 - sw) / boi) ** 0.0422 * (k_md / 1000 * mu_wi / mu_oi) ** 0.0770 * sw ** (-0.1903) * (pi / pa) ** (-0.2159) / 100


def test_arps_against_published_equation():
    rng = np.random.default_rng(0)
    phi, sw = rng.uniform(0.1, 0.35, 50), rng.uniform(0.15, 0.45, 50)
    args = (phi, sw, 1.3, rng.uniform(10, 900, 50), 1.2, 2500.0, rng.uniform(200, 2000, 50))
    np.testing.assert_allclose(st.arps_solution_gas_drive(*args), arps_sgd_ref(*args), rtol=1e-13)
    args = (phi, sw, 1.2, 500.0, 0.5, rng.uniform(0.5, 50, 50), 3000.0, 1500.0)
    np.testing.assert_allclose(st.arps_water_drive(*args), arps_wd_ref(*args), rtol=1e-13)
    assert st.arps_solution_gas_validity(0.2, 0.3, 100, 1, 2500, 500) is True
    assert st.arps_water_drive_validity(0.05, 0.3, 100, 0.5, 2, 3000, 1500) is False
    with pytest.raises(st.InvalidArgumentError, match="pa"):
        st.arps_solution_gas_drive(0.2, 0.3, 1.3, 100, 1, 2500, 3000)


def test_gas_recovery_pz():
    # RF = 1 - (pa/za)/(pi/zi) (Craft and Hawkins 1959).
    assert st.gas_recovery_factor_pz(3000, 0.85, [500, 1000], 0.95) == pytest.approx(1 - (np.array([500, 1000]) / 0.95) / (3000 / 0.85))


# ---- Buckley-Leverett --------------------------------------------------------------------


def fw_ref(s, swc, sor, krw_max, kro_max, nw, no, mu_o, mu_w):
    sn = np.clip((s - swc) / (1 - swc - sor), 0, 1)
    krw, kro = krw_max * sn**nw, kro_max * (1 - sn) ** no
    return (krw / mu_w) / (krw / mu_w + kro / mu_o)


@pytest.mark.parametrize("mu_o", [0.5, 2.0, 10.0])
def test_welge_front_against_scipy_tangent(mu_o):
    par = (0.2, 0.25, 0.35, 0.9, 3.0, 2.0)
    k = st.CoreyOilWater(swc=0.2, sorw=0.25, krw_max=0.35, kro_max=0.9, nw=3.0, no=2.0)
    f = lambda s: fw_ref(s, *par, mu_o, 0.5)  # noqa: E731
    df = lambda s: (f(s + 1e-7) - f(s - 1e-7)) / 2e-7  # noqa: E731
    # Welge (1952): the tangent from (Swc, 0) touches fw where fw' (S - Swc) = fw.
    grid = np.linspace(0.21, 0.749, 2000)
    i = np.argmax(f(grid) / (grid - 0.2))
    s_ref = optimize.brentq(lambda s: df(s) * (s - 0.2) - f(s), grid[i - 1], grid[i + 1])
    w = st.welge_front(k, mu_o=mu_o, mu_w=0.5)
    assert w["sw_front"] == pytest.approx(s_ref, abs=1e-7)
    assert st.fractional_flow(k, w["sw_front"], mu_o=mu_o, mu_w=0.5) == pytest.approx(f(s_ref), rel=1e-6)
    assert w["pv_breakthrough"] == pytest.approx(1 / df(s_ref), rel=1e-5)


def test_recovery_after_breakthrough_matches_profile_integral():
    # Buckley-Leverett (1942): at injection Qi the saturation S sits at x = Qi fw'(S). The
    # swept-zone average from integrating that profile (scipy) must equal Welge's result.
    k = st.CoreyOilWater(swc=0.2, sorw=0.25, krw_max=0.35, kro_max=0.9, nw=3.0, no=2.0)
    w = st.welge_front(k, mu_o=5.0, mu_w=0.5)
    f = lambda s: fw_ref(s, 0.2, 0.25, 0.35, 0.9, 3.0, 2.0, 5.0, 0.5)  # noqa: E731
    df = lambda s: (f(s + 1e-7) - f(s - 1e-7)) / 2e-7  # noqa: E731
    for qi in [0.2, 1.0, 3.0]:
        ed, sw_avg, sw_out, fw_out = st.waterflood_displacement(k, qi, mu_o=5.0, mu_w=0.5)
        # Average of S over x in [0, 1]: integral over saturations from the outlet value up.
        s_out = w["sw_front"] if qi <= w["pv_breakthrough"] else sw_out
        x_out = min(1.0, qi * df(s_out))
        area = integrate.quad(lambda s: qi * df(s), s_out, 0.75, limit=200)[0]  # int x dS
        avg = (0.75 * 0.0 + s_out * x_out + area) + 0.2 * (1 - x_out)
        assert sw_avg == pytest.approx(avg, rel=2e-4), qi


def test_piston_front_and_critical_saturation():
    # Straight-line relative permeabilities, equal viscosities: piston-like front
    # (common practice, no source). Oil flows only above its critical saturation: fw = 1.
    k = st.CoreyOilWater(swc=0.2, sorw=0.3, nw=1.0, no=1.0)
    w = st.welge_front(k, mu_o=1.0, mu_w=1.0)
    assert w["sw_front"] == pytest.approx(0.7) and w["pv_breakthrough"] == pytest.approx(0.5)
    assert st.fractional_flow(k, [0.7, 0.8, 1.0], mu_o=1.0, mu_w=1.0) == pytest.approx([1.0, 1.0, 1.0])
    assert st.displacement_efficiency(k, [0.25, 0.5, 2.0], mu_o=1.0, mu_w=1.0) == pytest.approx([0.25 / 0.8, 0.5 / 0.8, 0.5 / 0.8])


def test_fixed_input_cannot_be_correlated():
    with pytest.raises(st.InvalidArgumentError, match="fixed input cannot be correlated"):
        st.probabilistic_in_place("oil", **inputs(fvf=1.3), correlation={("sw", "fvf"): 0.3}, trials=1000)


def test_summarize_errors_name_samples():
    # The core's name `data` used to appear in the message.
    with pytest.raises(st.InvalidArgumentError, match=r"`samples` = NaN at index 1"):
        st.summarize([1.0, np.nan, 2.0])


def test_impossible_sample_counts_raise_memoryerror_not_abort():
    # 2**50 samples (9 PB) aborted the process (or panicked with "capacity overflow" for
    # 2**64 - 1); now a MemoryError naming the argument, as numpy does.
    d = D.uniform(0.0, 1.0)
    for n in (2**50, 2**64 - 1):
        with pytest.raises(MemoryError, match="`n`"):
            d.sample(n)
    with pytest.raises(MemoryError, match="`trials`"):
        st.probabilistic_in_place(
            "oil", area=D.uniform(1.0, 2.0), thickness=10.0, porosity=0.2, sw=0.3, fvf=1.2, trials=2**50
        )
    assert d.sample(10).shape == (10,)


def test_negative_counts_and_seeds_name_the_argument():
    # These used to raise OverflowError("can't convert negative int to unsigned").
    d = D.uniform(0.0, 1.0)
    for kw, name in [(dict(n=-1), "n"), (dict(n=3, seed=-1), "seed"), (dict(n=3, stream=-2), "stream")]:
        with pytest.raises(st.InvalidArgumentError, match=f"`{name}` = -"):
            d.sample(**kw)
    with pytest.raises(st.InvalidArgumentError, match="`trials` = -5"):
        st.probabilistic_in_place("oil", area=1.0, thickness=10.0, porosity=0.2, sw=0.3, fvf=1.2, trials=-5)
    # The whole unsigned range still works.
    assert d.sample(2, seed=2**64 - 1, stream=2**64 - 1).shape == (2,)

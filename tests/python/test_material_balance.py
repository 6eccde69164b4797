"""Tests of stocktank.material_balance against references outside the project.

Sources are named beside each check: the van Everdingen-Hurst integral evaluated with
scipy quadrature, an independent Laplace inversion (mpmath's Talbot method with mpmath's
Bessel functions), CoolProp's methane equation of state (Setzmann & Wagner 1991, the
reference EOS in CoolProp), scipy.stats.linregress, scipy.stats.t and
scipy.optimize.least_squares. Synthetic histories are round trips, not check values.
"""

import pickle
import threading
import time
import warnings

import numpy as np
import pytest

import stocktank as st
from stocktank import material_balance as mb

PI = 3000.0
PB = 2500.0


def make_pvt(viscosities=True):
    """A smooth synthetic black-oil table (a generator for round trips)."""
    p = np.arange(400.0, 3401.0, 100.0)
    s = np.minimum(p, PB)
    rs = 100.0 + 0.2 * s
    bob = 1.05 + 0.00012 * rs
    bo = np.where(p <= PB, bob, (1.05 + 0.00012 * (100 + 0.2 * PB)) * np.exp(-1.2e-5 * (p - PB)))
    z = 1.0 - 6e-5 * p + 1.2e-8 * p * p
    bg = 0.00504 * z * 640.0 / p
    kw = {}
    if viscosities:
        kw = dict(mu_o=np.where(p <= PB, 2.2 - 0.0005 * p, 2.2 - 0.0005 * PB + 1e-5 * (p - PB)), mu_g=0.012 + 2.5e-6 * p)
    return st.PvtTable(p=p, bo=bo, rs=rs, bg=bg, bw=np.full(p.size, 1.02), **kw)


RES = dict(p_initial=PI, swi=0.2, cw=3e-6, cf=4e-6)


def declining(k, p_end):
    t = 30.0 * np.arange(k)
    x = np.arange(k) / (k - 1)
    p = PI - (PI - p_end) * (1 - np.exp(-2.5 * x)) / (1 - np.exp(-2.5))
    return t, p


def synthetic(pvt, t, p, n, m, aquifer=None):
    """Forward model: F = N Et + We, producing GOR Rs + extra gas below the bubble point."""
    zero = np.zeros_like(t)
    terms = mb.oil_mbe_terms(pvt, t_days=t, p=p, np_stb=zero, gp_scf=zero, wp_stb=zero, m=m, **RES)
    we = aquifer.influx(t, p, p_initial=PI) if aquifer is not None else zero
    q = pvt.at(p)
    f = n * terms["et"] + we
    np_, gp_ = [], []
    npp = gpp = 0.0
    for i in range(len(t)):
        extra = 400.0 * np.clip((PB - p[i]) / 500.0, 0, 1)
        r = q["rs"][i] + extra
        npi = (f[i] - (gpp - r * npp) * q["bg"][i]) / (q["bo"][i] + extra * q["bg"][i])
        gpi = gpp + r * (npi - npp)
        np_.append(npi)
        gp_.append(gpi)
        npp, gpp = npi, gpi
    return dict(t_days=t, p=p, np_stb=np.array(np_), gp_scf=np.array(gp_), wp_stb=zero)


# ---- van Everdingen-Hurst against independent references ---------------------------------------


def veh_integral(td):
    """WD(tD) of an infinite radial aquifer from the integral of van Everdingen & Hurst
    (1949): WD = 4/pi^2 int_0^inf (1 - exp(-u^2 tD)) / (u^3 (J0(u)^2 + Y0(u)^2)) du, by
    scipy quadrature in x = ln u (the small-u tail below e^-300 added in closed form)."""
    from scipy import integrate, special

    def g(x):
        u = np.exp(x)
        q = u * u * td
        r = td if q == 0 else td * (-np.expm1(-q)) / q
        return r / (special.j0(u) ** 2 + special.y0(u) ** 2)

    pts = np.concatenate([np.linspace(-300, -20, 15), np.linspace(-20, np.log(100.0), 60)[1:]])
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        s = sum(integrate.quad(g, a, b, limit=200, epsabs=0, epsrel=1e-12)[0] for a, b in zip(pts[:-1], pts[1:]))
        f = lambda u: (1 - np.exp(-u * u * td)) / (u**3 * (special.j0(u) ** 2 + special.y0(u) ** 2))  # noqa: E731
        s += integrate.quad(f, 100, np.inf, limit=200)[0]
    s += td * (np.pi / 2) ** 2 / (300 + np.log(2) - np.euler_gamma)
    return 4 / np.pi**2 * s


@pytest.mark.parametrize("td", [0.01, 1.0, 100.0, 1e4])
def test_veh_infinite_against_integral(td):
    # Source: the vEH (1949) integral by scipy.integrate.quad. Measured agreement ~1e-6.
    assert st.veh_dimensionless_influx(td) == pytest.approx(veh_integral(td), rel=5e-6)


def test_veh_finite_and_pd_against_mpmath_talbot():
    mp = pytest.importorskip("mpmath")
    mp.mp.dps = 15

    def wbar(s, red):
        x = mp.sqrt(s)
        r = red * x
        num = mp.besseli(1, r) * mp.besselk(1, x) - mp.besselk(1, r) * mp.besseli(1, x)
        den = s**1.5 * (mp.besseli(0, x) * mp.besselk(1, r) + mp.besselk(0, x) * mp.besseli(1, r))
        return num / den

    # Source: mpmath.invertlaplace (Talbot) of the same Laplace-space solution with mpmath's
    # own Bessel functions: an independent inversion and independent special functions.
    # (Few points: the arbitrary-precision inversion takes seconds each.) Measured
    # agreement: 4e-5 at reD = 2, tD = 1; 4e-6 at reD = 5, tD = 10.
    for red, td in ((2.0, 1.0), (5.0, 10.0)):
        ref = float(mp.invertlaplace(lambda s: wbar(s, red), td, method="talbot"))
        assert st.veh_dimensionless_influx(td, red=red) == pytest.approx(ref, rel=1e-4)
    for td in (5.0,):
        # Infinite aquifer, constant rate: pD_bar = K0(sqrt s) / (s^1.5 K1(sqrt s)).
        ref = float(
            mp.invertlaplace(lambda s: mp.besselk(0, mp.sqrt(s)) / (s**1.5 * mp.besselk(1, mp.sqrt(s))), td, method="talbot")
        )
        assert st.veh_dimensionless_pressure(td) == pytest.approx(ref, rel=1e-4)


def test_veh_array_behaviour():
    out = st.veh_dimensionless_influx([[0.1], [1.0]], red=[5.0] if False else 5.0)
    assert isinstance(out, np.ndarray) and out.shape == (2, 1)
    assert isinstance(st.veh_dimensionless_influx(1), float)  # int in, float out
    assert np.isnan(st.veh_dimensionless_influx([np.nan, 1.0])[0])
    with pytest.raises(st.InvalidArgumentError, match=r"`td` = -1 at index 1"):
        st.veh_dimensionless_influx([1.0, -1.0])
    assert np.isnan(st.veh_dimensionless_influx([1.0, -1.0], errors="coerce")[1])


# ---- Gas: a real-gas volumetric reservoir from CoolProp -----------------------------------------


def test_volumetric_methane_pz_line_is_straight_with_coolprop_z():
    CP = pytest.importorskip("CoolProp.CoolProp")
    t_f = 200.0
    t_k = (t_f + 459.67) / 1.8
    psi = 6894.757293168

    def z(p):
        return CP.PropsSI("Z", "T", t_k, "P", p * psi, "Methane")

    g = 1e11
    pi = 6000.0
    p = np.linspace(pi, 800.0, 15)
    zz = np.array([z(x) for x in p])
    bg = st.gas_bg(p, zz, temperature_f=t_f)
    bgi = bg[0]
    gp = g * (1 - bgi / bg)  # volumetric depletion: G Bgi = (G - Gp) Bg
    fit = st.pz_fit(gp_scf=gp, p=p, z=zz, pz_abandon=500.0 / z(500.0))
    assert fit["g"] == pytest.approx(g, rel=1e-10)
    assert fit["r2"] == pytest.approx(1.0, abs=1e-12)
    assert fit["rf_abandon"] == pytest.approx(1 - (500.0 / z(500.0)) / (pi / zz[0]), rel=1e-10)
    # The line report agrees with scipy.stats.linregress.
    from scipy import stats

    lr = stats.linregress(gp, p / zz)
    assert fit["slope"] == pytest.approx(lr.slope, rel=1e-9)
    assert fit["intercept"] == pytest.approx(lr.intercept, rel=1e-12)
    cole = st.cole_plot(gp_scf=gp, p=p, z=zz, p_initial=pi, z_initial=zz[0], temperature_f=t_f)
    assert np.isnan(cole[0]) and np.allclose(cole[1:], g, rtol=1e-10)


def test_pz_fit_report_matches_linregress_with_noise():
    from scipy import stats

    rng = np.random.default_rng(7)
    gp = np.linspace(0, 4e10, 12)
    pz = 5200 * (1 - gp / 9e10) + rng.normal(0, 15, gp.size)
    fit = st.pz_fit(gp_scf=gp, p=pz, z=np.ones_like(gp))
    lr = stats.linregress(gp, pz)
    assert fit["slope"] == pytest.approx(lr.slope, rel=1e-10)
    assert fit["slope_se"] == pytest.approx(lr.stderr, rel=1e-8)
    assert fit["intercept_se"] == pytest.approx(lr.intercept_stderr, rel=1e-8)
    assert fit["r2"] == pytest.approx(lr.rvalue**2, rel=1e-10)
    assert fit["g"] == pytest.approx(-lr.intercept / lr.slope, rel=1e-10)
    assert fit["g"] == pytest.approx(9e10, rel=0.03)


# ---- Oil: Havlena-Odeh, history match -----------------------------------------------------------


def test_havlena_odeh_round_trips():
    pvt = make_pvt()
    t, p = declining(25, 1800.0)
    h = synthetic(pvt, t, p, 3e7, 0.4)
    f = mb.havlena_odeh_fit(pvt, **h, **RES, case="gas_cap_unknown_m")
    assert f["n"] == pytest.approx(3e7, rel=1e-8)
    assert f["m"] == pytest.approx(0.4, rel=1e-7)
    assert not f["used"][0]  # the initial row has Et = 0
    aq = st.Aquifer(model="veh", constant=250.0, td_per_day=0.8, red=6.0)
    h = synthetic(pvt, t, p, 4e7, 0.0, aq)
    f = mb.havlena_odeh_fit(pvt, **h, **RES, case="water_drive", aquifer=aq)
    assert f["n"] == pytest.approx(4e7, rel=1e-8)
    assert f["aquifer_constant"] == pytest.approx(250.0, rel=1e-8)


def test_history_match_agrees_with_scipy_least_squares():
    """The withdrawal objective against scipy.optimize.least_squares on the same residual,
    written here with the public building blocks."""
    from scipy import optimize

    pvt = make_pvt()
    t, p = declining(30, 2000.0)
    truth = st.Aquifer(model="fetkovich", constant=3000.0, tau_days=250.0)
    h = synthetic(pvt, t, p, 2e7, 0.0, truth)
    rng = np.random.default_rng(3)
    h["p"] = np.minimum(h["p"] + np.r_[0, rng.normal(0, 3, len(t) - 1)], PI)
    start = st.Aquifer(model="fetkovich", constant=1.0, tau_days=50.0)
    ours = mb.history_match(pvt, **h, **RES, m=0.0, aquifer=start, objective="withdrawal")
    terms = mb.oil_mbe_terms(pvt, **h, **RES)
    rows = slice(1, None)

    def resid(x):
        n, c, tau = np.exp(x)
        we = st.Aquifer(model="fetkovich", constant=c, tau_days=tau).influx(h["t_days"], h["p"], p_initial=PI)
        return ((terms["f"] - n * terms["et"] - we)[rows]) / 1e5

    x0 = np.log([ours["n"] * 0.9, ours["aquifer"].constant * 1.2, ours["aquifer"].tau_days * 0.8])
    ref = optimize.least_squares(resid, x0, xtol=1e-14, ftol=1e-14, gtol=1e-14)
    n, c, tau = np.exp(ref.x)
    assert ours["n"] == pytest.approx(n, rel=1e-5)
    assert ours["aquifer"].constant == pytest.approx(c, rel=1e-4)
    assert ours["aquifer"].tau_days == pytest.approx(tau, rel=1e-4)
    # Interval half-width over the standard error is Student's t (scipy.stats.t) for a
    # parameter estimated in logarithms: ln(hi / value) = t * se / value.
    from scipy import stats

    dof = len(t) - 1 - 3
    e = ours["parameters"]["n"]
    assert np.log(e["ci_high"] / e["value"]) == pytest.approx(stats.t.ppf(0.975, dof) * e["std_error"] / e["value"], rel=2e-3)


def test_history_match_pressure_objective_with_noise():
    pvt = make_pvt()
    t, p = declining(40, 2000.0)
    truth = st.Aquifer(model="veh", constant=250.0, td_per_day=0.8)
    h = synthetic(pvt, t, p, 4e7, 0.25, truth)
    start = st.Aquifer(model="veh", constant=1.0, td_per_day=0.1)
    exact = mb.history_match(pvt, **h, **RES, aquifer=start)
    assert exact["n"] == pytest.approx(4e7, rel=1e-5)
    assert exact["m"] == pytest.approx(0.25, abs=1e-4)
    assert exact["aquifer"].td_per_day == pytest.approx(0.8, rel=1e-3)
    rng = np.random.default_rng(11)
    h["p"] = np.minimum(h["p"] + np.r_[0, rng.uniform(-5, 5, len(t) - 1)], PI)
    noisy = mb.history_match(pvt, **h, **RES, aquifer=start)
    e = noisy["parameters"]["n"]
    assert noisy["n"] == pytest.approx(4e7, rel=0.05)
    assert e["ci_low"] < 4e7 * 1.01 and 4e7 * 0.99 < e["ci_high"]
    assert noisy["rms"] < 5.0  # psi: the model matches to the noise level
    df = mb.to_frame(noisy)
    assert {"p_model", "residuals", "we"} <= set(df.columns)
    pd = pytest.importorskip("pandas")
    again = mb.history_match(pvt, **mb.history_from_frame(pd.DataFrame(h)), **RES, aquifer=start)
    assert again["n"] == noisy["n"]


def test_history_match_batch_parallel_and_gil_released():
    pvt = make_pvt()
    t, p = declining(60, 2000.0)
    aq = st.Aquifer(model="veh", constant=200.0, td_per_day=0.5)
    hs = [synthetic(pvt, t, p, n, 0.0, aq) for n in (2e7, 3e7, 4e7, 5e7)]
    start = st.Aquifer(model="veh", constant=1.0, td_per_day=0.2)
    out = mb.history_match_batch([pvt] * 4, hs, p_initial=[PI] * 4, swi=[0.2] * 4, cw=[3e-6] * 4, cf=[4e-6] * 4, m=0.0, aquifer=start)
    assert [r["n"] for r in out] == pytest.approx([2e7, 3e7, 4e7, 5e7], rel=1e-5)
    # A bad history in a batch: "coerce" keeps going and returns the exception in place.
    bad = dict(hs[0])
    bad["p"] = bad["p"].copy()
    bad["p"][5] = PI + 10
    out = mb.history_match_batch([pvt] * 2, [hs[1], bad], p_initial=[PI] * 2, swi=[0.2] * 2, cw=[0.0] * 2, cf=[0.0] * 2, aquifer=start, errors="coerce")
    assert isinstance(out[1], st.InvalidRecordError) and "row 5" in str(out[1])
    # The GIL is released during the match: a Python thread keeps counting.
    counter = [0]
    stop = threading.Event()

    def count():
        while not stop.is_set():
            counter[0] += 1

    th = threading.Thread(target=count)
    th.start()
    t0 = time.perf_counter()
    before = counter[0]
    mb.history_match_batch([pvt] * 8, hs * 2, p_initial=[PI] * 8, swi=[0.2] * 8, cw=[3e-6] * 8, cf=[4e-6] * 8, m=0.0, aquifer=start)
    during = counter[0] - before
    elapsed = time.perf_counter() - t0
    stop.set()
    th.join()
    assert elapsed > 0 and during > 1000


def test_drive_indices_and_classification():
    pvt = make_pvt()
    t, p = declining(30, 2000.0)
    aq = st.Aquifer(model="fetkovich", constant=3000.0, tau_days=200.0)
    h = synthetic(pvt, t, p, 2e7, 0.0, aq)
    we = aq.influx(t, p, p_initial=PI)
    d = mb.drive_indices(pvt, **h, **RES, n=2e7, m=0.0, we=we)
    assert np.allclose(d["sum"][1:], 1.0, atol=1e-10)  # the indices close the balance
    c = mb.classify_drive(pvt, **h, **RES)
    assert "water" in c["mechanism"] and len(c["evidence"]) >= 3
    h = synthetic(pvt, t, p, 2e7, 0.0)
    c = mb.classify_drive(pvt, **h, **RES)
    assert c["mechanism"] == "solution-gas drive" and c["saturated"]


def test_muskat_forecast_closes_the_balance_and_recovery_arithmetic():
    pvt = make_pvt()
    k = st.CoreyGasOil(swc=0.2, sgc=0.05, sorg=0.15, krg_max=0.7, kro_max=0.9, ng=2.0, no=3.0)
    f = mb.muskat_forecast(pvt, k, p_bubble=PB, p_end=600.0, n_steps=200)
    q = pvt.at(f["p"])
    qb = pvt.at(PB)
    bt = q["bo"] + (qb["rs"] - q["rs"]) * q["bg"]
    i = slice(20, None, 20)
    rp = f["gp_over_n"][i] / f["np_over_n"][i]
    # Solution-gas-drive material balance (Craft & Hawkins 1959, ch. 4):
    # (Np/N) [Bt + (Rp - Rsi) Bg] = Bt - Bti.
    lhs = f["np_over_n"][i] * (bt[i] + (rp - qb["rs"]) * q["bg"][i])
    assert lhs == pytest.approx(bt[i] - qb["bo"], rel=2e-3)
    # RF = Np/N; 37% of 1,000,000 STB is 370,000 STB (common practice, no source).
    assert 0.37 * 1_000_000 == pytest.approx(370_000)
    assert f["np_over_n"][-1] * 1_000_000 == pytest.approx(1_000_000 * f["np_over_n"][-1])
    assert np.all(np.diff(f["np_over_n"]) >= 0)


# ---- Classes, errors -------------------------------------------------------------------------------


def test_classes_pickle_repr_eq():
    pvt = make_pvt()
    assert pickle.loads(pickle.dumps(pvt)) == pvt
    assert "PvtTable(31 rows" in repr(pvt)
    a = st.Aquifer(model="carter_tracy", constant=10.0, td_per_day=0.3, red=8.0)
    assert pickle.loads(pickle.dumps(a)) == a
    assert repr(a) == "Aquifer(model='carter_tracy', constant=10.0, td_per_day=0.3, red=8.0)"
    f = st.Aquifer.fetkovich(wei_rb=1e6, j=10.0, p_initial=2500.0)
    assert f.constant == 400.0 and f.tau_days == 40.0
    with pytest.raises(AttributeError):
        a.constant = 3.0  # frozen


def test_bad_input_names_the_row():
    pvt = make_pvt()
    t, p = declining(6, 2000.0)
    h = synthetic(pvt, t, p, 1e7, 0.0)
    bad = dict(h, t_days=np.r_[h["t_days"][:3], h["t_days"][2], h["t_days"][4:]])
    with pytest.raises(st.InvalidRecordError, match=r"`t_days` at row 3"):
        mb.havlena_odeh_fit(pvt, **bad, **RES)
    bad = dict(h, np_stb=np.r_[h["np_stb"][:4], h["np_stb"][2], h["np_stb"][5:]])
    with pytest.raises(st.InvalidRecordError, match=r"`np_stb` at row 4"):
        mb.havlena_odeh_fit(pvt, **bad, **RES)
    bad = dict(h, gp_scf=-h["gp_scf"])
    with pytest.raises(st.InvalidRecordError, match=r"`gp_scf` at row 1"):
        mb.havlena_odeh_fit(pvt, **bad, **RES)
    bad = dict(h, p=np.r_[h["p"][:2], PI + 1, h["p"][3:]])
    with pytest.raises(st.InvalidRecordError, match=r"`p` at row 2.*above the initial"):
        mb.havlena_odeh_fit(pvt, **bad, **RES)
    bad = dict(h, p=np.r_[h["p"][:5], 300.0])
    with pytest.raises(st.InvalidRecordError, match=r"`p` at row 5.*PVT table"):
        mb.oil_mbe_terms(pvt, **bad, **RES)
    flat = dict(h, p=np.full(6, PI))
    with pytest.raises(st.SingularError):
        mb.havlena_odeh_fit(pvt, **flat, **RES)
    with pytest.raises(st.SingularError):
        st.pz_fit(gp_scf=[0, 1e9, 2e9], p=[4000.0] * 3, z=[0.9] * 3)
    with pytest.raises(st.InvalidOptionError, match="case"):
        mb.havlena_odeh_fit(pvt, **h, **RES, case="nonsense")
    with pytest.raises(st.InvalidRecordError, match=r"`p` at row 1"):
        st.PvtTable(p=[1000, 900], bo=[1.2, 1.3], rs=[300, 500], bg=[0.002, 0.001])
    with pytest.raises(st.InvalidArgumentError, match=r"at index 1"):
        pvt.at([1000.0, 9000.0])
    assert issubclass(st.SingularError, ValueError)


# ---- robustness: unusual inputs (regressions) -----------------------------------------------


def test_veh_tiny_dimensionless_time_ends_and_is_not_nan():
    # tD = 1e-300 used to loop ~1e77 times in the Bessel K integral (cosh h rounded to 1), and
    # a closed aquifer gave NaN (0 x inf) from tD ~ 1e-4 down. Early time, both kinds and a
    # closed aquifer alike: WD ~ pD ~ 2 sqrt(tD/pi) (van Everdingen & Hurst 1949).
    td = np.array([1e-100, 1e-8, 1e-5])
    early = 2.0 * np.sqrt(td / np.pi)
    for red in (np.inf, 5.0):
        wd = st.veh_dimensionless_influx(td, red=red)
        pd_ = st.veh_dimensionless_pressure(td, red=red)
        np.testing.assert_allclose(wd, early, rtol=2e-3)
        np.testing.assert_allclose(pd_, early, rtol=2e-3)
    # Far below any real time (down to the smallest float): the same early-time value.
    td = np.array([1e-300, 5e-324])
    for f in (st.veh_dimensionless_influx, st.veh_dimensionless_pressure):
        np.testing.assert_allclose(f(td), 2.0 * np.sqrt(td / np.pi), rtol=1e-12)
        np.testing.assert_allclose(f(td, red=5.0), 2.0 * np.sqrt(td / np.pi), rtol=1e-12)
    # A huge radius ratio is an infinite aquifer (used to hang the same way).
    assert st.veh_dimensionless_influx(1.0, red=1e300) == pytest.approx(st.veh_dimensionless_influx(1.0), rel=1e-12)


def test_history_length_errors_name_the_python_keywords():
    pvt = make_pvt()
    t, p = declining(6, 2000.0)
    h = synthetic(pvt, t, p, 1e7, 0.0)
    for key, name in [("np_stb", "np_stb"), ("gp_scf", "gp_scf"), ("wp_stb", "wp_stb")]:
        bad = dict(h, **{key: h[key][:-1]})
        with pytest.raises(st.ShapeError, match=f"`{name}` has 5 rows"):
            mb.oil_mbe_terms(pvt, **bad, **RES)
    gp = h["gp_scf"]
    with pytest.raises(st.ShapeError, match="`gp_scf` has 5"):
        st.pz_fit(gp_scf=gp[:-1], p=h["p"], z=np.full(6, 0.9))
    table_p = np.arange(500.0, 3501.0, 100.0)
    with pytest.raises(st.ShapeError, match="`table_p` has 31 rows, `table_z` 30"):
        mb.gas_history_match(
            t_days=t, p=p, gp_scf=gp, p_initial=PI, table_p=table_p, table_z=np.full(30, 0.9), temperature_f=200.0
        )


def test_forecast_impossible_step_count_raises_memoryerror():
    pvt = make_pvt()
    k = st.CoreyGasOil(swc=0.2, sgc=0.05, sorg=0.15)
    for f in (mb.muskat_forecast, mb.tarner_forecast):
        with pytest.raises(MemoryError, match="`n_steps`"):
            f(pvt, k, p_bubble=PB, p_end=600.0, n_steps=2**60)


def test_history_match_batch_rejects_unknown_history_keys():
    # A misspelt key ("wp_stbb") used to be ignored, silently dropping the water column.
    pvt = make_pvt()
    t, p = declining(6, 2000.0)
    h = synthetic(pvt, t, p, 1e7, 0.0)
    bad = {("wp_stbb" if k == "wp_stb" else k): v for k, v in h.items()}
    kw = dict(p_initial=[PI, PI], swi=[0.2, 0.2], cw=[3e-6, 3e-6], cf=[4e-6, 4e-6], m=0.0)
    with pytest.raises(st.InvalidRecordError, match=r"`histories` at row 1: unknown key 'wp_stbb'"):
        mb.history_match_batch([pvt, pvt], [h, bad], **kw)
    out = mb.history_match_batch([pvt, pvt], [h, bad], **kw, errors="coerce")
    assert isinstance(out[0], dict) and isinstance(out[1], st.InvalidRecordError)


def test_history_match_rejects_nan_or_negative_tolerance():
    # A NaN or negative tolerance used to be accepted and the result still said converged.
    pvt = make_pvt()
    t, p = declining(8, 2000.0)
    h = synthetic(pvt, t, p, 1e7, 0.0)
    for tol in (float("nan"), -1.0, 0.0):
        with pytest.raises(st.InvalidArgumentError, match="`tolerance`"):
            mb.history_match(pvt, **h, **RES, m=0.0, tolerance=tol)


def test_negative_step_and_iteration_counts_name_the_argument():
    pvt = make_pvt()
    k = st.CoreyGasOil(swc=0.2, sgc=0.05, sorg=0.15)
    with pytest.raises(st.InvalidArgumentError, match="`n_steps` = -1"):
        mb.muskat_forecast(pvt, k, p_bubble=PB, p_end=600.0, n_steps=-1)
    t, p = declining(8, 2000.0)
    h = synthetic(pvt, t, p, 1e7, 0.0)
    with pytest.raises(st.InvalidArgumentError, match="`max_iterations` = -1"):
        mb.history_match(pvt, **h, **RES, m=0.0, max_iterations=-1)


def test_bt_errors_name_p_with_index_or_p_initial():
    # A pressure off the table gave an unindexed "out of range"; a NaN p_initial was
    # reported as `p`.
    pvt = make_pvt()
    with pytest.raises(st.InvalidArgumentError, match=r"`p` = 9000 at index 1"):
        pvt.bt([1000.0, 9000.0], p_initial=PI)
    out = pvt.bt([1000.0, 9000.0], p_initial=PI, errors="coerce")
    assert np.isfinite(out[0]) and np.isnan(out[1])
    for bad in (float("nan"), 9000.0):
        with pytest.raises(st.InvalidArgumentError, match="`p_initial`"):
            pvt.bt([1000.0], p_initial=bad)


def test_pvt_table_check_reports_unphysical_rows():
    # Facts of the trade (common practice, no source): Rs does not fall and Bg falls as
    # pressure rises; where Rs rises, Bg dRs > dBo (positive total compressibility); at
    # constant Rs (above Pb) Bo falls. A correlation-built table meets them all.
    oil = st.Oil(api=33.0, gas_sg=0.78, temperature_f=190.0, gor=550.0)
    t = oil.table(np.linspace(300.0, 4500.0, 30))
    cols = dict(p=t["p"], bo=t["bo"], rs=t["rs"], bg=t["bg"] / 5.614583333333333)  # rcf -> rb
    assert st.PvtTable(**cols).check() == []
    k = 5
    bad = {c: v.copy() for c, v in cols.items()}
    bad["rs"][k] = bad["rs"][k - 1] - 1.0  # a typing error: Rs falls at row k
    bad["bg"][k + 10] = bad["bg"][k + 9] * 1.01
    rules = {(p, rule) for p, rule, _ in st.PvtTable(**bad).check()}
    assert (cols["p"][k], "rs_falling_with_pressure") in rules
    assert (cols["p"][k + 10], "bg_not_falling_with_pressure") in rules
    # A Bo step up above Pb is reported, and nothing else.
    above = {c: v.copy() for c, v in cols.items()}
    above["bo"][-1] = above["bo"][-2] + 0.01
    v = st.PvtTable(**above).check()
    assert [(p, r) for p, r, _ in v] == [(cols["p"][-1], "bo_not_falling_above_pb")]
    # Bo rising faster than the released gas can fill: negative total compressibility.
    steep = {c: v.copy() for c, v in cols.items()}
    steep["bo"][2] = steep["bo"][1] + 0.2
    assert any(r == "negative_total_compressibility" and p == cols["p"][2] for p, r, _ in st.PvtTable(**steep).check())

"""Tarner forecast and gas history match through the Python API.

References outside the project: numpy.linalg.lstsq (linear least squares and its
covariance s^2 (X^T X)^-1) for the withdrawal objective with a pot aquifer, and the
Muskat (1945) forecast as an independent published method for Tarner (1944). Synthetic
histories are round trips, not check values.
"""

import numpy as np
import pytest

import stocktank as st
from stocktank import material_balance as mb

PB = 2500.0
PI_GAS = 5000.0
TF = 200.0
G = 8e10


def make_pvt():
    """A smooth synthetic black-oil table with viscosities (a generator for round trips)."""
    p = np.arange(400.0, 3401.0, 100.0)
    s = np.minimum(p, PB)
    rs = 100.0 + 0.2 * s
    bob = 1.05 + 0.00012 * rs
    bo = np.where(p <= PB, bob, (1.05 + 0.00012 * (100 + 0.2 * PB)) * np.exp(-1.2e-5 * (p - PB)))
    z = 1.0 - 6e-5 * p + 1.2e-8 * p * p
    bg = 0.00504 * z * 640.0 / p
    mu_o = np.where(p <= PB, 2.2 - 0.0005 * p, 2.2 - 0.0005 * PB + 1e-5 * (p - PB))
    return st.PvtTable(p=p, bo=bo, rs=rs, bg=bg, mu_o=mu_o, mu_g=0.012 + 2.5e-6 * p)


def test_tarner_matches_muskat_and_gor_equals_rs_below_sgc():
    pvt = make_pvt()
    k = st.CoreyGasOil(swc=0.2, sgc=0.05, sorg=0.15, krg_max=0.7, kro_max=0.9, ng=2.0, no=3.0)
    mu = mb.muskat_forecast(pvt, k, p_bubble=PB, p_end=600.0, n_steps=190)
    ta = mb.tarner_forecast(pvt, k, p_bubble=PB, p_end=600.0, n_steps=190)
    assert set(mu) <= set(ta) and {"iterations", "max_mismatch"} <= set(ta)
    np.testing.assert_array_equal(ta["p"], mu["p"])
    # Two independent published methods agree within 1e-4 (Np/N) and 3e-4 (GOR, where it
    # rises steeply) relative, with 10-psi steps.
    np.testing.assert_allclose(ta["np_over_n"][1:], mu["np_over_n"][1:], rtol=1e-4)
    np.testing.assert_allclose(ta["gor"], mu["gor"], rtol=3e-4)
    # GOR = Rs while Sg < Sgc (common practice, no source).
    below = ta["sg"] < k.sgc
    assert below.sum() > 3
    np.testing.assert_allclose(ta["gor"][below], pvt.at(ta["p"][below])["rs"], rtol=1e-12)
    # Recovery factor = Np/N; 37% of 1,000,000 STB is 370,000 STB (common practice, no source).
    assert 0.37 * 1_000_000 == pytest.approx(370_000)
    assert np.all(np.diff(ta["np_over_n"]) > 0)
    assert ta["iterations"].dtype.kind == "u" and ta["iterations"][0] == 0
    with pytest.raises(st.InvalidArgumentError, match="p_end"):
        mb.tarner_forecast(pvt, k, p_bubble=PB, p_end=PB + 10, n_steps=10)


def z_of(p):
    return 1.0 - 6e-5 * p + 1.2e-8 * p * p


TABLE_P = np.arange(500.0, 5501.0, 100.0)
TABLE = dict(table_p=TABLE_P, table_z=z_of(TABLE_P), temperature_f=TF)


def gas_history(aquifer=None, n=40, ce=0.0):
    t = 60.0 * np.arange(n)
    p = PI_GAS - 2200.0 * (1 - np.exp(-t / 1500.0))
    bg = st.gas_bg(p, z_of(p), temperature_f=TF)
    bgi = st.gas_bg(PI_GAS, z_of(PI_GAS), temperature_f=TF)
    we = aquifer.influx(t, p, p_initial=PI_GAS) if aquifer is not None else 0.0
    gp = (G * (bg - bgi + bgi * ce * (PI_GAS - p)) + we) / bg
    return t, p, gp


def test_gas_history_match_round_trip_fetkovich():
    truth = st.Aquifer(model="fetkovich", constant=2e4, tau_days=400.0)
    t, p, gp = gas_history(truth)
    start = st.Aquifer(model="fetkovich", tau_days=50.0)
    f = mb.gas_history_match(t_days=t, p=p, gp_scf=gp, p_initial=PI_GAS, aquifer=start, **TABLE)
    assert f["g"] == pytest.approx(G, rel=1e-5)
    assert f["aquifer"].constant == pytest.approx(2e4, rel=1e-4)
    assert f["aquifer"].tau_days == pytest.approx(400.0, rel=1e-4)
    assert list(f["parameters"]) == ["g", "aquifer_constant", "tau_days"]
    assert f["correlation"].shape == (3, 3)
    assert isinstance(f["warnings"], list) and f["condition_number"] >= 1.0
    # The same history through a Bg table instead of z.
    bg = st.gas_bg(TABLE_P, z_of(TABLE_P), temperature_f=TF)
    f2 = mb.gas_history_match(
        t_days=t, p=p, gp_scf=gp, p_initial=PI_GAS, aquifer=start, table_p=TABLE_P, table_bg=bg
    )
    assert f2["g"] == pytest.approx(G, rel=1e-5)


def test_gas_withdrawal_match_equals_numpy_lstsq():
    # With a pot aquifer the withdrawal objective F = G Et + C (pi - p) is linear in (G, C):
    # the match must equal numpy.linalg.lstsq, its standard errors s^2 (X^T X)^-1.
    truth = st.Aquifer(model="pot", constant=5e3)
    t, p, gp = gas_history(truth, n=30)
    rng = np.random.default_rng(7)
    gp = np.maximum.accumulate(gp * (1 + 0.01 * rng.standard_normal(gp.size)) * (t > 0))
    bg = st.gas_bg(p, z_of(p), temperature_f=TF)
    # A Bg table on the history's own pressures: no interpolation between the two sides.
    f = mb.gas_history_match(
        t_days=t,
        p=p,
        gp_scf=gp,
        p_initial=PI_GAS,
        aquifer=truth,
        objective="withdrawal",
        table_p=p[::-1],
        table_bg=bg[::-1],
    )
    bgi = st.gas_bg(PI_GAS, z_of(PI_GAS), temperature_f=TF)
    rows = slice(1, None)
    x = np.column_stack([(bg - bgi)[rows], (PI_GAS - p)[rows]])
    y = (gp * bg)[rows]
    coef, ssr, *_ = np.linalg.lstsq(x, y, rcond=None)
    s2 = ssr[0] / (x.shape[0] - 2)
    se = np.sqrt(np.diag(s2 * np.linalg.inv(x.T @ x)))
    assert f["g"] == pytest.approx(coef[0], rel=1e-7)
    assert f["aquifer"].constant == pytest.approx(coef[1], rel=1e-6)
    assert f["parameters"]["g"]["std_error"] == pytest.approx(se[0], rel=1e-3)
    assert f["parameters"]["aquifer_constant"]["std_error"] == pytest.approx(se[1], rel=1e-3)
    corr = -(np.linalg.inv(x.T @ x)[0, 1]) / np.sqrt(np.prod(np.diag(np.linalg.inv(x.T @ x))))
    assert f["correlation"][0, 1] == pytest.approx(-corr, abs=1e-4)


def test_gas_history_match_abnormal_pressure_and_errors():
    ce = (3e-6 * 0.25 + 1.5e-5) / 0.75
    t, p, gp = gas_history(None, n=25, ce=ce)
    f = mb.gas_history_match(
        t_days=t, p=p, gp_scf=gp, p_initial=PI_GAS, swi=0.25, cw=3e-6, cf=1.5e-5, **TABLE
    )
    assert f["g"] == pytest.approx(G, rel=1e-6)
    naive = mb.gas_history_match(t_days=t, p=p, gp_scf=gp, p_initial=PI_GAS, **TABLE)
    assert naive["g"] > 1.02 * G  # ignoring rock and water expansion overestimates G
    fc = mb.gas_history_match(t_days=t, p=p, gp_scf=gp, p_initial=PI_GAS, fit_ce=True, **TABLE)
    assert list(fc["parameters"]) == ["g", "ce"]
    assert fc["g"] == pytest.approx(G, rel=1e-5) and fc["ce"] == pytest.approx(ce, rel=1e-4)
    assert f["ce"] == pytest.approx(ce, rel=1e-12)
    bad = gp.copy()
    bad[5] = bad[4] - 1.0
    with pytest.raises(st.InvalidRecordError, match=r"`gp_scf` at row 5"):
        mb.gas_history_match(t_days=t, p=p, gp_scf=bad, p_initial=PI_GAS, **TABLE)
    z = z_of(TABLE_P)
    z[3] = -1.0
    with pytest.raises(st.InvalidRecordError, match=r"`table_z` at row 3"):
        mb.gas_history_match(
            t_days=t, p=p, gp_scf=gp, p_initial=PI_GAS, table_p=TABLE_P, table_z=z, temperature_f=TF
        )
    with pytest.raises(st.InvalidOptionError):
        mb.gas_history_match(t_days=t, p=p, gp_scf=gp, p_initial=PI_GAS, table_p=TABLE_P, table_z=z)
    with pytest.raises(st.InvalidRecordError, match=r"`p` at row"):
        mb.gas_history_match(
            t_days=t, p=p, gp_scf=gp, p_initial=PI_GAS, table_p=[4000.0, 5000.0], table_bg=[8e-4, 7e-4]
        )


def test_oil_history_match_reports_identifiability():
    from test_material_balance import RES, declining, make_pvt as make_oil_pvt, synthetic

    pvt = make_oil_pvt()
    t, p = declining(10, 2900.0)
    h = synthetic(pvt, t, p, 3e7, 0.3, st.Aquifer(model="pot", constant=500.0))
    pot = st.Aquifer(model="pot")
    with pytest.raises(st.SingularError, match=r"condition number.*`n` and `m`"):
        mb.history_match(pvt, **h, **RES, m=None, aquifer=pot, objective="withdrawal")
    f = mb.history_match(pvt, **h, **RES, m=0.3, aquifer=pot, objective="withdrawal")
    assert f["n"] == pytest.approx(3e7, rel=1e-5)
    assert f["condition_number"] > 1e4
    assert any("`n` and `aquifer_constant` are correlated" in w for w in f["warnings"])


def fetkovich_unit_influx(t, p, pi, tau):
    """Fetkovich (1971) pseudo-steady-state influx per unit C = Wei/pi, written here
    independently: dWe_n = C (pa_(n-1) - pbar_n)(1 - exp(-dt/tau)), pa = pi - We/C,
    pbar_n = (p_(n-1) + p_n)/2 (Fetkovich 1971; Dake 1978, section 9.7)."""
    we = np.zeros_like(p)
    for n in range(1, len(p)):
        pa = pi - we[n - 1]  # per unit C
        pbar = 0.5 * (p[n - 1] + p[n])
        we[n] = we[n - 1] + (pa - pbar) * (1 - np.exp(-(t[n] - t[n - 1]) / tau))
    return we


def test_gas_withdrawal_match_equals_scipy_least_squares_fetkovich():
    # Noisy production, Fetkovich aquifer: the withdrawal match of (G, C, tau) must land
    # where scipy.optimize.least_squares lands on the same model written in numpy.
    from scipy import optimize

    truth = st.Aquifer(model="fetkovich", constant=2e4, tau_days=400.0)
    t, p, gp = gas_history(truth, n=40)
    rng = np.random.default_rng(11)
    gp = np.maximum.accumulate(gp * (1 + 0.005 * rng.standard_normal(gp.size)) * (t > 0))
    bg = st.gas_bg(p, z_of(p), temperature_f=TF)
    bgi = bg[0]
    start = st.Aquifer(model="fetkovich", tau_days=100.0)
    f = mb.gas_history_match(
        t_days=t,
        p=p,
        gp_scf=gp,
        p_initial=PI_GAS,
        aquifer=start,
        objective="withdrawal",
        table_p=p[::-1],
        table_bg=bg[::-1],
    )
    y = (gp * bg)[1:]

    def resid(x):
        g, c, tau = np.exp(x)
        return (y - g * (bg - bgi)[1:] - c * fetkovich_unit_influx(t, p, PI_GAS, tau)[1:]) / 1e6

    sol = optimize.least_squares(resid, np.log([5e10, 1e4, 100.0]), method="lm", xtol=1e-14, ftol=1e-14)
    g, c, tau = np.exp(sol.x)
    assert f["g"] == pytest.approx(g, rel=1e-6)
    assert f["aquifer"].constant == pytest.approx(c, rel=1e-5)
    assert f["aquifer"].tau_days == pytest.approx(tau, rel=1e-5)
    # Standard errors from scipy's Jacobian: s^2 (J^T J)^-1 in log space.
    j = sol.jac
    s2 = 2 * sol.cost / (len(y) - 3)
    se = np.sqrt(np.diag(s2 * np.linalg.inv(j.T @ j)))
    assert f["parameters"]["g"]["std_error"] == pytest.approx(g * se[0], rel=1e-4)
    assert f["parameters"]["aquifer_constant"]["std_error"] == pytest.approx(c * se[1], rel=1e-4)


def test_gas_history_match_releases_the_gil():
    # A Python thread keeps counting while the match runs (the work happens without the GIL).
    import threading

    truth = st.Aquifer(model="veh", constant=600.0, td_per_day=0.05)
    t, p, gp = gas_history(truth, n=120)
    start = st.Aquifer(model="veh", td_per_day=0.5)
    bg = st.gas_bg(p, z_of(p), temperature_f=TF)
    table = dict(table_p=p[::-1], table_bg=bg[::-1])  # exact Bg at the history's pressures
    counter = [0]
    stop = threading.Event()

    def count():
        while not stop.is_set():
            counter[0] += 1

    th = threading.Thread(target=count)
    th.start()
    before = counter[0]
    for _ in range(3):
        f = mb.gas_history_match(t_days=t, p=p, gp_scf=gp, p_initial=PI_GAS, aquifer=start, **table)
    during = counter[0] - before
    stop.set()
    th.join()
    assert f["g"] == pytest.approx(G, rel=1e-6)
    assert during > 1000

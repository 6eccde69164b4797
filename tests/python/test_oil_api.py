"""Oil API from Python: custom Gas / Water descriptions in the black-oil tables (one oil and
many wells), and the Oil.co(p) method against numpy derivatives of Bo and the Vasquez-Beggs
equation written out independently."""

import math

import numpy as np
import pytest

import stocktank as st
from stocktank import oil as so

GRID = [500.0, 1000.0, 1500.0, 2000.0, 3000.0, 4000.0, 5000.0]
T = 190.0


def oil(**kw):
    base = dict(api=33.0, gas_sg=0.8, temperature_f=T, gor=500.0)
    base.update(kw)
    return st.Oil(**base)


# ---- custom gas and water in the table builder -----------------------------------------


def test_custom_gas_gives_its_own_bg_z_viscosity_density():
    o = oil()
    sour = st.Gas(0.8, co2=0.10, h2s=0.05, n2=0.02)
    tab = o.table(GRID, gas=sour)
    p = tab["p"]
    # The gas columns are the Gas's own functions called directly.
    np.testing.assert_allclose(tab["z"], sour.z(p, T), rtol=1e-12)
    np.testing.assert_allclose(tab["bg"], sour.bg(p, T), rtol=1e-12)
    np.testing.assert_allclose(tab["gas_viscosity"], sour.viscosity(p, T), rtol=1e-10)
    np.testing.assert_allclose(tab["gas_density"], sour.density(p, T), rtol=1e-12)
    # ... and differ from the default gas of the oil's gravity (Wichert-Aziz shifts Z).
    default = o.table(GRID)
    assert np.all(np.abs(tab["z"] / default["z"] - 1) > 1e-3)
    np.testing.assert_allclose(default["z"], st.Gas(0.8).z(p, T), rtol=1e-12)
    # Oil columns do not depend on the free gas; Bt does, through Bg (Bt = Bo + Bg (Rsi - Rs)).
    for k in ("rs", "bo", "oil_viscosity", "oil_density"):
        np.testing.assert_array_equal(tab[k], default[k])
    bt = tab["bo"] + tab["bg"] / 5.614583333333333 * (o.rsi() - tab["rs"])
    np.testing.assert_allclose(tab["bt"], bt, rtol=1e-12)


def test_custom_water_gives_its_own_bw_and_viscosity():
    o = oil(salinity_wt_pct=1.0)
    brine = st.Water(salinity_wt_pct=8.0, viscosity_method="mccain", gas_saturated=False)
    tab = o.table(GRID, water=brine)
    np.testing.assert_allclose(tab["bw"], brine.bw(tab["p"], T), rtol=1e-12)
    np.testing.assert_allclose(tab["water_viscosity"], brine.viscosity(tab["p"], T), rtol=1e-12)
    default = o.table(GRID)
    np.testing.assert_allclose(default["bw"], st.Water(salinity_wt_pct=1.0).bw(tab["p"], T), rtol=1e-12)
    assert np.all(tab["water_viscosity"] != default["water_viscosity"])
    # A brine at other standard conditions than the oil's would mix two bases in one table.
    with pytest.raises(st.InvalidArgumentError, match="water"):
        o.table(GRID, water=st.Water(salinity_wt_pct=8.0, p_sc=14.65))
    with pytest.raises(TypeError):
        o.table(GRID, gas=brine)


def test_check_table_and_dataframe_helper_take_gas_and_water():
    o = oil()
    sour = st.Gas(0.8, co2=0.2)
    assert o.check_table(GRID, gas=sour) == []
    df = so.black_oil_table(o, GRID, gas=sour, water=st.Water(salinity_wt_pct=3.0))
    np.testing.assert_allclose(df["z"], sour.z(df["p_psia"], T), rtol=1e-12)


def test_many_wells_one_gas_or_one_per_well():
    api, g = [30.0, 35.0, 40.0], [0.75, 0.8, 0.85]
    gases = [st.Gas(0.75, co2=0.05), st.Gas(0.8), st.Gas(0.85, h2s=0.1)]
    out = so.black_oil_tables_arrays(GRID, api, g, T, gor=400.0, gas=gases)
    for w in range(3):
        rows = out["well"] == w
        p = out["p"][rows]
        np.testing.assert_allclose(out["z"][rows], gases[w].z(p, T), rtol=1e-12)
        single = st.Oil(api=api[w], gas_sg=g[w], temperature_f=T, gor=400.0).table(GRID, gas=gases[w])
        np.testing.assert_allclose(out["bg"][rows], single["bg"], rtol=1e-14)
    one = so.black_oil_tables_arrays(GRID, api, g, T, gor=400.0, gas=gases[0])
    np.testing.assert_allclose(one["z"], gases[0].z(one["p"], T), rtol=1e-12)
    brines = [st.Water(salinity_wt_pct=s) for s in (0.0, 5.0, 10.0)]
    w = so.black_oil_tables_arrays(GRID, api, g, T, gor=400.0, water=brines)
    for k in range(3):
        rows = w["well"] == k
        np.testing.assert_allclose(w["bw"][rows], brines[k].bw(w["p"][rows], T), rtol=1e-12)
    df = so.black_oil_tables(GRID, api, g, T, gor=400.0, gas=gases, well=["A", "B", "C"])
    assert set(df["well"]) == {"A", "B", "C"}


def test_many_wells_bad_gas_or_water_arguments():
    args = (GRID, [30.0, 35.0], 0.8, T)
    with pytest.raises(st.ShapeError, match="gas"):
        so.black_oil_tables_arrays(*args, gor=400.0, gas=[st.Gas(0.8)] * 3)
    with pytest.raises(TypeError, match=r"`gas`\[1\]"):
        so.black_oil_tables_arrays(*args, gor=400.0, gas=[st.Gas(0.8), "methane"])
    with pytest.raises(TypeError, match="`water`"):
        so.black_oil_tables_arrays(*args, gor=400.0, water=3.0)
    with pytest.raises(TypeError, match="salinity_wt_pct"):
        so.black_oil_tables_arrays(*args, gor=400.0, salinity_wt_pct=2.0, water=st.Water())
    # The batch's standard conditions are the oils'; a Water at other ones is refused per well.
    with pytest.raises(st.InvalidRecordError, match="water"):
        so.black_oil_tables_arrays(*args, gor=400.0, water=st.Water(t_sc=59.0))
    out = so.black_oil_tables_arrays(*args, gor=400.0, water=st.Water(t_sc=59.0), errors="coerce")
    assert [w for (w, _) in out["errors"]] == [0, 1]


# ---- Oil.co ---------------------------------------------------------------------------------


def vasquez_beggs_co(p, rsb, gas_sg, api, t_f):
    # Vasquez, M., Beggs, H.D. (1980), JPT 32(6), 968-970: co in 1/psi above Pb, the equation
    # as published (written here from the paper's form, from memory).
    return (-1433.0 + 5.0 * rsb + 17.2 * t_f - 1180.0 * gas_sg + 12.61 * api) / (1e5 * p)


def test_co_above_pb_is_vasquez_beggs_and_minus_dlnbo_dp():
    o = oil()
    pb = o.bubble_point()
    p = np.linspace(pb + 50.0, 6000.0, 40)
    co = o.co(p)
    np.testing.assert_allclose(co, vasquez_beggs_co(p, 500.0, 0.8, 33.0, T), rtol=1e-12)
    np.testing.assert_allclose(co, so.co_undersaturated(p, 500.0, 0.8, 33.0, T), rtol=1e-14)
    # co = -(1/Bo) dBo/dp: numerical derivative of Bo (numpy, central differences).
    h = 0.5
    dbo = (o.bo(p + h) - o.bo(p - h)) / (2 * h)
    np.testing.assert_allclose(co, -dbo / o.bo(p), rtol=1e-6)
    # Petrosky-Farshad when chosen.
    pf = oil(co_method="petrosky_farshad")
    np.testing.assert_allclose(pf.co(p), so.co_undersaturated(p, 500.0, 0.8, 33.0, T, method="petrosky_farshad"))


def test_co_below_pb_is_apparent_compressibility():
    o = oil()
    pb = o.bubble_point()
    p = np.linspace(400.0, pb - 50.0, 30)
    gas = st.Gas(0.8)
    h = 0.05
    bo = o.bo(p)
    dbo = (o.bo(p + h) - o.bo(p - h)) / (2 * h)
    drs = (o.rs(p + h) - o.rs(p - h)) / (2 * h)
    # McCain (1988)-type apparent co: -(1/Bo) dBo/dp + (Bg/Bo) dRs/dp, Bg in rb/scf.
    ref = -dbo / bo + gas.bg(p, T) / 5.614583333333333 * drs / bo
    np.testing.assert_allclose(o.co(p), ref, rtol=1e-6)
    # The table's co column holds the same values.
    tab = o.table(list(p))
    below = tab["p"] < pb
    np.testing.assert_allclose(o.co(tab["p"][below]), tab["co"][below], rtol=1e-12)
    # A sour liberated gas (lower Z, smaller Bg) gives a smaller apparent co.
    sour = st.Gas(0.8, co2=0.2, h2s=0.1)
    assert np.all(o.co(p, gas=sour) != o.co(p))
    np.testing.assert_allclose(o.co(p, gas=sour), -dbo / bo + sour.bg(p, T) / 5.614583333333333 * drs / bo, rtol=1e-6)


def test_co_array_semantics_and_errors():
    o = oil()
    assert isinstance(o.co(3000.0), float)
    out = o.co([[1000.0, 2000.0], [3000.0, 4000.0]])
    assert out.shape == (2, 2) and out.dtype == np.float64
    r = o.co([3000.0, np.nan])
    assert r[0] > 0 and math.isnan(r[1])
    with pytest.raises(st.InvalidArgumentError, match=r"`p` = -5(\.0)? at index 1"):
        o.co([3000.0, -5.0])
    c = o.co([3000.0, -5.0], errors="coerce")
    assert c[0] > 0 and math.isnan(c[1])
    # Below Pb the liberated gas makes the oil far more compressible (common practice, no source).
    pb = o.bubble_point()
    assert o.co(pb - 200.0) > 5 * o.co(pb + 200.0)

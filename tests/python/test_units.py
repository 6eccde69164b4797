"""Unit conversions checked against pint (a general-purpose units library from PyPI)."""

import numpy as np
import pint
import pytest

import stocktank as st
from stocktank.units import FIELD, METRIC, UnitSystem, convert

U = pint.UnitRegistry()
# pint's "acre" is the US survey acre (4 ppm larger); the project uses the international acre,
# 43,560 international ft2 (CONVENTIONS, NIST SP 811). pint's oil_barrel is 42 US gal.
PINT = {
    "psia": "psi",
    "psi": "psi",
    "Pa": "Pa",
    "kPa": "kPa",
    "MPa": "MPa",
    "bar": "bar",
    "atm": "standard_atmosphere",
    "m3": "m**3",
    "sm3": "m**3",
    "rm3": "m**3",
    "bbl": "oil_barrel",
    "STB": "oil_barrel",
    "rb": "oil_barrel",
    "ft3": "ft**3",
    "scf": "ft**3",
    "rcf": "ft**3",
    "Mscf": None,
    "acre-ft": None,
    "kg/m3": "kg/m**3",
    "g/cm3": "g/cm**3",
    "lbm/ft3": "lb/ft**3",
    "cp": "centipoise",
    "mPa.s": "mPa*s",
    "Pa.s": "Pa*s",
    "1/psi": "1/psi",
    "1/Pa": "1/Pa",
    "1/kPa": "1/kPa",
    "1/MPa": "1/MPa",
    "1/bar": "1/bar",
    "ft2": "ft**2",
    "m2": "m**2",
    "ha": "hectare",
    "km2": "km**2",
    "ft": "ft",
    "m": "m",
    "in": "inch",
    "md": "millidarcy",
    "D": "darcy",
    "um2": "um**2",
}
SCALED = {"MSTB": (1e3, "oil_barrel"), "MMSTB": (1e6, "oil_barrel"), "Mscf": (1e3, "ft**3"), "MMscf": (1e6, "ft**3"), "Bscf": (1e9, "ft**3"), "acre-ft": (43560.0, "ft**3"), "acre": (43560.0, "ft**2"), "e3m3": (1e3, "m**3"), "e6m3": (1e6, "m**3")}


def pint_unit(name):
    if name in SCALED:
        k, base = SCALED[name]
        return U.Quantity(k, base)
    p = PINT.get(name)
    return None if p is None else U.Quantity(1.0, p)


LINEAR = [u for u in st.units.UNITS if pint_unit(u) is not None]


@pytest.mark.parametrize("name", LINEAR)
def test_every_linear_factor_against_pint(name):
    # Each unit to the field unit of its quantity, compared with pint's conversion.
    field = FIELD.get(st.units.unit_quantity(name)) or {"volume": "bbl", "gas_oil_ratio": "scf/STB", "volume_factor": "rb/STB"}.get(
        st.units.unit_quantity(name)
    )
    if field is None:
        field = {"area": "acre", "length": "ft", "permeability": "md"}[st.units.unit_quantity(name)]
    ours = convert(1.0, name, field)
    q = pint_unit(name)
    ref = q.to(pint_unit(field).units).magnitude / pint_unit(field).magnitude
    assert ours == pytest.approx(ref, rel=1e-12)


def test_ratios_against_pint():
    # GOR and FVF ratios are quotients of volume units.
    ref = (U.Quantity(1, "m**3") / U.Quantity(1, "m**3")).to("ft**3/oil_barrel").magnitude
    assert convert(1.0, "sm3/sm3", "scf/STB") == pytest.approx(ref, rel=1e-12)
    ref = (U.Quantity(1, "oil_barrel") / U.Quantity(1000, "ft**3")).to("dimensionless").magnitude
    assert convert(1.0, "rb/Mscf", "rcf/scf") == pytest.approx(ref, rel=1e-12)
    assert convert(1.3, "rb/STB", "rm3/sm3") == 1.3


def test_temperature_and_gauge_against_pint():
    for t in [-40.0, 0.0, 60.0, 212.0, 350.0]:
        assert convert(t, "degF", "degC") == pytest.approx(U.Quantity(t, U.degF).to(U.degC).magnitude, rel=1e-12, abs=1e-12)
        assert convert(t, "degF", "K") == pytest.approx(U.Quantity(t, U.degF).to(U.kelvin).magnitude, rel=1e-12)
        assert convert(t, "degF", "degR") == pytest.approx(U.Quantity(t, U.degF).to(U.degR).magnitude, rel=1e-12)
    # 0 psig is 1 standard atmosphere (common practice, no source).
    atm = U.Quantity(1, "standard_atmosphere").to("psi").magnitude
    assert convert(0.0, "psig", "psia") == pytest.approx(atm, rel=1e-14)
    assert convert(100.0, "psig", "kPa") == pytest.approx(U.Quantity(100 + atm, "psi").to("kPa").magnitude, rel=1e-12)


def test_acre_ft_constants():
    # 7758 bbl per acre-ft and 43,560 ft3 per acre-ft from the unit definitions and pint
    # (pint's survey acre gives 7758.40; the international acre 7758.37: both are "7758").
    ours = convert(1.0, "acre-ft", "bbl")
    assert round(ours) == 7758
    assert ours == pytest.approx((U.Quantity(43560, "ft**3")).to("oil_barrel").magnitude, rel=1e-14)
    assert round(U.Quantity(1, "acre*ft").to("oil_barrel").magnitude) == 7758
    assert convert(1.0, "acre-ft", "ft3") == pytest.approx(43560.0, rel=1e-15)


def test_array_and_errors():
    out = convert([[1.0], [2.0]], "bar", "kPa")
    assert isinstance(out, np.ndarray) and out.shape == (2, 1)
    assert np.isnan(convert([np.nan], "bar", "kPa")[0])
    assert isinstance(convert(1, "bar", "kPa"), float)
    with pytest.raises(st.InvalidOptionError, match="to_unit"):
        convert(1.0, "psia", "ft")
    with pytest.raises(st.InvalidOptionError, match="from_unit"):
        convert(1.0, "furlong", "ft")


def test_unit_system_and_metric_namespace():
    # A metric call equals the field call with hand-converted inputs and output.
    a_m2, h_m = 2.6e6, 12.0
    n_field = st.ooip(convert(a_m2, "m2", "acre"), convert(h_m, "m", "ft"), 0.8, 0.2, 0.25, 1.2)
    assert st.metric.ooip(a_m2, h_m, 0.8, 0.2, 0.25, 1.2) == pytest.approx(convert(n_field, "STB", "sm3"), rel=1e-13)
    g = st.metric.ogip(a_m2, h_m, 1.0, 0.2, 0.25, 0.004)
    assert g == pytest.approx(a_m2 * h_m * 0.2 * 0.75 / 0.004, rel=1e-12)  # m3/(rm3/sm3) = sm3
    # Keywords, arrays and renamed arguments work; pressures in kPa.
    rf = st.metric.gas_recovery_factor_pz(pi=20000.0, zi=0.9, pa=[2000.0, 4000.0], za=0.97)
    assert rf == pytest.approx(1 - (np.array([2000.0, 4000.0]) / 0.97) / (20000.0 / 0.9))
    rf = st.metric.arps_water_drive(0.25, 0.25, 1.2, 500.0, 0.5, 2.0, 20000.0, 10000.0)
    assert rf == pytest.approx(st.arps_water_drive(0.25, 0.25, 1.2, 500.0, 0.5, 2.0, 20000 / 6.894757293168361, 10000 / 6.894757293168361), rel=1e-12)
    ns = UnitSystem(area="km2", oil_volume="e6m3").namespace()
    assert ns.ooip(2.6, h_m, 0.8, 0.2, 0.25, 1.2) == pytest.approx(st.metric.ooip(a_m2, h_m, 0.8, 0.2, 0.25, 1.2) / 1e6, rel=1e-12)
    assert "m2" in st.metric.ooip.__doc__ and METRIC["pressure"] == "kPa"
    with pytest.raises(st.InvalidOptionError):
        UnitSystem(area="kPa")


def test_metric_probabilistic_matches_field():
    D = st.Distribution
    m2_per_acre = convert(1.0, "acre", "m2")
    kw = dict(porosity=D.uniform(0.15, 0.25), sw=0.3, fvf=1.2, trials=20000, seed=4)
    met = st.metric.probabilistic_in_place("oil", area=D.triangular(3e6, 4e6, 6e6), thickness=D.uniform(8.0, 15.0), **kw)
    fld = st.probabilistic_in_place(
        "oil",
        area=D.triangular(3e6 / m2_per_acre, 4e6 / m2_per_acre, 6e6 / m2_per_acre),
        thickness=D.uniform(8.0 / 0.3048, 15.0 / 0.3048),
        **kw,
    )
    assert met["unit"] == "sm3"
    assert met["summary"]["p50"] == pytest.approx(convert(fld["summary"]["p50"], "STB", "sm3"), rel=1e-9)
    assert met["inputs"]["area"].max() <= 6e6 * (1 + 1e-12)


def test_metric_gas_functions_and_class():
    # A metric call equals the field call with inputs and outputs converted by hand.
    p_kpa, t_c = np.array([5000.0, 20000.0]), 90.0
    p_psia, t_f = convert(p_kpa, "kPa", "psia"), convert(t_c, "degC", "degF")
    g = st.metric.Gas(0.7, co2=0.02)
    field = st.Gas(0.7, co2=0.02)
    np.testing.assert_allclose(g.z(p_kpa, t_c), field.z(p_psia, t_f), rtol=1e-14)
    np.testing.assert_allclose(g.density(p_kpa, t=t_c), convert(field.density(p_psia, t_f), "lbm/ft3", "kg/m3"), rtol=1e-13)
    np.testing.assert_allclose(g.cg(p=p_kpa, t=t_c), convert(field.cg(p_psia, t_f), "1/psi", "1/kPa"), rtol=1e-13)
    np.testing.assert_allclose(g.bg(p_kpa, t_c), field.bg(p_psia, t_f), rtol=1e-13)  # rcf/scf = rm3/sm3
    assert g.tpc_r == pytest.approx(convert(field.tpc_r, "degR", "K"), rel=1e-14)
    assert g.field == field and g == st.metric.Gas(0.7, co2=0.02)
    tpc, ppc = st.metric.pseudo_critical(0.7)
    assert ppc == pytest.approx(convert(st.gas.pseudo_critical(0.7)[1], "psia", "kPa"), rel=1e-14)
    z = 0.9
    assert st.metric.bg(p=20000.0, t=90.0, z=z) == pytest.approx(st.bg(convert(20000.0, "kPa", "psia"), convert(90.0, "degC", "degF"), z), rel=1e-13)


def test_rebase_gas_volume_ideal_gas():
    # Ideal gas law: V2 = V1 (p1 / p2)(T2 / T1) with absolute temperatures.
    v = st.units.rebase_gas_volume([1.0, 2.0], from_p_sc=14.696, from_t_sc=60.0, to_p_sc=14.65, to_t_sc=60.0)
    np.testing.assert_allclose(v, np.array([1.0, 2.0]) * 14.696 / 14.65, rtol=1e-15)
    assert st.units.unit_quantity("kPa") == "pressure"
    with pytest.raises(st.InvalidArgumentError, match="volume"):
        st.units.rebase_gas_volume(-1.0, from_p_sc=14.696, from_t_sc=60.0, to_p_sc=14.65, to_t_sc=60.0)


def test_rebase_errors_name_from_and_to_keywords():
    # Both base conditions used to be reported as `p_sc` / `t_sc`.
    with pytest.raises(st.InvalidArgumentError, match="`from_p_sc` = -1"):
        st.rebase_gas_volume(1.0, from_p_sc=-1.0, from_t_sc=60.0, to_p_sc=14.65, to_t_sc=60.0)
    with pytest.raises(st.InvalidArgumentError, match="`to_t_sc`"):
        st.rebase_gas_volume(1.0, from_p_sc=14.696, from_t_sc=60.0, to_p_sc=14.65, to_t_sc=-500.0)


def test_unit_system_errors_name_the_role():
    # The message used to name unit_factor's own `from_unit`.
    with pytest.raises(st.InvalidOptionError, match=r"role `pressure`.*\"furlong\""):
        UnitSystem(pressure="furlong")
    with pytest.raises(st.InvalidOptionError, match=r"role `area`"):
        UnitSystem(area="kPa")


def test_values_below_absolute_zero_are_errors():
    # Absolute zero is 0 K = -273.15 degC = -459.67 degF, and 1 atm = 14.695949 psi
    # (NIST SP 811): such values used to convert silently (-500 degF gave -22.4 K).
    with pytest.raises(st.InvalidArgumentError, match=r"`value` = -500 at index 1: must not be below absolute zero"):
        st.units.convert([60.0, -500.0], "degF", "K")
    with pytest.raises(st.InvalidArgumentError, match="absolute pressure"):
        st.units.convert(-15.0, "psig", "psia")
    assert st.units.convert(-459.67, "degF", "K") == pytest.approx(0.0, abs=1e-9)
    assert st.units.convert(-14.69, "psig", "psia") > 0.0
    assert st.units.convert(-3.0, "ft", "m") == pytest.approx(-0.9144)  # not checked
    # The metric wrappers convert through the same function.
    with pytest.raises(st.InvalidArgumentError, match="absolute zero"):
        UnitSystem(temperature="degC").to_field(-300.0, "temperature")

"""The metric namespace for oil and water: same numbers as the field functions, converted by pint.

Reference for every conversion: pint's unit definitions (a general-purpose units library).
"""

import numpy as np
import pint
import pytest

import stocktank as st

ureg = pint.UnitRegistry()
SCF_PER_STB_TO_SM3_PER_SM3 = (1.0 * ureg.foot**3 / ureg.oil_barrel).to("dimensionless").magnitude


def kpa(psia):
    return (psia * ureg.psi).to(ureg.kPa).magnitude


def deg_c(t_f):
    return ureg.Quantity(t_f, ureg.degF).to(ureg.degC).magnitude


def test_bubble_point_metric_matches_field():
    pb_field = st.bubble_point(640.0, 0.74, 35.5, 182.0)
    pb_metric = st.metric.bubble_point(640.0 * SCF_PER_STB_TO_SM3_PER_SM3, 0.74, 35.5, deg_c(182.0))
    assert pb_metric == pytest.approx(kpa(pb_field), rel=1e-9)


def test_oil_proxy_converts_inputs_and_outputs():
    field = st.Oil(api=35.5, gas_sg=0.74, temperature_f=182.0, gor=640.0)
    metric = st.metric.Oil(api=35.5, gas_sg=0.74, temperature=deg_c(182.0), gor=640.0 * SCF_PER_STB_TO_SM3_PER_SM3)
    assert metric.bubble_point() == pytest.approx(kpa(field.bubble_point()), rel=1e-9)
    p_psia = np.array([1500.0, 2500.0])
    # Bo is a ratio of volumes (rb/STB == rm3/sm3): unchanged by the unit system.
    np.testing.assert_allclose(metric.bo(kpa(p_psia)), field.bo(p_psia), rtol=1e-9)
    np.testing.assert_allclose(
        metric.rs(kpa(p_psia)), np.asarray(field.rs(p_psia)) * SCF_PER_STB_TO_SM3_PER_SM3, rtol=1e-9
    )


def test_water_proxy_and_functions():
    field = st.Water(salinity_wt_pct=6.5)
    metric = st.metric.Water(salinity_wt_pct=6.5)
    assert metric.bw(kpa(3000.0), deg_c(180.0)) == pytest.approx(field.bw(3000.0, 180.0), rel=1e-9)
    # cp == mPa.s (pint)
    assert metric.viscosity(kpa(3000.0), deg_c(180.0)) == pytest.approx(
        (field.viscosity(3000.0, 180.0) * ureg.centipoise).to(ureg.mPa * ureg.s).magnitude, rel=1e-9
    )
    rho = (st.water_density(3000.0, 180.0, 6.5) * ureg.lb / ureg.ft**3).to(ureg.kg / ureg.m**3).magnitude
    assert st.metric.water_density(kpa(3000.0), deg_c(180.0), 6.5) == pytest.approx(rho, rel=1e-9)

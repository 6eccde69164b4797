"""Package-level behaviour shared by every domain: exceptions, array semantics, pickling."""

import pickle

import numpy as np
import pytest

import stocktank as st


def test_exception_hierarchy_is_valueerror():
    for exc in (
        st.InvalidArgumentError,
        st.ShapeError,
        st.InvalidOptionError,
        st.InvalidRecordError,
        st.ConvergenceError,
        st.SingularError,
        st.OutOfRangeError,
    ):
        assert issubclass(exc, st.StocktankError)
    assert issubclass(st.StocktankError, ValueError)


def test_version_is_a_string():
    assert isinstance(st.__version__, str) and st.__version__.count(".") == 2


def test_scalar_in_float_out_array_in_array_out():
    kr = st.CoreyOilWater(swc=0.2, sorw=0.2, krw_max=0.5, kro_max=1.0, nw=2.0, no=2.0)
    assert isinstance(kr.krw(0.5), float)
    out = kr.krw([0.2, 0.5, 0.8])
    assert isinstance(out, np.ndarray) and out.dtype == np.float64
    # Corey formula evaluated by hand: 0.5 * ((0.5 - 0.2) / 0.6) ** 2 (Brooks-Corey 1964 form).
    np.testing.assert_allclose(out, [0.0, 0.5 * 0.25, 0.5], rtol=1e-14)
    # integer input is coerced; shapes are kept
    assert kr.krow(np.array([[1, 0]])).shape == (1, 2)


def test_nan_in_nan_out():
    kr = st.CoreyGasOil(swc=0.2, sgc=0.05, sorg=0.1)
    out = kr.krg(np.array([np.nan, 0.3]))
    assert np.isnan(out[0]) and out[1] > 0


def test_invalid_parameter_names_argument_and_value():
    with pytest.raises(st.InvalidArgumentError, match=r"`sorw` = 0\.9"):
        st.CoreyOilWater(swc=0.2, sorw=0.9)


def test_description_objects_pickle_compare_and_print():
    kr = st.CoreyGasOil(swc=0.2, sgc=0.05, sorg=0.1, krg_max=0.9, ng=2.5)
    back = pickle.loads(pickle.dumps(kr))
    assert back == kr and back is not kr
    assert back != st.CoreyGasOil(swc=0.2, sgc=0.06, sorg=0.1, krg_max=0.9, ng=2.5)
    assert repr(kr).startswith("CoreyGasOil(swc=0.2, sgc=0.05")
    assert eval(repr(kr), {"CoreyGasOil": st.CoreyGasOil}) == kr


def test_critical_gas_saturation_blocks_flow():
    # Gas does not flow below its critical saturation (common practice, no source).
    kr = st.CoreyGasOil(swc=0.2, sgc=0.05, sorg=0.1)
    assert np.all(kr.krg(np.linspace(0.0, 0.05, 11)) == 0.0)


def test_thread_count_setting_and_results_independent_of_it():
    rng = np.random.default_rng(7)
    ppr = rng.uniform(0.2, 15.0, 100_000)  # above the parallel threshold
    tpr = rng.uniform(1.05, 3.0, 100_000)
    default = st.z_factor(ppr, tpr)
    with st.num_threads(1):
        assert st.get_num_threads() == 1
        one = st.z_factor(ppr, tpr)
        with st.num_threads(2):
            assert st.get_num_threads() == 2
            two = st.z_factor(ppr, tpr)
        assert st.get_num_threads() == 1
    # The same bits on any number of threads: each element is computed alone.
    assert np.array_equal(one, default) and np.array_equal(two, default)
    assert st.set_num_threads(3) is None  # the default was in force
    assert st.set_num_threads(None) == 3
    assert st.get_num_threads() >= 1


def test_thread_count_must_be_positive():
    with pytest.raises(st.InvalidArgumentError, match=r"\bn\b.*0"):
        st.set_num_threads(0)
    with pytest.raises(st.InvalidArgumentError, match=r"-2"):
        st.set_num_threads(-2)
    assert st.set_num_threads(None) is None  # a failed call left the setting alone


def _parallel_work_in_child(_):
    # Above the parallel thresholds of the array layer, the table builder and Monte Carlo.
    z = st.z_factor(np.linspace(0.3, 10.0, 100_000), 1.5)
    t = st.black_oil_tables_arrays(np.linspace(500.0, 4000.0, 20), np.full(300, 35.0), 0.75, 180.0, gor=500.0)
    mc = st.probabilistic_in_place(
        "oil", area=st.Distribution("triangular", low=1.0, mode=2.0, high=3.0), thickness=10.0,
        porosity=0.2, sw=0.3, fvf=1.2, trials=200_000, seed=1,
    )
    return float(z.sum()), float(np.sum(t["bo"])), float(mc["summary"]["p50"]), st.get_num_threads()


@pytest.mark.skipif(not hasattr(__import__("os"), "fork"), reason="needs fork")
def test_forked_processes_start_their_own_threads():
    # Python's multiprocessing forks by default on Linux: a child inherits the parent's thread
    # pool bookkeeping but not its threads; work sent there would wait forever.
    import multiprocessing as mp

    here = _parallel_work_in_child(0)  # the parent's pools exist before the fork
    with st.num_threads(1):
        with mp.get_context("fork").Pool(2) as pool:
            got = pool.map_async(_parallel_work_in_child, [0, 1]).get(timeout=120)
    assert [g[:3] for g in got] == [here[:3]] * 2
    assert [g[3] for g in got] == [1, 1]  # the setting is inherited


def test_masked_arrays_give_nan_at_masked_elements():
    # A masked element is not a value of the user's: it must not be computed from the
    # data hidden under the mask (numpy's own np.asarray would drop the mask). NaN in gives
    # NaN out; the other elements equal the plain-array results; the input is unchanged.
    ppr = np.ma.masked_array([1.0, 2.0, 3.0], mask=[False, True, False])
    z = st.z_factor(ppr, 1.5)
    assert type(z) is np.ndarray and np.isnan(z[1])
    np.testing.assert_array_equal(z[[0, 2]], st.z_factor(np.array([1.0, 3.0]), 1.5))
    np.testing.assert_array_equal(ppr.data, [1.0, 2.0, 3.0])
    np.testing.assert_array_equal(ppr.mask, [False, True, False])
    # Integer data and a masked second argument too.
    z2 = st.z_factor(2.0, np.ma.masked_array([1, 2], mask=[True, False]))
    assert np.isnan(z2[0]) and z2[1] == st.z_factor(2.0, 2.0)
    # A masked negative value is not an error: it is missing, not bad.
    g = st.Gas(0.7).z(np.ma.masked_array([1000.0, -5.0], mask=[False, True]), 200.0)
    assert np.isnan(g[1]) and np.isfinite(g[0])

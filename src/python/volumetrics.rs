//! Python bindings of [`crate::volumetrics`]: conversion only.

use super::relperm::CoreyOilWater as PyCorey;
use super::{In, call, call_multi, detach, on_error};
use crate::array::{lift, lift_multi};
use crate::error::Error;
use crate::volumetrics::{
    self as v, Correlation, Distribution as D, Fluid, Input, VolumetricInputs,
};
use numpy::IntoPyArray;
use pyo3::prelude::*;
use pyo3::types::{PyDict, PyList, PyTuple};

// ---- deterministic kernels ----------------------------------------------------------------

macro_rules! lifted {
    ($name:ident, $kernel:path, [$($arg:ident),+], $sig:tt, $doc:literal) => {
        #[doc = $doc]
        #[allow(clippy::too_many_arguments)]
        #[pyfunction]
        #[pyo3(signature = $sig)]
        fn $name(py: Python<'_>, $($arg: In<'_>,)+ errors: &str) -> PyResult<Py<PyAny>> {
            let oe = on_error(errors)?;
            call(py, [$(&$arg),+], move |views| {
                lift([$(stringify!($arg)),+], views, oe, |[$($arg),+]| $kernel($($arg),+))
            })
        }
    };
}

lifted!(ooip, v::ooip, [area, thickness, net_to_gross, porosity, sw, boi],
    (area, thickness, net_to_gross, porosity, sw, boi, *, errors = "raise"),
    "Original oil in place, STB: 7758.37 A h NTG phi (1 - Sw) / Boi (A acres, h ft, Boi rb/STB).");
lifted!(ogip, v::ogip, [area, thickness, net_to_gross, porosity, sw, bgi],
    (area, thickness, net_to_gross, porosity, sw, bgi, *, errors = "raise"),
    "Original free gas in place, scf: 43,560 A h NTG phi (1 - Sw) / Bgi (Bgi rcf/scf).");
lifted!(ooip_from_rock_volume, v::ooip_from_rock_volume,
    [gross_rock_volume, net_to_gross, porosity, sw, boi],
    (gross_rock_volume, net_to_gross, porosity, sw, boi, *, errors = "raise"),
    "Oil in place, STB, from a gross rock volume in acre-ft.");
lifted!(ogip_from_rock_volume, v::ogip_from_rock_volume,
    [gross_rock_volume, net_to_gross, porosity, sw, bgi],
    (gross_rock_volume, net_to_gross, porosity, sw, bgi, *, errors = "raise"),
    "Free gas in place, scf, from a gross rock volume in acre-ft.");
lifted!(dissolved_gas_in_place, v::dissolved_gas_in_place, [ooip, rsi],
    (ooip, rsi, *, errors = "raise"),
    "Gas dissolved in the oil in place, scf: N (STB) * Rsi (scf/STB).");
lifted!(gas_cap_ratio, v::gas_cap_ratio, [gas_cap_gas, bgi, ooip, boi],
    (gas_cap_gas, bgi, ooip, boi, *, errors = "raise"),
    "Gas-cap ratio m = G Bgi / (N Boi) (G scf, Bgi rcf/scf, N STB, Boi rb/STB).");
lifted!(recoverable, v::recoverable, [in_place, recovery_factor],
    (in_place, recovery_factor, *, errors = "raise"),
    "Recoverable volume = in_place * recovery_factor (unit of in_place).");
lifted!(recovery_factor, v::recovery_factor, [recoverable, in_place],
    (recoverable, in_place, *, errors = "raise"),
    "Recovery factor (fraction) = recoverable / in_place.");
lifted!(remaining_recoverable, v::remaining_recoverable, [in_place, recovery_factor, cumulative],
    (in_place, recovery_factor, cumulative, *, errors = "raise"),
    "Remaining recoverable volume = in_place * recovery_factor - cumulative.");
lifted!(arps_solution_gas_drive, v::arps_solution_gas_drive,
    [porosity, sw, bob, k_md, mu_ob, pb, pa],
    (porosity, sw, bob, k_md, mu_ob, pb, pa, *, errors = "raise"),
    "Solution-gas-drive oil recovery factor (fraction), Arps et al. (1967) API correlation.");
lifted!(arps_water_drive, v::arps_water_drive,
    [porosity, sw, boi, k_md, mu_wi, mu_oi, pi, pa],
    (porosity, sw, boi, k_md, mu_wi, mu_oi, pi, pa, *, errors = "raise"),
    "Water-drive oil recovery factor (fraction), Arps et al. (1967) API correlation.");
lifted!(gas_recovery_factor_pz, v::gas_recovery_factor_pz, [pi, zi, pa, za],
    (pi, zi, pa, za, *, errors = "raise"),
    "Volumetric gas recovery factor at abandonment, 1 - (pa/za)/(pi/zi) (psia).");
lifted!(gravity_number, v::gravity_number, [k_md, area_ft2, delta_sg, dip_deg, qt_rb_per_day],
    (k_md, area_ft2, delta_sg, dip_deg, qt_rb_per_day, *, errors = "raise"),
    "Gravity number G (cp) of the fractional-flow equation for a dipping bed.");

fn ok_bool(b: bool) -> crate::Result<f64> {
    Ok(if b { 1.0 } else { 0.0 })
}

/// 1.0 where the inputs lie in the solution-gas-drive data range of Arps et al. (1967), else 0.0.
#[pyfunction]
#[pyo3(signature = (porosity, sw, k_md, mu_ob, pb, pa))]
fn _arps_solution_gas_validity(
    py: Python<'_>,
    porosity: In<'_>,
    sw: In<'_>,
    k_md: In<'_>,
    mu_ob: In<'_>,
    pb: In<'_>,
    pa: In<'_>,
) -> PyResult<Py<PyAny>> {
    call(py, [&porosity, &sw, &k_md, &mu_ob, &pb, &pa], |vs| {
        lift(
            ["porosity", "sw", "k_md", "mu_ob", "pb", "pa"],
            vs,
            crate::array::OnError::Raise,
            |[a, b, c, d, e, f]| ok_bool(v::arps_solution_gas_validity(a, b, c, d, e, f)),
        )
    })
}

/// 1.0 where the inputs lie in the water-drive data range of Arps et al. (1967), else 0.0.
#[pyfunction]
#[pyo3(signature = (porosity, sw, k_md, mu_wi, mu_oi, pi, pa))]
#[allow(clippy::too_many_arguments)]
fn _arps_water_drive_validity(
    py: Python<'_>,
    porosity: In<'_>,
    sw: In<'_>,
    k_md: In<'_>,
    mu_wi: In<'_>,
    mu_oi: In<'_>,
    pi: In<'_>,
    pa: In<'_>,
) -> PyResult<Py<PyAny>> {
    call(
        py,
        [&porosity, &sw, &k_md, &mu_wi, &mu_oi, &pi, &pa],
        |vs| {
            lift(
                ["porosity", "sw", "k_md", "mu_wi", "mu_oi", "pi", "pa"],
                vs,
                crate::array::OnError::Raise,
                |[a, b, c, d, e, f, g]| ok_bool(v::arps_water_drive_validity(a, b, c, d, e, f, g)),
            )
        },
    )
}

// ---- Buckley–Leverett ----------------------------------------------------------------------

fn flow(
    relperm: &PyCorey,
    mu_o: f64,
    mu_w: f64,
    swi: Option<f64>,
    gravity: f64,
) -> PyResult<v::FractionalFlow> {
    let k = relperm.0;
    Ok(v::FractionalFlow::new(
        k,
        mu_o,
        mu_w,
        gravity,
        swi.unwrap_or(k.swc),
    )?)
}

/// Reservoir water cut fw at water saturation ``sw`` (Buckley and Leverett 1942).
#[pyfunction]
#[pyo3(signature = (relperm, sw, *, mu_o, mu_w, gravity = 0.0))]
fn fractional_flow(
    py: Python<'_>,
    relperm: PyRef<'_, PyCorey>,
    sw: In<'_>,
    mu_o: f64,
    mu_w: f64,
    gravity: f64,
) -> PyResult<Py<PyAny>> {
    let f = flow(&relperm, mu_o, mu_w, None, gravity)?;
    call(py, [&sw], move |[s]| {
        lift(["sw"], [s], crate::array::OnError::Raise, |[s]| {
            Ok(f.fw(crate::error::fraction("sw", s)?))
        })
    })
}

/// The Welge (1952) tangent: front saturation, breakthrough and displacement efficiency.
#[pyfunction]
#[pyo3(signature = (relperm, *, mu_o, mu_w, swi = None, gravity = 0.0))]
fn welge_front<'py>(
    py: Python<'py>,
    relperm: PyRef<'py, PyCorey>,
    mu_o: f64,
    mu_w: f64,
    swi: Option<f64>,
    gravity: f64,
) -> PyResult<Bound<'py, PyDict>> {
    let f = flow(&relperm, mu_o, mu_w, swi, gravity)?;
    let w = py.detach(move || f.welge())?;
    let d = PyDict::new(py);
    d.set_item("sw_front", w.sw_front)?;
    d.set_item("fw_front", w.fw_front)?;
    d.set_item("slope", w.slope)?;
    d.set_item("sw_avg_breakthrough", w.sw_avg_breakthrough)?;
    d.set_item("pv_breakthrough", w.pv_breakthrough)?;
    d.set_item("ed_breakthrough", w.ed_breakthrough)?;
    d.set_item("swi", f.swi)?;
    Ok(d)
}

/// Displacement after ``pv_injected`` pore volumes of water: (ed, sw_avg, sw_outlet, fw_outlet).
#[pyfunction]
#[pyo3(signature = (relperm, pv_injected, *, mu_o, mu_w, swi = None, gravity = 0.0, errors = "raise"))]
#[allow(clippy::too_many_arguments)]
fn waterflood_displacement<'py>(
    py: Python<'py>,
    relperm: PyRef<'py, PyCorey>,
    pv_injected: In<'py>,
    mu_o: f64,
    mu_w: f64,
    swi: Option<f64>,
    gravity: f64,
    errors: &str,
) -> PyResult<Bound<'py, PyTuple>> {
    let oe = on_error(errors)?;
    let f = flow(&relperm, mu_o, mu_w, swi, gravity)?;
    let w = py.detach(move || f.welge())?;
    let outs = call_multi(py, [&pv_injected], move |[q]| {
        lift_multi(["pv_injected"], [q], oe, |[q]| {
            let s = f.state(&w, q)?;
            Ok([s.ed, s.sw_avg, s.sw_outlet, s.fw_outlet])
        })
    })?;
    PyTuple::new(py, outs)
}

// ---- distributions and Monte Carlo ---------------------------------------------------------

/// A probability distribution of one uncertain input (P90 is the LOW value).
#[pyclass(name = "Distribution", module = "stocktank._core", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct Distribution(pub D);

fn need(arg: &'static str, v: Option<f64>, kind: &'static str) -> PyResult<f64> {
    v.ok_or_else(|| Error::invalid(arg, f64::NAN, kind).into())
}

#[pymethods]
impl Distribution {
    #[new]
    #[pyo3(signature = (kind, *, value = None, low = None, mode = None, high = None, mean = None, sd = None, mu = None, sigma = None, p90 = None, p10 = None))]
    #[allow(clippy::too_many_arguments)]
    fn new(
        kind: &str,
        value: Option<f64>,
        low: Option<f64>,
        mode: Option<f64>,
        high: Option<f64>,
        mean: Option<f64>,
        sd: Option<f64>,
        mu: Option<f64>,
        sigma: Option<f64>,
        p90: Option<f64>,
        p10: Option<f64>,
    ) -> PyResult<Self> {
        const R: &str = "is required for this kind of distribution";
        let d = match kind {
            "fixed" => D::fixed(need("value", value, R)?)?,
            "uniform" => D::uniform(need("low", low, R)?, need("high", high, R)?)?,
            "triangular" => D::triangular(
                need("low", low, R)?,
                need("mode", mode, R)?,
                need("high", high, R)?,
            )?,
            "pert" => D::pert(
                need("low", low, R)?,
                need("mode", mode, R)?,
                need("high", high, R)?,
            )?,
            "normal" => {
                let base = match (mean, sd, p90, p10) {
                    (Some(m), Some(s), None, None) => {
                        D::normal(m, s, f64::NEG_INFINITY, f64::INFINITY)?
                    }
                    (None, None, Some(a), Some(b)) => D::normal_p90_p10(a, b)?,
                    _ => {
                        return Err(Error::invalid(
                            "sd",
                            f64::NAN,
                            "normal needs (mean, sd) or (p90, p10)",
                        )
                        .into());
                    }
                };
                let D::Normal { mean, sd, .. } = base else {
                    unreachable!()
                };
                D::normal(
                    mean,
                    sd,
                    low.unwrap_or(f64::NEG_INFINITY),
                    high.unwrap_or(f64::INFINITY),
                )?
            }
            "lognormal" => {
                let base = match (mean, sd, mu, sigma, p90, p10) {
                    (Some(m), Some(s), None, None, None, None) => D::lognormal_mean_sd(m, s)?,
                    (None, None, Some(m), Some(s), None, None) => {
                        D::lognormal(m, s, 0.0, f64::INFINITY)?
                    }
                    (None, None, None, None, Some(a), Some(b)) => D::lognormal_p90_p10(a, b)?,
                    _ => {
                        return Err(Error::invalid(
                            "sigma",
                            f64::NAN,
                            "lognormal needs (mean, sd) of the variable, (mu, sigma) of its log, or (p90, p10)",
                        )
                        .into());
                    }
                };
                let D::Lognormal { mu, sigma, .. } = base else {
                    unreachable!()
                };
                D::lognormal(mu, sigma, low.unwrap_or(0.0), high.unwrap_or(f64::INFINITY))?
            }
            other => {
                return Err(Error::InvalidOption {
                    arg: "kind",
                    value: other.to_string(),
                    allowed: "fixed, uniform, triangular, pert, normal, lognormal",
                }
                .into());
            }
        };
        Ok(Self(d))
    }

    /// A fixed value.
    #[staticmethod]
    fn fixed(value: f64) -> PyResult<Self> {
        Ok(Self(D::fixed(value)?))
    }
    /// Uniform on [low, high].
    #[staticmethod]
    fn uniform(low: f64, high: f64) -> PyResult<Self> {
        Ok(Self(D::uniform(low, high)?))
    }
    /// Triangular on [low, high] with its mode.
    #[staticmethod]
    fn triangular(low: f64, mode: f64, high: f64) -> PyResult<Self> {
        Ok(Self(D::triangular(low, mode, high)?))
    }
    /// PERT on [low, high] with its mode (beta, shape 4; Malcolm et al. 1959).
    #[staticmethod]
    fn pert(low: f64, mode: f64, high: f64) -> PyResult<Self> {
        Ok(Self(D::pert(low, mode, high)?))
    }
    /// Normal from (mean, sd) or (p90, p10), optionally truncated to [low, high].
    #[staticmethod]
    #[pyo3(signature = (mean = None, sd = None, *, p90 = None, p10 = None, low = None, high = None))]
    fn normal(
        mean: Option<f64>,
        sd: Option<f64>,
        p90: Option<f64>,
        p10: Option<f64>,
        low: Option<f64>,
        high: Option<f64>,
    ) -> PyResult<Self> {
        Self::new(
            "normal", None, low, None, high, mean, sd, None, None, p90, p10,
        )
    }
    /// Lognormal from (mean, sd) of the variable, (mu, sigma) of its log, or (p90, p10),
    /// optionally truncated to [low, high].
    #[staticmethod]
    #[pyo3(signature = (mean = None, sd = None, *, mu = None, sigma = None, p90 = None, p10 = None, low = None, high = None))]
    #[allow(clippy::too_many_arguments)]
    fn lognormal(
        mean: Option<f64>,
        sd: Option<f64>,
        mu: Option<f64>,
        sigma: Option<f64>,
        p90: Option<f64>,
        p10: Option<f64>,
        low: Option<f64>,
        high: Option<f64>,
    ) -> PyResult<Self> {
        Self::new(
            "lognormal",
            None,
            low,
            None,
            high,
            mean,
            sd,
            mu,
            sigma,
            p90,
            p10,
        )
    }

    /// The kind: fixed, uniform, triangular, pert, normal or lognormal.
    #[getter]
    fn kind(&self) -> &'static str {
        match self.0 {
            D::Fixed { .. } => "fixed",
            D::Uniform { .. } => "uniform",
            D::Triangular { .. } => "triangular",
            D::Pert { .. } => "pert",
            D::Normal { .. } => "normal",
            D::Lognormal { .. } => "lognormal",
        }
    }
    /// Analytic mean.
    fn mean(&self) -> f64 {
        self.0.mean()
    }
    /// Analytic variance.
    fn variance(&self) -> f64 {
        self.0.variance()
    }
    /// (smallest, largest) value the distribution can take.
    fn support(&self) -> (f64, f64) {
        self.0.support()
    }
    /// ``n`` reproducible samples (same ``seed`` and ``stream``, same samples).
    #[pyo3(signature = (n, *, seed = 0, stream = 0))]
    fn sample<'py>(
        &self,
        py: Python<'py>,
        n: i128,
        seed: i128,
        stream: i128,
    ) -> PyResult<Bound<'py, PyAny>> {
        let n: usize = super::whole("n", n)?;
        let seed: u64 = super::whole("seed", seed)?;
        let stream: u64 = super::whole("stream", stream)?;
        super::check_memory("n", n, std::mem::size_of::<f64>())?;
        let d = self.0;
        let x = detach(py, move || d.sample(n, seed, stream));
        Ok(x.into_pyarray(py).into_any())
    }
    /// The canonical constructor keywords.
    fn params<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        let k = PyDict::new(py);
        match self.0 {
            D::Fixed { value } => k.set_item("value", value)?,
            D::Uniform { low, high } => {
                k.set_item("low", low)?;
                k.set_item("high", high)?;
            }
            D::Triangular { low, mode, high } | D::Pert { low, mode, high } => {
                k.set_item("low", low)?;
                k.set_item("mode", mode)?;
                k.set_item("high", high)?;
            }
            D::Normal {
                mean,
                sd,
                low,
                high,
            } => {
                k.set_item("mean", mean)?;
                k.set_item("sd", sd)?;
                if low.is_finite() {
                    k.set_item("low", low)?;
                }
                if high.is_finite() {
                    k.set_item("high", high)?;
                }
            }
            D::Lognormal {
                mu,
                sigma,
                low,
                high,
            } => {
                k.set_item("mu", mu)?;
                k.set_item("sigma", sigma)?;
                if low > 0.0 {
                    k.set_item("low", low)?;
                }
                if high.is_finite() {
                    k.set_item("high", high)?;
                }
            }
        }
        Ok(k)
    }
    fn __repr__(&self, py: Python<'_>) -> PyResult<String> {
        let p = self.params(py)?;
        let mut parts = Vec::new();
        for (k, v) in p.iter() {
            parts.push(format!("{}={}", k.str()?, v.repr()?));
        }
        Ok(format!(
            "Distribution({:?}, {})",
            self.kind(),
            parts.join(", ")
        ))
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, Bound<'py, PyTuple>, Bound<'py, PyAny>)> {
        let py = slf.py();
        let kwargs = slf.get().params(py)?;
        kwargs.set_item("kind", slf.get().kind())?;
        let rebuild = py.import("stocktank._pickle")?.getattr("rebuild")?;
        let args = PyTuple::new(py, [slf.get_type().into_any(), kwargs.into_any()])?;
        Ok((rebuild, args, py.None().into_bound(py)))
    }
}

fn dist(arg: &'static str, ob: &Bound<'_, PyAny>) -> PyResult<D> {
    if let Ok(d) = ob.extract::<PyRef<'_, Distribution>>() {
        return Ok(d.0);
    }
    match ob.extract::<f64>() {
        Ok(x) => Ok(D::fixed(x).map_err(|_| Error::invalid(arg, x, "must be finite"))?),
        Err(_) => Err(pyo3::exceptions::PyTypeError::new_err(format!(
            "`{arg}` must be a Distribution or a number, got {}",
            ob.get_type().name()?
        ))),
    }
}

fn summary<'py>(py: Python<'py>, s: &v::Summary) -> PyResult<Bound<'py, PyDict>> {
    let d = PyDict::new(py);
    d.set_item("p90", s.p90)?;
    d.set_item("p50", s.p50)?;
    d.set_item("p10", s.p10)?;
    d.set_item("mean", s.mean)?;
    d.set_item("sd", s.sd)?;
    d.set_item("trials", s.trials)?;
    Ok(d)
}

/// Monte Carlo oil (STB) or gas (scf) in place with rank-correlated inputs (Iman–Conover 1982).
#[pyfunction]
#[pyo3(signature = (fluid = "oil", *, area, thickness, porosity, sw, fvf, net_to_gross = None, recovery_factor = None, correlation = None, trials = 100_000, seed = 0))]
#[allow(clippy::too_many_arguments)]
fn probabilistic_in_place<'py>(
    py: Python<'py>,
    fluid: &str,
    area: &Bound<'py, PyAny>,
    thickness: &Bound<'py, PyAny>,
    porosity: &Bound<'py, PyAny>,
    sw: &Bound<'py, PyAny>,
    fvf: &Bound<'py, PyAny>,
    net_to_gross: Option<&Bound<'py, PyAny>>,
    recovery_factor: Option<&Bound<'py, PyAny>>,
    correlation: Option<&Bound<'py, PyDict>>,
    trials: i128,
    seed: i128,
) -> PyResult<Bound<'py, PyDict>> {
    let trials: usize = super::whole("trials", trials)?;
    let seed: u64 = super::whole("seed", seed)?;
    let fl = match fluid {
        "oil" => Fluid::Oil,
        "gas" => Fluid::Gas,
        other => {
            return Err(Error::InvalidOption {
                arg: "fluid",
                value: other.to_string(),
                allowed: "oil, gas",
            }
            .into());
        }
    };
    let inputs = VolumetricInputs {
        area: dist("area", area)?,
        thickness: dist("thickness", thickness)?,
        net_to_gross: match net_to_gross {
            Some(x) => dist("net_to_gross", x)?,
            None => D::Fixed { value: 1.0 },
        },
        porosity: dist("porosity", porosity)?,
        sw: dist("sw", sw)?,
        fvf: dist("fvf", fvf)?,
        recovery_factor: match recovery_factor {
            Some(x) => Some(dist("recovery_factor", x)?),
            None => None,
        },
    };
    let corr = match correlation {
        None => None,
        Some(c) => {
            let mut pairs = Vec::new();
            for (k, val) in c.iter() {
                let (a, b): (String, String) = k.extract().map_err(|_| {
                    pyo3::exceptions::PyTypeError::new_err(
                        "`correlation` keys must be (name, name) tuples",
                    )
                })?;
                let r: f64 = val.extract()?;
                pairs.push((Input::parse(&a)?, Input::parse(&b)?, r));
            }
            Some(Correlation::from_pairs(&pairs)?)
        }
    };
    // A column per input (up to 7) and the results, with their ranks: about 16 numbers a trial.
    super::check_memory("trials", trials, 16 * std::mem::size_of::<f64>())?;
    let sim = detach(py, move || {
        v::probabilistic_in_place(fl, &inputs, corr.as_ref(), trials, seed)
    })?;
    let out = PyDict::new(py);
    out.set_item("fluid", fluid)?;
    out.set_item("unit", if fl == Fluid::Oil { "STB" } else { "scf" })?;
    out.set_item("summary", summary(py, &sim.summary)?)?;
    match &sim.recoverable_summary {
        Some(s) => out.set_item("recoverable_summary", summary(py, s)?)?,
        None => out.set_item("recoverable_summary", py.None())?,
    }
    let tornado = PyList::empty(py);
    for t in &sim.tornado {
        let d = PyDict::new(py);
        d.set_item("input", t.input.name())?;
        d.set_item("input_low", t.input_low)?;
        d.set_item("input_high", t.input_high)?;
        d.set_item("volume_at_low", t.volume_at_low)?;
        d.set_item("volume_at_high", t.volume_at_high)?;
        d.set_item("swing", t.swing)?;
        d.set_item("rank_correlation", t.rank_correlation)?;
        tornado.append(d)?;
    }
    out.set_item("tornado", tornado)?;
    let ins = PyDict::new(py);
    for (i, col) in Input::ALL.iter().zip(sim.inputs) {
        if *i == Input::RecoveryFactor && col.is_empty() {
            continue;
        }
        ins.set_item(i.name(), col.into_pyarray(py))?;
    }
    out.set_item("inputs", ins)?;
    out.set_item("in_place", sim.in_place.into_pyarray(py))?;
    match sim.recoverable {
        Some(r) => out.set_item("recoverable", r.into_pyarray(py))?,
        None => out.set_item("recoverable", py.None())?,
    }
    Ok(out)
}

/// P90 (low), P50, P10 (high), mean, sd and trials of a sample (1-D, no NaN).
#[pyfunction]
fn summarize<'py>(py: Python<'py>, samples: In<'py>) -> PyResult<Bound<'py, PyDict>> {
    let view = samples.as_array();
    let data: Vec<f64> = view.iter().copied().collect();
    let s = detach(py, move || v::summarize(&data))
        .map_err(|e| super::rename_arg(e, &[("data", "samples")]))?;
    summary(py, &s)
}

pub(super) fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_function(wrap_pyfunction!(ooip, m)?)?;
    m.add_function(wrap_pyfunction!(ogip, m)?)?;
    m.add_function(wrap_pyfunction!(ooip_from_rock_volume, m)?)?;
    m.add_function(wrap_pyfunction!(ogip_from_rock_volume, m)?)?;
    m.add_function(wrap_pyfunction!(dissolved_gas_in_place, m)?)?;
    m.add_function(wrap_pyfunction!(gas_cap_ratio, m)?)?;
    m.add_function(wrap_pyfunction!(recoverable, m)?)?;
    m.add_function(wrap_pyfunction!(recovery_factor, m)?)?;
    m.add_function(wrap_pyfunction!(remaining_recoverable, m)?)?;
    m.add_function(wrap_pyfunction!(arps_solution_gas_drive, m)?)?;
    m.add_function(wrap_pyfunction!(arps_water_drive, m)?)?;
    m.add_function(wrap_pyfunction!(_arps_solution_gas_validity, m)?)?;
    m.add_function(wrap_pyfunction!(_arps_water_drive_validity, m)?)?;
    m.add_function(wrap_pyfunction!(gas_recovery_factor_pz, m)?)?;
    m.add_function(wrap_pyfunction!(gravity_number, m)?)?;
    m.add_function(wrap_pyfunction!(fractional_flow, m)?)?;
    m.add_function(wrap_pyfunction!(welge_front, m)?)?;
    m.add_function(wrap_pyfunction!(waterflood_displacement, m)?)?;
    m.add_class::<Distribution>()?;
    m.add_function(wrap_pyfunction!(probabilistic_in_place, m)?)?;
    m.add_function(wrap_pyfunction!(summarize, m)?)?;
    Ok(())
}

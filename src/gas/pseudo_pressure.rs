//! Real-gas pseudo-pressure m(p) of Al-Hussainy, Ramey and Crawford (1966).

use super::description::Gas;
use crate::array::OnError;
use crate::error::{Error, Result, positive, temperature_f};
use ndarray::{ArrayD, ArrayViewD};
use rayon::prelude::*;

/// Gauss–Legendre nodes on [-1, 1], 8 points (Abramowitz & Stegun 1964, Table 25.4).
const GL_X: [f64; 4] = [
    0.183_434_642_495_649_8,
    0.525_532_409_916_329,
    0.796_666_477_413_626_7,
    0.960_289_856_497_536_3,
];
/// Gauss–Legendre weights matching [`GL_X`].
const GL_W: [f64; 4] = [
    0.362_683_783_378_362,
    0.313_706_645_877_887_3,
    0.222_381_034_453_374_5,
    0.101_228_536_290_376_3,
];
/// Widest pressure sub-interval of the composite quadrature, psia.
///
/// # Examples
/// ```
/// assert_eq!(stocktank::gas::PSEUDO_PRESSURE_STEP_PSIA, 100.0);
/// ```
pub const PSEUDO_PRESSURE_STEP_PSIA: f64 = 100.0;

/// Most quadrature pieces between two pressures (so pieces are wider than
/// [`PSEUDO_PRESSURE_STEP_PSIA`] only for gaps above 2,000,000 psi, far outside any
/// correlation; without a cap, p = 1e10 psia would take hours).
///
/// # Examples
/// ```
/// assert_eq!(stocktank::gas::PSEUDO_PRESSURE_MAX_PIECES, 20_000);
/// ```
pub const PSEUDO_PRESSURE_MAX_PIECES: usize = 20_000;

impl Gas {
    /// The integrand 2 p / (mu Z) of the pseudo-pressure at `p_psia` and `t_f`, psia/cp.
    ///
    /// # Errors
    /// As [`Gas::z`].
    ///
    /// # Examples
    /// ```
    /// let g = stocktank::gas::Gas::new(0.7).unwrap();
    /// assert!(g.pseudo_pressure_integrand(1000.0, 200.0).unwrap() > 0.0);
    /// ```
    #[inline]
    pub fn pseudo_pressure_integrand(&self, p_psia: f64, t_f: f64) -> Result<f64> {
        let (z, mu) = self.z_and_viscosity(p_psia, t_f)?;
        Ok(2.0 * p_psia / (mu * z))
    }

    /// 2 ∫_a^b p / (mu Z) dp by composite 8-point Gauss–Legendre on pieces no wider than
    /// [`PSEUDO_PRESSURE_STEP_PSIA`] (at most [`PSEUDO_PRESSURE_MAX_PIECES`] pieces).
    fn integrate(&self, a: f64, b: f64, t_f: f64) -> Result<f64> {
        if b <= a {
            return Ok(0.0);
        }
        let n = ((b - a) / PSEUDO_PRESSURE_STEP_PSIA)
            .ceil()
            .clamp(1.0, PSEUDO_PRESSURE_MAX_PIECES as f64) as usize;
        let h = (b - a) / n as f64;
        let mut sum = 0.0;
        for k in 0..n {
            let mid = a + (k as f64 + 0.5) * h;
            let half = 0.5 * h;
            for (x, w) in GL_X.iter().zip(GL_W.iter()) {
                sum += w * half * self.pseudo_pressure_integrand(mid - half * x, t_f)?;
                sum += w * half * self.pseudo_pressure_integrand(mid + half * x, t_f)?;
            }
        }
        Ok(sum)
    }

    /// Real-gas pseudo-pressure m(p), psia^2/cp, at each pressure of an array (any shape,
    /// any order), at one temperature.
    ///
    /// # Formula
    /// ```text
    /// m(p) = 2 ∫_0^p p' / (mu(p') Z(p')) dp'
    /// ```
    /// evaluated between the sorted distinct pressures by composite 8-point Gauss–Legendre
    /// quadrature (pieces of at most 100 psi; relative error below 1e-9 against adaptive
    /// quadrature in the tests) and summed cumulatively; the pieces run in parallel.
    ///
    /// # Arguments
    /// * `p_psia` - pressures, psia, > 0 (NaN gives NaN).
    /// * `t_f` - reservoir temperature, degF.
    /// * `on_error` - raise on, or set NaN for, pressures <= 0.
    ///
    /// # Returns
    /// m(p) in psia^2/cp, in the shape of `p_psia`.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p_psia` (with index) or `t_f`; the Z-factor's or
    /// viscosity's error for a pressure they reject, with the index of the first pressure
    /// whose integral reaches it (with [`OnError::Coerce`]: NaN from that pressure up).
    ///
    /// # Examples
    /// ```
    /// use ndarray::arr1;
    /// use stocktank::array::OnError;
    /// let g = stocktank::gas::Gas::new(0.7).unwrap();
    /// let p = arr1(&[3000.0, 1000.0, 2000.0]).into_dyn();
    /// let m = g.pseudo_pressure(p.view(), 200.0, OnError::Raise).unwrap();
    /// assert!(m[1] < m[2] && m[2] < m[0]);
    /// ```
    ///
    /// # References
    /// Al-Hussainy, R., Ramey, H.J., Crawford, P.B. (1966). The flow of real gases through
    /// porous media. J. Pet. Technol. 18(5), 624–636.
    pub fn pseudo_pressure(
        &self,
        p_psia: ArrayViewD<'_, f64>,
        t_f: f64,
        on_error: OnError,
    ) -> Result<ArrayD<f64>> {
        temperature_f("t_f", t_f)?;
        let shape = p_psia.shape().to_vec();
        let flat: Vec<f64> = p_psia.iter().copied().collect();
        let mut order: Vec<usize> = Vec::with_capacity(flat.len());
        for (k, &p) in flat.iter().enumerate() {
            if p.is_nan() {
                continue;
            }
            if let Err(e) = positive("p_psia", p) {
                match on_error {
                    OnError::Coerce => continue,
                    OnError::Raise => {
                        if shape.is_empty() {
                            return Err(e);
                        }
                        let mut multi = vec![0usize; shape.len()];
                        crate::array::unravel(k, &shape, &mut multi);
                        return Err(e.at_index(&multi));
                    }
                }
            }
            order.push(k);
        }
        order.sort_by(|&a, &b| flat[a].total_cmp(&flat[b]));
        // Distinct sorted pressures and the integral over each gap.
        let mut nodes: Vec<f64> = Vec::with_capacity(order.len());
        for &k in &order {
            if nodes.last() != Some(&flat[k]) {
                nodes.push(flat[k]);
            }
        }
        let pieces: Vec<Result<f64>> = (0..nodes.len())
            .into_par_iter()
            .map(|i| {
                let a = if i == 0 { 0.0 } else { nodes[i - 1] };
                self.integrate(a, nodes[i], t_f)
            })
            .collect();
        // A piece that fails (the Z-factor or viscosity rejects a pressure inside it) fails
        // every pressure from its upper end on: NaN there with `Coerce`; with `Raise`, the
        // error carries the index of the first such pressure.
        let mut cumulative = Vec::with_capacity(nodes.len());
        let mut acc = 0.0;
        for (i, piece) in pieces.into_iter().enumerate() {
            match piece {
                Ok(v) => acc += v,
                Err(_) if on_error == OnError::Coerce => acc = f64::NAN,
                Err(e) => {
                    let k = order.iter().copied().find(|&k| flat[k] == nodes[i]);
                    return Err(match k {
                        Some(k) if !shape.is_empty() => {
                            let mut multi = vec![0usize; shape.len()];
                            crate::array::unravel(k, &shape, &mut multi);
                            e.at_index(&multi)
                        }
                        _ => e,
                    });
                }
            }
            cumulative.push(acc);
        }
        let mut out = vec![f64::NAN; flat.len()];
        let mut j = 0;
        for &k in &order {
            while nodes[j] != flat[k] {
                j += 1;
            }
            out[k] = cumulative[j];
        }
        ArrayD::from_shape_vec(ndarray::IxDyn(&shape), out).map_err(|e| Error::Shape(e.to_string()))
    }
}

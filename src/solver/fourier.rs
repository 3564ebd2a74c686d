//! Glauert's Fourier-sine solution of Prandtl's lifting-line equation, by collocation.
//!
//! With y = y_mid - (b/2) cos(theta) and Gamma = 2 b V sum A_n sin(n theta), the monoplane
//! equation at each collocation angle is (Glauert, *The Elements of Aerofoil and Airscrew
//! Theory*, 1926, ch. XI; Anderson, *Fundamentals of Aerodynamics*, sec. 5.3.4)
//!
//!   alpha(theta) - alpha_L0(theta) = (4 b / (a0 c)) sum A_n sin(n theta)
//!                                    + sum n A_n sin(n theta) / sin(theta).
//!
//! The full series (odd and even n) is kept so asymmetric loads are represented.

use nalgebra::{DMatrix, DVector};

use super::controls::ControlSpan;

/// The spanwise map y(theta) of a wing whose tips are at `y_mid -+ half_span`.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SpanMap {
    /// Midpoint of the span, m.
    pub y_mid: f64,
    /// Half the span, m.
    pub half_span: f64,
}

impl SpanMap {
    /// y at angle theta (0 at the left tip, pi at the right tip).
    #[must_use]
    pub fn y(self, theta: f64) -> f64 {
        self.y_mid - self.half_span * theta.cos()
    }

    /// theta at y, clamped to [0, pi].
    #[must_use]
    pub fn theta(self, y: f64) -> f64 {
        (-(y - self.y_mid) / self.half_span).clamp(-1.0, 1.0).acos()
    }
}

/// The collocation angles theta_k = k pi / (N + 1), k = 1..N: evenly spaced in theta, which
/// clusters points toward the tips and keeps them off the tips themselves.
#[must_use]
pub fn collocation_angles(terms: usize) -> Vec<f64> {
    let h = std::f64::consts::PI / (terms as f64 + 1.0);
    (1..=terms).map(|k| k as f64 * h).collect()
}

/// sin(n theta)/sin(theta) for n = 1..=N, by the Chebyshev recurrence U_n = 2x U_{n-1} - U_{n-2}
/// with x = cos(theta). Finite at the tips, where it tends to n (theta = 0) or (-1)^(n+1) n.
pub fn sine_ratios(theta: f64, out: &mut [f64]) {
    let x = theta.cos();
    let (mut previous, mut current) = (0.0, 1.0);
    for slot in out.iter_mut() {
        *slot = current;
        let next = 2.0 * x * current - previous;
        previous = current;
        current = next;
    }
}

/// Sums of the series at one angle: `(sum A_n sin n theta, sum n A_n sin n theta / sin theta)`.
#[must_use]
pub fn series_at(a: &[f64], theta: f64, ratios: &mut [f64]) -> (f64, f64) {
    sine_ratios(theta, ratios);
    let s = theta.sin();
    let (mut load, mut induced) = (0.0, 0.0);
    for (n, (&an, &u)) in a.iter().zip(ratios.iter()).enumerate() {
        load += an * u;
        induced += (n + 1) as f64 * an * u;
    }
    (load * s, induced)
}

/// Sums of two series at one angle sharing one evaluation of the sine ratios:
/// `[(sum A_n sin n theta, sum n A_n sin n theta / sin theta); 2]` for `a` and `b`.
#[must_use]
pub fn series_pair_at(a: &[f64], b: &[f64], theta: f64, ratios: &mut [f64]) -> [(f64, f64); 2] {
    sine_ratios(theta, ratios);
    let s = theta.sin();
    let mut out = [(0.0, 0.0); 2];
    for (n, ((&an, &bn), &u)) in a.iter().zip(b).zip(ratios.iter()).enumerate() {
        let order = (n + 1) as f64;
        out[0].0 += an * u;
        out[0].1 += order * an * u;
        out[1].0 += bn * u;
        out[1].1 += order * bn * u;
    }
    out[0].0 *= s;
    out[1].0 *= s;
    out
}

/// The collocation matrix M[k][n-1] = sin(n theta_k) (mu_k + n / sin theta_k), with
/// mu_k = 4 b / (a0_k c_k).
#[must_use]
pub fn matrix(thetas: &[f64], mu: &[f64]) -> DMatrix<f64> {
    let n = thetas.len();
    let mut m = DMatrix::zeros(n, n);
    let mut ratios = vec![0.0; n];
    for (k, (&theta, &mu_k)) in thetas.iter().zip(mu).enumerate() {
        sine_ratios(theta, &mut ratios);
        let s = theta.sin();
        for (j, &u) in ratios.iter().enumerate() {
            let order = (j + 1) as f64;
            // sin(n theta) = sin(theta) U_{n-1}; the 1/sin(theta) term leaves U_{n-1} alone.
            m[(k, j)] = u * (mu_k * s + order);
        }
    }
    m
}

/// Fraction of the collocation cell around each angle that lies inside `span`, times its
/// angle increase. Averaging over the cell, rather than sampling the step at the point,
/// moves the effective control edge continuously with the true edge, which removes the
/// term-count oscillation of part-span controls (see docs/theory.md).
pub fn add_control_shift(map: SpanMap, thetas: &[f64], span: &ControlSpan, out: &mut [f64]) {
    let h = std::f64::consts::PI / (thetas.len() as f64 + 1.0);
    let (t_from, t_to) = (map.theta(span.y_from), map.theta(span.y_to));
    for (slot, &theta) in out.iter_mut().zip(thetas) {
        let (lo, hi) = (theta - 0.5 * h, theta + 0.5 * h);
        let overlap = (hi.min(t_to) - lo.max(t_from)).max(0.0);
        *slot += span.alpha_increase * overlap / h;
    }
}

/// The LU factors of the collocation matrix with the two responses that span every solution:
/// A(alpha) = alpha * `per_alpha` + `at_zero` (the problem is linear in alpha).
#[derive(Debug, Clone)]
pub struct Responses {
    /// Coefficients per radian of reference angle of attack.
    pub per_alpha: Vec<f64>,
    /// Coefficients at zero reference angle of attack (twist, camber and controls).
    pub at_zero: Vec<f64>,
}

/// Solves a mirrored wing's system in two halves.
///
/// On a wing mirrored about its span midpoint, mu(theta) = mu(pi - theta) and
/// sin(n (pi - theta)) = (-1)^(n+1) sin(n theta), so adding and subtracting the equations at
/// theta_k and pi - theta_k splits the system exactly: the odd terms answer the symmetric part
/// of the right-hand side, the even terms the antisymmetric part. Two systems of N/2 cost a
/// quarter of one of N to factor. `mu` and `rhs` are given at all N collocation angles.
#[must_use]
pub fn responses_mirrored(thetas: &[f64], mu: &[f64], rhs: &[f64]) -> Option<Responses> {
    let n = thetas.len();
    let (odd, even) = (n.div_ceil(2), n / 2);
    let mut m_odd = DMatrix::zeros(odd, odd);
    let mut m_even = DMatrix::zeros(even, even);
    let mut ratios = vec![0.0; n];
    for k in 0..odd {
        sine_ratios(thetas[k], &mut ratios);
        let s = thetas[k].sin();
        for (j, &u) in ratios.iter().enumerate() {
            let value = u * (mu[k] * s + (j + 1) as f64);
            match (j % 2, k < even) {
                (0, _) => m_odd[(k, j / 2)] = value,
                (_, true) => m_even[(k, j / 2)] = value,
                _ => {}
            }
        }
    }
    let mirror = |k: usize| rhs[n - 1 - k];
    let symmetric: Vec<f64> = (0..odd).map(|k| 0.5 * (rhs[k] + mirror(k))).collect();
    let antisymmetric: Vec<f64> = (0..even).map(|k| 0.5 * (rhs[k] - mirror(k))).collect();
    let lu_odd = m_odd.lu();
    let per_alpha_odd = lu_odd.solve(&DVector::from_element(odd, 1.0))?;
    let zero_odd = lu_odd.solve(&DVector::from_vec(symmetric))?;
    let zero_even = if even > 0 {
        m_even.lu().solve(&DVector::from_vec(antisymmetric))?
    } else {
        DVector::zeros(0)
    };
    let mut per_alpha = vec![0.0; n];
    let mut at_zero = vec![0.0; n];
    for j in 0..odd {
        per_alpha[2 * j] = per_alpha_odd[j];
        at_zero[2 * j] = zero_odd[j];
    }
    for j in 0..even {
        at_zero[2 * j + 1] = zero_even[j];
    }
    let finite = per_alpha.iter().chain(&at_zero).all(|v| v.is_finite());
    finite.then_some(Responses { per_alpha, at_zero })
}

/// Factors `m` once and back-substitutes both right-hand sides.
///
/// Returns `None` when the matrix is singular.
#[must_use]
pub fn responses(m: DMatrix<f64>, at_zero_rhs: &[f64]) -> Option<Responses> {
    let n = m.nrows();
    let lu = m.lu();
    let per_alpha = lu.solve(&DVector::from_element(n, 1.0))?;
    let at_zero = lu.solve(&DVector::from_column_slice(at_zero_rhs))?;
    let finite = per_alpha
        .iter()
        .chain(at_zero.iter())
        .all(|v| v.is_finite());
    finite.then(|| Responses {
        per_alpha: per_alpha.as_slice().to_vec(),
        at_zero: at_zero.as_slice().to_vec(),
    })
}

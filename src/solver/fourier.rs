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

    /// y at the angle whose cosine is `cos_theta`.
    #[must_use]
    pub fn y_at_cos(self, cos_theta: f64) -> f64 {
        self.y_mid - self.half_span * cos_theta
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

/// The series sums of both responses at one angle, as (value at zero alpha, value per radian).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PairSums {
    /// sum A_n sin(n theta).
    pub load: (f64, f64),
    /// sum n A_n sin(n theta) / sin(theta): the induced angle.
    pub induced: (f64, f64),
}

/// Angles evaluated side by side: the Chebyshev recurrence is a serial chain, so running
/// several independent chains at once keeps the floating-point units busy.
const LANES: usize = 4;

/// [`series_at`] for both responses at many angles, given as `(cos theta, sin theta)`, in one
/// recurrence per angle. The sums are formed in the same order as [`series_at`].
#[must_use]
pub fn pair_sums(at_zero: &[f64], per_alpha: &[f64], angles: &[(f64, f64)]) -> Vec<PairSums> {
    let weighted: Vec<[f64; 4]> = at_zero
        .iter()
        .zip(per_alpha)
        .enumerate()
        .map(|(i, (&z, &p))| {
            let order = (i + 1) as f64;
            [z, p, order * z, order * p]
        })
        .collect();
    let mut out = Vec::with_capacity(angles.len());
    for chunk in angles.chunks(LANES) {
        let mut two_x = [0.0; LANES];
        for (slot, &(cos, _)) in two_x.iter_mut().zip(chunk) {
            *slot = 2.0 * cos;
        }
        let mut previous = [0.0; LANES];
        let mut current = [1.0; LANES];
        let mut acc = [[0.0; LANES]; 4];
        for w in &weighted {
            for (sum, &coefficient) in acc.iter_mut().zip(w) {
                for (slot, &u) in sum.iter_mut().zip(&current) {
                    *slot += coefficient * u;
                }
            }
            for lane in 0..LANES {
                let next = two_x[lane] * current[lane] - previous[lane];
                previous[lane] = current[lane];
                current[lane] = next;
            }
        }
        for (lane, &(_, s)) in chunk.iter().enumerate() {
            out.push(PairSums {
                load: (acc[0][lane] * s, acc[1][lane] * s),
                induced: (acc[2][lane], acc[3][lane]),
            });
        }
    }
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

/// Solves the collocation system for both responses: the right-hand side 1 (per radian of
/// alpha) and `at_zero_rhs`.
///
/// For a mirrored wing, mu at theta and at pi - theta are equal and
/// sin(n (pi - theta)) = (-1)^(n+1) sin(n theta), so the sum and the difference of each pair of
/// mirrored rows involve only odd and only even n respectively: two systems of half the size,
/// a quarter of the factorisation work, and the same solution up to rounding.
/// Returns `None` when the matrix is singular.
#[must_use]
pub fn solve_collocation(
    thetas: &[f64],
    mu: &[f64],
    at_zero_rhs: &[f64],
    mirrored: bool,
) -> Option<Responses> {
    if !mirrored {
        return responses(matrix(thetas, mu), at_zero_rhs);
    }
    let n = thetas.len();
    let pairs = n / 2;
    let odd_count = n - pairs;
    // Column by column (contiguous in nalgebra's column-major storage), running the
    // recurrence sin(n theta)/sin(theta) = U_{n-1}(cos theta) for all rows at once.
    let rows = &thetas[..odd_count];
    let two_x: Vec<f64> = rows.iter().map(|t| 2.0 * t.cos()).collect();
    let mu_s: Vec<f64> = rows.iter().zip(mu).map(|(t, m)| m * t.sin()).collect();
    let mut previous = vec![0.0; odd_count];
    let mut current = vec![1.0; odd_count];
    let mut odd = DMatrix::zeros(odd_count, odd_count);
    let mut even = DMatrix::zeros(pairs, pairs);
    for j in 0..n {
        let order = (j + 1) as f64;
        let (column, used) = if j % 2 == 0 {
            (odd.column_mut(j / 2), odd_count)
        } else {
            (even.column_mut(j / 2), pairs)
        };
        for (slot, (&u, &ms)) in column.into_iter().zip(current.iter().zip(&mu_s)).take(used) {
            *slot = u * (ms + order);
        }
        for k in 0..odd_count {
            let next = two_x[k] * current[k] - previous[k];
            previous[k] = current[k];
            current[k] = next;
        }
    }
    let mirror = |k: usize| at_zero_rhs[n - 1 - k];
    let odd_rhs: Vec<f64> = (0..odd_count)
        .map(|k| {
            if k < pairs {
                0.5 * (at_zero_rhs[k] + mirror(k))
            } else {
                at_zero_rhs[k]
            }
        })
        .collect();
    let even_rhs: Vec<f64> = (0..pairs)
        .map(|k| 0.5 * (at_zero_rhs[k] - mirror(k)))
        .collect();
    let odd_lu = odd.lu();
    let odd_alpha = odd_lu.solve(&DVector::from_element(odd_count, 1.0))?;
    let odd_zero = odd_lu.solve(&DVector::from_column_slice(&odd_rhs))?;
    let even_zero = if pairs > 0 {
        even.lu().solve(&DVector::from_column_slice(&even_rhs))?
    } else {
        DVector::zeros(0)
    };
    let mut per_alpha = vec![0.0; n];
    let mut at_zero = vec![0.0; n];
    for (i, (&a, &z)) in odd_alpha.iter().zip(odd_zero.iter()).enumerate() {
        per_alpha[2 * i] = a;
        at_zero[2 * i] = z;
    }
    for (i, &z) in even_zero.iter().enumerate() {
        at_zero[2 * i + 1] = z;
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

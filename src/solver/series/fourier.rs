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

use crate::solver::controls::ControlSpan;

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

/// The series sums of both responses at one angle, as (value at zero alpha, value per radian).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PairSums {
    /// sum A_n sin(n theta).
    pub load: (f64, f64),
    /// sum n A_n sin(n theta) / sin(theta): the induced angle.
    pub induced: (f64, f64),
}

/// Angles evaluated side by side: the Chebyshev recurrence is a serial chain, so running
/// several independent chains at once keeps the floating-point units busy (2, 4 and 8 lanes
/// measured alike here; 4 keeps the accumulators in registers).
const LANES: usize = 4;

/// Weighted Chebyshev sums at one angle, split by the parity of n:
/// `odd[k] = sum over odd n of w_n[k] U_{n-1}(cos theta)`, `even[k]` likewise over even n.
///
/// Since U_{n-1}(-x) = (-1)^(n-1) U_{n-1}(x), the same sums at the mirrored angle
/// pi - theta are `odd - even`: one recurrence serves both halves of a mirrored wing.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ParitySums<const K: usize> {
    /// Sums over odd n.
    pub odd: [f64; K],
    /// Sums over even n.
    pub even: [f64; K],
}

impl<const K: usize> ParitySums<K> {
    /// The sums at theta.
    #[must_use]
    pub fn at_angle(&self) -> [f64; K] {
        std::array::from_fn(|k| self.odd[k] + self.even[k])
    }

    /// The sums at pi - theta.
    #[must_use]
    pub fn at_mirror(&self) -> [f64; K] {
        std::array::from_fn(|k| self.odd[k] - self.even[k])
    }
}

#[inline(always)]
fn accumulate<const K: usize>(acc: &mut [[f64; LANES]; K], weights: &[f64; K], u: &[f64; LANES]) {
    for (sum, &w) in acc.iter_mut().zip(weights) {
        for (slot, &value) in sum.iter_mut().zip(u) {
            *slot += w * value;
        }
    }
}

/// One step of the two-term recurrence U_{k+2} = c U_k - U_{k-2}, c = 4x^2 - 2, which follows
/// from U_{k+1} = 2x U_k - U_{k-1} applied twice: it runs the even-index and the odd-index
/// U side by side as independent chains, so neither waits for the other.
#[inline(always)]
fn advance(c: &[f64; LANES], previous: &mut [f64; LANES], current: &mut [f64; LANES]) {
    for lane in 0..LANES {
        let next = c[lane] * current[lane] - previous[lane];
        previous[lane] = current[lane];
        current[lane] = next;
    }
}

/// [`ParitySums`] of `weights` (one row per n = 1..N) at each angle given by its cosine.
#[must_use]
pub fn parity_sums<const K: usize>(weights: &[[f64; K]], cosines: &[f64]) -> Vec<ParitySums<K>> {
    let mut out = Vec::with_capacity(cosines.len());
    for chunk in cosines.chunks(LANES) {
        let mut x = [0.0; LANES];
        x[..chunk.len()].copy_from_slice(chunk);
        let c: [f64; LANES] = std::array::from_fn(|lane| 4.0 * x[lane] * x[lane] - 2.0);
        // U_{n-1} for odd n: U_0 = 1 from U_{-2} = -1; for even n: U_1 = 2x from U_{-1} = 0.
        let (mut even_previous, mut even_index) = ([-1.0; LANES], [1.0; LANES]);
        let mut odd_previous = [0.0; LANES];
        let mut odd_index: [f64; LANES] = std::array::from_fn(|lane| 2.0 * x[lane]);
        let mut odd = [[0.0; LANES]; K];
        let mut even = [[0.0; LANES]; K];
        let mut rows = weights.chunks_exact(2);
        for pair in rows.by_ref() {
            accumulate(&mut odd, &pair[0], &even_index);
            accumulate(&mut even, &pair[1], &odd_index);
            advance(&c, &mut even_previous, &mut even_index);
            advance(&c, &mut odd_previous, &mut odd_index);
        }
        if let [last] = rows.remainder() {
            accumulate(&mut odd, last, &even_index);
        }
        for lane in 0..chunk.len() {
            out.push(ParitySums {
                odd: std::array::from_fn(|k| odd[k][lane]),
                even: std::array::from_fn(|k| even[k][lane]),
            });
        }
    }
    out
}

/// Rows `[A_n(0), dA_n/dalpha, n A_n(0), n dA_n/dalpha]` for [`parity_sums`]: load and
/// induced angle of both responses.
#[must_use]
pub fn pair_weights(at_zero: &[f64], per_alpha: &[f64]) -> Vec<[f64; 4]> {
    at_zero
        .iter()
        .zip(per_alpha)
        .enumerate()
        .map(|(i, (&z, &p))| {
            let order = (i + 1) as f64;
            [z, p, order * z, order * p]
        })
        .collect()
}

impl PairSums {
    /// The load and induced sums from the four weighted sums of [`pair_weights`], with
    /// `sin` = sin(theta) turning U_{n-1} into sin(n theta) for the load.
    #[must_use]
    pub fn from_sums(sums: [f64; 4], sin: f64) -> Self {
        Self {
            load: (sums[0] * sin, sums[1] * sin),
            induced: (sums[2], sums[3]),
        }
    }
}

/// The load sum A_n sin(n theta) and the induced sum n A_n sin(n theta)/sin(theta) of both
/// responses at many angles, given as `(cos theta, sin theta)`, in one recurrence per angle.
#[must_use]
pub fn pair_sums(at_zero: &[f64], per_alpha: &[f64], angles: &[(f64, f64)]) -> Vec<PairSums> {
    let cosines: Vec<f64> = angles.iter().map(|a| a.0).collect();
    parity_sums(&pair_weights(at_zero, per_alpha), &cosines)
        .iter()
        .zip(angles)
        .map(|(sums, &(_, sin))| PairSums::from_sums(sums.at_angle(), sin))
        .collect()
}

/// Rows `[A_n(0), dA_n/dalpha]` for [`parity_sums`]: the load of both responses.
#[must_use]
pub fn load_weights(at_zero: &[f64], per_alpha: &[f64]) -> Vec<[f64; 2]> {
    at_zero
        .iter()
        .zip(per_alpha)
        .map(|(&z, &p)| [z, p])
        .collect()
}

/// The inputs of the collocation system, as [`solve_collocation`] took them.
#[derive(Debug, Clone, Copy)]
pub struct Collocation<'a> {
    /// `(cos theta_k, sin theta_k)` of each collocation angle.
    pub angles: &'a [(f64, f64)],
    /// mu_k = 4 b / (a0_k c_k).
    pub mu: &'a [f64],
    /// The zero-alpha right-hand side alpha_k - alpha_L0,k (twist, camber, controls).
    pub rhs: &'a [f64],
    /// True for a mirrored wing, whose angles come in pairs theta, pi - theta.
    pub mirrored: bool,
}

/// [`pair_sums`] at the collocation points themselves. Only the load needs the series: the
/// induced angle there follows from the lifting-line equation the A_n were solved to satisfy,
/// alpha_i = alpha + rhs_k - mu_k sum A_n sin(n theta_k). A mirrored wing evaluates the right
/// half and takes the left half from the same recurrences.
#[must_use]
pub fn collocation_sums(at_zero: &[f64], per_alpha: &[f64], at: Collocation) -> Vec<PairSums> {
    let len = at.angles.len();
    let weights = load_weights(at_zero, per_alpha);
    let mut loads = vec![[0.0; 2]; len];
    if at.mirrored {
        let upper = len / 2;
        let cosines: Vec<f64> = at.angles[upper..].iter().map(|a| a.0).collect();
        for (i, sums) in parity_sums(&weights, &cosines).iter().enumerate() {
            loads[len - 1 - (upper + i)] = sums.at_mirror();
            loads[upper + i] = sums.at_angle();
        }
    } else {
        let cosines: Vec<f64> = at.angles.iter().map(|a| a.0).collect();
        for (slot, sums) in loads.iter_mut().zip(parity_sums(&weights, &cosines)) {
            *slot = sums.at_angle();
        }
    }
    loads
        .iter()
        .zip(at.angles)
        .zip(at.mu.iter().zip(at.rhs))
        .map(|((l, &(_, sin)), (&mu, &rhs))| {
            let load = (l[0] * sin, l[1] * sin);
            PairSums {
                load,
                induced: (rhs - mu * load.0, 1.0 - mu * load.1),
            }
        })
        .collect()
}

/// The collocation matrix `M[k][n-1]` = sin(n theta_k) (mu_k + n / sin theta_k), with
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
    let cells = CellOverlap::new(map, thetas.len(), span);
    for (slot, &theta) in out.iter_mut().zip(thetas) {
        *slot += span.alpha_increase * cells.fraction(theta);
    }
}

/// The fraction of each collocation cell [theta - h/2, theta + h/2], h = pi/(N + 1), that lies
/// inside a control's span.
struct CellOverlap {
    h: f64,
    from: f64,
    to: f64,
}

impl CellOverlap {
    fn new(map: SpanMap, terms: usize, span: &ControlSpan) -> Self {
        Self {
            h: std::f64::consts::PI / (terms as f64 + 1.0),
            from: map.theta(span.y_from),
            to: map.theta(span.y_to),
        }
    }

    fn fraction(&self, theta: f64) -> f64 {
        let (lo, hi) = (theta - 0.5 * self.h, theta + 0.5 * self.h);
        (hi.min(self.to) - lo.max(self.from)).max(0.0) / self.h
    }
}

/// [`add_control_shift`] for a control on a mirrored wing: the overlap of each right-half cell
/// with `right` is computed once and the mirrored left cell receives the same overlap times
/// `left_increase` (the left half's angle increase), so the two halves match exactly.
/// The controls lie on the right half (y >= 0), so only right-half cells can overlap them.
pub fn add_mirrored_control_shift(
    map: SpanMap,
    thetas: &[f64],
    right: &ControlSpan,
    left_increase: f64,
    out: &mut [f64],
) {
    let n = thetas.len();
    let cells = CellOverlap::new(map, n, right);
    for k in n / 2..n {
        let overlap = cells.fraction(thetas[k]);
        if overlap == 0.0 {
            continue;
        }
        out[k] += right.alpha_increase * overlap;
        // At the middle point of an odd count (k = n - 1 - k), the left half of its cell
        // overlaps the left control by the same amount.
        out[n - 1 - k] += left_increase * overlap;
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
    let mut odd = vec![0.0; odd_count * odd_count];
    let mut even = vec![0.0; pairs * pairs];
    for j in 0..n {
        let order = (j + 1) as f64;
        let column = if j % 2 == 0 {
            &mut odd[(j / 2) * odd_count..(j / 2 + 1) * odd_count]
        } else {
            &mut even[(j / 2) * pairs..(j / 2 + 1) * pairs]
        };
        for ((slot, &u), &ms) in column.iter_mut().zip(&current).zip(&mu_s) {
            *slot = u * (ms + order);
        }
        for ((p, c), &tx) in previous.iter_mut().zip(current.iter_mut()).zip(&two_x) {
            let next = tx * *c - *p;
            *p = *c;
            *c = next;
        }
    }
    let odd = DMatrix::from_vec(odd_count, odd_count, odd);
    let even = DMatrix::from_vec(pairs, pairs, even);
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
    // A wing with no antisymmetric input (no deflected aileron) has no even terms at all.
    let even_zero = if even_rhs.iter().any(|&v| v != 0.0) {
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

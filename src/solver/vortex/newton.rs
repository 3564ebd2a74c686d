//! Newton's method on the circulation residual of the numerical lifting line.
//!
//! Each section's Kutta-Joukowski lift must equal its section lift (Phillips & Snyder,
//! J. Aircraft 37(4), 2000, eq. 18, linearised in the onset angles as Prandtl's equation is;
//! in units of chord times lift coefficient):
//!
//!   R_i = 2 g_i - c_i cl_i(alpha_eff,i),
//!   alpha_eff,i = alpha n_z,i + roll_i + sum_j A_ij g_j + twist_i + control shift_i,
//!
//! with g = Gamma/V and A_ij the normal velocity at section i from horseshoe j per unit g.
//! The Jacobian is analytic, J = 2 I - diag(c cl') A; a step that does not reduce the
//! largest residual is halved.

use nalgebra::{DMatrix, DVector};

use super::influence::Influence;
use super::panels::ControlPoint;
use crate::solver::SolveError;
use crate::wing::Section;

/// A section lift law: (cl, dcl/dalpha) at an effective angle (radians).
pub type LiftLaw = fn(&Section, f64) -> (f64, f64);

/// The inputs that stay fixed during one solve.
pub struct Problem<'a> {
    /// Control points.
    pub points: &'a [ControlPoint],
    /// Influences.
    pub influence: &'a Influence,
    /// The onset angle at each section: alpha n_z + roll + twist + control shift, radians.
    pub onset: Vec<f64>,
    /// The section lift law.
    pub lift: LiftLaw,
    /// Reference chord for the residual's scale, m.
    pub chord_scale: f64,
    /// Factor on every section's lift curve (1/beta, Prandtl-Glauert).
    pub lift_scale: f64,
}

/// Newton's answer.
#[derive(Debug, Clone)]
pub struct Converged {
    /// Circulation over airspeed, m.
    pub g: Vec<f64>,
    /// Iterations taken.
    pub iterations: usize,
    /// Final largest residual, in lift-coefficient units.
    pub residual: f64,
    /// Section (cl, dcl/dalpha) at each control point.
    pub cl: Vec<(f64, f64)>,
    /// Effective angle of attack at each control point, radians.
    pub angles: Vec<f64>,
    /// The Jacobian's LU factors at the answer (for derivatives with respect to alpha).
    pub jacobian: nalgebra::LU<f64, nalgebra::Dyn, nalgebra::Dyn>,
}

impl Problem<'_> {
    fn n(&self) -> usize {
        self.points.len()
    }

    /// The effective angle at every section for circulations `g`.
    #[must_use]
    pub fn angles(&self, g: &[f64]) -> Vec<f64> {
        let n = self.n();
        (0..n)
            .map(|i| {
                let row = &self.influence.normal[i * n..(i + 1) * n];
                self.onset[i] + row.iter().zip(g).map(|(a, gj)| a * gj).sum::<f64>()
            })
            .collect()
    }

    /// Section (cl, slope) at each control point for circulations `g`.
    #[must_use]
    pub fn lifts(&self, g: &[f64]) -> Vec<(f64, f64)> {
        let k = self.lift_scale;
        self.angles(g)
            .iter()
            .zip(self.points)
            .map(|(&a, p)| {
                let (cl, slope) = (self.lift)(&p.section, a);
                (k * cl, k * slope)
            })
            .collect()
    }

    fn residual(&self, g: &[f64], cl: &[(f64, f64)]) -> Vec<f64> {
        self.points
            .iter()
            .zip(cl)
            .zip(g)
            .map(|((p, c), &gi)| 2.0 * gi - p.section.chord * c.0)
            .collect()
    }

    fn size(&self, r: &[f64]) -> f64 {
        r.iter().fold(0.0_f64, |m, v| m.max(v.abs())) / self.chord_scale
    }

    /// The analytic Jacobian dR_i/dg_j = 2 delta_ij - c_i cl'_i A_ij.
    fn jacobian(&self, cl: &[(f64, f64)]) -> DMatrix<f64> {
        let n = self.n();
        let mut m = DMatrix::zeros(n, n);
        for i in 0..n {
            let k = self.points[i].section.chord * cl[i].1;
            for j in 0..n {
                m[(i, j)] = -k * self.influence.normal[i * n + j];
            }
            m[(i, i)] += 2.0;
        }
        m
    }

    /// Newton from `start` to `tol` (largest residual over the reference chord) within
    /// `max_iter` iterations.
    ///
    /// # Errors
    /// [`SolveError::NotConverged`] with the iterations and the residual reached;
    /// [`SolveError::Singular`] when a Jacobian cannot be factored.
    pub fn solve(&self, start: &[f64], tol: f64, max_iter: usize) -> Result<Converged, SolveError> {
        let mut g = start.to_vec();
        let mut cl = self.lifts(&g);
        let mut r = self.residual(&g, &cl);
        let mut size = self.size(&r);
        for iteration in 0..=max_iter {
            let lu = self.jacobian(&cl).lu();
            if size <= tol && size.is_finite() {
                return Ok(Converged {
                    angles: self.angles(&g),
                    g,
                    iterations: iteration,
                    residual: size,
                    cl,
                    jacobian: lu,
                });
            }
            if iteration == max_iter || !size.is_finite() {
                break;
            }
            let minus_r = DVector::from_iterator(r.len(), r.iter().map(|v| -v));
            let step = lu.solve(&minus_r).ok_or(SolveError::Singular)?;
            let mut damping = 1.0;
            loop {
                let trial: Vec<f64> = g
                    .iter()
                    .zip(step.iter())
                    .map(|(a, d)| a + damping * d)
                    .collect();
                let trial_cl = self.lifts(&trial);
                let trial_r = self.residual(&trial, &trial_cl);
                let trial_size = self.size(&trial_r);
                if trial_size < size || damping < 1.0 / 64.0 {
                    (g, cl, r, size) = (trial, trial_cl, trial_r, trial_size);
                    break;
                }
                damping *= 0.5;
            }
        }
        Err(SolveError::NotConverged {
            iterations: max_iter,
            residual: size,
        })
    }

    /// dg/dalpha at a converged answer: J dg = c cl' n_z.
    ///
    /// # Errors
    /// [`SolveError::Singular`] when the factors cannot be solved.
    pub fn rate(&self, done: &Converged) -> Result<Vec<f64>, SolveError> {
        let rhs = DVector::from_iterator(
            self.n(),
            self.points
                .iter()
                .zip(&done.cl)
                .map(|(p, c)| p.section.chord * c.1 * p.normal[2]),
        );
        done.jacobian
            .solve(&rhs)
            .map(|v| v.as_slice().to_vec())
            .ok_or(SolveError::Singular)
    }
}

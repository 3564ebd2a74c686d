//! Section curves between two stations where a table airfoil is involved: the two stations'
//! own curves, whose values blend (cl(alpha) at a point is the linear-in-y blend of the two
//! stations' cl(alpha); likewise cd and cm).

use std::sync::Arc;

use super::table::{Columns, SectionTable, TableSource};
use super::{Airfoil, Section};

/// Two stations' section curves and how far the point lies from the first to the second.
#[derive(Debug, Clone, PartialEq)]
pub struct TableBlend {
    /// The inner (first) station's curve.
    pub first: Curve,
    /// The outer (second) station's curve.
    pub second: Curve,
    /// Fraction of the way from `first` to `second`, 0 to 1.
    pub t: f64,
}

/// One station's section curves: straight lines from the linear parameters, or a table.
#[derive(Debug, Clone, PartialEq)]
pub enum Curve {
    /// `cl = a (alpha - alpha_L0)`, `cd = cd0 + cd1 cl + cd2 cl^2`, constant cm.
    Linear(LinearCurve),
    /// Interpolated in a table.
    Table(Arc<SectionTable>),
}

/// The linear parameters of one airfoil.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LinearCurve {
    /// Per radian.
    pub lift_slope: f64,
    /// Radians.
    pub alpha_zero_lift: f64,
    /// Polar constant term.
    pub cd0: f64,
    /// Polar linear term.
    pub cd1: f64,
    /// Polar quadratic term.
    pub cd2: f64,
    /// Constant pitching-moment coefficient.
    pub cm0: f64,
}

impl LinearCurve {
    /// The linear parameters of an airfoil (for a table airfoil, those of its linear range).
    #[must_use]
    pub fn of(a: &Airfoil) -> Self {
        Self {
            lift_slope: a.lift_slope,
            alpha_zero_lift: a.alpha_zero_lift_deg.to_radians(),
            cd0: a.cd0,
            cd1: a.cd1,
            cd2: a.cd2,
            cm0: a.cm0,
        }
    }
}

impl Curve {
    /// An airfoil's own curve: its table, else its straight line.
    #[must_use]
    pub fn of(a: &Airfoil) -> Self {
        a.table.as_ref().map_or_else(
            || Self::Linear(LinearCurve::of(a)),
            |t| Self::Table(Arc::clone(t)),
        )
    }

    /// cl and dcl/dalpha (per radian) at section angle of attack `alpha` (radians).
    #[must_use]
    pub fn lift(&self, alpha: f64) -> (f64, f64) {
        match self {
            Self::Linear(l) => (l.lift_slope * (alpha - l.alpha_zero_lift), l.lift_slope),
            Self::Table(t) => t.lift(alpha),
        }
    }

    /// Profile-drag coefficient at `alpha` (radians).
    #[must_use]
    pub fn drag(&self, alpha: f64) -> f64 {
        match self {
            Self::Linear(l) => {
                let cl = self.lift(alpha).0;
                l.cd0 + l.cd1 * cl + l.cd2 * cl * cl
            }
            Self::Table(t) => t.drag(alpha),
        }
    }

    /// Pitching-moment coefficient about the quarter chord at `alpha` (radians).
    #[must_use]
    pub fn moment(&self, alpha: f64) -> f64 {
        match self {
            Self::Linear(l) => l.cm0,
            Self::Table(t) => t.moment(alpha),
        }
    }

    /// The angles of attack (radians) the curve's data cover; `None` for a straight line.
    #[must_use]
    pub fn data_range(&self) -> Option<(f64, f64)> {
        match self {
            Self::Linear(_) => None,
            Self::Table(t) => {
                let r = t.alpha_range_deg();
                Some((r.start.to_radians(), r.end.to_radians()))
            }
        }
    }
}

fn mix(a: f64, b: f64, t: f64) -> f64 {
    a + (b - a) * t
}

impl TableBlend {
    /// A station's own table (nothing to blend).
    #[must_use]
    pub fn single(table: &Arc<SectionTable>) -> Arc<Self> {
        Arc::new(Self {
            first: Curve::Table(Arc::clone(table)),
            second: Curve::Table(Arc::clone(table)),
            t: 0.0,
        })
    }

    /// The curves fraction `t` of the way from section `a` to section `b`; `None` when
    /// neither involves a table (the blended linear parameters then say it all).
    #[must_use]
    pub fn between(a: &Section, b: &Section, t: f64) -> Option<Arc<Self>> {
        (a.curves.is_some() || b.curves.is_some()).then(|| {
            Arc::new(Self {
                first: nearest_curve(a),
                second: nearest_curve(b),
                t,
            })
        })
    }

    /// The angles of attack (radians) that every weighted table of the blend covers; `None`
    /// when no weighted side is a table.
    #[must_use]
    pub fn data_range(&self) -> Option<(f64, f64)> {
        [(&self.first, self.t < 1.0), (&self.second, self.t > 0.0)]
            .into_iter()
            .filter(|&(_, weighted)| weighted)
            .filter_map(|(curve, _)| curve.data_range())
            .reduce(|a, b| (a.0.max(b.0), a.1.min(b.1)))
    }

    /// `(1 - t) f(first) + t f(second)`, skipping a side that has no weight.
    fn mix<T>(&self, f: impl Fn(&Curve) -> T, add: impl Fn(T, T, f64) -> T) -> T {
        if self.t <= 0.0 {
            f(&self.first)
        } else if self.t >= 1.0 {
            f(&self.second)
        } else {
            add(f(&self.first), f(&self.second), self.t)
        }
    }

    /// Blended cl and dcl/dalpha (per radian) at `alpha` (radians).
    #[must_use]
    pub fn lift(&self, alpha: f64) -> (f64, f64) {
        self.mix(
            |c| c.lift(alpha),
            |p, q, t| (mix(p.0, q.0, t), mix(p.1, q.1, t)),
        )
    }

    /// Blended profile-drag coefficient at `alpha` (radians).
    #[must_use]
    pub fn drag(&self, alpha: f64) -> f64 {
        self.mix(|c| c.drag(alpha), mix)
    }

    /// Blended pitching-moment coefficient at `alpha` (radians).
    #[must_use]
    pub fn moment(&self, alpha: f64) -> f64 {
        self.mix(|c| c.moment(alpha), mix)
    }

    /// Every alpha row of the tables involved, in order, without repeats (degrees).
    fn rows_deg(&self) -> Vec<f64> {
        let mut alpha: Vec<f64> = [&self.first, &self.second]
            .into_iter()
            .filter_map(|c| match c {
                Curve::Table(t) => Some(t.columns().alpha_deg.clone()),
                Curve::Linear(_) => None,
            })
            .flatten()
            .collect();
        alpha.sort_by(f64::total_cmp);
        alpha.dedup();
        alpha
    }
}

/// The one curve that stands for a section when it is blended again: its airfoil's own, or
/// the nearer of its two stations' curves.
fn nearest_curve(s: &Section) -> Curve {
    match &s.curves {
        Some(b) if b.t <= 0.5 => b.first.clone(),
        Some(b) => b.second.clone(),
        None => Curve::of(&s.airfoil),
    }
}

/// A section as an airfoil of its own: its blended linear parameters, and where tables are
/// involved a table of the blended values at every row of the stations' tables (between those
/// rows the two agree to interpolation accuracy).
#[must_use]
pub fn section_airfoil(s: &Section) -> Airfoil {
    let table = s.curves.as_ref().and_then(|b| {
        let alpha_deg = b.rows_deg();
        let at = |f: &dyn Fn(f64) -> f64| -> Vec<f64> {
            alpha_deg.iter().map(|a| f(a.to_radians())).collect()
        };
        let columns = Columns {
            cl: at(&|a| b.lift(a).0),
            cd: at(&|a| b.drag(a)),
            cm: Some(at(&|a| b.moment(a))),
            alpha_deg: alpha_deg.clone(),
        };
        SectionTable::new(TableSource::Inline, columns).ok()
    });
    match table {
        Some(t) => Airfoil::from_table(t, Some(s.airfoil.cl_max)),
        None => Airfoil {
            table: None,
            ..s.airfoil.clone()
        },
    }
}

//! Section properties blended between two stations, for linear and table airfoils alike.

use std::sync::Arc;

use super::table::SectionTable;
use super::Airfoil;

/// Airfoil properties at a point between two stations: the linear parameters blended
/// linearly in y (what the series method uses), and, where a table airfoil is involved, the
/// two stations' own curves, whose values are blended (cl(alpha) at the point is the blend of
/// the two stations' cl(alpha); likewise cd and cm).
#[derive(Debug, Clone, PartialEq)]
pub struct BlendedAirfoil {
    /// Section lift-curve slope, per radian.
    pub lift_slope: f64,
    /// Zero-lift angle of attack, degrees.
    pub alpha_zero_lift_deg: f64,
    /// Maximum section lift coefficient.
    pub cl_max: f64,
    /// Constant term of the profile-drag polar.
    pub cd0: f64,
    /// Linear term of the profile-drag polar.
    pub cd1: f64,
    /// Quadratic term of the profile-drag polar.
    pub cd2: f64,
    /// Pitching-moment coefficient about the quarter chord.
    pub cm0: f64,
    /// The stations' curves when either airfoil is a table; `None` when both are linear.
    pub tables: Option<Arc<TableBlend>>,
}

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

impl Curve {
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
}

impl TableBlend {
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
}

fn mix(a: f64, b: f64, t: f64) -> f64 {
    a + (b - a) * t
}

impl From<&Airfoil> for BlendedAirfoil {
    /// The properties at the airfoil's own station.
    fn from(a: &Airfoil) -> Self {
        Self {
            lift_slope: a.lift_slope,
            alpha_zero_lift_deg: a.alpha_zero_lift_deg,
            cl_max: a.cl_max,
            cd0: a.cd0,
            cd1: a.cd1,
            cd2: a.cd2,
            cm0: a.cm0,
            tables: a.table.as_ref().map(|t| {
                Arc::new(TableBlend {
                    first: Curve::Table(Arc::clone(t)),
                    second: Curve::Table(Arc::clone(t)),
                    t: 0.0,
                })
            }),
        }
    }
}

impl BlendedAirfoil {
    /// Fraction `t` of the way from `self` to `other`: parameters blended linearly; where
    /// either side is a table, the two sides' curves kept for blending their values.
    #[must_use]
    pub fn lerp(&self, other: &Self, t: f64) -> Self {
        let tables = (self.tables.is_some() || other.tables.is_some()).then(|| {
            Arc::new(TableBlend {
                first: self.curve(),
                second: other.curve(),
                t,
            })
        });
        Self {
            lift_slope: mix(self.lift_slope, other.lift_slope, t),
            alpha_zero_lift_deg: mix(self.alpha_zero_lift_deg, other.alpha_zero_lift_deg, t),
            cl_max: mix(self.cl_max, other.cl_max, t),
            cd0: mix(self.cd0, other.cd0, t),
            cd1: mix(self.cd1, other.cd1, t),
            cd2: mix(self.cd2, other.cd2, t),
            cm0: mix(self.cm0, other.cm0, t),
            tables,
        }
    }

    /// The one curve that stands for this section when it is blended again: its own line,
    /// or the nearer of its two stations' curves.
    fn curve(&self) -> Curve {
        match &self.tables {
            Some(b) if b.t <= 0.5 => b.first.clone(),
            Some(b) => b.second.clone(),
            None => Curve::Linear(self.linear()),
        }
    }

    /// The linear parameters as a curve.
    #[must_use]
    pub fn linear(&self) -> LinearCurve {
        LinearCurve {
            lift_slope: self.lift_slope,
            alpha_zero_lift: self.alpha_zero_lift_deg.to_radians(),
            cd0: self.cd0,
            cd1: self.cd1,
            cd2: self.cd2,
            cm0: self.cm0,
        }
    }

    /// True when a table airfoil is involved (the linear parameters are then a fit).
    #[must_use]
    pub const fn has_table(&self) -> bool {
        self.tables.is_some()
    }

    /// Section cl and dcl/dalpha (per radian) at section angle of attack `alpha` (radians,
    /// to the local chord line): the straight line of the linear parameters, or the blend of
    /// the two stations' curves.
    #[must_use]
    pub fn lift(&self, alpha: f64) -> (f64, f64) {
        match &self.tables {
            None => Curve::Linear(self.linear()).lift(alpha),
            Some(b) => b.mix(
                |c| c.lift(alpha),
                |p, q, t| (mix(p.0, q.0, t), mix(p.1, q.1, t)),
            ),
        }
    }

    /// Section profile-drag coefficient at `alpha` (radians): the polar at the line's cl, or
    /// the blend of the two stations' values.
    #[must_use]
    pub fn drag(&self, alpha: f64) -> f64 {
        match &self.tables {
            None => Curve::Linear(self.linear()).drag(alpha),
            Some(b) => b.mix(|c| c.drag(alpha), mix),
        }
    }

    /// Section pitching-moment coefficient about the quarter chord at `alpha` (radians).
    #[must_use]
    pub fn moment(&self, alpha: f64) -> f64 {
        match &self.tables {
            None => self.cm0,
            Some(b) => b.mix(|c| c.moment(alpha), mix),
        }
    }
}

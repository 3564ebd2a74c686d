//! The twist that gives a prescribed spanwise loading at a design lift coefficient (the
//! inverse of Glauert's method), and the closed-form optimum washout beside it.
//!
//! In Glauert's series (Glauert, *The Elements of Aerofoil and Airscrew Theory*, 1926) the
//! monoplane equation at theta, with y = y_mid - (b/2) cos(theta), reads
//!
//!   alpha + twist(theta) - alpha_L0(theta) = mu(theta) sum A_n sin(n theta)
//!                                            + sum n A_n sin(n theta) / sin(theta),
//!   mu = 4 b / (a0 c).
//!
//! Read backwards: choose the A_n (the loading) and the equation gives the geometric angle
//! alpha + twist needed at every theta. The loadings used here have A_1 and A_3 only:
//! elliptic (A_3 = 0), Prandtl's 1933 bell Gamma ~ (1 - eta^2)^(3/2) = sin^3(theta), which is
//! (3 sin(theta) - sin(3 theta))/4, so A_3/A_1 = -1/3 (shared reference, section 3), and a
//! blend K of the two at equal lift, A_3/A_1 = -K/3. A_1 = CL/(pi AR).

use std::collections::BTreeMap;
use std::f64::consts::PI;

use super::{at_cl, DesignError, SolveFn};
use crate::wing::{Airfoil, Geometry, Station, Wing};

/// Largest difference, radians, between the required twist and the stations' linear
/// interpolation before a station is added (0.005 deg).
const TWIST_TOLERANCE: f64 = 0.005 * PI / 180.0;
/// Shortest segment that is split further, as a fraction of the half span.
const SHORTEST_SEGMENT: f64 = 1e-4;
/// Most stations a designed wing may have.
const MOST_STATIONS: usize = 400;
/// Largest twist, degrees, accepted in a design before the planform is called unsuitable.
const LARGEST_TWIST_DEG: f64 = 45.0;

/// A prescribed spanwise loading shape.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Loading {
    /// Gamma ~ sqrt(1 - eta^2): least induced drag for the span (Prandtl).
    Elliptic,
    /// Gamma ~ (1 - eta^2)^(3/2): Prandtl's 1933 bell loading.
    Bell,
    /// (1 - K) elliptic + K bell at equal lift, K in [0, 1].
    Blend(f64),
}

impl Loading {
    /// Reads `elliptic`, `bell` or `blend:K` with K in [0, 1].
    ///
    /// # Errors
    /// A one-line message for any other text.
    pub fn parse(text: &str) -> Result<Self, String> {
        match text {
            "elliptic" => Ok(Self::Elliptic),
            "bell" => Ok(Self::Bell),
            _ => {
                let k = text
                    .strip_prefix("blend:")
                    .and_then(|k| k.parse::<f64>().ok())
                    .ok_or_else(|| {
                        format!("--loading: expected elliptic, bell or blend:K (got `{text}`)")
                    })?;
                if (0.0..=1.0).contains(&k) {
                    Ok(Self::Blend(k))
                } else {
                    Err(format!("--loading blend:K needs K in [0, 1] (got {k})"))
                }
            }
        }
    }

    /// The bell's share K: 0 for elliptic, 1 for bell.
    #[must_use]
    pub const fn bell_share(self) -> f64 {
        match self {
            Self::Elliptic => 0.0,
            Self::Bell => 1.0,
            Self::Blend(k) => k,
        }
    }

    /// A_3/A_1 of the loading: -K/3 (sin^3 = (3 sin - sin 3theta)/4).
    #[must_use]
    pub fn a3_over_a1(self) -> f64 {
        -self.bell_share() / 3.0
    }

    /// The span efficiency the loading has by itself: e = 1/(1 + 3 (A_3/A_1)^2)
    /// (Glauert's delta = sum n (A_n/A_1)^2), so 0.75 for the bell.
    #[must_use]
    pub fn ideal_e(self) -> f64 {
        let r = self.a3_over_a1();
        1.0 / (1.0 + 3.0 * r * r)
    }

    /// How the loading is named on output.
    #[must_use]
    pub fn label(self) -> String {
        match self {
            Self::Elliptic => "elliptic".into(),
            Self::Bell => "bell".into(),
            Self::Blend(k) => format!("blend:{k}"),
        }
    }
}

/// One station of a designed wing.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TwistRow {
    /// Position, m.
    pub y: f64,
    /// Chord, m.
    pub chord: f64,
    /// Twist of the input wing there (interpolated for an added station), degrees.
    pub before_deg: f64,
    /// Designed twist, degrees.
    pub twist_deg: f64,
    /// Closed-form optimum twist (elliptic loading, root section's a0), degrees; NaN at a
    /// zero chord.
    pub optimum_deg: f64,
    /// True for a station the design added.
    pub added: bool,
}

/// The wing with its twist designed for a loading at a lift coefficient.
#[derive(Debug, Clone, PartialEq)]
pub struct TwistDesign {
    /// The designed wing: chords, airfoils and controls kept, twist replaced, stations added
    /// where the twist needs them.
    pub wing: Wing,
    /// Design lift coefficient.
    pub cl: f64,
    /// The loading designed for.
    pub loading: Loading,
    /// Angle of attack of the reference line at the design CL (controls neutral), degrees.
    pub alpha_deg: f64,
    /// The stations of the designed wing.
    pub rows: Vec<TwistRow>,
    /// Closed-form optimum washout amount, degrees (root minus the washout at omega = 1).
    pub optimum_washout_deg: f64,
}

/// Designs the twist of `wing` that gives `loading` at lift coefficient `cl`, controls
/// neutral. The twist at the root (y = 0, or the station nearest it) keeps its value, so
/// the reference line does not move; the angle of attack takes up the rest.
///
/// # Errors
/// [`DesignError::Impossible`] for a zero design CL or a twist beyond 45 deg anywhere (as a
/// pointed tip needs for the elliptic loading).
pub fn design_twist(wing: &Wing, cl: f64, loading: Loading) -> Result<TwistDesign, DesignError> {
    if !cl.is_finite() || cl == 0.0 {
        return Err(DesignError::Impossible(format!(
            "--cl must be a non-zero number (got {cl})"
        )));
    }
    if let Some(p) = crate::wing::validate::problems(wing).into_iter().next() {
        return Err(DesignError::Solve(crate::solver::SolveError::Invalid(p)));
    }
    let target = Target::new(wing, cl, loading);
    let ys = design_positions(wing, &target);
    let reference_y = reference_y(wing);
    let reference_angle = target.angle(wing, reference_y);
    let reference_twist_deg = twist_deg_at(wing, reference_y);
    let alpha = reference_angle - reference_twist_deg.to_radians();
    let mut designed = wing.clone();
    designed.stations = ys
        .iter()
        .map(|&y| station_at(wing, y, &mut designed.airfoils))
        .collect();
    let mut rows = Vec::with_capacity(ys.len());
    for station in &mut designed.stations {
        // Measured from the root's angle so the root keeps its twist to the last digit.
        let twist =
            reference_twist_deg.to_radians() + target.angle(wing, station.y) - reference_angle;
        if !(twist.is_finite() && twist.to_degrees().abs() <= LARGEST_TWIST_DEG) {
            return Err(DesignError::Impossible(format!(
                "the {} loading needs {} deg of twist at y = {:.4} m: this planform cannot \
                 carry it",
                loading.label(),
                crate::text::fixed(twist.to_degrees(), 1),
                station.y
            )));
        }
        station.twist_deg =
            reference_twist_deg + (target.angle(wing, station.y) - reference_angle).to_degrees();
        rows.push(TwistRow {
            y: station.y,
            chord: station.chord,
            before_deg: twist_deg_at(wing, station.y),
            twist_deg: station.twist_deg,
            optimum_deg: optimum_twist_deg(wing, cl, station.y),
            added: !wing.stations.iter().any(|s| s.y == station.y),
        });
    }
    Ok(TwistDesign {
        wing: designed,
        cl,
        loading,
        alpha_deg: alpha.to_degrees(),
        rows,
        optimum_washout_deg: optimum_washout(wing, cl).to_degrees(),
    })
}

/// The loading's A_1 and A_3/A_1 with the planform's span and the map y(theta).
struct Target {
    a1: f64,
    ratio: f64,
    span: f64,
    y_mid: f64,
}

impl Target {
    fn new(wing: &Wing, cl: f64, loading: Loading) -> Self {
        let g = Geometry::of(wing);
        Self {
            a1: cl / (PI * g.aspect_ratio),
            ratio: loading.a3_over_a1(),
            span: g.span,
            y_mid: g.y_mid,
        }
    }

    /// The geometric angle alpha + twist (radians) the loading needs at `y`, controls
    /// neutral: alpha_L0 + A_1 [mu s (1 + r u) + 1 + 3 r u] with s = sin(theta),
    /// u = sin(3 theta)/sin(theta) = 3 - 4 s^2 and r = A_3/A_1 (the module's equation).
    fn angle(&self, wing: &Wing, y: f64) -> f64 {
        let section = wing.section_at(y);
        let cos = (-(y - self.y_mid) / (0.5 * self.span)).clamp(-1.0, 1.0);
        let s = (1.0 - cos * cos).max(0.0).sqrt();
        let u = 3.0 - 4.0 * s * s;
        let mu_s = if s == 0.0 {
            0.0
        } else {
            4.0 * self.span * s / (section.airfoil.lift_slope * section.chord)
        };
        section.airfoil.alpha_zero_lift_deg.to_radians()
            + self.a1 * (mu_s * (1.0 + self.ratio * u) + 1.0 + 3.0 * self.ratio * u)
    }
}

/// The twist at `y`, degrees: a station's own value where there is one (no round trip
/// through radians), else the interpolation.
fn twist_deg_at(wing: &Wing, y: f64) -> f64 {
    wing.stations
        .iter()
        .find(|s| s.y == y)
        .map_or_else(|| wing.section_at(y).twist.to_degrees(), |s| s.twist_deg)
}

/// The position whose twist is kept: the root (y = 0) when the wing spans it, else the
/// station nearest it.
fn reference_y(wing: &Wing) -> f64 {
    let (left, right) = wing.span_ends();
    0.0_f64.clamp(left, right)
}

/// The wing's own station positions plus those the required twist needs, found by halving
/// each segment while its midpoint's required angle differs from the linear interpolation
/// of its ends by more than [`TWIST_TOLERANCE`].
fn design_positions(wing: &Wing, target: &Target) -> Vec<f64> {
    let shortest = SHORTEST_SEGMENT * 0.5 * target.span;
    let mut ys = vec![wing.stations[0].y];
    for pair in wing.stations.windows(2) {
        let mut stack = vec![(pair[0].y, pair[1].y)];
        // Depth-first, right half of a split pushed first so positions come out in order.
        while let Some((a, b)) = stack.pop() {
            let mid = 0.5 * (a + b);
            let linear = 0.5 * (target.angle(wing, a) + target.angle(wing, b));
            let needs_split = (target.angle(wing, mid) - linear).abs() > TWIST_TOLERANCE
                && b - a > shortest
                && ys.len() + stack.len() < MOST_STATIONS;
            if needs_split {
                stack.push((mid, b));
                stack.push((a, mid));
            } else {
                ys.push(b);
            }
        }
    }
    ys
}

/// The input wing's station at `y` if it has one, else a new station interpolated there;
/// between two different airfoils the new station gets their blend, added to `airfoils`
/// under a key naming both and the fraction.
fn station_at(wing: &Wing, y: f64, airfoils: &mut BTreeMap<String, Airfoil>) -> Station {
    if let Some(s) = wing.stations.iter().find(|s| s.y == y) {
        return s.clone();
    }
    let upper = wing.stations.partition_point(|s| s.y < y);
    let (a, b) = (&wing.stations[upper - 1], &wing.stations[upper]);
    let t = (y - a.y) / (b.y - a.y);
    let section = wing.section_at(y);
    let airfoil = if a.airfoil == b.airfoil {
        a.airfoil.clone()
    } else {
        let key = format!("{}~{}@{:.4}", a.airfoil, b.airfoil, t);
        airfoils.insert(key.clone(), section.to_airfoil());
        key
    };
    Station {
        y,
        chord: section.chord,
        twist_deg: section.twist.to_degrees(),
        airfoil,
        x_le: section.x_le,
        z: a.z + (b.z - a.z) * t,
    }
}

/// The closed-form optimum washout amount, radians: Omega = 4 b CL / (pi AR a0 c_root)
/// (Phillips, "Lifting-line analysis for twisted wings and washout-optimized wings",
/// J. Aircraft 41(1), 2004; follows from the module's equation with elliptic loading, one
/// section slope a0 and one zero-lift angle). a0 is the root section's.
#[must_use]
pub fn optimum_washout(wing: &Wing, cl: f64) -> f64 {
    let g = Geometry::of(wing);
    let root = wing.section_at(reference_y(wing));
    4.0 * g.span * cl / (PI * g.aspect_ratio * root.airfoil.lift_slope * root.chord)
}

/// The closed-form optimum washout distribution omega(y) = 1 - sin(theta) c_root / c(y),
/// 0 at the root and 1 where the washout is Omega (Phillips 2004, as for
/// [`optimum_washout`]).
#[must_use]
pub fn optimum_distribution(wing: &Wing, y: f64) -> f64 {
    let g = Geometry::of(wing);
    let cos = ((y - g.y_mid) / (0.5 * g.span)).clamp(-1.0, 1.0);
    let s = (1.0 - cos * cos).max(0.0).sqrt();
    let root = wing.section_at(reference_y(wing)).chord;
    let chord = wing.section_at(y).chord;
    if chord > 0.0 {
        1.0 - s * root / chord
    } else {
        f64::NAN
    }
}

/// The closed-form optimum twist at `y`, degrees: the root's twist minus Omega omega(y).
#[must_use]
pub fn optimum_twist_deg(wing: &Wing, cl: f64, y: f64) -> f64 {
    let root_twist = twist_deg_at(wing, reference_y(wing));
    root_twist - (optimum_washout(wing, cl) * optimum_distribution(wing, y)).to_degrees()
}

/// Induced-drag factor delta of the wing's planform untwisted (controls neutral).
///
/// With the optimum washout for CL_d the loading is A = A_d + (alpha - alpha_d) p, A_d
/// elliptic and p the untwisted planform's response, so off design
/// CDi = (CL^2 + delta_0 (CL - CL_d)^2)/(pi AR): the off-design penalty of a
/// washout-optimised wing (derived here from Glauert's series; the same behaviour as
/// Phillips 2004's result).
///
/// # Errors
/// As the solver.
pub fn untwisted_delta(wing: &Wing, solve: SolveFn) -> Result<f64, DesignError> {
    let mut plain = wing.clone();
    for s in &mut plain.stations {
        s.twist_deg = 0.0;
    }
    for c in &mut plain.controls {
        c.deflection_deg = 0.0;
    }
    let solution = solve(&plain, &at_cl(&plain, 1.0))?;
    Ok(solution.coefficients.delta.unwrap_or(0.0))
}

/// The off-design induced-drag penalty of a washout-optimised wing at `cl` when designed
/// for `design_cl`: delta_0 (CL - CL_d)^2 / (pi AR) (see [`untwisted_delta`]).
#[must_use]
pub fn off_design_penalty(delta0: f64, aspect_ratio: f64, cl: f64, design_cl: f64) -> f64 {
    delta0 * (cl - design_cl).powi(2) / (PI * aspect_ratio)
}

/// The designed wing with its controls at neutral, as the design assumes.
#[must_use]
pub fn controls_neutral(wing: &Wing) -> Wing {
    let mut w = wing.clone();
    for c in &mut w.controls {
        c.deflection_deg = 0.0;
    }
    w
}

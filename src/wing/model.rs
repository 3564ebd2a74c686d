//! Plain data for a wing described station by station.

use std::collections::BTreeMap;
use std::sync::Arc;

use super::blend::{self, Curve, TableBlend};
use super::table::SectionTable;

/// Section (2-D) properties of one named airfoil. A table airfoil carries its table; its
/// linear fields are then those of the table's linear range (what the series method uses).
#[derive(Debug, Clone, PartialEq)]
pub struct Airfoil {
    /// Section lift-curve slope, per radian.
    pub lift_slope: f64,
    /// Zero-lift angle of attack, degrees.
    pub alpha_zero_lift_deg: f64,
    /// Maximum section lift coefficient.
    pub cl_max: f64,
    /// Profile-drag polar `cd = cd0 + cd1*cl + cd2*cl^2`.
    pub cd0: f64,
    /// Linear term of the profile-drag polar.
    pub cd1: f64,
    /// Quadratic term of the profile-drag polar.
    pub cd2: f64,
    /// Section pitching-moment coefficient about the quarter chord, positive nose up.
    pub cm0: f64,
    /// The section data as a table, when the airfoil is given by one.
    pub table: Option<Arc<SectionTable>>,
}

impl Default for Airfoil {
    /// A thin-airfoil section: slope 2 pi, no camber, no drag.
    fn default() -> Self {
        Self {
            lift_slope: std::f64::consts::TAU,
            alpha_zero_lift_deg: 0.0,
            cl_max: 1.4,
            cd0: 0.0,
            cd1: 0.0,
            cd2: 0.0,
            cm0: 0.0,
            table: None,
        }
    }
}

impl Airfoil {
    /// A table airfoil: the linear fields from the table's linear range, cl_max the given
    /// one or else the table's largest cl.
    #[must_use]
    pub fn from_table(table: SectionTable, cl_max: Option<f64>) -> Self {
        let linear = *table.linear();
        Self {
            lift_slope: linear.lift_slope,
            alpha_zero_lift_deg: linear.alpha_zero_lift_deg,
            cl_max: cl_max.unwrap_or_else(|| table.largest_cl()),
            cd0: linear.cd0,
            cd1: linear.cd1,
            cd2: linear.cd2,
            cm0: linear.cm0,
            table: Some(Arc::new(table)),
        }
    }
}

/// One spanwise station; the wing varies linearly in `y` between stations.
#[derive(Debug, Clone, PartialEq)]
pub struct Station {
    /// Spanwise position, m, positive to the right looking forward.
    pub y: f64,
    /// Local chord, m.
    pub chord: f64,
    /// Local incidence relative to the wing reference line, degrees, nose-up positive.
    pub twist_deg: f64,
    /// Key into [`Wing::airfoils`].
    pub airfoil: String,
    /// Leading-edge offset aft of the reference, m.
    pub x_le: f64,
    /// Leading-edge height, m.
    pub z: f64,
}

/// How a control surface deflects on the two halves of the wing.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ControlKind {
    /// Both halves deflect alike.
    Flap,
    /// The right half deflects by `deflection`, the left by its negative.
    Aileron,
}

impl ControlKind {
    /// The name used in wing files.
    #[must_use]
    pub const fn as_str(self) -> &'static str {
        match self {
            Self::Flap => "flap",
            Self::Aileron => "aileron",
        }
    }
}

/// A plain trailing-edge control surface, given on the right half and mirrored on the left.
#[derive(Debug, Clone, PartialEq)]
pub struct Control {
    /// Free-text name.
    pub name: String,
    /// Flap or aileron.
    pub kind: ControlKind,
    /// Inner edge on the right half, m.
    pub y_inner: f64,
    /// Outer edge on the right half, m.
    pub y_outer: f64,
    /// Control chord over local chord, in (0, 1).
    pub chord_fraction: f64,
    /// Deflection, degrees, trailing edge down positive (the right half's, for an aileron).
    pub deflection_deg: f64,
    /// Optional factor replacing the thin-airfoil flap effectiveness.
    pub effectiveness: Option<f64>,
}

/// The flight condition: angle of attack (or a target CL), true airspeed and ISA altitude.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Condition {
    /// Angle of attack of the wing reference line, degrees.
    pub alpha_deg: f64,
    /// When set, solve for the angle of attack that gives this CL instead.
    pub target_cl: Option<f64>,
    /// True airspeed, m/s.
    pub speed: f64,
    /// ISA geopotential altitude, m.
    pub altitude: f64,
    /// Steady roll rate pb/2V, dimensionless, right wing down positive: the local angle of
    /// attack at y rises by roll_rate * 2y/b.
    pub roll_rate: f64,
}

impl Default for Condition {
    fn default() -> Self {
        Self {
            alpha_deg: 0.0,
            target_cl: None,
            speed: 20.0,
            altitude: 0.0,
            roll_rate: 0.0,
        }
    }
}

/// Section properties at one spanwise position, interpolated between stations.
#[derive(Debug, Clone, PartialEq)]
pub struct Section {
    /// Chord, m.
    pub chord: f64,
    /// Twist, radians.
    pub twist: f64,
    /// Blended section properties (slope per radian, `alpha_zero_lift_deg` in degrees).
    pub airfoil: BlendedAirfoil,
    /// Leading-edge offset aft, m.
    pub x_le: f64,
    /// The stations' curves where a table airfoil is involved (`None`: both linear, and
    /// `airfoil` says it all).
    pub curves: Option<Arc<TableBlend>>,
}

/// Where `y` falls among `items` at increasing positions `y_of(item)` (at least two): the
/// index of the upper end of its segment and the fraction of the way along it, clamped to the
/// ends past the first and last item.
pub(crate) fn bracket<T>(items: &[T], y_of: impl Fn(&T) -> f64, y: f64) -> (usize, f64) {
    let upper = items
        .partition_point(|item| y_of(item) < y)
        .clamp(1, items.len() - 1);
    let (ya, yb) = (y_of(&items[upper - 1]), y_of(&items[upper]));
    (upper, ((y - ya) / (yb - ya)).clamp(0.0, 1.0))
}

impl Section {
    /// The section angles of attack (radians) its airfoil tables cover; `None` for linear
    /// sections, whose straight lines have no ends.
    #[must_use]
    pub fn data_range(&self) -> Option<(f64, f64)> {
        self.curves.as_ref().and_then(|b| b.data_range())
    }

    /// Section lift coefficient and its slope dcl/dalpha (per radian) at effective angle of
    /// attack `alpha_eff` (radians, of the section's chord line, control shifts included):
    /// the linear section cl = a0 (alpha_eff - alpha_L0) (thin-airfoil theory; Anderson,
    /// *Fundamentals of Aerodynamics*, sec. 4.8), or, where a table airfoil is involved, the
    /// blend of the two stations' interpolated curves ([`TableBlend::lift`]).
    #[must_use]
    pub fn lift(&self, alpha_eff: f64) -> (f64, f64) {
        match &self.curves {
            Some(b) => b.lift(alpha_eff),
            None => Curve::of(&self.airfoil).lift(alpha_eff),
        }
    }

    /// Section profile-drag coefficient at `alpha_eff` (radians): the polar
    /// cd0 + cd1 cl + cd2 cl^2 at the section's cl, or the tables' blended cd.
    #[must_use]
    pub fn profile_drag(&self, alpha_eff: f64) -> f64 {
        match &self.curves {
            Some(b) => b.drag(alpha_eff),
            None => Curve::of(&self.airfoil).drag(alpha_eff),
        }
    }

    /// Section pitching-moment coefficient about the quarter chord at `alpha_eff` (radians),
    /// positive nose up: `cm0`, or the tables' blended cm.
    #[must_use]
    pub fn moment(&self, alpha_eff: f64) -> f64 {
        match &self.curves {
            Some(b) => b.moment(alpha_eff),
            None => self.airfoil.cm0,
        }
    }

    /// This section as an airfoil of its own (a table of the blended values where tables are
    /// involved).
    #[must_use]
    pub fn to_airfoil(&self) -> Airfoil {
        blend::section_airfoil(self)
    }

    /// Linear blend, fraction `t` of the way from `self` to `other` (the rule between stations).
    #[must_use]
    pub fn lerp(&self, other: &Self, t: f64) -> Self {
        let mix = |p: f64, q: f64| p + (q - p) * t;
        let (fa, fb) = (&self.airfoil, &other.airfoil);
        Self {
            chord: mix(self.chord, other.chord),
            twist: mix(self.twist, other.twist),
            x_le: mix(self.x_le, other.x_le),
            airfoil: Airfoil {
                lift_slope: mix(fa.lift_slope, fb.lift_slope),
                alpha_zero_lift_deg: mix(fa.alpha_zero_lift_deg, fb.alpha_zero_lift_deg),
                cl_max: mix(fa.cl_max, fb.cl_max),
                cd0: mix(fa.cd0, fb.cd0),
                cd1: mix(fa.cd1, fb.cd1),
                cd2: mix(fa.cd2, fb.cd2),
                cm0: mix(fa.cm0, fb.cm0),
                table: None,
            },
            curves: TableBlend::between(self, other, t),
        }
    }
}

/// Airfoil properties blended linearly between two stations' airfoils (a table airfoil's
/// linear parameters being those of its linear range; the tables themselves blend in
/// [`Section::curves`]).
pub type BlendedAirfoil = Airfoil;

/// A whole wing: stations, their airfoils, control surfaces and a default condition.
#[derive(Debug, Clone, PartialEq)]
pub struct Wing {
    /// Free-text name.
    pub name: String,
    /// True: stations cover the right half from y = 0 and are mirrored.
    pub symmetric: bool,
    /// Stations in strictly increasing `y`.
    pub stations: Vec<Station>,
    /// Airfoils by key.
    pub airfoils: BTreeMap<String, Airfoil>,
    /// Control surfaces.
    pub controls: Vec<Control>,
    /// The file's default condition.
    pub condition: Condition,
    /// Reference quantities of the pitching moment (`[reference]`; planform defaults).
    pub reference: super::Reference,
}

impl Wing {
    /// Spanwise extent `(y_left_tip, y_right_tip)`, m.
    #[must_use]
    pub fn span_ends(&self) -> (f64, f64) {
        let last = self.stations.last().map_or(0.0, |s| s.y);
        if self.symmetric {
            (-last, last)
        } else {
            (self.stations.first().map_or(0.0, |s| s.y), last)
        }
    }

    /// Section properties at `y` (m). A symmetric wing is mirrored about y = 0; positions
    /// past the tips are clamped to the tip station.
    #[must_use]
    pub fn section_at(&self, y: f64) -> Section {
        let y = if self.symmetric { y.abs() } else { y };
        let (upper, t) = bracket(&self.stations, |s| s.y, y);
        let (a, b) = (&self.stations[upper - 1], &self.stations[upper]);
        self.station_section(a).lerp(&self.station_section(b), t)
    }

    /// The section at a station itself, its airfoil looked up by key.
    #[must_use]
    pub fn station_section(&self, station: &Station) -> Section {
        let airfoil = self.airfoil_or_default(&station.airfoil);
        Section {
            chord: station.chord,
            twist: station.twist_deg.to_radians(),
            x_le: station.x_le,
            curves: airfoil.table.as_ref().map(TableBlend::single),
            airfoil,
        }
    }

    /// The airfoil with this key; a validated wing always has it, an edited one may not.
    fn airfoil_or_default(&self, key: &str) -> Airfoil {
        self.airfoils.get(key).cloned().unwrap_or_default()
    }

    /// The same wing mirrored left to right (stations, and aileron deflections flipped).
    #[must_use]
    pub fn mirrored(&self) -> Self {
        let mut wing = self.clone();
        if !self.symmetric {
            wing.stations = self
                .stations
                .iter()
                .rev()
                .map(|s| Station {
                    y: -s.y,
                    ..s.clone()
                })
                .collect();
        }
        for control in &mut wing.controls {
            if control.kind == ControlKind::Aileron {
                control.deflection_deg = -control.deflection_deg;
            }
        }
        wing
    }
}

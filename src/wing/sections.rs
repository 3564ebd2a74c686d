//! The stations' section properties with airfoils resolved once, for fast repeated look-ups.

use super::{Section, Wing};

/// Every station's [`Section`], in station order, interpolated like [`Wing::section_at`]
/// without looking airfoils up by name at each point (the solver asks hundreds of times).
#[derive(Debug, Clone)]
pub struct Sections {
    symmetric: bool,
    ys: Vec<f64>,
    rows: Vec<Section>,
}

impl Sections {
    /// Resolves a wing's stations. The wing must have at least two stations.
    #[must_use]
    pub fn of(wing: &Wing) -> Self {
        Self {
            symmetric: wing.symmetric,
            ys: wing.stations.iter().map(|s| s.y).collect(),
            rows: wing.stations.iter().map(|s| wing.section_at(s.y)).collect(),
        }
    }

    /// Section properties at `y` (m), linear between stations, mirrored for a symmetric wing,
    /// clamped past the tips; equal to [`Wing::section_at`].
    #[must_use]
    pub fn at(&self, y: f64) -> Section {
        let y = if self.symmetric { y.abs() } else { y };
        let upper = self
            .ys
            .partition_point(|&s| s < y)
            .clamp(1, self.ys.len() - 1);
        let (ya, yb) = (self.ys[upper - 1], self.ys[upper]);
        let t = ((y - ya) / (yb - ya)).clamp(0.0, 1.0);
        let (a, b) = (&self.rows[upper - 1], &self.rows[upper]);
        let lerp = |p: f64, q: f64| p + (q - p) * t;
        let (fa, fb) = (a.airfoil, b.airfoil);
        Section {
            chord: lerp(a.chord, b.chord),
            twist: lerp(a.twist, b.twist),
            x_le: lerp(a.x_le, b.x_le),
            airfoil: super::Airfoil {
                lift_slope: lerp(fa.lift_slope, fb.lift_slope),
                alpha_zero_lift_deg: lerp(fa.alpha_zero_lift_deg, fb.alpha_zero_lift_deg),
                cl_max: lerp(fa.cl_max, fb.cl_max),
                cd0: lerp(fa.cd0, fb.cd0),
                cd1: lerp(fa.cd1, fb.cd1),
                cd2: lerp(fa.cd2, fb.cd2),
            },
        }
    }
}

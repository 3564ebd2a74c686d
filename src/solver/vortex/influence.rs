//! Induced velocities of straight vortex segments (Biot-Savart), per unit circulation.
//!
//! Finite segment and semi-infinite leg in the forms of Phillips & Snyder, "Modern adaptation
//! of Prandtl's classic lifting-line theory", J. Aircraft 37(4), 2000, eqs. 13-14 (Katz &
//! Plotkin, *Low-Speed Aerodynamics*, 2nd ed., 2001, sec. 10.4.5, for the segment).

use std::f64::consts::PI;

use super::panels::{cross, dot, norm, Panels, Vec3};

/// Freestream direction of the trailing legs (x aft).
const AFT: Vec3 = [1.0, 0.0, 0.0];

/// Relative distance below which a point counts as on a vortex line (its own line induces
/// nothing there).
const ON_LINE: f64 = 1e-12;

fn sub(a: Vec3, b: Vec3) -> Vec3 {
    [a[0] - b[0], a[1] - b[1], a[2] - b[2]]
}

fn scaled(v: Vec3, k: f64) -> Vec3 {
    v.map(|x| x * k)
}

fn add(a: Vec3, b: Vec3) -> Vec3 {
    [a[0] + b[0], a[1] + b[1], a[2] + b[2]]
}

/// Velocity at `p` of a unit vortex from `a` to `b`:
/// (r1 + r2)(r1 x r2) / (4 pi r1 r2 (r1 r2 + r1 . r2)), r1 = p - a, r2 = p - b.
#[must_use]
pub fn segment(p: Vec3, a: Vec3, b: Vec3) -> Vec3 {
    let (r1, r2) = (sub(p, a), sub(p, b));
    let (n1, n2) = (norm(r1), norm(r2));
    let c = cross(r1, r2);
    if norm(c) <= ON_LINE * n1 * n2 {
        return [0.0; 3];
    }
    let denominator = n1 * n2 * (n1 * n2 + dot(r1, r2));
    scaled(c, (n1 + n2) / (4.0 * PI * denominator))
}

/// Velocity at `p` of a unit vortex from `a` running to infinity along the unit vector `u`:
/// (u x r) / (4 pi r (r - u . r)), r = p - a.
#[must_use]
pub fn semi_infinite(p: Vec3, a: Vec3, u: Vec3) -> Vec3 {
    let r = sub(p, a);
    let n = norm(r);
    let c = cross(u, r);
    if norm(c) <= ON_LINE * n {
        return [0.0; 3];
    }
    scaled(c, 1.0 / (4.0 * PI * n * (n - dot(u, r))))
}

/// The trailing legs of a unit horseshoe with bound vortex `a` -> `b`: in from infinity to
/// `a`, out from `b` to infinity.
#[must_use]
pub fn trailing_legs(p: Vec3, a: Vec3, b: Vec3) -> Vec3 {
    sub(semi_infinite(p, b, AFT), semi_infinite(p, a, AFT))
}

/// The influence of every horseshoe on every control point, per unit circulation.
#[derive(Debug, Clone)]
pub struct Influence {
    /// `normal[i * n + j]`: velocity normal to section i at its control point from horseshoe j.
    pub normal: Vec<f64>,
    /// `trefftz[i * n + j]`: normal velocity far downstream at control point i's (y, z) from
    /// horseshoe j's trailing legs taken as infinite lines.
    pub trefftz: Vec<f64>,
}

/// A unit horseshoe's whole velocity at `p`: bound vortex `a` -> `b` and both legs.
fn horseshoe(p: Vec3, a: Vec3, b: Vec3) -> Vec3 {
    add(segment(p, a, b), trailing_legs(p, a, b))
}

impl Influence {
    /// The influences on a lattice.
    ///
    /// Prandtl's lifting line acts on the wing laid flat and unswept (each section at its own
    /// y, horseshoes on the line x = z = 0, control points on that line); the sweep and
    /// dihedral act through the difference between the real horseshoes and the flat ones,
    /// both seen from the three-quarter-chord point of each section (Weissinger's collocation
    /// point). On a flat unswept wing the difference is exactly zero and the method is the
    /// classic numerical lifting line, which converges to Glauert's answer. Seen half a chord
    /// away, a swept or cranked vortex line has no logarithmic singularity at the control
    /// points, so a swept wing's answer converges as panels are added (docs/theory.md, vortex
    /// method); on an infinite yawed wing with a0 = 2 pi it gives simple sweep theory's
    /// cl = 2 pi alpha cos(sweep).
    #[must_use]
    pub fn of(panels: &Panels) -> Self {
        let n = panels.len();
        let mut normal = Vec::with_capacity(n * n);
        let mut trefftz = Vec::with_capacity(n * n);
        let flat: Vec<Vec3> = panels.edges.iter().map(|e| [0.0, e[1], 0.0]).collect();
        for point in &panels.points {
            let half_chord = 0.5 * point.section.chord;
            let on_line = [0.0, point.at[1], 0.0];
            let behind = add(point.at, [half_chord, 0.0, 0.0]);
            let behind_flat = [half_chord, point.at[1], 0.0];
            for j in 0..n {
                let (a, b) = (panels.edges[j], panels.edges[j + 1]);
                let (fa, fb) = (flat[j], flat[j + 1]);
                let prandtl = trailing_legs(on_line, fa, fb);
                let shape = sub(horseshoe(behind, a, b), horseshoe(behind_flat, fa, fb));
                normal.push(dot(add(prandtl, shape), point.normal));
                trefftz.push(dot(far_field(point.at, a, b), point.normal));
            }
        }
        Self { normal, trefftz }
    }
}

/// The two-dimensional velocity in the Trefftz plane at `p`'s (y, z) of a unit horseshoe's
/// trailing legs a and b taken as infinite lines: (x^ x r) / (2 pi r^2) for each.
fn far_field(p: Vec3, a: Vec3, b: Vec3) -> Vec3 {
    let line = |e: Vec3| {
        let r = [0.0, p[1] - e[1], p[2] - e[2]];
        let r2 = dot(r, r);
        if r2 <= ON_LINE * ON_LINE {
            return [0.0; 3];
        }
        scaled(cross(AFT, r), 1.0 / (2.0 * PI * r2))
    };
    sub(line(b), line(a))
}

//! The wing the workbench opens when there is no session, no file and no bundled example.

use std::collections::BTreeMap;

use crate::wing::{Airfoil, Condition, Station, Wing};

/// A plain tapered wing with a little washout, ready to be reshaped.
#[must_use]
pub fn wing() -> Wing {
    let section = Airfoil {
        lift_slope: 6.0,
        alpha_zero_lift_deg: -2.0,
        cl_max: 1.4,
        cd0: 0.008,
        cd1: 0.0,
        cd2: 0.006,
        ..Airfoil::default()
    };
    let station = |y: f64, chord: f64, twist_deg: f64| Station {
        y,
        chord,
        twist_deg,
        airfoil: "section".into(),
        x_le: 0.0,
        z: 0.0,
    };
    Wing {
        name: "new wing".into(),
        symmetric: true,
        stations: vec![
            station(0.0, 1.2, 0.0),
            station(2.5, 1.0, -1.0),
            station(5.0, 0.6, -2.0),
        ],
        airfoils: BTreeMap::from([("section".to_string(), section)]),
        controls: Vec::new(),
        condition: Condition {
            alpha_deg: 4.0,
            target_cl: None,
            speed: 30.0,
            altitude: 0.0,
            roll_rate: 0.0,
        },
        reference: Default::default(),
    }
}

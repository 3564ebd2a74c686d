//! Airfoil tables: reading (inline and CSV), blending between stations, the linear range the
//! series method uses, and saving a wing whose airfoils are tables.

mod common;

use std::path::Path;

use gammaline::solver::{self, Method};
use gammaline::wing::table::{Columns, SectionTable, TableSource};
use gammaline::wing::{file, Airfoil, Sections};

fn manifest() -> &'static Path {
    Path::new(env!("CARGO_MANIFEST_DIR"))
}

/// A section whose lift is exactly linear, 0.1 per degree with zero lift at -2 deg, from -8 to
/// 10 deg, then bends over to a peak of 1.45 at 14 deg and drops past it (invented).
fn linear_below_stall() -> Columns {
    let alpha = vec![
        -8.0, -6.0, -4.0, -2.0, 0.0, 2.0, 4.0, 6.0, 8.0, 10.0, 12.0, 14.0, 16.0,
    ];
    let mut cl: Vec<f64> = alpha.iter().map(|a| 0.1 * (a + 2.0)).collect();
    cl[10] = 1.32;
    cl[11] = 1.45;
    cl[12] = 1.30;
    let cd = alpha.iter().map(|a| 0.008 + 0.0001 * a * a).collect();
    Columns {
        alpha_deg: alpha,
        cl,
        cd,
        cm: None,
    }
}

/// The linear airfoil the table follows below stall.
fn the_line() -> Airfoil {
    Airfoil {
        lift_slope: 0.1_f64.to_degrees(),
        alpha_zero_lift_deg: -2.0,
        cl_max: 1.45,
        ..Airfoil::default()
    }
}

fn table_airfoil(columns: Columns) -> Airfoil {
    let table = SectionTable::new(TableSource::Inline, columns).expect("a valid table");
    Airfoil::from_table(table, None)
}

#[test]
fn a_table_linear_below_stall_gives_the_linear_answer() {
    // Follows from the rule in docs/wing-file.md (the linear range of a table that is straight
    // below stall is that straight line) and from the series method using only the slope and
    // zero-lift angle; no outside value.
    let airfoil = table_airfoil(linear_below_stall());
    assert!((airfoil.lift_slope - the_line().lift_slope).abs() < 1e-9);
    assert!((airfoil.alpha_zero_lift_deg + 2.0).abs() < 1e-12);
    assert_eq!(
        airfoil.cl_max, 1.45,
        "cl_max defaults to the table's largest cl"
    );
    let mut linear = common::tapered(8.0, 0.5);
    linear.airfoils.insert("a".into(), the_line());
    let mut tabled = linear.clone();
    tabled.airfoils.insert("a".into(), airfoil);
    let condition = common::at_alpha(5.0);
    let a = solver::solve(&linear, &condition, Method::default()).expect("solves");
    let b = solver::solve(&tabled, &condition, Method::default()).expect("solves");
    let (ca, cb) = (a.coefficients, b.coefficients);
    assert!((ca.cl - cb.cl).abs() < 1e-12, "{} vs {}", ca.cl, cb.cl);
    assert!((ca.cdi - cb.cdi).abs() < 1e-12);
    assert!((a.cl_alpha - b.cl_alpha).abs() < 1e-9);
    assert!(
        b.warnings.iter().any(|w| w.contains("linear range")),
        "the series method says it used the linear range: {:?}",
        b.warnings
    );
}

#[test]
fn below_stall_a_table_section_lifts_like_the_line_and_bends_over_past_it() {
    // Same rule as above at the section: cl(alpha) and its slope equal the line's where the
    // table is straight, up to the last row before the bend (Hermite interpolation reproduces
    // straight data; Fritsch & Carlson,
    // SIAM J. Numer. Anal. 17(2), 1980), and stay below it past the bend.
    let mut wing = common::rectangular(6.0);
    wing.airfoils
        .insert("a".into(), table_airfoil(linear_below_stall()));
    let sections = Sections::of(&wing);
    let section = sections.at(0.4);
    let line = |alpha_deg: f64| 0.1 * (alpha_deg + 2.0);
    for alpha_deg in [-7.5, -2.0, 0.3, 5.0, 7.9] {
        let (cl, slope) = section.lift(f64::to_radians(alpha_deg));
        assert!((cl - line(alpha_deg)).abs() < 1e-12, "{alpha_deg}: {cl}");
        assert!((slope - 0.1_f64.to_degrees()).abs() < 1e-9, "{alpha_deg}");
    }
    let (at_peak, slope_at_peak) = section.lift(14_f64.to_radians());
    assert_eq!((at_peak, slope_at_peak), (1.45, 0.0));
    assert!(section.lift(15_f64.to_radians()).0 < 1.45);
    assert!(section.lift(11_f64.to_radians()).0 < line(11.0));
}

#[test]
fn between_a_table_station_and_a_linear_one_the_values_blend() {
    // The blending rule of docs/wing-file.md: cl(alpha) at a point between stations is the
    // blend of the two stations' cl(alpha), linear in y; no outside value.
    let mut wing = common::rectangular(6.0);
    wing.stations[1].airfoil = "b".into();
    wing.airfoils
        .insert("a".into(), table_airfoil(linear_below_stall()));
    wing.airfoils.insert("b".into(), common::thin());
    let sections = Sections::of(&wing);
    let tip = wing.stations[1].y;
    let alpha = 13_f64.to_radians();
    let table_cl = sections.at(0.0).lift(alpha).0;
    let thin_cl = std::f64::consts::TAU * alpha;
    for fraction in [0.25, 0.5, 0.9] {
        let (cl, _) = sections.at(fraction * tip).lift(alpha);
        let expected = table_cl + fraction * (thin_cl - table_cl);
        assert!(
            (cl - expected).abs() < 1e-12,
            "{fraction}: {cl} vs {expected}"
        );
    }
    let mid = sections.at(0.5 * tip);
    let drag = 0.5 * (0.008 + 0.0001 * 13.0 * 13.0);
    assert!(
        (mid.profile_drag(alpha) - drag).abs() < 1e-12,
        "the thin section has no drag"
    );
}

#[test]
fn the_example_tables_load_with_their_cl_max_and_moment() {
    let wing = file::read(&manifest().join("wings/ridge-courier.toml")).expect("loads");
    let root = &wing.airfoils["root"];
    let table = root.table.as_ref().expect("a table airfoil");
    assert_eq!(root.cl_max, 1.60, "defaults to the table's largest cl");
    assert_eq!(wing.airfoils["outboard"].cl_max, 1.30, "given in the file");
    assert_eq!(
        table.source,
        TableSource::File("ridge-courier-root.csv".into())
    );
    assert_eq!(table.moment(0.0), -0.087, "the CSV's cm at alpha 0");
    let tip = wing.airfoils["tip"].table.as_ref().expect("inline table");
    assert_eq!(tip.source, TableSource::Inline);
    assert_eq!(tip.columns().alpha_deg.len(), 12);
}

#[test]
fn saving_a_table_wing_keeps_its_table_references_and_arrays() {
    let path = manifest().join("wings/ridge-courier.toml");
    let text = std::fs::read_to_string(&path).expect("readable");
    let mut wing = file::read(&path).expect("loads");
    wing.stations[1].chord = 0.35;
    wing.airfoils.get_mut("root").expect("root").cl_max = 1.55;
    let edited = file::edit_toml(&text, &wing);
    assert!(
        edited.contains("table = \"ridge-courier-root.csv\""),
        "{edited}"
    );
    assert!(edited.contains("cl_max = 1.55"), "{edited}");
    assert!(edited.contains("chord = 0.35"), "{edited}");
    let new_lines: Vec<&str> = edited.lines().filter(|l| !text.contains(l)).collect();
    assert_eq!(new_lines, ["chord = 0.35", "cl_max = 1.55"], "{edited}");
    assert_eq!(edited.lines().count(), text.lines().count() + 1, "{edited}");
    let again = file::parse(&edited, &path).expect("reads back beside its tables");
    assert_eq!(again, wing);
}

#[test]
fn a_written_table_wing_stands_on_its_own() {
    // to_toml writes every table inline, so the text reads anywhere (a session's copy).
    let wing = file::read(&manifest().join("wings/ridge-courier.toml")).expect("loads");
    let text = file::to_toml(&wing);
    assert!(!text.contains(".csv"), "{text}");
    let again = file::parse(&text, Path::new("/nowhere/else.toml")).expect("reads");
    assert_eq!(again, wing);
}

proptest::proptest! {
    /// Rows rising with alpha give a curve that never falls between them, and never leaves
    /// the range of its two rows (Fritsch & Carlson, SIAM J. Numer. Anal. 17(2), 1980: the
    /// slopes scaled into alpha^2 + beta^2 <= 9 are sufficient for monotonicity).
    #[test]
    fn rising_rows_give_a_rising_curve(
        steps in proptest::collection::vec((0.1f64..5.0, 0.0f64..0.6), 4..12),
    ) {
        let mut alpha = vec![-6.0];
        let mut cl = vec![-0.3];
        for (da, dcl) in &steps {
            alpha.push(alpha[alpha.len() - 1] + da);
            cl.push(cl[cl.len() - 1] + dcl);
        }
        let n = alpha.len();
        let columns = Columns { alpha_deg: alpha.clone(), cl: cl.clone(), cd: vec![0.01; n], cm: None };
        if let Ok(table) = SectionTable::new(TableSource::Inline, columns) {
            for k in 0..n - 1 {
                let mut last = cl[k];
                for i in 1..=20 {
                    let a = alpha[k] + (alpha[k + 1] - alpha[k]) * f64::from(i) / 20.0;
                    let (value, slope) = table.lift(a.to_radians());
                    proptest::prop_assert!(value >= last - 1e-12, "falls at {a}");
                    proptest::prop_assert!(value <= cl[k + 1] + 1e-12, "overshoots at {a}");
                    proptest::prop_assert!(slope >= -1e-9, "negative slope at {a}");
                    last = value;
                }
            }
        }
    }
}

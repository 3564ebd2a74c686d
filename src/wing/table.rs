//! Airfoil section data given as a table of cl, cd (and cm) against alpha, interpolated by
//! monotone piecewise-cubic Hermite curves, with the linear range the series method uses.

use std::ops::Range;

/// Fewest rows a table may have.
pub const MIN_ROWS: usize = 4;
/// Most rows a table may have (a measured polar has a few hundred at most).
pub const MAX_ROWS: usize = 10_000;
/// How far an interval's slope may stray from the slope at zero lift and still count as part
/// of the linear range (10 %, chosen so a lift curve's gentle bend before stall is left out;
/// common practice, no source).
pub const LINEAR_TOLERANCE: f64 = 0.10;

/// Where a table's rows came from.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum TableSource {
    /// Arrays written in the airfoil's own table of the wing file.
    Inline,
    /// A CSV file, as named in the wing file (relative to the wing file's folder).
    File(String),
}

/// One column of a table (the wing-file key and CSV header name).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Column {
    /// Angle of attack, degrees.
    Alpha,
    /// Section lift coefficient.
    Cl,
    /// Section profile-drag coefficient.
    Cd,
    /// Section pitching-moment coefficient about the quarter chord.
    Cm,
}

impl Column {
    /// The key in the wing file and the name in a CSV header.
    #[must_use]
    pub const fn key(self) -> &'static str {
        match self {
            Self::Alpha => "alpha",
            Self::Cl => "cl",
            Self::Cd => "cd",
            Self::Cm => "cm",
        }
    }

    /// Position in a CSV row.
    #[must_use]
    pub const fn index(self) -> usize {
        match self {
            Self::Alpha => 0,
            Self::Cl => 1,
            Self::Cd => 2,
            Self::Cm => 3,
        }
    }
}

/// A broken table rule: the row (0-based; `None` for the table as a whole), the column and
/// what is wrong.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct TableProblem {
    /// Row, 0-based, or `None` for the whole column.
    pub row: Option<usize>,
    /// The column.
    pub column: Column,
    /// What is wrong.
    pub reason: String,
}

fn problem(row: Option<usize>, column: Column, reason: String) -> TableProblem {
    TableProblem {
        row,
        column,
        reason,
    }
}

/// The columns of a table as read, before checking.
#[derive(Debug, Clone, Default, PartialEq)]
pub struct Columns {
    /// Angle of attack, degrees.
    pub alpha_deg: Vec<f64>,
    /// Lift coefficient.
    pub cl: Vec<f64>,
    /// Profile-drag coefficient.
    pub cd: Vec<f64>,
    /// Pitching-moment coefficient about the quarter chord, when given.
    pub cm: Option<Vec<f64>>,
}

/// The straight line and drag polar fitted to a table's linear range (what the series method
/// uses in place of the table).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LinearRange {
    /// The rows of the linear range.
    pub first_row: usize,
    /// Last row of the linear range (inclusive).
    pub last_row: usize,
    /// Lift slope over the range, per radian.
    pub lift_slope: f64,
    /// Zero-lift angle of the fitted line, degrees.
    pub alpha_zero_lift_deg: f64,
    /// `cd = cd0 + cd1 cl + cd2 cl^2` fitted by least squares over the range.
    pub cd0: f64,
    /// Linear term of the fitted polar.
    pub cd1: f64,
    /// Quadratic term of the fitted polar.
    pub cd2: f64,
    /// The range's mean cm (0 without a cm column).
    pub cm0: f64,
}

/// A checked airfoil table with its interpolants. Two tables are equal when their rows are,
/// wherever they were read from (a table read from a CSV file and written inline is the same
/// section).
#[derive(Debug, Clone)]
pub struct SectionTable {
    /// Where the rows came from.
    pub source: TableSource,
    columns: Columns,
    cl_curve: Hermite,
    cd_curve: Hermite,
    cm_curve: Option<Hermite>,
    linear: LinearRange,
}

impl PartialEq for SectionTable {
    fn eq(&self, other: &Self) -> bool {
        self.columns == other.columns
    }
}

impl SectionTable {
    /// Checks the columns and builds the interpolants.
    ///
    /// # Errors
    /// The first broken rule in row order: too few or too many rows, columns of different
    /// lengths, a non-finite value, alpha not strictly increasing, a negative cd, or a lift
    /// curve that does not rise through zero lift.
    pub fn new(source: TableSource, columns: Columns) -> Result<Self, TableProblem> {
        check(&columns)?;
        let cl_curve = Hermite::new(&columns.alpha_deg, &columns.cl);
        let cd_curve = Hermite::new(&columns.alpha_deg, &columns.cd);
        let cm_curve = columns
            .cm
            .as_ref()
            .map(|cm| Hermite::new(&columns.alpha_deg, cm));
        let linear = linear_range(&columns).ok_or_else(|| {
            problem(
                None,
                Column::Cl,
                "must rise with alpha where the lift curve crosses zero".into(),
            )
        })?;
        Ok(Self {
            source,
            columns,
            cl_curve,
            cd_curve,
            cm_curve,
            linear,
        })
    }

    /// The rows as read.
    #[must_use]
    pub const fn columns(&self) -> &Columns {
        &self.columns
    }

    /// The straight line and polar of the linear range.
    #[must_use]
    pub const fn linear(&self) -> &LinearRange {
        &self.linear
    }

    /// What a linear method takes from this table, as one line for the warnings.
    #[must_use]
    pub fn linear_note(&self, key: &str) -> String {
        let l = &self.linear;
        let a = &self.columns.alpha_deg;
        format!(
            "airfoil {key}: a linear method uses the table's linear range only (alpha {} to {} deg): \
             slope {:.3}/rad, zero-lift angle {:.2} deg, cd fitted as a quadratic in cl",
            a[l.first_row],
            a[l.last_row],
            l.lift_slope,
            // Rounded first so a fit of -1e-17 prints as 0.00, not -0.00.
            (l.alpha_zero_lift_deg * 100.0).round() / 100.0 + 0.0
        )
    }

    /// The largest cl in the table (the default cl_max).
    #[must_use]
    pub fn largest_cl(&self) -> f64 {
        self.columns.cl.iter().copied().fold(f64::MIN, f64::max)
    }

    /// The alpha range covered, degrees.
    #[must_use]
    pub fn alpha_range_deg(&self) -> Range<f64> {
        let a = &self.columns.alpha_deg;
        a[0]..a[a.len() - 1]
    }

    /// cl and dcl/dalpha (per radian) at `alpha` (radians); held at the end values, with zero
    /// slope, outside the table.
    #[must_use]
    pub fn lift(&self, alpha: f64) -> (f64, f64) {
        let (cl, per_deg) = self.cl_curve.at(alpha.to_degrees());
        (cl, per_deg.to_degrees())
    }

    /// Profile-drag coefficient at `alpha` (radians).
    #[must_use]
    pub fn drag(&self, alpha: f64) -> f64 {
        self.cd_curve.at(alpha.to_degrees()).0
    }

    /// Pitching-moment coefficient about the quarter chord at `alpha` (radians); 0 without a
    /// cm column.
    #[must_use]
    pub fn moment(&self, alpha: f64) -> f64 {
        self.cm_curve
            .as_ref()
            .map_or(0.0, |c| c.at(alpha.to_degrees()).0)
    }
}

/// The table rules, first broken one in row order.
fn check(c: &Columns) -> Result<(), TableProblem> {
    let n = c.alpha_deg.len();
    let named = [
        (Column::Cl, Some(&c.cl)),
        (Column::Cd, Some(&c.cd)),
        (Column::Cm, c.cm.as_ref()),
    ];
    for (column, values) in named {
        if let Some(values) = values {
            if values.len() != n {
                let reason = format!("has {} values, alpha has {n}", values.len());
                return Err(problem(None, column, reason));
            }
        }
    }
    if n < MIN_ROWS {
        let reason = format!("at least {MIN_ROWS} rows are needed (got {n})");
        return Err(problem(None, Column::Alpha, reason));
    }
    if n > MAX_ROWS {
        let reason = format!("at most {MAX_ROWS} rows are allowed (got {n})");
        return Err(problem(None, Column::Alpha, reason));
    }
    for row in 0..n {
        check_row(c, row)?;
    }
    Ok(())
}

fn check_row(c: &Columns, row: usize) -> Result<(), TableProblem> {
    let cells = [
        (Column::Alpha, Some(c.alpha_deg[row])),
        (Column::Cl, Some(c.cl[row])),
        (Column::Cd, Some(c.cd[row])),
        (Column::Cm, c.cm.as_ref().map(|cm| cm[row])),
    ];
    for (column, value) in cells {
        let Some(value) = value else { continue };
        if !value.is_finite() {
            let reason = format!("must be a finite number (got {value})");
            return Err(problem(Some(row), column, reason));
        }
    }
    let alpha = c.alpha_deg[row];
    if row > 0 && alpha <= c.alpha_deg[row - 1] {
        let before = c.alpha_deg[row - 1];
        let reason = format!("must increase strictly down the table (got {alpha} after {before})");
        return Err(problem(Some(row), Column::Alpha, reason));
    }
    if c.cd[row] < 0.0 {
        let reason = format!("must be >= 0 (got {})", c.cd[row]);
        return Err(problem(Some(row), Column::Cd, reason));
    }
    Ok(())
}

/// The linear range: starting from the interval where cl crosses zero (or, for a table that
/// never crosses zero, the interval next to the row of least |cl|), the longest run of
/// consecutive intervals whose slopes lie within [`LINEAR_TOLERANCE`] of that interval's
/// slope. A least-squares line through the run's rows gives the slope and zero-lift angle,
/// and a least-squares quadratic in cl the drag polar. `None` when the curve does not rise
/// there.
fn linear_range(c: &Columns) -> Option<LinearRange> {
    let (a, cl) = (&c.alpha_deg, &c.cl);
    let slope = |k: usize| (cl[k + 1] - cl[k]) / (a[k + 1] - a[k]);
    let seed = seed_interval(cl);
    let reference = slope(seed);
    if reference <= 0.0 {
        return None;
    }
    let close = |k: usize| (slope(k) - reference).abs() <= LINEAR_TOLERANCE * reference;
    let mut first = seed;
    while first > 0 && close(first - 1) {
        first -= 1;
    }
    let mut last = seed + 1;
    while last + 1 < a.len() && close(last) {
        last += 1;
    }
    let rows = first..last + 1;
    let (intercept, per_deg) = least_squares_line(&a[rows.clone()], &cl[rows.clone()]);
    let (cd0, cd1, cd2) = least_squares_polar(&cl[rows.clone()], &c.cd[rows.clone()]);
    let cm0 = c.cm.as_ref().map_or(0.0, |cm| {
        cm[rows.clone()].iter().sum::<f64>() / rows.len() as f64
    });
    Some(LinearRange {
        first_row: first,
        last_row: last,
        lift_slope: per_deg.to_degrees(),
        alpha_zero_lift_deg: -intercept / per_deg,
        cd0,
        cd1,
        cd2,
        cm0,
    })
}

/// The interval where cl first changes sign from negative to non-negative, else the interval
/// after the row of least |cl| (before it, at the last row).
fn seed_interval(cl: &[f64]) -> usize {
    if let Some(k) = (0..cl.len() - 1).find(|&k| cl[k] < 0.0 && cl[k + 1] >= 0.0) {
        return k;
    }
    let least = (0..cl.len())
        .min_by(|&i, &j| cl[i].abs().total_cmp(&cl[j].abs()))
        .unwrap_or(0);
    least.min(cl.len() - 2)
}

/// `(intercept, slope)` of the least-squares line through the points.
fn least_squares_line(x: &[f64], y: &[f64]) -> (f64, f64) {
    let n = x.len() as f64;
    let (mx, my) = (x.iter().sum::<f64>() / n, y.iter().sum::<f64>() / n);
    let sxy: f64 = x.iter().zip(y).map(|(a, b)| (a - mx) * (b - my)).sum();
    let sxx: f64 = x.iter().map(|a| (a - mx) * (a - mx)).sum();
    let slope = sxy / sxx;
    (my - slope * mx, slope)
}

/// `(c0, c1, c2)` of the least-squares `y = c0 + c1 x + c2 x^2`; a line through two points
/// (or a constant when the x are all equal), since a quadratic needs three.
fn least_squares_polar(x: &[f64], y: &[f64]) -> (f64, f64, f64) {
    if x.len() >= 3 {
        let basis = |v: f64| [1.0, v, v * v];
        let mut normal = nalgebra::Matrix3::<f64>::zeros();
        let mut rhs = nalgebra::Vector3::<f64>::zeros();
        for (&xi, &yi) in x.iter().zip(y) {
            let b = basis(xi);
            for r in 0..3 {
                rhs[r] += b[r] * yi;
                for c in 0..3 {
                    normal[(r, c)] += b[r] * b[c];
                }
            }
        }
        if let Some(s) = normal.lu().solve(&rhs) {
            if s.iter().all(|v| v.is_finite()) {
                return (s[0], s[1], s[2]);
            }
        }
    }
    let spread = x.iter().any(|&v| (v - x[0]).abs() > 1e-12);
    if spread {
        let (c0, c1) = least_squares_line(x, y);
        (c0, c1, 0.0)
    } else {
        (y.iter().sum::<f64>() / y.len() as f64, 0.0, 0.0)
    }
}

/// A monotone piecewise-cubic Hermite interpolant (Fritsch & Carlson, "Monotone piecewise
/// cubic interpolation", SIAM J. Numer. Anal. 17(2), 1980): node slopes start as the mean of
/// the neighbouring secants (zero where they differ in sign, the secant at the ends) and are
/// scaled so that alpha^2 + beta^2 <= 9 on every interval. It keeps the data's monotone
/// stretches monotone, never overshoots a peak (so the table's largest cl is the curve's
/// largest), reproduces straight data exactly and has a continuous first derivative.
#[derive(Debug, Clone, PartialEq)]
struct Hermite {
    x: Vec<f64>,
    y: Vec<f64>,
    slope: Vec<f64>,
}

impl Hermite {
    fn new(x: &[f64], y: &[f64]) -> Self {
        let n = x.len();
        let secant: Vec<f64> = (0..n - 1)
            .map(|k| (y[k + 1] - y[k]) / (x[k + 1] - x[k]))
            .collect();
        let mut slope = vec![0.0; n];
        slope[0] = secant[0];
        slope[n - 1] = secant[n - 2];
        for k in 1..n - 1 {
            let (left, right) = (secant[k - 1], secant[k]);
            slope[k] = if left * right > 0.0 {
                0.5 * (left + right)
            } else {
                0.0
            };
        }
        for (k, &d) in secant.iter().enumerate() {
            if d == 0.0 {
                slope[k] = 0.0;
                slope[k + 1] = 0.0;
                continue;
            }
            let (a, b) = (slope[k] / d, slope[k + 1] / d);
            let size = a.hypot(b);
            if size > 3.0 {
                let tau = 3.0 / size;
                slope[k] = tau * a * d;
                slope[k + 1] = tau * b * d;
            }
        }
        Self {
            x: x.to_vec(),
            y: y.to_vec(),
            slope,
        }
    }

    /// Value and first derivative at `x`; the end values, with zero slope, outside.
    fn at(&self, x: f64) -> (f64, f64) {
        let n = self.x.len();
        if x <= self.x[0] {
            return (self.y[0], 0.0);
        }
        if x >= self.x[n - 1] {
            return (self.y[n - 1], 0.0);
        }
        let k = self.x.partition_point(|&v| v <= x).clamp(1, n - 1) - 1;
        let h = self.x[k + 1] - self.x[k];
        let t = (x - self.x[k]) / h;
        let (y0, y1) = (self.y[k], self.y[k + 1]);
        let (m0, m1) = (self.slope[k] * h, self.slope[k + 1] * h);
        let (t2, t3) = (t * t, t * t * t);
        let value = (2.0 * t3 - 3.0 * t2 + 1.0) * y0
            + (t3 - 2.0 * t2 + t) * m0
            + (-2.0 * t3 + 3.0 * t2) * y1
            + (t3 - t2) * m1;
        let derivative = ((6.0 * t2 - 6.0 * t) * y0
            + (3.0 * t2 - 4.0 * t + 1.0) * m0
            + (-6.0 * t2 + 6.0 * t) * y1
            + (3.0 * t2 - 2.0 * t) * m1)
            / h;
        (value, derivative)
    }
}

/// A CSV table as read: the columns, and where the header and each row stand in the file.
#[derive(Debug, Clone, PartialEq)]
pub struct CsvTable {
    /// The values.
    pub columns: Columns,
    /// The header's line and the column of each name.
    pub header: CsvRow,
    /// Each row's line and the column of each cell.
    pub rows: Vec<CsvRow>,
}

/// Reads a CSV table: a header `alpha,cl,cd` or `alpha,cl,cd,cm`, then one row per line;
/// blank lines and lines starting with `#` are skipped. Cells may be padded with spaces.
///
/// # Errors
/// The 1-based line and column of the first malformed cell, with the column and reason.
pub fn parse_csv(text: &str) -> Result<CsvTable, CsvError> {
    let mut lines = text
        .lines()
        .enumerate()
        .map(|(i, l)| (i + 1, l))
        .filter(|(_, l)| !l.trim().is_empty() && !l.trim_start().starts_with('#'));
    let Some((header_line, header_text)) = lines.next() else {
        return Err(CsvError {
            line: 1,
            column: 1,
            field: "table".into(),
            reason: "the file is empty: expected a header `alpha,cl,cd` or `alpha,cl,cd,cm`".into(),
        });
    };
    let header_cells = cells(header_text);
    let names: Vec<&str> = header_cells.iter().map(|c| c.1).collect();
    let with_cm = match names.as_slice() {
        ["alpha", "cl", "cd"] => false,
        ["alpha", "cl", "cd", "cm"] => true,
        _ => {
            return Err(CsvError {
                line: header_line,
                column: 1,
                field: "table".into(),
                reason: format!(
                    "the header must be `alpha,cl,cd` or `alpha,cl,cd,cm` (got `{}`)",
                    header_text.trim()
                ),
            })
        }
    };
    let wanted = names.len();
    let mut columns = Columns {
        cm: with_cm.then(Vec::new),
        ..Columns::default()
    };
    let mut rows = Vec::new();
    for (line, text) in lines {
        let cells = cells(text);
        if cells.len() != wanted {
            let column = cells.get(wanted).map_or(text.chars().count() + 1, |c| c.0);
            let field = names.get(cells.len()).map_or("table", |n| *n);
            return Err(CsvError {
                line,
                column,
                field: field.into(),
                reason: format!("this row has {} values, the header {wanted}", cells.len()),
            });
        }
        let mut values = [0.0; 4];
        for (i, (column, cell)) in cells.iter().enumerate() {
            values[i] = cell.parse::<f64>().map_err(|_| CsvError {
                line,
                column: *column,
                field: names[i].into(),
                reason: format!("must be a number (got `{cell}`)"),
            })?;
        }
        columns.alpha_deg.push(values[0]);
        columns.cl.push(values[1]);
        columns.cd.push(values[2]);
        if let Some(cm) = &mut columns.cm {
            cm.push(values[3]);
        }
        rows.push(CsvRow {
            line,
            columns: cells.iter().map(|c| c.0).collect(),
        });
    }
    let header = CsvRow {
        line: header_line,
        columns: header_cells.iter().map(|c| c.0).collect(),
    };
    Ok(CsvTable {
        columns,
        header,
        rows,
    })
}

/// Each cell's 1-based starting column (characters, after leading spaces) and its trimmed text.
fn cells(line: &str) -> Vec<(usize, &str)> {
    let mut out = Vec::new();
    let mut column = 1;
    for cell in line.split(',') {
        let lead = cell.chars().take_while(|c| c.is_whitespace()).count();
        out.push((column + lead, cell.trim()));
        column += cell.chars().count() + 1;
    }
    out
}

/// Where one CSV row stands in its file: its line and each cell's column.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct CsvRow {
    /// 1-based line.
    pub line: usize,
    /// 1-based column of each cell.
    pub columns: Vec<usize>,
}

/// A CSV table that cannot be read.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct CsvError {
    /// 1-based line.
    pub line: usize,
    /// 1-based column.
    pub column: usize,
    /// The column name, or `table`.
    pub field: String,
    /// What is wrong.
    pub reason: String,
}

#[cfg(test)]
mod tests {
    use super::*;

    fn columns(alpha: &[f64], cl: &[f64]) -> Columns {
        Columns {
            alpha_deg: alpha.to_vec(),
            cl: cl.to_vec(),
            cd: vec![0.01; alpha.len()],
            cm: None,
        }
    }

    #[test]
    fn straight_data_is_reproduced_exactly_between_rows() {
        // Property of cubic Hermite interpolation with the secant as every node slope (Fritsch
        // & Carlson 1980, eq. 2): a straight line is reproduced; no outside value.
        let alpha = [-4.0, 0.0, 2.0, 7.0, 10.0];
        let cl: Vec<f64> = alpha.iter().map(|a| 0.1 * (a + 2.0)).collect();
        let t = SectionTable::new(TableSource::Inline, columns(&alpha, &cl)).expect("valid");
        for a in [-3.3, 0.5, 5.0, 9.9] {
            let (value, slope) = t.lift(f64::to_radians(a));
            assert!((value - 0.1 * (a + 2.0)).abs() < 1e-12, "{a}: {value}");
            assert!((slope - 0.1_f64.to_degrees()).abs() < 1e-9, "{a}: {slope}");
        }
        let linear = t.linear();
        assert_eq!((linear.first_row, linear.last_row), (0, 4));
        assert!((linear.alpha_zero_lift_deg + 2.0).abs() < 1e-12);
    }

    #[test]
    fn a_peak_is_not_overshot_and_the_slope_is_zero_there() {
        // Fritsch & Carlson 1980: a node between secants of opposite sign gets slope 0, so
        // the interpolant's largest value is the data's.
        let alpha = [0.0, 5.0, 10.0, 14.0, 16.0, 20.0];
        let cl = [0.2, 0.75, 1.25, 1.5, 1.42, 1.1];
        let t = SectionTable::new(TableSource::Inline, columns(&alpha, &cl)).expect("valid");
        let most = (0..=2000)
            .map(|i| t.lift(f64::to_radians(f64::from(i) * 0.01)).0)
            .fold(f64::MIN, f64::max);
        assert!((most - 1.5).abs() < 1e-12, "{most}");
        assert_eq!(t.lift(14_f64.to_radians()).1, 0.0);
        assert_eq!(t.largest_cl(), 1.5);
    }

    #[test]
    fn the_linear_range_stops_where_the_curve_bends() {
        let alpha = [-6.0, -4.0, 0.0, 4.0, 8.0, 12.0, 14.0];
        let cl = [-0.4, -0.2, 0.2, 0.6, 1.0, 1.2, 1.25];
        let t = SectionTable::new(TableSource::Inline, columns(&alpha, &cl)).expect("valid");
        let linear = t.linear();
        assert_eq!((linear.first_row, linear.last_row), (0, 4));
        assert!((linear.lift_slope - 0.1_f64.to_degrees()).abs() < 1e-9);
        assert!((linear.alpha_zero_lift_deg + 2.0).abs() < 1e-9);
    }

    #[test]
    fn the_rules_name_row_and_column() {
        let bad = |alpha: &[f64], cl: &[f64]| {
            SectionTable::new(TableSource::Inline, columns(alpha, cl)).expect_err("bad")
        };
        let e = bad(&[0.0, 1.0, 1.0, 2.0], &[0.0, 0.1, 0.2, 0.3]);
        assert_eq!((e.row, e.column), (Some(2), Column::Alpha));
        let e = bad(&[0.0, 1.0, 2.0], &[0.0, 0.1, 0.2]);
        assert_eq!((e.row, e.column), (None, Column::Alpha));
        let e = bad(&[0.0, 1.0, 2.0, 3.0], &[0.0, 0.1, f64::NAN, 0.3]);
        assert_eq!((e.row, e.column), (Some(2), Column::Cl));
        let e = bad(&[0.0, 1.0, 2.0, 3.0], &[0.3, 0.2, 0.1, 0.0]);
        assert_eq!((e.row, e.column), (None, Column::Cl));
    }

    #[test]
    fn csv_cells_are_located() {
        let text = "# lift of a made-up section\nalpha, cl, cd\n-2, 0.0, 0.01\n0, 0.2,  x\n";
        let e = parse_csv(text).expect_err("bad cell");
        assert_eq!((e.line, e.column, e.field.as_str()), (4, 10, "cd"));
        let e = parse_csv("alpha,cl,cd\n1,2\n").expect_err("short row");
        assert_eq!((e.line, e.field.as_str()), (2, "cd"));
        let e = parse_csv("alpha,cd,cl\n").expect_err("header");
        assert_eq!((e.line, e.column), (1, 1));
    }
}

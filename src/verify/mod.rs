//! The published verification cases: one table ([`cases`]) read by `gammaline verify` and by
//! the test suite, so a user sees the same evidence the tests check.
//!
//! Each [`Case`] names its source (book or report, equation or table), computes one number
//! with the library and compares it with the expected value within a stated tolerance.
//! Pure: no I/O; [`render`] turns the outcomes into text, JSON or CSV strings.

mod cases;
pub mod render;
pub mod wings;

pub use cases::cases;

/// How far a computed value may lie from the expected one.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Tolerance {
    /// `|computed - expected| <= tol`.
    Absolute(f64),
    /// `|computed - expected| <= tol * |expected|`.
    Relative(f64),
}

impl Tolerance {
    /// Whether `computed` is within this tolerance of `expected` (never for a NaN).
    #[must_use]
    pub fn admits(self, expected: f64, computed: f64) -> bool {
        let gap = (computed - expected).abs();
        match self {
            Self::Absolute(tol) => gap <= tol,
            Self::Relative(tol) => gap <= tol * expected.abs(),
        }
    }
}

impl std::fmt::Display for Tolerance {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            Self::Absolute(tol) => write!(f, "+-{tol:e}"),
            Self::Relative(tol) if *tol >= 1e-4 => write!(f, "+-{}%", render::value(tol * 100.0)),
            Self::Relative(tol) => write!(f, "+-{tol:e} rel."),
        }
    }
}

/// The two numbers a case compares.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Reading {
    /// The published (or closed-form) value.
    pub expected: f64,
    /// What gammaline computes.
    pub computed: f64,
}

/// What a case's computation returns: a reading, or why it could not be made.
pub type Check = Box<dyn Fn() -> Result<Reading, String> + Send + Sync>;

/// One verification case.
pub struct Case {
    /// Short name: what is computed, on which wing.
    pub name: String,
    /// Book or report, edition, equation or table.
    pub source: &'static str,
    /// Allowed distance between expected and computed.
    pub tolerance: Tolerance,
    check: Check,
}

impl Case {
    /// A case against a fixed published value.
    pub fn fixed(
        name: impl Into<String>,
        source: &'static str,
        expected: f64,
        tolerance: Tolerance,
        compute: impl Fn() -> Result<f64, String> + Send + Sync + 'static,
    ) -> Self {
        Self::derived(name, source, tolerance, move || {
            compute().map(|computed| Reading { expected, computed })
        })
    }

    /// A case whose expected value is itself computed (a closed form of the case's wing).
    pub fn derived(
        name: impl Into<String>,
        source: &'static str,
        tolerance: Tolerance,
        check: impl Fn() -> Result<Reading, String> + Send + Sync + 'static,
    ) -> Self {
        Self {
            name: name.into(),
            source,
            tolerance,
            check: Box::new(check),
        }
    }

    /// Computes the case and judges it.
    #[must_use]
    pub fn run(&self) -> Outcome {
        let reading = (self.check)();
        let pass = reading
            .as_ref()
            .is_ok_and(|r| self.tolerance.admits(r.expected, r.computed));
        Outcome {
            case: self.name.clone(),
            source: self.source,
            tolerance: self.tolerance,
            reading,
            pass,
        }
    }
}

/// A case's result.
#[derive(Debug, Clone, PartialEq)]
pub struct Outcome {
    /// The case's name.
    pub case: String,
    /// The case's source.
    pub source: &'static str,
    /// The case's tolerance.
    pub tolerance: Tolerance,
    /// Expected and computed values, or the error that stopped the computation.
    pub reading: Result<Reading, String>,
    /// Within tolerance (false when the computation failed).
    pub pass: bool,
}

/// Runs every case in table order.
#[must_use]
pub fn run_all() -> Vec<Outcome> {
    cases().iter().map(Case::run).collect()
}

/// Whether every outcome passed (the command's exit status).
#[must_use]
pub fn all_pass(outcomes: &[Outcome]) -> bool {
    outcomes.iter().all(|o| o.pass)
}

//! One-parameter trade studies.

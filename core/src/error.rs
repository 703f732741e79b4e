//! Why an input was refused. Every constructor and fallible function in core returns these as
//! values; none panics.

use core::fmt;

/// A reason core refused an input.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum StressError {
    /// A component is NaN or infinite. `component` names it (e.g. "σx", "τxy").
    NonFinite {
        /// Which component.
        component: &'static str,
    },
    /// A 3×3 matrix is not symmetric: `|a_ij − a_ji|` exceeds the tolerance.
    NotSymmetric {
        /// Row of the offending entry (0-based).
        row: usize,
        /// Column of the offending entry (0-based).
        col: usize,
        /// The mismatch `|a_ij − a_ji|`.
        mismatch: f64,
        /// The tolerance it was judged against.
        tolerance: f64,
    },
    /// A plane normal has zero or non-finite length.
    DegenerateNormal,
    /// A result computed from finite inputs lies beyond the double-precision range
    /// (about ±1.8e308); `what` names the result.
    Overflow {
        /// Which result (e.g. "the turned element", "the stress in pascals").
        what: &'static str,
    },
    /// Two slices that must have the same length do not.
    LengthMismatch {
        /// Length of the input.
        input: usize,
        /// Length of the output.
        output: usize,
    },
}

impl fmt::Display for StressError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Self::NonFinite { component } => {
                write!(f, "{component} is not a finite number")
            }
            Self::NotSymmetric {
                row,
                col,
                mismatch,
                tolerance,
            } => write!(
                f,
                "the stress matrix is not symmetric: entries ({},{}) and ({},{}) differ by {mismatch:e}, more than the tolerance {tolerance:e}",
                row + 1,
                col + 1,
                col + 1,
                row + 1
            ),
            Self::Overflow { what } => write!(
                f,
                "{what} overflows the number range (about ±1.8e308): the entries are finite but too large for this unit; use a larger unit"
            ),
            Self::DegenerateNormal => {
                write!(f, "the plane normal has zero length; give at least one non-zero component")
            }
            Self::LengthMismatch { input, output } => write!(
                f,
                "output has room for {output} results but {input} tensors were given"
            ),
        }
    }
}

#[cfg(feature = "std")]
impl std::error::Error for StressError {}

//! The one error type of hydrograde.
//!
//! Every failure names the parameter, the value it was given and the rule it broke, so a
//! message read in Python, C or a spreadsheet says what to fix. Bindings map
//! [`Error::kind`] to their own status codes and exception classes; the list of kinds is
//! [`ErrorKind::ALL`], which the binding tests compare against their own lists.

use thiserror::Error as ThisError;

/// Result alias used throughout the crate.
pub type Result<T> = std::result::Result<T, Error>;

/// Everything that can go wrong in hydrograde.
#[derive(Debug, Clone, PartialEq, ThisError)]
#[non_exhaustive]
pub enum Error {
    /// A number that must be finite was NaN or infinite.
    #[error("{name} = {}: must be a finite number", Shown(*value))]
    NotFinite {
        /// Parameter name as the user wrote it (e.g. `re`, `rel_roughness`).
        name: &'static str,
        /// The value that was given.
        value: f64,
    },
    /// A finite number outside the range the calculation accepts.
    #[error("{name} = {}: {rule}", Shown(*value))]
    OutOfRange {
        /// Parameter name.
        name: &'static str,
        /// The value that was given.
        value: f64,
        /// The rule it broke, e.g. "must be greater than 0".
        rule: String,
    },
    /// A name (correlation, fitting, material, pipe size, unit…) that is not known.
    #[error(
        "unknown {what} \"{given}\"{}; known: {known}",
        crate::names::DidYouMean(given, known)
    )]
    UnknownName {
        /// What kind of name it is, e.g. "correlation".
        what: &'static str,
        /// The name that was given.
        given: String,
        /// The accepted names, comma-separated.
        known: String,
    },
    /// Input that is malformed as a whole rather than one bad number: an empty line, a
    /// fitting with no bore to refer to, arrays of different lengths.
    #[error("{name}: {reason}")]
    Invalid {
        /// The parameter or object at fault.
        name: &'static str,
        /// What is wrong with it.
        reason: String,
    },
    /// The question has no answer: curves that do not cross, a head that no flow meets,
    /// a transitional Reynolds number with the refuse option.
    #[error("no solution: {reason}")]
    NoSolution {
        /// Why there is no solution.
        reason: String,
    },
    /// An error in one element of a batch, with the element's index.
    #[error("element {index}: {source}")]
    AtIndex {
        /// Zero-based index of the failing element.
        index: usize,
        /// The element's own error.
        source: Box<Error>,
    },
}

/// A value as an error message shows it: as Rust prints it, except that magnitudes of
/// 1e16 and above (which would print every digit) take the exponent form.
struct Shown(f64);

impl std::fmt::Display for Shown {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        if self.0.is_finite() && self.0.abs() >= 1e16 {
            write!(f, "{:e}", self.0)
        } else {
            write!(f, "{}", self.0)
        }
    }
}

/// The category of an [`Error`]; bindings map it to status codes and exception classes.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum ErrorKind {
    /// See [`Error::NotFinite`].
    NotFinite,
    /// See [`Error::OutOfRange`].
    OutOfRange,
    /// See [`Error::UnknownName`].
    UnknownName,
    /// See [`Error::Invalid`].
    Invalid,
    /// See [`Error::NoSolution`].
    NoSolution,
}

impl ErrorKind {
    /// Every kind, in a fixed order; binding tests check their mappings cover this list.
    pub const ALL: [ErrorKind; 5] = [
        ErrorKind::NotFinite,
        ErrorKind::OutOfRange,
        ErrorKind::UnknownName,
        ErrorKind::Invalid,
        ErrorKind::NoSolution,
    ];

    /// A stable snake_case name for the kind (used by bindings for class and code names).
    pub fn name(self) -> &'static str {
        match self {
            ErrorKind::NotFinite => "not_finite",
            ErrorKind::OutOfRange => "out_of_range",
            ErrorKind::UnknownName => "unknown_name",
            ErrorKind::Invalid => "invalid",
            ErrorKind::NoSolution => "no_solution",
        }
    }
}

impl Error {
    /// The category of this error (for a batch error, the category of its element's error).
    pub fn kind(&self) -> ErrorKind {
        match self {
            Error::NotFinite { .. } => ErrorKind::NotFinite,
            Error::OutOfRange { .. } => ErrorKind::OutOfRange,
            Error::UnknownName { .. } => ErrorKind::UnknownName,
            Error::Invalid { .. } => ErrorKind::Invalid,
            Error::NoSolution { .. } => ErrorKind::NoSolution,
            Error::AtIndex { source, .. } => source.kind(),
        }
    }

    /// Builds an [`Error::OutOfRange`].
    pub fn out_of_range(name: &'static str, value: f64, rule: impl Into<String>) -> Self {
        Error::OutOfRange {
            name,
            value,
            rule: rule.into(),
        }
    }

    /// Builds an [`Error::Invalid`].
    pub fn invalid(name: &'static str, reason: impl Into<String>) -> Self {
        Error::Invalid {
            name,
            reason: reason.into(),
        }
    }

    /// Builds an [`Error::NoSolution`].
    pub fn no_solution(reason: impl Into<String>) -> Self {
        Error::NoSolution {
            reason: reason.into(),
        }
    }

    /// Builds an [`Error::UnknownName`] from the list of accepted names.
    pub fn unknown_name(what: &'static str, given: &str, known: &[&str]) -> Self {
        Error::UnknownName {
            what,
            given: given.to_string(),
            known: known.join(", "),
        }
    }

    /// Wraps this error with the index of the batch element it came from.
    pub fn at_index(self, index: usize) -> Self {
        Error::AtIndex {
            index,
            source: Box::new(self),
        }
    }
}

/// Input checks shared by every module. Each returns the value on success so checks
/// chain: `let d = check::positive("diameter", d)?;`.
pub mod check {
    use super::{Error, Result};

    /// The value must be finite (not NaN, not ±∞).
    #[inline]
    pub fn finite(name: &'static str, value: f64) -> Result<f64> {
        if value.is_finite() {
            Ok(value)
        } else {
            Err(Error::NotFinite { name, value })
        }
    }

    /// The value must be finite and strictly greater than zero.
    #[inline]
    pub fn positive(name: &'static str, value: f64) -> Result<f64> {
        let v = finite(name, value)?;
        if v > 0.0 {
            Ok(v)
        } else {
            Err(Error::out_of_range(name, v, "must be greater than 0"))
        }
    }

    /// The value must be finite and zero or greater.
    #[inline]
    pub fn non_negative(name: &'static str, value: f64) -> Result<f64> {
        let v = finite(name, value)?;
        if v >= 0.0 {
            Ok(v)
        } else {
            Err(Error::out_of_range(name, v, "must not be negative"))
        }
    }

    /// The value must be finite and lie in the closed interval `[lo, hi]`; `unit` is
    /// printed after the limits in the message (e.g. "K", "" for none).
    #[inline]
    pub fn within(name: &'static str, value: f64, lo: f64, hi: f64, unit: &str) -> Result<f64> {
        let v = finite(name, value)?;
        if (lo..=hi).contains(&v) {
            Ok(v)
        } else {
            let unit = if unit.is_empty() {
                String::new()
            } else {
                format!(" {unit}")
            };
            Err(Error::out_of_range(
                name,
                v,
                format!("must lie between {lo}{unit} and {hi}{unit}"),
            ))
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn messages_name_parameter_and_value() {
        let e = check::positive("re", -3.0).unwrap_err();
        assert_eq!(e.to_string(), "re = -3: must be greater than 0");
        let e = check::finite("length", f64::NAN).unwrap_err();
        assert_eq!(e.to_string(), "length = NaN: must be a finite number");
        let e = check::positive("length", -1e300).unwrap_err();
        assert_eq!(e.to_string(), "length = -1e300: must be greater than 0");
        let e = check::within("temperature", 500.0, 273.15, 423.15, "K").unwrap_err();
        assert_eq!(
            e.to_string(),
            "temperature = 500: must lie between 273.15 K and 423.15 K"
        );
    }

    #[test]
    fn batch_errors_keep_the_kind_of_their_element() {
        let e = check::positive("re", 0.0).unwrap_err().at_index(7);
        assert_eq!(e.kind(), ErrorKind::OutOfRange);
        assert_eq!(e.to_string(), "element 7: re = 0: must be greater than 0");
    }

    #[test]
    fn unknown_names_list_the_known_ones() {
        let e = Error::unknown_name("correlation", "moody", &["colebrook", "haaland"]);
        assert_eq!(
            e.to_string(),
            "unknown correlation \"moody\"; known: colebrook, haaland"
        );
        assert_eq!(e.kind(), ErrorKind::UnknownName);
    }
}

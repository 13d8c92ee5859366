//! Element labels and counts: their checks and the [`Tag`] that carries both.

use crate::error::{Error, Result};
use serde::{Deserialize, Serialize};

/// The longest label accepted, in characters (a table column, not a paragraph).
pub const MAX_LABEL_CHARS: usize = 120;

/// The largest count of identical fittings in one row: far above any real run of
/// fittings, small enough that N·K stays a plausible resistance.
pub const MAX_COUNT: u32 = 10_000;

/// Checks a user label: 1 … [`MAX_LABEL_CHARS`] characters, not only spaces, no control
/// characters (they would break the tables and messages it appears in).
///
/// # Errors
/// [`Error::Invalid`] naming `label`.
pub fn check_label(label: &str) -> Result<String> {
    let n = label.chars().count();
    if label.trim().is_empty() {
        return Err(Error::invalid("label", "must not be empty or only spaces"));
    }
    if n > MAX_LABEL_CHARS {
        return Err(Error::invalid(
            "label",
            format!("has {n} characters: at most {MAX_LABEL_CHARS} are accepted"),
        ));
    }
    if let Some(c) = label.chars().find(|c| c.is_control()) {
        return Err(Error::invalid(
            "label",
            format!("contains the control character {c:?}: labels are one line of text"),
        ));
    }
    Ok(label.to_string())
}

/// Checks a count of identical fittings given as any integer: 1 … [`MAX_COUNT`].
///
/// # Errors
/// [`Error::OutOfRange`] naming `count`.
pub fn check_count(count: i64) -> Result<u32> {
    if (1..=i64::from(MAX_COUNT)).contains(&count) {
        Ok(count as u32)
    } else {
        Err(Error::out_of_range(
            "count",
            count as f64,
            format!("must be a whole number from 1 to {MAX_COUNT} (identical fittings in one row)"),
        ))
    }
}

/// A label and a count an element carries into a line: what the bindings attach to an
/// element before it is pushed (`Fitting.k(0.3, label="riser", count=6)` in Python).
/// Built only through [`Tag::new`]; deserialising runs the same checks.
#[derive(Debug, Clone, PartialEq, Eq, Serialize, Deserialize)]
#[serde(try_from = "TagSpec")]
pub struct Tag {
    pub(super) label: Option<String>,
    pub(super) count: u32,
}

#[derive(Deserialize)]
struct TagSpec {
    label: Option<String>,
    count: i64,
}

impl TryFrom<TagSpec> for Tag {
    type Error = Error;
    fn try_from(s: TagSpec) -> Result<Tag> {
        Tag::new(s.label.as_deref(), s.count)
    }
}

impl Default for Tag {
    fn default() -> Tag {
        Tag {
            label: None,
            count: 1,
        }
    }
}

impl Tag {
    /// A tag of an optional label (see [`check_label`]) and a count (see [`check_count`];
    /// only fittings take a count above 1, checked when the element is pushed).
    ///
    /// # Errors
    /// A bad label or count.
    pub fn new(label: Option<&str>, count: i64) -> Result<Tag> {
        Ok(Tag {
            label: label.map(check_label).transpose()?,
            count: check_count(count)?,
        })
    }

    /// The label, if one was given.
    pub fn label(&self) -> Option<&str> {
        self.label.as_deref()
    }

    /// The count (1 unless given).
    pub fn count(&self) -> u32 {
        self.count
    }

    /// True for no label and a count of 1.
    pub fn is_default(&self) -> bool {
        *self == Tag::default()
    }
}

//! A built line's elements, labels and counts, and the slicing and joining of lines.

use super::{LineBuilder, LineSpec, Tag};
use crate::error::{Error, Result};
use crate::line::{Element, Line};
use std::ops::{Bound, RangeBounds};

impl Line {
    /// An empty [`LineBuilder`].
    pub fn builder() -> LineBuilder {
        LineBuilder::new()
    }

    /// The stored form: what the user gave.
    pub(crate) fn spec(&self) -> LineSpec {
        LineSpec {
            elements: self.elements.clone(),
            options: self.options.clone(),
            roughness_ranges: self.roughness_ranges.clone(),
            labels: self.labels.clone(),
            counts: self.counts.clone(),
        }
    }

    /// The number of elements (at least 1).
    pub fn len(&self) -> usize {
        self.elements.len()
    }

    /// Always false: a line has at least one element (for the `len` convention).
    pub fn is_empty(&self) -> bool {
        self.elements.is_empty()
    }

    /// The elements in route order.
    pub fn iter(&self) -> std::slice::Iter<'_, Element> {
        self.elements.iter()
    }

    /// The label of element `index` as result rows show it: the user's, or the default
    /// (kind and index, see the module documentation), prefixed `"N × "` for N counted
    /// fittings. `None` when `index` is not an element.
    pub fn label(&self, index: usize) -> Option<String> {
        let e = self.elements.get(index)?;
        let own = self.labels[index].clone().unwrap_or_else(|| match e {
            Element::Pipe(_) => numbered("pipe", index),
            Element::Rise(_) => numbered("rise", index),
            Element::Fitting(f) => match f.catalogue_name() {
                Some(n) => numbered(n, index),
                None if f.method().name() == "k" => numbered("fitting", index),
                None => numbered(f.method().name(), index),
            },
            Element::Equipment(q) => q.name().to_string(),
            Element::Pump(_) => numbered("pump", index),
        });
        Some(match self.counts[index] {
            1 => own,
            n => format!("{n} × {own}"),
        })
    }

    /// The label and count of element `index` as a [`Tag`]; `None` when `index` is not
    /// an element.
    pub fn tag(&self, index: usize) -> Option<Tag> {
        Some(Tag {
            label: self.labels.get(index)?.clone(),
            count: self.counts[index],
        })
    }

    /// The label the user gave element `index`, if any.
    pub fn user_label(&self, index: usize) -> Option<&str> {
        self.labels.get(index)?.as_deref()
    }

    /// How many identical fittings element `index` stands for (1 for every other
    /// element); `None` when `index` is not an element.
    pub fn count(&self, index: usize) -> Option<u32> {
        self.counts.get(index).copied()
    }

    /// The line of the elements in `range` (indices into this line), with their labels,
    /// counts and roughness ranges and this line's options. Default labels renumber.
    ///
    /// # Errors
    /// A range past the end or reversed (naming `end` or `start`); an empty range
    /// (naming `slice`: a line needs an element); a fitting left without a bore to take.
    pub fn slice(&self, range: impl RangeBounds<usize>) -> Result<Line> {
        let n = self.len();
        let start = match range.start_bound() {
            Bound::Included(&s) => s,
            Bound::Excluded(&s) => s.saturating_add(1),
            Bound::Unbounded => 0,
        };
        let end = match range.end_bound() {
            Bound::Included(&e) => e.saturating_add(1),
            Bound::Excluded(&e) => e,
            Bound::Unbounded => n,
        };
        if end > n {
            return Err(Error::out_of_range(
                "end",
                end as f64,
                format!("must not pass the line's {n} elements"),
            ));
        }
        if start > end {
            return Err(Error::out_of_range(
                "start",
                start as f64,
                format!("must not come after end = {end}"),
            ));
        }
        if start == end {
            return Err(Error::invalid(
                "slice",
                format!("{start}..{end} leaves no element: a line needs at least one"),
            ));
        }
        let s = self.spec();
        Line::from_spec(LineSpec {
            elements: s.elements[start..end].to_vec(),
            roughness_ranges: s.roughness_ranges[start..end].to_vec(),
            labels: s.labels[start..end].to_vec(),
            counts: s.counts[start..end].to_vec(),
            options: s.options,
        })
    }

    /// This line followed by `other`: its elements with their labels, counts and
    /// roughness ranges appended, under this line's options (see
    /// [`LineBuilder::push_line`]).
    ///
    /// # Errors
    /// Options that differ (naming `other`); the errors of building the joined route.
    pub fn join(&self, other: &Line) -> Result<Line> {
        let mut b = LineBuilder::from_line(self.clone());
        b.push_line(other)?;
        b.build()
    }
}

impl<'a> IntoIterator for &'a Line {
    type Item = &'a Element;
    type IntoIter = std::slice::Iter<'a, Element>;
    fn into_iter(self) -> Self::IntoIter {
        self.iter()
    }
}

/// `"{word} {index}"`, written without the formatting machinery: every result row of a
/// long line names its element, and `format!` would be most of a row's cost.
fn numbered(word: &str, index: usize) -> String {
    let mut digits = [0u8; 20];
    let (mut n, mut start) = (index, digits.len());
    loop {
        start -= 1;
        digits[start] = b'0' + (n % 10) as u8;
        n /= 10;
        if n == 0 {
            break;
        }
    }
    let mut s = String::with_capacity(word.len() + 1 + digits.len() - start);
    s.push_str(word);
    s.push(' ');
    // ASCII digits: always UTF-8.
    s.push_str(std::str::from_utf8(&digits[start..]).unwrap_or_default());
    s
}

#[cfg(test)]
mod numbered_tests {
    #[test]
    fn numbered_labels_read_as_formatted_ones() {
        // Exact check against the standard formatter.
        for i in [0usize, 7, 10, 99, 100, 12_345, usize::MAX] {
            assert_eq!(super::numbered("pipe", i), format!("pipe {i}"));
        }
    }
}

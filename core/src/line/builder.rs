//! Building lines: the one [`LineBuilder`] every binding wraps, element labels, counted
//! fittings, and the slicing and joining of lines.
//!
//! A builder collects elements in route order with their options and builds a checked
//! [`Line`] on demand. The build is lazy and cached: a fitting without a bore of its own
//! takes it from a pipe that may be pushed after it, so a half-built route is allowed to
//! be incomplete until it is used.
//!
//! **Labels.** Every element has a label shown in result rows: the user's, or by default
//! its kind and index in the line (`"pipe 3"`, `"rise 5"`, `"fitting 4"` for a fixed K,
//! a fitting's catalogue or method name, `"elbow_90_long_radius 2"`, `"expansion 6"`;
//! equipment its own name). Default labels follow
//! the index in the line they are in, so a slice renumbers them; user labels travel with
//! their element.
//!
//! **Counted fittings.** `count = N` stands for N identical fittings in one place of the
//! route (six long-radius elbows on one run). They are one row of the result, labelled
//! `"6 × …"`, with N times the fitting's resistance: head loss N·K·V²/(2g) (exact from the
//! definition of K, the fittings seeing the same velocity). Their K error is one shared
//! error, not N independent ones: identical fittings of one make share their catalogue
//! value's bias, which is what the K spread describes (the same rule that makes every
//! instance of a catalogue entry one source). The band of the row is therefore N times
//! the band of one fitting.

use super::{Element, Line, LineOptions};
use crate::band::UncertaintyOptions;
use crate::error::{Error, Result};
use crate::fluid::Fluid;
use crate::friction;
use crate::section::TurbulentDiameter;
use serde::{Deserialize, Serialize};
use std::ops::{Bound, RangeBounds};
use std::sync::OnceLock;

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
    label: Option<String>,
    count: u32,
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

/// What the user gave for a line, nothing worked out: its stored form and the builder's
/// contents. Per-element lists may be empty (all default).
#[derive(Debug, Clone, Default, PartialEq, Serialize, Deserialize)]
pub(crate) struct LineSpec {
    pub elements: Vec<Element>,
    pub options: LineOptions,
    pub roughness_ranges: Vec<Option<(f64, f64)>>,
    #[serde(default)]
    pub labels: Vec<Option<String>>,
    #[serde(default)]
    pub counts: Vec<u32>,
}

impl LineSpec {
    /// Fills empty labels and counts with their defaults and checks every per-element
    /// list has one entry per element, every label and every count.
    pub(crate) fn normalised(mut self) -> Result<LineSpec> {
        let n = self.elements.len();
        if self.roughness_ranges.is_empty() {
            self.roughness_ranges = vec![None; n];
        }
        if self.labels.is_empty() {
            self.labels = vec![None; n];
        }
        if self.counts.is_empty() {
            self.counts = vec![1; n];
        }
        for (name, len) in [
            ("roughness_ranges", self.roughness_ranges.len()),
            ("labels", self.labels.len()),
            ("counts", self.counts.len()),
        ] {
            if len != n {
                return Err(Error::invalid(
                    name,
                    format!("has {len} entries for {n} elements"),
                ));
            }
        }
        for (i, l) in self.labels.iter().enumerate() {
            if let Some(l) = l {
                check_label(l).map_err(|e| e.at_index(i))?;
            }
        }
        for (i, &c) in self.counts.iter().enumerate() {
            count_fits(&self.elements[i], i64::from(c)).map_err(|e| e.at_index(i))?;
        }
        Ok(self)
    }

    fn push(&mut self, e: Element, label: Option<String>, count: u32) {
        self.elements.push(e);
        self.roughness_ranges.push(None);
        self.labels.push(label);
        self.counts.push(count);
    }
}

/// A count for element `e`: fittings only.
fn count_fits(e: &Element, count: i64) -> Result<u32> {
    let n = check_count(count)?;
    if n != 1 && !matches!(e, Element::Fitting(_)) {
        return Err(Error::invalid(
            "count",
            format!(
                "count = {n}: only fittings can be counted (a pipe states its length, a rise its height)"
            ),
        ));
    }
    Ok(n)
}

/// Collects the elements and options of a line and builds a checked [`Line`].
///
/// ```
/// use hydrograde::fitting::Fitting;
/// use hydrograde::line::{Element, LineBuilder};
/// use hydrograde::pipe::Pipe;
/// use hydrograde::section::Section;
///
/// let mut b = LineBuilder::new();
/// b.push(Element::Pipe(Pipe::new(Section::circle(0.05)?, 20.0, 4.5e-5)?));
/// let elbows = b.push_labelled(Element::Fitting(Fitting::k(0.3)?), "riser elbows")?;
/// b.set_count(elbows, 6)?;
/// let line = b.build()?;
/// assert_eq!(line.len(), 2);
/// assert_eq!(line.label(1).as_deref(), Some("6 × riser elbows"));
/// # Ok::<(), hydrograde::Error>(())
/// ```
#[derive(Debug, Clone, Default)]
pub struct LineBuilder {
    spec: LineSpec,
    /// The built line, made on first use after a change.
    built: OnceLock<Result<Line>>,
}

impl LineBuilder {
    /// An empty builder with the default options.
    pub fn new() -> LineBuilder {
        LineBuilder::default()
    }

    /// A builder holding `line`'s elements, labels, counts and options (already built).
    pub fn from_line(line: Line) -> LineBuilder {
        let built = OnceLock::new();
        let spec = line.spec();
        // A fresh OnceLock is empty, so this set cannot fail.
        let _ = built.set(Ok(line));
        LineBuilder { spec, built }
    }

    /// Forgets the built line: every change goes through here.
    fn edit(&mut self) -> &mut LineSpec {
        self.built = OnceLock::new();
        &mut self.spec
    }

    /// The number of elements pushed so far.
    pub fn len(&self) -> usize {
        self.spec.elements.len()
    }

    /// True before the first element.
    pub fn is_empty(&self) -> bool {
        self.spec.elements.is_empty()
    }

    /// The elements pushed so far, in route order.
    pub fn elements(&self) -> &[Element] {
        &self.spec.elements
    }

    /// The options so far.
    pub fn options(&self) -> &LineOptions {
        &self.spec.options
    }

    /// Appends an element with its default label; returns its index.
    pub fn push(&mut self, e: Element) -> usize {
        self.edit().push(e, None, 1);
        self.len() - 1
    }

    /// Appends an element with a label of the user's (see [`check_label`]); returns its
    /// index.
    ///
    /// # Errors
    /// A bad label (nothing is appended).
    pub fn push_labelled(&mut self, e: Element, label: &str) -> Result<usize> {
        let label = check_label(label)?;
        self.edit().push(e, Some(label), 1);
        Ok(self.len() - 1)
    }

    /// Appends an element with a [`Tag`]'s label and count; returns its index.
    ///
    /// # Errors
    /// A count above 1 on an element that is not a fitting (nothing is appended).
    pub fn push_tagged(&mut self, e: Element, tag: &Tag) -> Result<usize> {
        let count = count_fits(&e, i64::from(tag.count))?;
        self.edit().push(e, tag.label.clone(), count);
        Ok(self.len() - 1)
    }

    /// Appends every element of `line` with its label, count and roughness range, under
    /// this builder's options: `line`'s options must be the same except its inlet
    /// pressure (which in the middle of a route means nothing).
    ///
    /// # Errors
    /// Options that differ, naming `other` (nothing is appended).
    pub fn push_line(&mut self, line: &Line) -> Result<()> {
        let mut theirs = line.options.clone();
        theirs.inlet_pressure = self.spec.options.inlet_pressure;
        if theirs != self.spec.options {
            return Err(Error::invalid(
                "other",
                "its options (friction, turbulent diameter, uncertainty or surroundings) differ from this line's: give both lines the same options before joining them",
            ));
        }
        let s = self.edit();
        s.elements.extend_from_slice(&line.elements);
        s.roughness_ranges.extend_from_slice(&line.roughness_ranges);
        s.labels.extend_from_slice(&line.labels);
        s.counts.extend_from_slice(&line.counts);
        Ok(())
    }

    /// The element at `index`, or an error naming `index`.
    fn at(&self, index: usize) -> Result<&Element> {
        let n = self.len();
        self.spec.elements.get(index).ok_or_else(|| {
            Error::out_of_range(
                "index",
                index as f64,
                format!("must be the index of an element (the line has {n})"),
            )
        })
    }

    /// Sets (`Some`) or clears (`None`, back to the default) the label of element `index`.
    ///
    /// # Errors
    /// `index` not an element; a bad label.
    pub fn set_label(&mut self, index: usize, label: Option<&str>) -> Result<()> {
        self.at(index)?;
        let label = label.map(check_label).transpose()?;
        self.edit().labels[index] = label;
        Ok(())
    }

    /// Makes the fitting at `index` stand for `count` identical fittings (1 …
    /// [`MAX_COUNT`]; see the module documentation for the loss and band).
    ///
    /// # Errors
    /// `index` not an element; `count` out of range; a count above 1 on an element that is
    /// not a fitting.
    pub fn set_count(&mut self, index: usize, count: u32) -> Result<()> {
        let n = count_fits(self.at(index)?, i64::from(count))?;
        self.edit().counts[index] = n;
        Ok(())
    }

    /// Sets the relative half-width (0…1) of the K of the fitting at `index`.
    ///
    /// # Errors
    /// `index` not a fitting; a bad spread.
    pub fn set_k_spread(&mut self, index: usize, spread: f64) -> Result<()> {
        let f = match self.at(index)? {
            Element::Fitting(f) => f.clone().with_k_spread(spread)?,
            _ => return Err(not_a("fitting", index, self.len())),
        };
        self.edit().elements[index] = Element::Fitting(f);
        Ok(())
    }

    /// States the likely range (low, high; m) of the roughness of the pipe at `index`
    /// (see [`Line::set_roughness_range`]); checked at once.
    ///
    /// # Errors
    /// `index` not a pipe; a bad range or one that leaves out the pipe's roughness.
    pub fn set_roughness_range(&mut self, index: usize, low: f64, high: f64) -> Result<()> {
        match self.at(index)? {
            Element::Pipe(p) => {
                super::uncertainty::roughness_input(p, Some((low, high)), &self.spec.options)?;
            }
            _ => return Err(not_a("pipe", index, self.len())),
        }
        self.edit().roughness_ranges[index] = Some((low, high));
        Ok(())
    }

    /// Replaces all the options.
    ///
    /// # Errors
    /// Options that do not validate (nothing changes).
    pub fn set_options(&mut self, options: LineOptions) -> Result<()> {
        options.validate()?;
        self.edit().options = options;
        Ok(())
    }

    /// Changes the options through `f`, keeping the old ones when the result does not
    /// validate.
    fn with_options(&mut self, f: impl FnOnce(&mut LineOptions)) -> Result<()> {
        let mut o = self.spec.options.clone();
        f(&mut o);
        self.set_options(o)
    }

    /// Sets the friction options of every pipe.
    ///
    /// # Errors
    /// Options that do not validate.
    pub fn set_friction(&mut self, friction: friction::Options) -> Result<()> {
        self.with_options(|o| o.friction = friction)
    }

    /// Sets (`Some`, Pa absolute, > 0) or clears the inlet static pressure.
    ///
    /// # Errors
    /// A pressure not finite or not positive.
    pub fn set_inlet_pressure(&mut self, pressure: Option<f64>) -> Result<()> {
        self.with_options(|o| o.inlet_pressure = pressure)
    }

    /// Sets (`Some`, Pa above the start, finite) or clears the pressure the line must
    /// deliver at its end (see [`LineOptions::end_pressure`]).
    ///
    /// # Errors
    /// A pressure not finite.
    pub fn set_end_pressure(&mut self, pressure: Option<f64>) -> Result<()> {
        self.with_options(|o| o.end_pressure = pressure)
    }

    /// Sets the diameter turbulent flow in non-circular ducts uses.
    pub fn set_turbulent_diameter(&mut self, mode: TurbulentDiameter) {
        self.edit().options.turbulent_diameter = mode;
    }

    /// Sets the uncertainty sources of the bands.
    ///
    /// # Errors
    /// Options that do not validate.
    pub fn set_uncertainty(&mut self, uncertainty: UncertaintyOptions) -> Result<()> {
        self.with_options(|o| o.uncertainty = uncertainty)
    }

    /// Sets (`Some`, a gas) or resets (`None`: dry air, 20 °C, 101 325 Pa) the air around
    /// the line.
    ///
    /// # Errors
    /// A liquid.
    pub fn set_surroundings(&mut self, surroundings: Option<Fluid>) -> Result<()> {
        self.with_options(|o| o.surroundings = surroundings)
    }

    /// Counts the surrounding air column for a liquid line too (see
    /// [`LineOptions::air_column_for_liquids`]).
    pub fn set_air_column_for_liquids(&mut self, on: bool) {
        self.edit().options.air_column_for_liquids = on;
    }

    /// The built line, built on the first call after a change and kept.
    ///
    /// # Errors
    /// An empty route; a fitting with no bore to take; the errors of [`Line`]'s checks.
    pub fn line(&self) -> Result<&Line> {
        self.built
            .get_or_init(|| Line::from_spec(self.spec.clone()))
            .as_ref()
            .map_err(Clone::clone)
    }

    /// The built line (a copy of [`LineBuilder::line`]).
    ///
    /// # Errors
    /// As [`LineBuilder::line`].
    pub fn build(&self) -> Result<Line> {
        self.line().cloned()
    }
}

fn not_a(what: &str, index: usize, n: usize) -> Error {
    Error::out_of_range(
        "index",
        index as f64,
        format!("must be the index of a {what} in the line (the line has {n} elements)"),
    )
}

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
            Element::Pipe(_) => format!("pipe {index}"),
            Element::Rise(_) => format!("rise {index}"),
            Element::Fitting(f) => match f.catalogue_name() {
                Some(n) => format!("{n} {index}"),
                None if f.method().name() == "k" => format!("fitting {index}"),
                None => format!("{} {index}", f.method().name()),
            },
            Element::Equipment(q) => q.name().to_string(),
            Element::Pump(_) => format!("pump {index}"),
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

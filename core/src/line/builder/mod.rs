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
use std::sync::OnceLock;

mod route;
mod tag;
pub use tag::{MAX_COUNT, MAX_LABEL_CHARS, Tag, check_count, check_label};

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

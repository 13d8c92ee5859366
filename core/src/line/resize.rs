//! Resizing a line, or a section of it, to one round bore: what sizing tries.
//!
//! The rule, for the elements `start..end` of the section (the whole line by default):
//!
//! - every round pipe takes the new inside diameter (and, when a material is named, that
//!   material's typical roughness and range: a pipe sized in PVC is a PVC pipe);
//!   non-round ducts keep their section;
//! - a fitting whose K refers to a stated bore is the same kind of fitting in the new
//!   bore: its K is referred to the new diameter (a fixed K stays the same number on the
//!   new velocity; a Cv or Kv gives its K at the new bore). A fitting without a stated
//!   bore follows the pipe it sits in, as always;
//! - equipment with a fixed K on a stated bore (a heat exchanger's nozzle, a meter's
//!   body) cannot be resized: the line is refused with an error naming each such element
//!   by index and label. Size the sections on either side of it instead;
//! - a change of section (contraction or expansion) is rebuilt from the bores that now
//!   meet at it: each side next to a resized pipe takes the new bore, the other side
//!   keeps its stated bore. Where the two sides end up equal the transition is removed
//!   from the sized line (the sized line then has fewer elements than this one); where
//!   they differ it becomes the contraction or expansion between them (a contraction
//!   whose outlet side grew past its inlet becomes an expansion). Transitions just
//!   outside the section that touch a resized pipe are rebuilt the same way;
//! - a border of the section with no transition element, where the new bore meets a pipe
//!   of another bore, is counted by the flow path as an abrupt contraction or expansion
//!   row with its warning (see the path module); add a transition element there to state
//!   it.

use super::builder::LineSpec;
use super::{Element, Line, Rating};
use crate::error::{Error, Result, check};
use crate::fitting::Fitting;
use crate::pipe::Pipe;
use crate::section::Section;
use serde::{Deserialize, Serialize};

/// Relative difference below which two bores are the same (as the flow path's rule).
const SAME_BORE: f64 = 1e-9;

/// Which part of a line sizing changes and what its resized pipes are made of. The
/// default resizes every round pipe and keeps each pipe's own roughness.
#[derive(Debug, Clone, Default, PartialEq, Serialize, Deserialize)]
pub struct Resize {
    /// Elements `start..end` (indices into the line, end excluded) whose pipes and
    /// fittings take the new bore; `None` for the whole line.
    pub section: Option<(usize, usize)>,
    /// A catalogue wall material (see [`crate::roughness::catalogue`]) the resized pipes
    /// are made of: they take its typical roughness and its range for the bands. `None`
    /// keeps each pipe's own roughness.
    pub material: Option<String>,
}

impl Resize {
    /// Resizes the elements `start..end`.
    pub fn section(start: usize, end: usize) -> Resize {
        Resize {
            section: Some((start, end)),
            material: None,
        }
    }

    /// The same scope with the resized pipes made of `material`.
    pub fn in_material(mut self, material: &str) -> Resize {
        self.material = Some(material.to_string());
        self
    }
}

fn same(a: f64, b: f64) -> bool {
    (a - b).abs() <= SAME_BORE * a.abs().max(b.abs())
}

impl Line {
    /// The elements `start..end` a scope covers, checked against this line.
    ///
    /// # Errors
    /// A section past the end (naming `end`), reversed or empty (naming `start`); a
    /// section without a round pipe (naming `section`); an unknown material; equipment
    /// with a fixed bore in the section (naming `section`, with each element's index and
    /// label).
    pub(crate) fn resize_range(&self, scope: &Resize) -> Result<(usize, usize)> {
        let n = self.elements.len();
        let (start, end) = scope.section.unwrap_or((0, n));
        if end > n {
            return Err(Error::out_of_range(
                "end",
                end as f64,
                format!("the section must not pass the line's {n} elements"),
            ));
        }
        if start >= end {
            return Err(Error::out_of_range(
                "start",
                start as f64,
                format!("must come before end = {end} (a section holds at least one element)"),
            ));
        }
        if let Some(m) = &scope.material {
            crate::roughness::material(m)?;
        }
        let round = |e: &Element| matches!(e, Element::Pipe(p) if p.section().is_circular());
        if !self.elements[start..end].iter().any(round) {
            return Err(Error::invalid(
                "section",
                format!("elements {start}..{end} hold no round pipe to size"),
            ));
        }
        let fixed: Vec<String> = (start..end)
            .filter_map(|i| match &self.elements[i] {
                Element::Equipment(q) => match q.rating() {
                    Rating::FixedK {
                        diameter: Some(d), ..
                    } => Some(format!(
                        "element {i} ('{}', K on a fixed {d} m bore)",
                        self.label(i).unwrap_or_default()
                    )),
                    _ => None,
                },
                _ => None,
            })
            .collect();
        if !fixed.is_empty() {
            return Err(Error::invalid(
                "section",
                format!(
                    "{} hold(s) a fixed bore and cannot be resized; size the sections on either side (elements {start}..{end} were asked), or state the equipment's K on the adjoining pipe's bore",
                    fixed.join(", ")
                ),
            ));
        }
        Ok((start, end))
    }

    /// The same line with the round pipes of a section (the whole line by default) set to
    /// inside diameter `diameter` (m), fittings and transitions following by the rule of
    /// the module documentation (transitions left with equal bores are removed).
    ///
    /// # Errors
    /// `diameter` not positive or not finite; the errors of [`Line::resize_range`]; a
    /// roughness of the named material too large for the bore.
    pub fn with_diameter_in(&self, diameter: f64, scope: &Resize) -> Result<Line> {
        check::positive("diameter", diameter)?;
        let (start, end) = self.resize_range(scope)?;
        let spec = self.spec();
        let n = spec.elements.len();
        let mut elements = spec.elements.clone();
        let mut ranges = spec.roughness_ranges.clone();
        let mut resized = vec![false; n];
        for i in start..end {
            match &spec.elements[i] {
                Element::Pipe(p) if p.section().is_circular() => {
                    elements[i] = Element::Pipe(match &scope.material {
                        Some(m) => {
                            ranges[i] = None;
                            Pipe::of_material(Section::circle(diameter)?, p.length(), m)?
                        }
                        None => p.with_diameter(diameter)?,
                    });
                    resized[i] = true;
                }
                Element::Fitting(f) if f.transition_bores().is_none() && f.diameter().is_some() => {
                    elements[i] = Element::Fitting(f.clone().with_diameter(diameter)?);
                }
                _ => {}
            }
        }
        // Rebuild the transitions next to a resized pipe; drop those left with equal bores.
        let sets_section = |e: &Element| match e {
            Element::Pipe(_) => true,
            Element::Fitting(f) => f.transition_bores().is_some(),
            _ => false,
        };
        let mut keep = vec![true; n];
        for i in 0..n {
            let Element::Fitting(f) = &spec.elements[i] else {
                continue;
            };
            let Some((d_in, d_out)) = f.transition_bores() else {
                continue;
            };
            let up = (0..i).rev().find(|&j| sets_section(&spec.elements[j]));
            let down = (i + 1..n).find(|&j| sets_section(&spec.elements[j]));
            let new_in = if up.is_some_and(|j| resized[j]) {
                diameter
            } else {
                d_in
            };
            let new_out = if down.is_some_and(|j| resized[j]) {
                diameter
            } else {
                d_out
            };
            if new_in == d_in && new_out == d_out {
                continue;
            }
            if same(new_in, new_out) {
                keep[i] = false;
                continue;
            }
            let rebuilt = if new_out < new_in {
                Fitting::contraction(new_in, new_out)?
            } else {
                Fitting::expansion(new_in, new_out)?
            };
            // The same kind keeps the user's spread of K; a new kind takes its default.
            let rebuilt = if rebuilt.method().name() == f.method().name() {
                rebuilt.with_k_spread(f.k_spread())?
            } else {
                rebuilt
            };
            elements[i] = Element::Fitting(rebuilt);
        }
        Line::from_spec(LineSpec {
            elements: kept(elements, &keep),
            roughness_ranges: kept(ranges, &keep),
            labels: kept(spec.labels, &keep),
            counts: kept(spec.counts, &keep),
            options: spec.options,
        })
    }
}

/// The entries of `v` whose `keep` is true.
fn kept<T>(v: Vec<T>, keep: &[bool]) -> Vec<T> {
    v.into_iter()
        .zip(keep)
        .filter_map(|(x, k)| k.then_some(x))
        .collect()
}

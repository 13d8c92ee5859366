//! A line read from a table of rows, one element per row, as a person lays it out in a
//! spreadsheet range or a CSV file. The columns, in order:
//!
//! | column   | pipe row                                   | fitting row                      | rise row |
//! |----------|--------------------------------------------|----------------------------------|----------|
//! | kind     | `pipe`                                     | `fitting`                        | `rise`   |
//! | size     | bore (number) or `"steel 2 40"` (table, nominal size, schedule) | optional bore, as for a pipe | blank |
//! | length   | length (number)                            | blank                            | blank    |
//! | material | material name or absolute roughness (number) | blank                          | blank    |
//! | fitting  | blank                                      | catalogue name or a fixed K      | blank    |
//! | rise     | optional rise of the run, m up             | optional                         | the rise |
//! | label    | optional text for messages                 | optional                         | optional |
//!
//! Bores and roughnesses are read in one length unit, lengths and rises in another (both
//! metres by default), converted through [`crate::units`]. Rows left entirely blank are
//! skipped, so a range may have spare rows at its end. Every error names the row (1-based,
//! as a person counts) and the column.

use crate::error::{Error, Result};
use crate::fitting::Fitting;
use crate::line::{Element, Line};
use crate::pipe::Pipe;
use crate::section::Section;
use crate::sizes::{self, PipeTable};
use crate::units;

/// The columns of a row, in order.
pub const ROW_COLUMNS: [&str; 7] = [
    "kind", "size", "length", "material", "fitting", "rise", "label",
];

/// One cell of a row.
#[derive(Debug, Clone, PartialEq)]
pub enum Cell {
    /// An empty cell.
    Blank,
    /// A number.
    Number(f64),
    /// Text; text that is only spaces counts as blank.
    Text(String),
}

/// The units of a table of rows (symbols of [`crate::units`]).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct RowUnits<'a> {
    /// Unit of bores and roughnesses, e.g. `"mm"`.
    pub diameter: &'a str,
    /// Unit of lengths and rises, e.g. `"m"` or `"ft"`.
    pub length: &'a str,
}

impl Default for RowUnits<'_> {
    fn default() -> Self {
        RowUnits {
            diameter: "m",
            length: "m",
        }
    }
}

/// A line built from rows, with the row each element came from.
#[derive(Debug, Clone, PartialEq)]
pub struct RowsLine {
    /// The line.
    pub line: Line,
    /// For each element of the line, the 1-based row it came from and that row's label.
    pub element_rows: Vec<(usize, Option<String>)>,
}

impl RowsLine {
    /// A band source named by the core (e.g. `"K of gate_valve (element 4)"`) with the
    /// element replaced by its row and label (`"K of gate_valve (row 5, isolation)"`).
    pub fn describe_source(&self, source: &str) -> String {
        for (i, (row, label)) in self.element_rows.iter().enumerate() {
            let tag = format!("(element {i})");
            if source.contains(&tag) {
                let place = match label {
                    Some(l) => format!("(row {row}, {l})"),
                    None => format!("(row {row})"),
                };
                return source.replace(&tag, &place);
            }
        }
        source.to_string()
    }
}

/// Where in the table a value is read, for messages.
struct At<'a> {
    row: usize,
    label: Option<&'a str>,
}

impl At<'_> {
    fn fail(&self, column: usize, what: impl std::fmt::Display) -> Error {
        let label = self.label.map(|l| format!(" ({l})")).unwrap_or_default();
        Error::invalid(
            "rows",
            format!(
                "row {}{label}, column {} ({}): {what}",
                self.row,
                column + 1,
                ROW_COLUMNS[column]
            ),
        )
    }
}

fn text(cell: &Cell) -> Option<&str> {
    match cell {
        Cell::Text(t) if !t.trim().is_empty() => Some(t.trim()),
        _ => None,
    }
}

fn is_blank(cell: &Cell) -> bool {
    match cell {
        Cell::Blank => true,
        Cell::Text(t) => t.trim().is_empty(),
        Cell::Number(_) => false,
    }
}

/// A length-like cell converted to metres, or None when blank.
fn number_in(at: &At, cells: &[Cell], column: usize, unit: &str) -> Result<Option<f64>> {
    match &cells[column] {
        Cell::Number(v) => units::convert(*v, unit, "m")
            .map(Some)
            .map_err(|e| at.fail(column, e)),
        c if is_blank(c) => Ok(None),
        Cell::Text(t) => Err(at.fail(column, format!("expected a number, got \"{}\"", t.trim()))),
        Cell::Blank => Ok(None),
    }
}

/// A bore: a number in the diameter unit, or "table nominal schedule".
fn bore(at: &At, cells: &[Cell], unit: &str) -> Result<Option<f64>> {
    const SIZE: usize = 1;
    let Some(t) = text(&cells[SIZE]) else {
        return number_in(at, cells, SIZE, unit);
    };
    let words: Vec<&str> = t.split_whitespace().collect();
    if words.len() < 3 {
        return Err(at.fail(
            SIZE,
            format!("\"{t}\" is neither a bore nor a standard size written as table, nominal size and schedule (e.g. \"steel 2 40\")"),
        ));
    }
    let table: PipeTable = words[0].parse().map_err(|e| at.fail(SIZE, e))?;
    let nominal = words[1..words.len() - 1].join(" ");
    let size =
        sizes::lookup(table, &nominal, words[words.len() - 1]).map_err(|e| at.fail(SIZE, e))?;
    Ok(Some(size.inside_diameter))
}

fn require_blank(at: &At, cells: &[Cell], columns: &[usize], kind: &str) -> Result<()> {
    for &c in columns {
        if !is_blank(&cells[c]) {
            return Err(at.fail(c, format!("must be blank in a {kind} row")));
        }
    }
    Ok(())
}

/// The elements of one non-blank row.
fn row_elements(at: &At, cells: &[Cell], u: &RowUnits) -> Result<Vec<Element>> {
    let kind = match &cells[0] {
        Cell::Text(t) if !t.trim().is_empty() => crate::names::key(t),
        _ => return Err(at.fail(0, "expected pipe, fitting or rise")),
    };
    let rise = number_in(at, cells, 5, u.length)?;
    let mut out = Vec::with_capacity(2);
    match kind.as_str() {
        "pipe" => {
            require_blank(at, cells, &[4], "pipe")?;
            let d =
                bore(at, cells, u.diameter)?.ok_or_else(|| at.fail(1, "a pipe needs its bore"))?;
            let length = number_in(at, cells, 2, u.length)?
                .ok_or_else(|| at.fail(2, "a pipe needs its length"))?;
            let section = Section::circle(d).map_err(|e| at.fail(1, e))?;
            let pipe = match (&cells[3], text(&cells[3])) {
                (_, Some(material)) => {
                    Pipe::of_material(section, length, material).map_err(|e| at.fail(3, e))?
                }
                (Cell::Number(_), None) => {
                    let r = number_in(at, cells, 3, u.diameter)?.unwrap_or(0.0);
                    Pipe::new(section, length, r).map_err(|e| at.fail(3, e))?
                }
                _ => return Err(at.fail(3, "a pipe needs a material name or a roughness")),
            };
            out.push(Element::Pipe(pipe));
        }
        "fitting" => {
            require_blank(at, cells, &[2, 3], "fitting")?;
            let mut f = match (&cells[4], text(&cells[4])) {
                (_, Some(name)) => Fitting::named(name).map_err(|e| at.fail(4, e))?,
                (Cell::Number(k), None) => Fitting::k(*k).map_err(|e| at.fail(4, e))?,
                _ => return Err(at.fail(4, "a fitting needs a catalogue name or a K")),
            };
            if let Some(d) = bore(at, cells, u.diameter)? {
                f = f.with_diameter(d).map_err(|e| at.fail(1, e))?;
            }
            out.push(Element::Fitting(f));
        }
        "rise" => {
            require_blank(at, cells, &[1, 2, 3, 4], "rise")?;
            if rise.is_none() {
                return Err(at.fail(5, "a rise row needs the rise"));
            }
        }
        _ => {
            return Err(at.fail(
                0,
                format!(
                    "unknown kind \"{}\"; known: pipe, fitting, rise",
                    text(&cells[0]).unwrap_or("")
                ),
            ));
        }
    }
    if let Some(h) = rise {
        out.push(Element::rise(h).map_err(|e| at.fail(5, e))?);
    }
    Ok(out)
}

/// Builds a line from rows of up to seven cells (see the module documentation).
///
/// ```
/// use hydrograde::line::rows::{Cell, RowUnits, line_from_rows};
/// let t = |s: &str| Cell::Text(s.to_string());
/// let rows = vec![
///     vec![t("pipe"), Cell::Number(52.5), Cell::Number(30.0), t("commercial steel")],
///     vec![t("fitting"), Cell::Blank, Cell::Blank, Cell::Blank, t("Gate Valve")],
///     vec![t("rise"), Cell::Blank, Cell::Blank, Cell::Blank, Cell::Blank, Cell::Number(4.0)],
/// ];
/// let units = RowUnits { diameter: "mm", length: "m" };
/// let line = line_from_rows(&rows, &units)?.line;
/// assert_eq!(line.elements().len(), 3);
/// assert_eq!(line.static_head(), 4.0);
/// # Ok::<(), hydrograde::Error>(())
/// ```
///
/// # Errors
/// [`Error::Invalid`] naming the row and column: a row with more than seven cells, an
/// unknown kind, a missing or misplaced value, text where a number belongs, an unknown
/// fitting, material, pipe size or unit, a value the element refuses; a table with no
/// element; a line the core refuses as a whole (e.g. fittings with no bore to take).
pub fn line_from_rows(rows: &[Vec<Cell>], units: &RowUnits) -> Result<RowsLine> {
    for (name, unit) in [
        ("diameter unit", units.diameter),
        ("length unit", units.length),
    ] {
        units::convert(1.0, unit, "m")
            .map_err(|e| Error::invalid("rows", format!("{name}: {e}")))?;
    }
    let mut elements = Vec::new();
    let mut element_rows = Vec::new();
    for (i, row) in rows.iter().enumerate() {
        let mut cells = row.clone();
        if cells.len() > ROW_COLUMNS.len() {
            return Err(Error::invalid(
                "rows",
                format!(
                    "row {}: {} cells; a row has at most {} ({})",
                    i + 1,
                    cells.len(),
                    ROW_COLUMNS.len(),
                    ROW_COLUMNS.join(", ")
                ),
            ));
        }
        cells.resize(ROW_COLUMNS.len(), Cell::Blank);
        if cells.iter().all(is_blank) {
            continue;
        }
        let label = text(&cells[6]).map(str::to_string);
        let at = At {
            row: i + 1,
            label: label.as_deref(),
        };
        for e in row_elements(&at, &cells, units)? {
            elements.push(e);
            element_rows.push((i + 1, label.clone()));
        }
    }
    if elements.is_empty() {
        return Err(Error::invalid("rows", "no element: every row is blank"));
    }
    let line = Line::new(elements).map_err(|e| Error::invalid("rows", e.to_string()))?;
    Ok(RowsLine { line, element_rows })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::Fluid;

    fn t(s: &str) -> Cell {
        Cell::Text(s.to_string())
    }
    const B: Cell = Cell::Blank;
    fn n(v: f64) -> Cell {
        Cell::Number(v)
    }

    #[test]
    fn rows_give_the_same_line_as_the_elements() {
        let rows = vec![
            vec![
                t("Pipe"),
                n(52.5),
                n(30.0),
                n(0.045),
                B,
                n(2.5),
                t("suction"),
            ],
            vec![t("fitting"), B, B, B, t("gate valve")],
            vec![B, B, B],
            vec![t("FITTING"), B, B, B, n(0.5)],
            vec![t("rise"), B, B, B, B, n(-1.0)],
        ];
        let u = RowUnits {
            diameter: "mm",
            length: "m",
        };
        let got = line_from_rows(&rows, &u).unwrap();
        let want = Line::new(vec![
            Element::Pipe(Pipe::circular(0.0525, 30.0, 0.045 * 1e-3).unwrap()),
            Element::rise(2.5).unwrap(),
            Element::Fitting(Fitting::named("gate_valve").unwrap()),
            Element::Fitting(Fitting::k(0.5).unwrap()),
            Element::rise(-1.0).unwrap(),
        ])
        .unwrap();
        assert_eq!(got.line, want);
        assert_eq!(got.element_rows[2], (2, None));
        assert_eq!(got.element_rows[4], (5, None));
        let water = Fluid::new(998.2, 1.0e-3).unwrap();
        assert_eq!(
            got.line.required_head(&water, 0.004).unwrap(),
            want.required_head(&water, 0.004).unwrap()
        );
        assert_eq!(
            got.describe_source("K of gate_valve (element 2)"),
            "K of gate_valve (row 2)"
        );
        assert_eq!(got.describe_source("roughness"), "roughness");
    }

    #[test]
    fn a_standard_size_reads_the_table() {
        let rows = vec![vec![
            t("pipe"),
            t("steel 2 40"),
            n(10.0),
            t("commercial_steel"),
        ]];
        let line = line_from_rows(&rows, &RowUnits::default()).unwrap().line;
        let Element::Pipe(p) = &line.elements()[0] else {
            panic!("not a pipe")
        };
        // 2" schedule 40: 2.067 in inside (ASME B36.10M, from memory).
        assert!((p.bore() - 2.067 * 0.0254).abs() < 1e-12);
    }

    #[test]
    fn errors_name_row_and_column() {
        let u = RowUnits::default();
        let msg = |rows: Vec<Vec<Cell>>| line_from_rows(&rows, &u).unwrap_err().to_string();
        let m = msg(vec![
            vec![t("pipe"), n(0.05), n(10.0), n(0.0)],
            vec![t("pipe"), n(0.05), t("ten"), n(0.0), B, B, t("riser")],
        ]);
        assert!(
            m.contains("row 2 (riser), column 3 (length)") && m.contains("\"ten\""),
            "{m}"
        );
        let m = msg(vec![vec![t("pipe"), n(-0.05), n(10.0), n(0.0)]]);
        assert!(m.contains("row 1, column 2 (size)"), "{m}");
        let m = msg(vec![vec![t("valve")]]);
        assert!(m.contains("unknown kind \"valve\""), "{m}");
        let m = msg(vec![vec![t("fitting"), B, B, B, t("no_such_fitting")]]);
        assert!(
            m.contains("column 5 (fitting)") && m.contains("unknown fitting"),
            "{m}"
        );
        let m = msg(vec![vec![t("pipe"), n(0.05), n(10.0), t("unobtainium")]]);
        assert!(m.contains("column 4 (material)"), "{m}");
        let m = msg(vec![vec![t("pipe"), n(0.05), n(10.0)]]);
        assert!(m.contains("needs a material name or a roughness"), "{m}");
        let m = msg(vec![vec![B, B], vec![B]]);
        assert!(m.contains("no element"), "{m}");
        let m = msg(vec![vec![B; 8]]);
        assert!(m.contains("at most 7"), "{m}");
        let m = msg(vec![vec![t("pipe"), n(0.05), n(10.0), n(0.0), t("elbow")]]);
        assert!(
            m.contains("column 5 (fitting): must be blank in a pipe row"),
            "{m}"
        );
        let m = line_from_rows(
            &[vec![t("rise"), B, B, B, B, n(1.0)]],
            &RowUnits {
                diameter: "kg",
                length: "m",
            },
        )
        .unwrap_err()
        .to_string();
        assert!(m.contains("diameter unit"), "{m}");
    }
}

//! The printed table of times, ratios and targets.

/// One line of the table.
pub struct Row {
    what: String,
    ns: f64,
    ratio: Option<(f64, String)>,
    target: Option<(String, bool)>,
}

impl Row {
    /// A time with no ratio (a reference for the rows below it).
    pub fn time(what: &str, ns: f64) -> Self {
        Row {
            what: what.to_owned(),
            ns,
            ratio: None,
            target: None,
        }
    }

    /// A time, its ratio against `against`, and an optional target (text, met).
    pub fn ratio(
        what: &str,
        ns: f64,
        against: &str,
        ratio: f64,
        target: Option<(&str, bool)>,
    ) -> Self {
        Row {
            what: what.to_owned(),
            ns,
            ratio: Some((ratio, against.to_owned())),
            target: target.map(|(s, met)| (s.to_owned(), met)),
        }
    }
}

/// Rows in the order they were measured.
pub struct Table(Vec<Row>);

impl Table {
    /// An empty table.
    pub fn new() -> Self {
        Table(Vec::new())
    }

    /// Appends a row.
    pub fn push(&mut self, r: Row) {
        self.0.push(r);
    }

    /// Prints a Markdown table to stdout.
    pub fn print(&self) {
        println!();
        println!("| measurement | ns per item | ratio | against | target | met |");
        println!("|---|---:|---:|---|---|---|");
        for r in &self.0 {
            let (ratio, against) = match &r.ratio {
                Some((x, a)) if x.is_finite() => (format!("{x:.2}"), a.as_str()),
                Some(_) => ("".to_owned(), ""),
                None => ("".to_owned(), ""),
            };
            let (target, met) = match &r.target {
                Some((s, true)) => (s.as_str(), "met"),
                Some((s, false)) => (s.as_str(), "NOT met"),
                None => ("", ""),
            };
            println!(
                "| {} | {:.2} | {} | {} | {} | {} |",
                r.what, r.ns, ratio, against, target, met
            );
        }
    }
}

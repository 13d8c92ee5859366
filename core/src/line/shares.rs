//! Which items dominate a line's head loss and its band: shares by element, by kind of
//! element and by uncertainty source.

use super::LineResult;
use serde::{Deserialize, Serialize};

/// One row of a table of shares.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Share {
    /// The element's label, the kind's name (`"pipe"`, `"fitting"`, …) or the source's
    /// name (`"friction model"`, `"K of elbow_90_long"`, …).
    pub name: String,
    /// The kind: the element's kind name, or the source's kind (`"friction_model"`, …).
    pub kind: String,
    /// Row index in [`LineResult::elements`] (by-element rows only).
    pub row: Option<usize>,
    /// Head loss, m (elements and kinds; `None` for sources, which carry no loss).
    pub head_loss: Option<f64>,
    /// Share of the line's head loss, head_loss / Σ head_loss (`None` for sources and when
    /// the line's head loss is zero).
    pub loss_share: Option<f64>,
    /// Share of the variance of the line's head loss (`None` when its band has no width).
    /// For an element, the covariance of its loss with the total over the total's
    /// variance (these sum to 1 and may be negative for an element whose error offsets
    /// the rest); for a source, its contribution to the band.
    pub band_share: Option<f64>,
}

/// Shares of a line's head loss and of its band.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Shares {
    /// One row per row of the result, in route order.
    pub by_element: Vec<Share>,
    /// One row per kind of element present, in order of first appearance.
    pub by_kind: Vec<Share>,
    /// One row per source of the head-loss band, largest first.
    pub by_source: Vec<Share>,
}

impl LineResult {
    /// Loss and band shares by element, by kind and by source (exact sums of the rows;
    /// a rise has no loss and no band).
    ///
    /// ```
    /// use hydrograde::fluid::Fluid;
    /// use hydrograde::fitting::Fitting;
    /// use hydrograde::line::{Element, Line};
    /// use hydrograde::pipe::Pipe;
    /// use hydrograde::section::Section;
    ///
    /// let line = Line::new(vec![
    ///     Element::Pipe(Pipe::new(Section::circle(0.05)?, 20.0, 4.5e-5)?),
    ///     Element::Fitting(Fitting::k(2.0)?),
    /// ])?;
    /// let r = line.evaluate(&Fluid::water(293.15, 101_325.0)?, 0.003)?;
    /// let s = r.shares();
    /// let total: f64 = s.by_element.iter().filter_map(|e| e.loss_share).sum();
    /// assert!((total - 1.0).abs() < 1e-12);
    /// # Ok::<(), hydrograde::Error>(())
    /// ```
    pub fn shares(&self) -> Shares {
        let total = self.head_loss;
        let of_total = |h: f64| (total != 0.0).then(|| h / total);
        let by_element: Vec<Share> = self
            .elements
            .iter()
            .enumerate()
            .map(|(i, e)| Share {
                name: e.label.clone(),
                kind: e.kind.name().to_string(),
                row: Some(i),
                head_loss: Some(e.head_loss),
                loss_share: of_total(e.head_loss),
                band_share: e.band_share,
            })
            .collect();
        let mut by_kind: Vec<Share> = Vec::new();
        for e in &by_element {
            let row = match by_kind.iter_mut().find(|k| k.kind == e.kind) {
                Some(k) => k,
                None => {
                    by_kind.push(Share {
                        name: e.kind.clone(),
                        kind: e.kind.clone(),
                        row: None,
                        head_loss: Some(0.0),
                        loss_share: of_total(0.0),
                        band_share: e.band_share.map(|_| 0.0),
                    });
                    let last = by_kind.len() - 1;
                    &mut by_kind[last]
                }
            };
            row.head_loss = row.head_loss.zip(e.head_loss).map(|(a, b)| a + b);
            row.loss_share = row.loss_share.zip(e.loss_share).map(|(a, b)| a + b);
            row.band_share = row.band_share.zip(e.band_share).map(|(a, b)| a + b);
        }
        let by_source = self
            .head_loss_band
            .contributions
            .iter()
            .map(|c| Share {
                name: c.name(),
                kind: c.source.kind().to_string(),
                row: None,
                head_loss: None,
                loss_share: None,
                band_share: Some(c.share),
            })
            .collect();
        Shares {
            by_element,
            by_kind,
            by_source,
        }
    }
}

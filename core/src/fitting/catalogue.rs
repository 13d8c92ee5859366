//! The named catalogue of common fittings and valves.
//!
//! Names are plain lowercase trade words of our own. Most entries carry the 3-K constants
//! of Darby's table (Darby, R., 2001, "Correlate pressure drops through fittings",
//! Chemical Engineering 108(4); also Darby, 1999, Chemical Engineering Fluid Mechanics);
//! entries Darby does not list use Hooper's 2-K constants (Hooper, W. B., 1981,
//! "The two-K method predicts head losses in pipe fittings", Chemical Engineering
//! 88(17)), Crane's equivalent lengths (Crane Co., 1988, Technical Paper 410) or a
//! common-practice K. **Every constant in this table was typed from memory of those
//! publications, without the documents at hand**; each entry's `source` says so. Check a
//! constant against the publication (or better, the maker's data) before relying on it.
//!
//! The spread of K is common practice: ±25 % for Darby's fitted constants, ±30 % for his
//! valves, ±35 % for Hooper's, ±40 % for Crane's L/D data of foot valves and ±50 % for
//! strainers, whose loss depends on the screen and how clean it is.

use super::{Fitting, Method};
use crate::error::{Error, Result};

/// One catalogue entry.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CatalogueEntry {
    /// The name accepted by [`Fitting::named`].
    pub name: &'static str,
    /// What the fitting is, in a few words.
    pub description: &'static str,
    /// The method and its constants.
    pub method: Method,
    /// Relative half-width of K (common practice).
    pub k_spread: f64,
    /// Where the constants come from.
    pub source: &'static str,
    /// True for check valves and foot valves, which stop reverse flow.
    pub blocks_reverse_flow: bool,
}

const DARBY: &str = "Darby (2001) 3-K table, from memory";
const HOOPER: &str = "Hooper (1981) 2-K table, from memory";
const CRANE: &str = "Crane TP-410 (1988) L/D, from memory";
const PRACTICE: &str = "common practice for a clean screen, from memory; use the maker's Cv";

const fn three_k(
    name: &'static str,
    description: &'static str,
    k1: f64,
    k_inf: f64,
    k_d: f64,
    k_spread: f64,
) -> CatalogueEntry {
    CatalogueEntry {
        name,
        description,
        method: Method::ThreeK { k1, k_inf, k_d },
        k_spread,
        source: DARBY,
        blocks_reverse_flow: false,
    }
}

const fn two_k(
    name: &'static str,
    description: &'static str,
    k1: f64,
    k_inf: f64,
) -> CatalogueEntry {
    CatalogueEntry {
        name,
        description,
        method: Method::TwoK { k1, k_inf },
        k_spread: 0.35,
        source: HOOPER,
        blocks_reverse_flow: false,
    }
}

const fn l_over_d(name: &'static str, description: &'static str, l_over_d: f64) -> CatalogueEntry {
    CatalogueEntry {
        name,
        description,
        method: Method::EquivalentLength { l_over_d },
        k_spread: 0.4,
        source: CRANE,
        blocks_reverse_flow: false,
    }
}

const fn fixed(name: &'static str, description: &'static str, k: f64) -> CatalogueEntry {
    CatalogueEntry {
        name,
        description,
        method: Method::K { k },
        k_spread: 0.5,
        source: PRACTICE,
        blocks_reverse_flow: false,
    }
}

const FIT: f64 = 0.25;
const VALVE: f64 = 0.3;

/// The entry used by [`Fitting::tee_run`].
pub(crate) const TEE_RUN: CatalogueEntry = three_k(
    "tee_run_flanged",
    "tee, flow straight through the run, flanged or welded",
    150.0,
    0.017,
    4.0,
    FIT,
);
/// The entry used by [`Fitting::tee_branch`].
pub(crate) const TEE_BRANCH: CatalogueEntry = three_k(
    "tee_branch_flanged",
    "standard tee, flow through the branch, flanged or welded",
    800.0,
    0.28,
    4.0,
    FIT,
);

static CATALOGUE: [CatalogueEntry; 39] = [
    // Elbows, 90°
    three_k(
        "elbow_90_threaded",
        "90° standard elbow r/D = 1, threaded",
        800.0,
        0.14,
        4.0,
        FIT,
    ),
    three_k(
        "elbow_90_standard",
        "90° standard elbow r/D = 1, flanged or welded",
        800.0,
        0.091,
        4.0,
        FIT,
    ),
    three_k(
        "elbow_90_long_radius",
        "90° long-radius elbow r/D = 1.5",
        800.0,
        0.056,
        3.9,
        FIT,
    ),
    three_k(
        "elbow_90_mitre_1_weld",
        "90° mitre bend, one weld (90°)",
        1000.0,
        0.27,
        4.0,
        FIT,
    ),
    three_k(
        "elbow_90_mitre_2_welds",
        "90° mitre bend, two welds (45°)",
        800.0,
        0.068,
        4.1,
        FIT,
    ),
    three_k(
        "elbow_90_mitre_3_welds",
        "90° mitre bend, three welds (30°)",
        800.0,
        0.035,
        4.2,
        FIT,
    ),
    // Elbows, 45°
    three_k(
        "elbow_45_standard",
        "45° standard elbow r/D = 1",
        500.0,
        0.071,
        4.2,
        FIT,
    ),
    three_k(
        "elbow_45_long_radius",
        "45° long-radius elbow r/D = 1.5",
        500.0,
        0.052,
        4.0,
        FIT,
    ),
    three_k(
        "elbow_45_mitre_1_weld",
        "45° mitre bend, one weld (45°)",
        500.0,
        0.086,
        4.0,
        FIT,
    ),
    three_k(
        "elbow_45_mitre_2_welds",
        "45° mitre bend, two welds (22.5°)",
        500.0,
        0.052,
        4.0,
        FIT,
    ),
    // Return bends, 180°
    three_k(
        "return_bend_threaded",
        "180° close return bend r/D = 1, threaded",
        1000.0,
        0.23,
        4.0,
        FIT,
    ),
    three_k(
        "return_bend_standard",
        "180° return bend r/D = 1, flanged or welded",
        1000.0,
        0.12,
        4.0,
        FIT,
    ),
    three_k(
        "return_bend_long_radius",
        "180° long-radius return bend r/D = 1.5",
        1000.0,
        0.10,
        4.0,
        FIT,
    ),
    // Tees
    three_k(
        "tee_branch_threaded",
        "standard tee, flow through the branch, threaded",
        500.0,
        0.274,
        4.0,
        FIT,
    ),
    three_k(
        "tee_branch_long_radius",
        "long-radius tee, flow through the branch, threaded",
        800.0,
        0.14,
        4.0,
        FIT,
    ),
    TEE_BRANCH,
    three_k(
        "tee_branch_stub_in",
        "stub-in branch, flow through the branch",
        1000.0,
        0.34,
        4.0,
        FIT,
    ),
    three_k(
        "tee_run_threaded",
        "tee, flow straight through the run, threaded",
        200.0,
        0.091,
        4.0,
        FIT,
    ),
    TEE_RUN,
    three_k(
        "tee_run_stub_in",
        "stub-in branch, flow straight through the run",
        100.0,
        0.0,
        0.0,
        FIT,
    ),
    // Valves
    three_k(
        "gate_valve",
        "gate valve, full bore (β = 1), open",
        300.0,
        0.037,
        3.9,
        VALVE,
    ),
    three_k(
        "ball_valve",
        "ball valve, full bore (β = 1), open",
        300.0,
        0.017,
        3.5,
        VALVE,
    ),
    three_k(
        "globe_valve",
        "globe valve, standard pattern (β = 1), open",
        1500.0,
        1.7,
        3.6,
        VALVE,
    ),
    three_k(
        "angle_valve",
        "angle valve, 90°, open",
        1000.0,
        0.69,
        4.0,
        VALVE,
    ),
    three_k(
        "angle_valve_45",
        "angle valve, 45° (Y pattern), open",
        950.0,
        0.25,
        4.0,
        VALVE,
    ),
    three_k(
        "plug_valve",
        "plug valve, straight through, open",
        300.0,
        0.084,
        3.9,
        VALVE,
    ),
    three_k(
        "plug_valve_three_way_run",
        "three-way plug valve, flow through the run",
        300.0,
        0.14,
        4.0,
        VALVE,
    ),
    three_k(
        "plug_valve_branch",
        "plug valve, flow through the branch",
        500.0,
        0.41,
        4.0,
        VALVE,
    ),
    three_k(
        "diaphragm_valve",
        "diaphragm valve, dam (weir) type, open",
        1000.0,
        0.69,
        4.9,
        VALVE,
    ),
    non_return(three_k(
        "swing_check_valve",
        "swing check valve, fully open",
        1500.0,
        0.46,
        4.0,
        VALVE,
    )),
    non_return(three_k(
        "lift_check_valve",
        "lift check valve, fully open",
        2000.0,
        2.85,
        3.8,
        VALVE,
    )),
    two_k(
        "butterfly_valve",
        "butterfly valve, fully open",
        800.0,
        0.25,
    ),
    non_return(two_k(
        "tilting_disc_check_valve",
        "tilting-disc check valve, fully open",
        1000.0,
        0.50,
    )),
    two_k(
        "gate_valve_reduced_bore",
        "gate, ball or plug valve, reduced bore β = 0.8",
        1000.0,
        0.25,
    ),
    two_k(
        "globe_valve_y_pattern",
        "globe valve, Y pattern, open",
        1000.0,
        2.0,
    ),
    non_return(l_over_d(
        "foot_valve_poppet",
        "foot valve with strainer, poppet disc",
        420.0,
    )),
    non_return(l_over_d(
        "foot_valve_hinged",
        "foot valve with strainer, hinged disc",
        75.0,
    )),
    fixed("y_strainer", "Y strainer, clean screen", 3.0),
    fixed("basket_strainer", "basket strainer, clean basket", 1.5),
];

/// An entry that stops reverse flow (check and foot valves).
const fn non_return(e: CatalogueEntry) -> CatalogueEntry {
    CatalogueEntry {
        blocks_reverse_flow: true,
        ..e
    }
}

/// Every catalogue entry with its method, spread and source.
pub fn catalogue_entries() -> &'static [CatalogueEntry] {
    &CATALOGUE
}

/// The entry called `name`, with its method, spread and source.
///
/// # Errors
/// [`Error::UnknownName`] listing the catalogue when `name` is not in it.
pub fn entry(name: &str) -> Result<&'static CatalogueEntry> {
    crate::names::find(CATALOGUE.iter(), |e| e.name, name).ok_or_else(|| {
        let names: Vec<&str> = CATALOGUE.iter().map(|e| e.name).collect();
        Error::unknown_name("fitting", name, &names)
    })
}

/// The fitting of a catalogue entry, named after it.
pub(crate) fn fitting_of(e: &CatalogueEntry) -> Fitting {
    Fitting {
        method: e.method,
        diameter: None,
        k_spread: e.k_spread,
        name: Some(e.name.to_string()),
    }
}

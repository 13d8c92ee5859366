//! Cross-sections of ducts: area, wetted perimeter, hydraulic diameter and the exact
//! laminar constant.
//!
//! The laminar constant C is the product f·Re of fully developed laminar flow, with f the
//! Darcy friction factor and Re built on the hydraulic diameter D_h = 4A/P. Each value
//! below is the exact solution of the Poiseuille problem in that section (Shah & London
//! 1978, *Laminar Flow Forced Convection in Ducts*, chapters on each shape):
//!
//! | section | C = f·Re (Darcy, on D_h) | limits |
//! |---|---|---|
//! | circle | 64 | — |
//! | annulus, r = D_i/D_o | 64 (1−r)² / [1 + r² − (1−r²)/ln(1/r)] | 96 as r → 1 (plates), 64 as r → 0 |
//! | rectangle, α = short/long | 96 / {(1+α)² [1 − (192α/π⁵) Σ_{n odd} tanh(nπ/2α)/n⁵]} | 96 as α → 0, 56.908… square |
//! | ellipse, semi-axes a ≥ b | 128 π² (a² + b²) / P² with P the exact perimeter | 64 circle, 8π² as b/a → 0 |
//! | equilateral triangle | 160/3 | — |
//! | custom | as given | — |
//!
//! Velocity is flow / area. Laminar flow uses C with D_h. Turbulent flow uses D_h, or on
//! request the laminar-equivalent diameter D_le = (64/C)·D_h (Jones 1976 for rectangles;
//! Jones & Leung 1981 for annuli), see [`TurbulentDiameter`]. Turbulent correlations are
//! less accurate in non-circular sections, so those carry
//! [`Warnings::NON_CIRCULAR_SECTION`].

use crate::error::{Error, Result, check};
use crate::math;
use crate::warning::Warnings;
use serde::{Deserialize, Serialize};
use std::f64::consts::PI;

/// The shape and size of a duct's cross-section. All lengths in metres.
///
/// Built only through the checking constructors ([`Section::circle`] …, or
/// [`Section::from_shape`]), so it always holds a valid shape; [`Section::shape`] gives
/// its dimensions. Deserialising runs the same checks.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(try_from = "Shape", into = "Shape")]
pub struct Section(Shape);

/// A cross-section's kind and dimensions as plain numbers, m (the stored form of a
/// [`Section`]; [`Section::from_shape`] checks it).
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub enum Shape {
    /// Round pipe of inside diameter `diameter` (m).
    Circle {
        /// Inside diameter, m.
        diameter: f64,
    },
    /// Concentric annulus between an outer pipe and an inner rod or tube.
    Annulus {
        /// Inside diameter of the outer pipe, m.
        outer: f64,
        /// Outside diameter of the inner tube, m.
        inner: f64,
    },
    /// Rectangular duct.
    Rectangle {
        /// Width, m.
        width: f64,
        /// Height, m.
        height: f64,
    },
    /// Elliptical duct given by its full axes.
    Ellipse {
        /// Major axis (full length), m.
        major: f64,
        /// Minor axis (full length), m.
        minor: f64,
    },
    /// Equilateral triangular duct.
    Triangle {
        /// Side length, m.
        side: f64,
    },
    /// Any other shape, described by its area, wetted perimeter and laminar constant.
    Custom {
        /// Flow area, m².
        area: f64,
        /// Wetted perimeter, m.
        wetted_perimeter: f64,
        /// Laminar constant f·Re (Darcy, on the hydraulic diameter), dimensionless.
        laminar_constant: f64,
    },
}

/// Which length turbulent correlations use for Re and ε/D in a non-circular section.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default, Serialize, Deserialize)]
pub enum TurbulentDiameter {
    /// The hydraulic diameter D_h = 4A/P (the default, common practice).
    #[default]
    Hydraulic,
    /// The laminar-equivalent diameter D_le = (64/C)·D_h, which brings rectangular ducts
    /// (Jones 1976) and annuli (Jones & Leung 1981) closer to round-pipe correlations.
    /// Other shapes use D_h.
    LaminarEquivalent,
}

impl TurbulentDiameter {
    /// Names used by the bindings: `"hydraulic"`, `"laminar_equivalent"`.
    pub fn name(self) -> &'static str {
        match self {
            TurbulentDiameter::Hydraulic => "hydraulic",
            TurbulentDiameter::LaminarEquivalent => "laminar_equivalent",
        }
    }
}

impl std::str::FromStr for TurbulentDiameter {
    type Err = Error;
    fn from_str(s: &str) -> Result<Self> {
        match crate::names::key(s).as_str() {
            "hydraulic" => Ok(TurbulentDiameter::Hydraulic),
            "laminarequivalent" => Ok(TurbulentDiameter::LaminarEquivalent),
            _ => Err(Error::unknown_name(
                "turbulent diameter",
                s,
                &["hydraulic", "laminar_equivalent"],
            )),
        }
    }
}

/// The smallest length of a section, m (1 pm: far below any duct, which leaves room for
/// the limiting shapes of thin slots and rods, and far above the sizes where the area
/// underflows).
pub const MIN_DIMENSION: f64 = 1e-12;
/// The largest length of a section, m (1 km: above any duct or tunnel, and far below the
/// sizes where the area or a flow's head overflows).
pub const MAX_DIMENSION: f64 = 1e3;

/// A length of a section: finite, > 0 and within [`MIN_DIMENSION`]..=[`MAX_DIMENSION`].
fn dimension(name: &'static str, value: f64) -> Result<f64> {
    let v = check::positive(name, value)?;
    if (MIN_DIMENSION..=MAX_DIMENSION).contains(&v) {
        Ok(v)
    } else {
        Err(Error::out_of_range(
            name,
            v,
            format!("must lie between {MIN_DIMENSION:e} m and {MAX_DIMENSION:e} m"),
        ))
    }
}

impl TryFrom<Shape> for Section {
    type Error = Error;
    fn try_from(shape: Shape) -> Result<Section> {
        Section::from_shape(shape)
    }
}

impl From<Section> for Shape {
    fn from(s: Section) -> Shape {
        s.0
    }
}

impl Section {
    /// A section of the given shape, through the same checks as the constructors.
    ///
    /// # Errors
    /// The errors of the constructor of that shape.
    pub fn from_shape(shape: Shape) -> Result<Section> {
        match shape {
            Shape::Circle { diameter } => Section::circle(diameter),
            Shape::Annulus { outer, inner } => Section::annulus(outer, inner),
            Shape::Rectangle { width, height } => Section::rectangle(width, height),
            Shape::Ellipse { major, minor } => Section::ellipse(major, minor),
            Shape::Triangle { side } => Section::triangle(side),
            Shape::Custom {
                area,
                wetted_perimeter,
                laminar_constant,
            } => Section::custom(area, wetted_perimeter, laminar_constant),
        }
    }

    /// The kind and dimensions of the section, m.
    pub fn shape(&self) -> Shape {
        self.0
    }

    /// The same shape with every length multiplied by `factor` (> 0).
    ///
    /// # Errors
    /// `factor` not finite or not positive; a scaled length outside the section limits.
    pub fn scaled(&self, factor: f64) -> Result<Section> {
        let k = check::positive("factor", factor)?;
        match self.0 {
            Shape::Circle { diameter } => Section::circle(diameter * k),
            Shape::Annulus { outer, inner } => Section::annulus(outer * k, inner * k),
            Shape::Rectangle { width, height } => Section::rectangle(width * k, height * k),
            Shape::Ellipse { major, minor } => Section::ellipse(major * k, minor * k),
            Shape::Triangle { side } => Section::triangle(side * k),
            Shape::Custom {
                area,
                wetted_perimeter,
                laminar_constant,
            } => Section::custom(area * k * k, wetted_perimeter * k, laminar_constant),
        }
    }

    /// A round pipe of inside diameter `diameter` (m).
    ///
    /// # Errors
    /// `diameter` not finite or not greater than 0.
    pub fn circle(diameter: f64) -> Result<Section> {
        Ok(Section(Shape::Circle {
            diameter: dimension("diameter", diameter)?,
        }))
    }

    /// A concentric annulus: `outer` is the bore of the outer pipe, `inner` the outside
    /// diameter of the inner tube (both m).
    ///
    /// # Errors
    /// Either not finite or not greater than 0; `inner` not less than `outer`.
    pub fn annulus(outer: f64, inner: f64) -> Result<Section> {
        let outer = dimension("outer", outer)?;
        let inner = dimension("inner", inner)?;
        if inner >= outer {
            return Err(Error::out_of_range(
                "inner",
                inner,
                format!("must be less than outer = {outer}"),
            ));
        }
        Ok(Section(Shape::Annulus { outer, inner }))
    }

    /// A rectangle of `width` × `height` (m).
    ///
    /// # Errors
    /// Either not finite or not greater than 0.
    pub fn rectangle(width: f64, height: f64) -> Result<Section> {
        Ok(Section(Shape::Rectangle {
            width: dimension("width", width)?,
            height: dimension("height", height)?,
        }))
    }

    /// An ellipse with full axes `major` ≥ `minor` (m).
    ///
    /// # Errors
    /// Either not finite or not greater than 0; `minor` greater than `major`.
    pub fn ellipse(major: f64, minor: f64) -> Result<Section> {
        let major = dimension("major", major)?;
        let minor = dimension("minor", minor)?;
        if minor > major {
            return Err(Error::out_of_range(
                "minor",
                minor,
                format!("must not exceed major = {major}"),
            ));
        }
        Ok(Section(Shape::Ellipse { major, minor }))
    }

    /// An equilateral triangle of side `side` (m).
    ///
    /// # Errors
    /// `side` not finite or not greater than 0.
    pub fn triangle(side: f64) -> Result<Section> {
        Ok(Section(Shape::Triangle {
            side: dimension("side", side)?,
        }))
    }

    /// Any shape given by its `area` (m²), wetted `perimeter` (m) and laminar constant
    /// f·Re (Darcy, on D_h = 4A/P).
    ///
    /// # Errors
    /// Any value not finite or not greater than 0; a perimeter shorter than that of the
    /// circle of the same area (P² < 4πA, impossible for any shape: isoperimetric
    /// inequality).
    pub fn custom(area: f64, perimeter: f64, laminar_constant: f64) -> Result<Section> {
        let area = check::positive("area", area)?;
        if area > MAX_DIMENSION * MAX_DIMENSION {
            return Err(Error::out_of_range(
                "area",
                area,
                format!("must be at most {:e} m²", MAX_DIMENSION * MAX_DIMENSION),
            ));
        }
        let perimeter = check::positive("perimeter", perimeter)?;
        if perimeter > 4.0 * MAX_DIMENSION * 1e3 {
            return Err(Error::out_of_range(
                "perimeter",
                perimeter,
                format!("must be at most {:e} m", 4.0 * MAX_DIMENSION * 1e3),
            ));
        }
        let laminar_constant = check::within("laminar_constant", laminar_constant, 1.0, 1e4, "")?;
        // Allow rounding in the user's numbers: a circle typed to a few digits must pass.
        if perimeter * perimeter < 4.0 * PI * area * (1.0 - 1e-9) {
            return Err(Error::out_of_range(
                "perimeter",
                perimeter,
                format!(
                    "is shorter than the circle of the same area ({:.6e} m); no shape has \
                     that little perimeter",
                    (4.0 * PI * area).sqrt()
                ),
            ));
        }
        Ok(Section(Shape::Custom {
            area,
            wetted_perimeter: perimeter,
            laminar_constant,
        }))
    }

    /// A short name of the shape: `"circle"`, `"annulus"`, `"rectangle"`, `"ellipse"`,
    /// `"triangle"`, `"custom"`.
    pub fn shape_name(&self) -> &'static str {
        match self.0 {
            Shape::Circle { .. } => "circle",
            Shape::Annulus { .. } => "annulus",
            Shape::Rectangle { .. } => "rectangle",
            Shape::Ellipse { .. } => "ellipse",
            Shape::Triangle { .. } => "triangle",
            Shape::Custom { .. } => "custom",
        }
    }

    /// Flow area A, m².
    pub fn area(&self) -> f64 {
        match self.0 {
            Shape::Circle { diameter } => PI / 4.0 * diameter * diameter,
            Shape::Annulus { outer, inner } => PI / 4.0 * (outer - inner) * (outer + inner),
            Shape::Rectangle { width, height } => width * height,
            Shape::Ellipse { major, minor } => PI / 4.0 * major * minor,
            Shape::Triangle { side } => 3f64.sqrt() / 4.0 * side * side,
            Shape::Custom { area, .. } => area,
        }
    }

    /// Wetted perimeter P, m (for the annulus, both walls).
    pub fn wetted_perimeter(&self) -> f64 {
        match self.0 {
            Shape::Circle { diameter } => PI * diameter,
            Shape::Annulus { outer, inner } => PI * (outer + inner),
            Shape::Rectangle { width, height } => 2.0 * (width + height),
            Shape::Ellipse { major, minor } => ellipse_perimeter(major / 2.0, minor / 2.0),
            Shape::Triangle { side } => 3.0 * side,
            Shape::Custom {
                wetted_perimeter, ..
            } => wetted_perimeter,
        }
    }

    /// Hydraulic diameter D_h = 4A/P, m. Exactly the diameter for a circle and
    /// `outer − inner` for an annulus.
    pub fn hydraulic_diameter(&self) -> f64 {
        match self.0 {
            Shape::Circle { diameter } => diameter,
            Shape::Annulus { outer, inner } => outer - inner,
            Shape::Rectangle { width, height } => 2.0 * width * height / (width + height),
            Shape::Triangle { side } => side / 3f64.sqrt(),
            _ => 4.0 * self.area() / self.wetted_perimeter(),
        }
    }

    /// The exact laminar constant C = f·Re (Darcy friction factor, Re on the hydraulic
    /// diameter), dimensionless; see the module table for each formula. Accurate to a few
    /// ulp against 40-digit mpmath evaluations (core/tests/section_exact.rs).
    pub fn laminar_constant(&self) -> f64 {
        match self.0 {
            Shape::Circle { .. } => 64.0,
            Shape::Annulus { outer, inner } => annulus_constant(outer, inner),
            Shape::Rectangle { width, height } => {
                rectangle_constant(width.min(height) / width.max(height))
            }
            Shape::Ellipse { major, minor } => {
                let (a, b) = (major / 2.0, minor / 2.0);
                let p = ellipse_perimeter(a, b);
                128.0 * PI * PI * (a * a + b * b) / (p * p)
            }
            Shape::Triangle { .. } => 160.0 / 3.0,
            Shape::Custom {
                laminar_constant, ..
            } => laminar_constant,
        }
    }

    /// True for a round pipe.
    pub fn is_circular(&self) -> bool {
        matches!(self.0, Shape::Circle { .. })
    }

    /// The length turbulent correlations use, m: D_h, or with
    /// [`TurbulentDiameter::LaminarEquivalent`] the laminar-equivalent diameter
    /// (64/C)·D_h for rectangles (Jones 1976) and annuli (Jones & Leung 1981). Circles,
    /// ellipses, triangles and custom sections use D_h in both modes: the correction was
    /// proposed and tested for rectangles and annuli only.
    pub fn turbulent_diameter(&self, mode: TurbulentDiameter) -> f64 {
        let dh = self.hydraulic_diameter();
        match (mode, self.0) {
            (
                TurbulentDiameter::LaminarEquivalent,
                Shape::Rectangle { .. } | Shape::Annulus { .. },
            ) => 64.0 / self.laminar_constant() * dh,
            _ => dh,
        }
    }

    /// Mean velocity (m/s) of a volumetric flow `flow` (m³/s, signed) through the section.
    #[inline]
    pub fn velocity(&self, flow: f64) -> f64 {
        flow / self.area()
    }

    /// Warnings every result in this section carries:
    /// [`Warnings::NON_CIRCULAR_SECTION`] unless it is a circle.
    pub fn warnings(&self) -> Warnings {
        if self.is_circular() {
            Warnings::NONE
        } else {
            Warnings::NON_CIRCULAR_SECTION
        }
    }
}

/// f·Re of a concentric annulus. With x = ln(D_o/D_i) the closed form becomes
/// 128 sinh²(x/2) / (cosh x − sinh x / x), whose denominator is summed as a series for
/// x < 1 to avoid the cancellation of the textbook form as D_i/D_o → 1.
fn annulus_constant(outer: f64, inner: f64) -> f64 {
    // (outer − inner) is exact when the two are close (Sterbenz), so x keeps full accuracy.
    let x = math::ln_1p((outer - inner) / inner);
    if x >= 1.0 {
        // r ≤ 1/e: the textbook form loses at most a couple of bits here.
        let r = inner / outer;
        return 64.0 * (1.0 - r) * (1.0 - r) / (1.0 + r * r - (1.0 - r * r) / x);
    }
    let s = math::sinh(x / 2.0);
    // cosh x − sinh x / x = Σ_{k≥1} x^{2k} · 2k / (2k+1)!
    let x2 = x * x;
    let mut term = x2 / 6.0; // x^{2k}/(2k+1)! at k = 1
    let mut den = 0.0;
    for k in 1..=24 {
        let kf = f64::from(k);
        let add = term * 2.0 * kf;
        den += add;
        if add <= den * f64::EPSILON * 0.25 {
            break;
        }
        term *= x2 / ((2.0 * kf + 2.0) * (2.0 * kf + 3.0));
    }
    128.0 * s * s / den
}

/// f·Re of a rectangle of aspect ratio α = short/long in (0, 1].
///
/// Σ_{n odd} tanh(nπ/2α)/n⁵ = (31/32) ζ(5) − Σ_{n odd} (1 − tanh(nπ/2α))/n⁵: the
/// remainder decays like e^{−nπ/α}, so a few terms reach machine precision (13 at α = 1).
fn rectangle_constant(alpha: f64) -> f64 {
    // ζ(5), mpmath to 40 digits: 1.036927755143369926331365486457034168057.
    const ZETA5: f64 = 1.036_927_755_143_37;
    let mut rest = 0.0;
    let mut n = 1.0f64;
    for _ in 0..64 {
        // 1 − tanh(y) = 2 e^{−2y} / (1 + e^{−2y}), with y = nπ/(2α).
        let e = math::exp(-n * PI / alpha);
        let add = 2.0 * e / (1.0 + e) / math::powi(n, 5);
        rest += add;
        if add <= f64::EPSILON * 1e-3 {
            break;
        }
        n += 2.0;
    }
    let sum = 31.0 / 32.0 * ZETA5 - rest;
    let pi5 = math::powi(PI, 5);
    96.0 / ((1.0 + alpha) * (1.0 + alpha) * (1.0 - 192.0 * alpha / pi5 * sum))
}

/// Exact perimeter of an ellipse with semi-axes a ≥ b > 0 (m), from the arithmetic–
/// geometric mean: P = 2π/M(a, b) · [(a² + b²)/2 − Σ_{n≥1} 2^{n−1} c_n²], with
/// c_{n+1} = c_n² / (4 a_{n+1}) (Abramowitz & Stegun 1964, 17.6; converges quadratically).
pub fn ellipse_perimeter(a: f64, b: f64) -> f64 {
    let (mut an, mut bn) = (a.max(b), a.min(b));
    let mut cn2 = (an - bn) * (an + bn); // c_0²
    let mut sum = (an * an + bn * bn) / 2.0;
    let mut weight = 0.5;
    for _ in 0..64 {
        let a_next = (an + bn) / 2.0;
        let b_next = (an * bn).sqrt();
        // c_{n+1} = c_n² / (4 a_{n+1}), squared.
        let c_next = cn2 / (4.0 * a_next);
        cn2 = c_next * c_next;
        weight *= 2.0;
        let add = weight * cn2;
        sum -= add;
        an = a_next;
        bn = b_next;
        if add <= sum * f64::EPSILON * 0.25 {
            break;
        }
    }
    2.0 * PI / ((an + bn) / 2.0) * sum
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn constructors_validate() {
        assert!(Section::circle(0.0).is_err());
        assert!(Section::annulus(0.1, 0.1).is_err());
        assert!(Section::annulus(0.1, 0.2).is_err());
        assert!(Section::rectangle(0.1, f64::INFINITY).is_err());
        assert!(Section::ellipse(0.1, 0.2).is_err());
        assert!(Section::triangle(-1.0).is_err());
        // A circle of diameter 1: A = π/4, P = π (exact); P slightly too short fails.
        assert!(Section::custom(PI / 4.0, PI, 64.0).is_ok());
        assert!(Section::custom(PI / 4.0, 3.0, 64.0).is_err());
        let e = Section::annulus(0.1, 0.2).unwrap_err();
        assert_eq!(e.to_string(), "inner = 0.2: must be less than outer = 0.1");
    }

    #[test]
    fn circle_warnings_and_diameters() {
        let c = Section::circle(0.1).unwrap();
        assert!(c.warnings().is_empty());
        assert_eq!(
            c.turbulent_diameter(TurbulentDiameter::LaminarEquivalent),
            0.1
        );
        // Flat ducts have C > 64, so Jones's diameter is smaller than D_h (Jones 1976).
        let r = Section::rectangle(0.1, 1.0).unwrap();
        assert_eq!(r.warnings(), Warnings::NON_CIRCULAR_SECTION);
        assert!(
            r.turbulent_diameter(TurbulentDiameter::LaminarEquivalent)
                < r.turbulent_diameter(TurbulentDiameter::Hydraulic)
        );
        assert_eq!(
            "laminar_equivalent".parse::<TurbulentDiameter>().unwrap(),
            TurbulentDiameter::LaminarEquivalent
        );
    }
}

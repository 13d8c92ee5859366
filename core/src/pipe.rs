//! One straight run of duct: the Darcy–Weisbach head loss with its derivative.
//!
//! ```text
//! h = f · (L / D_h) · V |V| / (2 g),   V = Q / A
//! ```
//!
//! `f` comes from [`crate::friction::darcy_factor`] with the section's exact laminar
//! constant. Turbulent flow in a non-circular section uses the hydraulic diameter or, on
//! request, the laminar-equivalent diameter of Jones (1976): Re and ε/D are then taken on
//! `D_t` and the laminar constant is scaled by `D_t/D_h`, so laminar flow still gives the
//! exact `C/Re_h`. Its flow derivative follows from `Re ∝ |Q|`:
//!
//! ```text
//! dh/dQ = L |V| (Re_t ∂f/∂Re_t + 2 f) / (2 g D_h A)
//! ```
//!
//! which tends to the Hagen–Poiseuille slope `C ν L / (2 g D_h² A)` as `Q → 0`.
//! The head loss is an odd function of the signed flow `Q` with a
//! continuous derivative through zero (laminar near zero) and through the transition (the
//! friction blend is C¹).

use crate::error::{Result, check};
use crate::fluid::Fluid;
use crate::friction::{self, Correlation, Friction, Options, Regime};
use crate::section::{Section, TurbulentDiameter};
use crate::units::STANDARD_GRAVITY;
use crate::warning::Warnings;
use serde::{Deserialize, Serialize};

/// A straight run: a cross-section, a length and an absolute wall roughness.
///
/// Built only through the checking constructors ([`Pipe::new`], [`Pipe::circular`],
/// [`Pipe::of_material`]); the accessors read it. Deserialising runs the same checks.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(try_from = "PipeSpec", into = "PipeSpec")]
pub struct Pipe {
    section: Section,
    length: f64,
    roughness: f64,
    roughness_range: Option<(f64, f64)>,
    material: Option<String>,
}

/// The stored form of a [`Pipe`].
#[derive(Serialize, Deserialize)]
struct PipeSpec {
    section: Section,
    length: f64,
    roughness: f64,
    #[serde(default)]
    roughness_range: Option<(f64, f64)>,
    #[serde(default)]
    material: Option<String>,
}

impl TryFrom<PipeSpec> for Pipe {
    type Error = crate::Error;
    fn try_from(s: PipeSpec) -> Result<Pipe> {
        let mut p = Pipe::new(s.section, s.length, s.roughness)?;
        if let Some(name) = &s.material {
            crate::roughness::material(name)?;
        }
        if let Some((lo, hi)) = s.roughness_range {
            check_range(p.roughness, lo, hi)?;
        }
        p.roughness_range = s.roughness_range;
        p.material = s.material;
        Ok(p)
    }
}

impl From<Pipe> for PipeSpec {
    fn from(p: Pipe) -> PipeSpec {
        PipeSpec {
            section: p.section,
            length: p.length,
            roughness: p.roughness,
            roughness_range: p.roughness_range,
            material: p.material,
        }
    }
}

/// A roughness range (m): 0 < low ≤ high, finite, holding the roughness.
fn check_range(roughness: f64, lo: f64, hi: f64) -> Result<()> {
    check::positive("low", lo)?;
    check::positive("high", hi)?;
    if hi < lo {
        return Err(crate::Error::out_of_range(
            "high",
            hi,
            format!("must not be below low ({lo} m): the roughness range is inverted"),
        ));
    }
    if !(lo..=hi).contains(&roughness) {
        return Err(crate::Error::out_of_range(
            "roughness",
            roughness,
            format!("must lie inside its stated range {lo} … {hi} m"),
        ));
    }
    Ok(())
}

/// The longest run a pipe accepts, m (10,000 km: longer than any pipeline, short enough
/// that its head loss stays a finite number).
pub const MAX_LENGTH: f64 = 1e7;

/// What a pipe's head loss needs that depends on neither the fluid nor the flow, worked
/// out once (when a line is built): the section's area (m²), hydraulic and turbulent
/// diameters (m), laminar constant and warnings, and the pipe's own constants below.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub(crate) struct Geometry {
    pub area: f64,
    pub dh: f64,
    pub dt: f64,
    pub c: f64,
    pub warnings: Warnings,
    /// D_t/D_h: Reynolds numbers and the laminar constant on the turbulent diameter.
    pub scale: f64,
    /// L/(D_h·2g), s²/m: the head loss is f times this times V|V|.
    pub length_head: f64,
    /// ε/D_t, the relative roughness the friction factor takes.
    pub rel_roughness: f64,
}

/// The flow-dependent numbers of a pipe at one flow, before its friction factor.
#[derive(Debug, Clone, Copy)]
pub(crate) struct Kinematics {
    /// Q/A, m/s (signed).
    pub velocity: f64,
    /// |V|, m/s.
    pub speed: f64,
    /// Reynolds number on the hydraulic diameter.
    pub re_h: f64,
    /// Reynolds number on the turbulent diameter (what the friction factor takes).
    pub re_t: f64,
}

impl Geometry {
    /// The velocity and Reynolds numbers at signed flow `flow` (m³/s) for kinematic
    /// viscosity `nu` (m²/s).
    #[inline(always)]
    pub(crate) fn kinematics(&self, nu: f64, flow: f64) -> Kinematics {
        let velocity = flow / self.area;
        let speed = velocity.abs();
        let re_h = speed * self.dh / nu;
        Kinematics {
            velocity,
            speed,
            re_h,
            re_t: re_h * self.scale,
        }
    }

    /// True where the loss is the exact laminar law without a friction factor: laminar
    /// flow (except for Churchill, which covers every regime itself), or a Reynolds
    /// number below the smallest one a friction factor is defined for.
    #[inline(always)]
    pub(crate) fn direct_laminar(re_t: f64, opts: &Options) -> bool {
        let defined = re_t >= friction::MIN_REYNOLDS;
        (re_t < opts.laminar_limit && opts.correlation != Correlation::Churchill) || !defined
    }

    /// Head loss (m) and slope (s/m²) of the exact laminar law, f = C/Re_h, written so
    /// that zero flow is regular: linear in V.
    #[inline(always)]
    pub(crate) fn laminar_loss(&self, nu: f64, k: &Kinematics) -> (f64, f64) {
        let per_speed = self.c * nu / self.dh * self.length_head; // h / V
        (per_speed * k.velocity, per_speed / self.area)
    }

    /// The friction options on this section: the section's laminar constant on the
    /// turbulent diameter.
    #[inline(always)]
    pub(crate) fn friction_options(&self, opts: &Options) -> Options {
        Options {
            laminar_constant: self.c * self.scale,
            ..*opts
        }
    }

    /// Head loss (m) at friction factor `f`.
    #[inline(always)]
    pub(crate) fn head(&self, f: f64, k: &Kinematics) -> f64 {
        f * self.length_head * k.velocity * k.speed
    }

    /// Head loss (m) and slope (s/m²) at friction factor `f` with ∂f/∂Re_t `df_dre`:
    /// dh/dQ = L |V| (Re_t ∂f/∂Re_t + 2 f) / (2 g D_h A) (module docs).
    #[inline(always)]
    pub(crate) fn loss(&self, f: f64, df_dre: f64, k: &Kinematics) -> (f64, f64) {
        (
            self.head(f, k),
            self.length_head * k.speed * (k.re_t * df_dre + 2.0 * f) / self.area,
        )
    }

    /// Head loss (m) and slope (s/m²) at signed flow `flow` (m³/s) alone, the solvers'
    /// hot path: the numbers of [`Pipe::flow_state_in`], formed by the same functions,
    /// without warnings or sensitivities. `None` where `flow_state_in` would fail or its
    /// checks must speak (non-finite flow, Reynolds number or relative roughness out of
    /// range, a non-finite result); `opts` were checked when the line was built.
    #[inline(always)]
    pub(crate) fn lean_loss(&self, nu: f64, flow: f64, opts: &Options) -> Option<(f64, f64)> {
        if !flow.is_finite() {
            return None;
        }
        let k = self.kinematics(nu, flow);
        if k.re_t > friction::MAX_REYNOLDS {
            return None;
        }
        let (loss, slope) = if Geometry::direct_laminar(k.re_t, opts) {
            self.laminar_loss(nu, &k)
        } else {
            // Re is inside its range here (checked above); the laminar constant is the
            // section's (or 64, Jones): only ε/D on the turbulent diameter is left.
            if !(0.0..=friction::MAX_REL_ROUGHNESS).contains(&self.rel_roughness) {
                return None;
            }
            let o = self.friction_options(opts);
            let fr = friction::factor_remembered(k.re_t, self.rel_roughness, &o).ok()?;
            self.loss(fr.f, fr.df_dre, &k)
        };
        (loss.is_finite() && slope.is_finite()).then_some((loss, slope))
    }
}

/// The state of flow in a pipe at one flow rate.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct PipeFlow {
    /// Mean velocity Q/A, m/s (signed with the flow).
    pub velocity: f64,
    /// Reynolds number on the hydraulic diameter, |V| D_h ρ/μ.
    pub reynolds: f64,
    /// Darcy friction factor (NaN at zero flow, where it is undefined).
    pub friction_factor: f64,
    /// Flow regime.
    pub regime: Regime,
    /// Head loss, m of the flowing fluid (signed with the flow).
    pub head_loss: f64,
    /// ∂(head loss)/∂Q, s/m².
    pub dhead_dflow: f64,
    /// ∂(head loss)/∂f at fixed flow, m (for uncertainty bands).
    pub dhead_dfactor: f64,
    /// ∂f/∂(ε/D_t) (for uncertainty bands).
    pub df_drel_roughness: f64,
    /// ∂f/∂Re_t (for uncertainty bands).
    pub df_dre: f64,
    /// Warnings of the friction correlation and the section.
    pub warnings: Warnings,
}

impl Pipe {
    /// A run of the given section, length (m, > 0) and absolute roughness (m, ≥ 0, less
    /// than half the hydraulic diameter).
    ///
    /// # Errors
    /// `length` or `roughness` not finite, length ≤ 0 or above [`MAX_LENGTH`], roughness < 0
    /// or ≥ D_h/2.
    pub fn new(section: Section, length: f64, roughness: f64) -> Result<Pipe> {
        check::positive("length", length)?;
        if length > MAX_LENGTH {
            return Err(crate::Error::out_of_range(
                "length",
                length,
                format!("must be at most {MAX_LENGTH:e} m"),
            ));
        }
        check::non_negative("roughness", roughness)?;
        let dh = section.hydraulic_diameter();
        if roughness / dh > friction::MAX_REL_ROUGHNESS {
            return Err(crate::Error::out_of_range(
                "roughness",
                roughness,
                format!("must be below half the hydraulic diameter ({dh} m)"),
            ));
        }
        Ok(Pipe {
            section,
            length,
            roughness,
            roughness_range: None,
            material: None,
        })
    }

    /// A run of a catalogue wall material (see [`crate::roughness::catalogue`]): its
    /// typical roughness, with the material's low–high range for the bands.
    ///
    /// # Errors
    /// An unknown material name; the checks of [`Pipe::new`].
    pub fn of_material(section: Section, length: f64, material: &str) -> Result<Pipe> {
        let m = crate::roughness::material(material)?;
        let mut p = Pipe::new(section, length, m.typical)?;
        p.roughness_range = Some((m.low, m.high));
        p.material = Some(m.name);
        Ok(p)
    }

    /// The cross-section.
    pub fn section(&self) -> &Section {
        &self.section
    }

    /// Length along the axis, m.
    pub fn length(&self) -> f64 {
        self.length
    }

    /// Absolute wall roughness ε, m.
    pub fn roughness(&self) -> f64 {
        self.roughness
    }

    /// Likely range (low, high) of the roughness, m, when known (from the material
    /// catalogue); the uncertainty bands read ε as log-uniform over it.
    pub fn roughness_range(&self) -> Option<(f64, f64)> {
        self.roughness_range
    }

    /// The catalogue material the roughness comes from, if any: pipes of one material
    /// share one roughness error in the bands.
    pub fn material(&self) -> Option<&str> {
        self.material.as_deref()
    }

    /// The same run with another section and roughness, for a Monte Carlo sample: the
    /// sampled roughness may stray beyond the limits a user's pipe must keep.
    pub(crate) fn perturbed(&self, section: Section, roughness: f64) -> Pipe {
        Pipe {
            section,
            roughness,
            ..self.clone()
        }
    }

    /// A round pipe of inside diameter `diameter` (m).
    pub fn circular(diameter: f64, length: f64, roughness: f64) -> Result<Pipe> {
        Pipe::new(Section::circle(diameter)?, length, roughness)
    }

    /// The diameter a fitting beside this pipe refers its K to: the hydraulic diameter
    /// (the inside diameter of a round pipe), m.
    pub fn bore(&self) -> f64 {
        self.section.hydraulic_diameter()
    }

    /// Relative roughness ε/D_h.
    pub fn rel_roughness(&self) -> f64 {
        self.roughness / self.section.hydraulic_diameter()
    }

    /// The same run with a round section of another diameter (for sizing).
    pub fn with_diameter(&self, diameter: f64) -> Result<Pipe> {
        let mut p = Pipe::new(Section::circle(diameter)?, self.length, self.roughness)?;
        p.roughness_range = self.roughness_range;
        p.material = self.material.clone();
        Ok(p)
    }

    /// Head loss and its derivative at signed volumetric flow `flow` (m³/s).
    ///
    /// `opts` chooses the correlation and the regime limits; its laminar constant is
    /// replaced by the section's. `diameter_mode` chooses the turbulent diameter.
    ///
    /// # Errors
    /// A non-finite flow, a flow whose Reynolds number exceeds
    /// [`friction::MAX_REYNOLDS`] (the error names the flow), invalid options, or a
    /// transitional flow with the refuse option. A Reynolds number below
    /// [`friction::MIN_REYNOLDS`] counts as zero flow: exact laminar loss, friction factor
    /// NaN.
    pub fn flow_state(
        &self,
        fluid: &Fluid,
        flow: f64,
        opts: &Options,
        diameter_mode: TurbulentDiameter,
    ) -> Result<PipeFlow> {
        self.flow_state_in(&self.geometry(diameter_mode), fluid, flow, opts)
    }

    /// The section's geometry and the pipe's constants for a turbulent-diameter mode,
    /// worked out once (the rectangle's laminar constant is a series) so that repeated
    /// evaluations skip them.
    pub(crate) fn geometry(&self, diameter_mode: TurbulentDiameter) -> Geometry {
        let dh = self.section.hydraulic_diameter();
        let dt = self.section.turbulent_diameter(diameter_mode);
        Geometry {
            area: self.section.area(),
            dh,
            dt,
            c: self.section.laminar_constant(),
            warnings: self.section.warnings(),
            scale: dt / dh,
            length_head: self.length / (dh * (2.0 * STANDARD_GRAVITY)),
            rel_roughness: self.roughness / dt,
        }
    }

    /// [`Pipe::flow_state`] with the geometry already worked out.
    pub(crate) fn flow_state_in(
        &self,
        g: &Geometry,
        fluid: &Fluid,
        flow: f64,
        opts: &Options,
    ) -> Result<PipeFlow> {
        check::finite("flow", flow)?;
        let nu = fluid.viscosity / fluid.density;
        let k = g.kinematics(nu, flow);
        let re_t = k.re_t;
        let mut warnings = g.warnings;
        if re_t > friction::MAX_REYNOLDS {
            return Err(crate::Error::out_of_range(
                "flow",
                flow,
                format!(
                    "gives Reynolds number {re_t:e} in this duct, above the {:e} the friction correlations accept",
                    friction::MAX_REYNOLDS
                ),
            ));
        }
        // ∂h/∂f at fixed flow, for the bands.
        let dhead_dfactor = g.head(1.0, &k);
        // Below the smallest Reynolds number a friction factor is defined for, the flow is
        // treated as zero flow is: the exact laminar loss, no friction factor.
        if Geometry::direct_laminar(re_t, opts) {
            let defined = re_t >= friction::MIN_REYNOLDS;
            let (head_loss, dhead_dflow) = g.laminar_loss(nu, &k);
            if !(head_loss.is_finite() && dhead_dflow.is_finite()) {
                return Err(not_finite_loss(flow));
            }
            let (c, re_h) = (g.c, k.re_h);
            return Ok(PipeFlow {
                velocity: k.velocity,
                reynolds: re_h,
                friction_factor: if defined { c / re_h } else { f64::NAN },
                regime: Regime::Laminar,
                head_loss,
                dhead_dflow,
                dhead_dfactor,
                df_drel_roughness: 0.0,
                df_dre: if defined {
                    -c / (re_h * re_h) / g.scale
                } else {
                    0.0
                },
                warnings,
            });
        }
        let o = g.friction_options(opts);
        let rr = g.rel_roughness;
        // One combined check of the friction inputs; the full checks (and their message)
        // run only when it fails.
        let fr: Friction = if friction::inputs_ok(re_t, rr) && friction::options_ok(&o) {
            friction::factor_remembered(re_t, rr, &o)?
        } else {
            friction::darcy_factor(re_t, rr, &o)?
        };
        warnings |= fr.warnings;
        let (head_loss, dhead_dflow) = g.loss(fr.f, fr.df_dre, &k);
        if !(head_loss.is_finite() && dhead_dflow.is_finite()) {
            return Err(not_finite_loss(flow));
        }
        Ok(PipeFlow {
            velocity: k.velocity,
            reynolds: k.re_h,
            friction_factor: fr.f,
            regime: fr.regime,
            head_loss,
            dhead_dflow,
            dhead_dfactor,
            df_drel_roughness: fr.df_drel_roughness,
            df_dre: fr.df_dre,
            warnings,
        })
    }

    /// Head loss (m) and its derivative with respect to flow (s/m²) with default options:
    /// the call a simulator's Newton loop makes.
    pub fn head_loss(&self, fluid: &Fluid, flow: f64) -> Result<(f64, f64)> {
        let s = self.flow_state(
            fluid,
            flow,
            &Options::default(),
            TurbulentDiameter::Hydraulic,
        )?;
        Ok((s.head_loss, s.dhead_dflow))
    }
}

/// The error for a flow whose head loss or slope overflows.
fn not_finite_loss(flow: f64) -> crate::Error {
    crate::Error::out_of_range(
        "flow",
        flow,
        "gives a head loss in this duct that is not a finite number (the loss overflows double precision)",
    )
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    fn water() -> Fluid {
        Fluid::new(998.0, 1.0e-3).unwrap()
    }

    #[test]
    fn laminar_matches_hagen_poiseuille() {
        // Exact analytical solution: h = 128 μ L Q / (π ρ g D⁴).
        let p = Pipe::circular(0.01, 10.0, 0.0).unwrap();
        let q = 1e-6;
        let (h, dh) = p.head_loss(&water(), q).unwrap();
        let exact =
            128.0 * 1e-3 * 10.0 * q / (std::f64::consts::PI * 998.0 * STANDARD_GRAVITY * 1e-8);
        assert_relative_eq!(h, exact, max_relative = 1e-14);
        assert_relative_eq!(dh, exact / q, max_relative = 1e-14);
        assert_eq!(p.head_loss(&water(), 0.0).unwrap().0, 0.0);
        assert_relative_eq!(
            p.head_loss(&water(), 0.0).unwrap().1,
            exact / q,
            max_relative = 1e-14
        );
    }

    #[test]
    fn odd_in_flow() {
        // Exact property: reversing the flow reverses the loss.
        let p = Pipe::circular(0.05, 30.0, 4.5e-5).unwrap();
        for q in [1e-5, 1e-4, 1e-3, 1e-2] {
            let (a, da) = p.head_loss(&water(), q).unwrap();
            let (b, db) = p.head_loss(&water(), -q).unwrap();
            assert_eq!(a, -b);
            assert_eq!(da, db);
        }
    }

    #[test]
    fn derivative_matches_central_difference() {
        // Reference: central finite differences.
        let p = Pipe::circular(0.05, 30.0, 4.5e-5).unwrap();
        for q in [2e-5, 1e-4, 1.5e-4, 2.2e-4, 1e-3, 1e-2, -3e-3] {
            let (_, d) = p.head_loss(&water(), q).unwrap();
            let h = 1e-7 * q.abs();
            let fd = (p.head_loss(&water(), q + h).unwrap().0
                - p.head_loss(&water(), q - h).unwrap().0)
                / (2.0 * h);
            assert_relative_eq!(d, fd, max_relative = 1e-6);
        }
    }

    #[test]
    fn bad_inputs() {
        assert!(
            Pipe::circular(0.05, -1.0, 0.0)
                .unwrap_err()
                .to_string()
                .starts_with("length = -1")
        );
        assert!(
            Pipe::circular(0.05, 1.0, -1e-3)
                .unwrap_err()
                .to_string()
                .starts_with("roughness = -0.001")
        );
        assert!(Pipe::circular(0.05, 1.0, 0.03).is_err());
        let p = Pipe::circular(0.05, 1.0, 0.0).unwrap();
        assert!(
            p.head_loss(&water(), f64::NAN)
                .unwrap_err()
                .to_string()
                .starts_with("flow = NaN")
        );
    }
}

//! A straight run: head loss with its derivative, the flow state, batches.

use crate::ffi::{self, FfiResult, guard, out_ptr, put};
use crate::friction::regime_code;
use crate::section::{HG_SECTION_CIRCLE, section_of};
use hydrograde::error::check;
use hydrograde::fluid::Fluid;
use hydrograde::friction::Options;
use hydrograde::pipe::{Pipe, PipeFlow};
use hydrograde::section::TurbulentDiameter;

/// The state of flow in a straight run at one flow rate. Set `struct_size` to
/// `sizeof(hg_pipe_flow)` before the call.
#[repr(C)]
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct hg_pipe_flow {
    /// Size of this struct in bytes, set by the caller.
    pub struct_size: usize,
    /// Mean velocity Q/A, m/s, signed with the flow.
    pub velocity: f64,
    /// Reynolds number on the hydraulic diameter, |V|·D_h·ρ/μ.
    pub reynolds: f64,
    /// Darcy friction factor; 0 at zero flow, where it is undefined (`regime` is then
    /// laminar).
    pub friction_factor: f64,
    /// Head loss, m of the flowing fluid, signed with the flow.
    pub head_loss: f64,
    /// ∂(head loss)/∂Q, s/m² (continuous through zero flow and the transition).
    pub dhead_dflow: f64,
    /// Flow regime, `HG_REGIME_*`.
    pub regime: i32,
    /// Warning bits, `HG_WARN_*`.
    pub warnings: u32,
}

crate::ffi::sized!(hg_pipe_flow, warnings: u32);

fn pipe_of(shape: i32, a: f64, b: f64, length: f64, roughness: f64) -> FfiResult<Pipe> {
    Ok(Pipe::new(section_of(shape, a, b)?, length, roughness)?)
}

fn state(pipe: &Pipe, density: f64, viscosity: f64, flow: f64) -> FfiResult<PipeFlow> {
    let fluid = Fluid::new(density, viscosity)?;
    Ok(pipe.flow_state(
        &fluid,
        flow,
        &Options::default(),
        TurbulentDiameter::Hydraulic,
    )?)
}

/// Head loss `*head_loss` (m of fluid, signed with the flow) and its derivative
/// `*dhead_dflow` (s/m²) of a round pipe at volumetric flow `flow` (m³/s, signed): the
/// call a simulator's Newton loop makes. Darcy–Weisbach with the exact Colebrook
/// friction factor, laminar f = 64/Re and a C¹ blend between Re 2300 and 4000; the loss
/// is odd in the flow and zero at zero flow, with a continuous derivative.
///
/// Pipe: inside `diameter` (m, > 0), `length` (m, > 0), absolute wall `roughness` (m,
/// ≥ 0, at most half the diameter). Fluid: `density` (kg/m³, > 0) and dynamic
/// `viscosity` (Pa·s, > 0), e.g. from `hg_water`.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a bad pipe or fluid;
/// `HG_ERR_NULL_POINTER` when an output is NULL (nothing is written). Thread-safe.
///
/// # Safety
/// `head_loss` and `dhead_dflow` must be NULL or point to writable doubles.
#[unsafe(no_mangle)]
#[allow(clippy::too_many_arguments)]
pub unsafe extern "C" fn hg_pipe_head_loss(
    diameter: f64,
    length: f64,
    roughness: f64,
    density: f64,
    viscosity: f64,
    flow: f64,
    head_loss: *mut f64,
    dhead_dflow: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("head_loss", head_loss),
            out_ptr("dhead_dflow", dhead_dflow),
        ])?;
        let pipe = pipe_of(HG_SECTION_CIRCLE, diameter, 0.0, length, roughness)?;
        let (h, d) = pipe.head_loss(&Fluid::new(density, viscosity)?, flow)?;
        // SAFETY: forwarded contract; both pointers were checked.
        unsafe {
            put("head_loss", head_loss, h)?;
            put("dhead_dflow", dhead_dflow, d)
        }
    })
}

/// The full flow state of a straight run of any section `shape` (`HG_SECTION_*`, with
/// dimensions `a`, `b` as for `hg_section_properties`), `length` (m, > 0) and absolute
/// `roughness` (m, ≥ 0, at most half the hydraulic diameter) at flow `flow` (m³/s,
/// signed), for a fluid of `density` (kg/m³, > 0) and `viscosity` (Pa·s, > 0). Laminar
/// flow uses the section's exact laminar constant; turbulent flow the hydraulic diameter
/// (with `HG_WARN_NON_CIRCULAR_SECTION` for other shapes than a circle).
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_INVALID` for a
/// `struct_size` too small or b ≠ 0 on a one-dimension shape; `HG_ERR_NULL_POINTER`.
/// Thread-safe.
///
/// # Safety
/// `out` must be NULL or point to a writable `hg_pipe_flow` of `out->struct_size` bytes.
#[unsafe(no_mangle)]
#[allow(clippy::too_many_arguments)]
pub unsafe extern "C" fn hg_duct_flow_state(
    shape: i32,
    a: f64,
    b: f64,
    length: f64,
    roughness: f64,
    density: f64,
    viscosity: f64,
    flow: f64,
    out: *mut hg_pipe_flow,
) -> i32 {
    guard(|| {
        // SAFETY: forwarded contract.
        unsafe { ffi::check_sized_out("out", out)? };
        let pipe = pipe_of(shape, a, b, length, roughness)?;
        let s = state(&pipe, density, viscosity, flow)?;
        let c = hg_pipe_flow {
            struct_size: std::mem::size_of::<hg_pipe_flow>(),
            velocity: s.velocity,
            reynolds: s.reynolds,
            // The core marks the undefined factor at zero flow with NaN; C callers get 0
            // (documented) rather than a NaN they might not test for.
            friction_factor: if s.friction_factor.is_nan() {
                0.0
            } else {
                s.friction_factor
            },
            head_loss: s.head_loss,
            dhead_dflow: s.dhead_dflow,
            regime: regime_code(s.regime),
            warnings: s.warnings.bits(),
        };
        // SAFETY: forwarded contract.
        unsafe { ffi::write_sized("out", out, &c) }
    })
}

/// Reynolds number `*re` = ρ·|V|·D/μ of flow `flow` (m³/s, signed) in a round pipe of
/// inside `diameter` (m, > 0), with V = Q/A, for a fluid of `density` (kg/m³, > 0) and
/// `viscosity` (Pa·s, > 0): the core's `Fluid::reynolds`. (The flow state of
/// `hg_duct_flow_state` computes |V|·D/ν and may differ from it in the last bit.)
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Thread-safe.
///
/// # Safety
/// `re` must be NULL or point to a writable double.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_reynolds(
    flow: f64,
    diameter: f64,
    density: f64,
    viscosity: f64,
    re: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("re", re)])?;
        let section = section_of(HG_SECTION_CIRCLE, diameter, 0.0)?;
        let fluid = Fluid::new(density, viscosity)?;
        // Named as the flow, not as the velocity derived from it.
        check::finite("flow", flow)?;
        let value = fluid.reynolds(section.velocity(flow), diameter)?;
        // SAFETY: forwarded contract.
        unsafe { put("re", re, value) }
    })
}

/// Head losses and derivatives of one round pipe (as `hg_pipe_head_loss`) at `n` flows:
/// `head_loss[i]`, `dhead_dflow[i]` at `flow[i]`. The results equal the scalar call's bit
/// for bit. Either output may be the `flow` array itself (computed in place); the two
/// outputs must be different arrays.
///
/// Returns `HG_OK`; the status of the bad pipe or fluid; the status of the first bad
/// flow (message "element <i>: ..."), with the outputs partly written;
/// `HG_ERR_NULL_POINTER`; `HG_ERR_INVALID` for `n` = 0. Thread-safe.
///
/// # Safety
/// `flow`, `head_loss` and `dhead_dflow` must be NULL or valid for `n` doubles.
#[unsafe(no_mangle)]
#[allow(clippy::too_many_arguments)]
pub unsafe extern "C" fn hg_pipe_head_loss_batch(
    diameter: f64,
    length: f64,
    roughness: f64,
    density: f64,
    viscosity: f64,
    flow: *const f64,
    n: usize,
    head_loss: *mut f64,
    dhead_dflow: *mut f64,
) -> i32 {
    guard(|| {
        let pipe = pipe_of(HG_SECTION_CIRCLE, diameter, 0.0, length, roughness)?;
        let fluid = Fluid::new(density, viscosity)?;
        // SAFETY: forwarded contract.
        let q = unsafe { ffi::slice("flow", flow, n)? }.to_vec();
        if ffi::overlaps(head_loss, n, dhead_dflow, n) {
            return Err(ffi::Fail::new(
                crate::HG_ERR_INVALID,
                "dhead_dflow: must not overlap head_loss",
            ));
        }
        ffi::check_len("head_loss", head_loss.cast_const(), n)?;
        ffi::check_len("dhead_dflow", dhead_dflow.cast_const(), n)?;
        // Computed aside, so a failing flow leaves both outputs untouched.
        let (mut hs, mut ds) = (vec![0.0; n], vec![0.0; n]);
        for (i, &qi) in q.iter().enumerate() {
            (hs[i], ds[i]) = pipe.head_loss(&fluid, qi).map_err(|e| e.at_index(i))?;
        }
        // SAFETY: the flows were copied, and the two outputs do not overlap.
        unsafe {
            ffi::slice_mut("head_loss", head_loss, n)?.copy_from_slice(&hs);
            ffi::slice_mut("dhead_dflow", dhead_dflow, n)?.copy_from_slice(&ds);
        }
        Ok(())
    })
}

//! Warning bits and their names.

use hydrograde::Warnings;
use std::ffi::c_char;

// The core's bits, typed as literals for cbindgen; a test checks them against the core.

/// The Reynolds number lies outside the published range of the correlation.
pub const HG_WARN_REYNOLDS_OUT_OF_RANGE: u32 = 1;
/// The relative roughness lies outside the published range of the correlation.
pub const HG_WARN_ROUGHNESS_OUT_OF_RANGE: u32 = 2;
/// Transitional flow: the friction factor is not well defined; its band spans both regimes.
pub const HG_WARN_TRANSITIONAL_FLOW: u32 = 4;
/// A non-circular section: turbulent results on the hydraulic diameter are less accurate.
pub const HG_WARN_NON_CIRCULAR_SECTION: u32 = 8;
/// A gas whose pressure loss exceeds 10 % of the inlet pressure: results are approximate.
pub const HG_WARN_GAS_COMPRESSIBILITY: u32 = 16;
/// The pressure falls below the vapour pressure: cavitation or flashing is likely.
pub const HG_WARN_BELOW_VAPOUR_PRESSURE: u32 = 32;
/// A fitting or equipment value used outside the range its data covers.
pub const HG_WARN_FITTING_OUT_OF_RANGE: u32 = 64;
/// The bore changes between two elements with no contraction or expansion element: the
/// change is counted as an abrupt contraction or expansion row of its own.
pub const HG_WARN_BORE_CHANGE_WITHOUT_TRANSITION: u32 = 128;
/// A velocity above 15 m/s in a liquid or 80 m/s in a gas: likely a flow in the wrong
/// unit (L/s or m³/h typed as m³/s).
pub const HG_WARN_IMPLAUSIBLE_VELOCITY: u32 = 256;
/// A bore under 2 mm or over 5 m: likely millimetres typed as metres.
pub const HG_WARN_IMPLAUSIBLE_BORE: u32 = 512;
/// A pipe longer than 200 km: likely millimetres or feet typed as metres.
pub const HG_WARN_IMPLAUSIBLE_LENGTH: u32 = 1024;
/// A rated pressure drop under 10 Pa: likely bar or kPa typed as Pa.
pub const HG_WARN_IMPLAUSIBLE_RATED_DROP: u32 = 2048;
/// A liquid's viscosity far above its density's kind: likely centipoise typed as Pa·s.
pub const HG_WARN_IMPLAUSIBLE_VISCOSITY: u32 = 4096;

/// The name of one warning bit (`HG_WARN_*`) as a static string, e.g.
/// "transitional_flow"; NULL when `bit` is not exactly one known warning bit.
/// Thread-safe.
#[unsafe(no_mangle)]
pub extern "C" fn hg_warning_name(bit: u32) -> *const c_char {
    const NAMES: [&str; 13] = [
        "reynolds_out_of_range\0",
        "roughness_out_of_range\0",
        "transitional_flow\0",
        "non_circular_section\0",
        "gas_compressibility\0",
        "below_vapour_pressure\0",
        "fitting_out_of_range\0",
        "bore_change_without_transition\0",
        "implausible_velocity\0",
        "implausible_bore\0",
        "implausible_length\0",
        "implausible_rated_drop\0",
        "implausible_viscosity\0",
    ];
    Warnings::ALL
        .iter()
        .zip(NAMES)
        .find(|((w, _), _)| w.bits() == bit)
        .map_or(std::ptr::null(), |(_, n)| n.as_ptr().cast())
}

#[cfg(test)]
mod tests {
    use super::*;
    use std::ffi::CStr;

    #[test]
    fn warning_constants_and_names_follow_the_core() {
        let ours = [
            HG_WARN_REYNOLDS_OUT_OF_RANGE,
            HG_WARN_ROUGHNESS_OUT_OF_RANGE,
            HG_WARN_TRANSITIONAL_FLOW,
            HG_WARN_NON_CIRCULAR_SECTION,
            HG_WARN_GAS_COMPRESSIBILITY,
            HG_WARN_BELOW_VAPOUR_PRESSURE,
            HG_WARN_FITTING_OUT_OF_RANGE,
            HG_WARN_BORE_CHANGE_WITHOUT_TRANSITION,
            HG_WARN_IMPLAUSIBLE_VELOCITY,
            HG_WARN_IMPLAUSIBLE_BORE,
            HG_WARN_IMPLAUSIBLE_LENGTH,
            HG_WARN_IMPLAUSIBLE_RATED_DROP,
            HG_WARN_IMPLAUSIBLE_VISCOSITY,
        ];
        assert_eq!(
            ours.len(),
            Warnings::ALL.len(),
            "a core warning has no HG_WARN_*"
        );
        for (bit, (w, name)) in ours.iter().zip(Warnings::ALL) {
            assert_eq!(*bit, w.bits());
            // SAFETY: static NUL-terminated string.
            let got = unsafe { CStr::from_ptr(hg_warning_name(*bit)) };
            assert_eq!(got.to_str().unwrap(), name);
        }
        assert!(hg_warning_name(0).is_null());
        assert!(hg_warning_name(3).is_null());
    }
}

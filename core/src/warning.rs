//! Warnings: results that still compute but deserve a second look.
//!
//! A [`Warnings`] value is a small bit set. The bit values are part of the C ABI
//! (`HG_WARN_*`) and never change meaning once released; new warnings take new bits.

use serde::{Deserialize, Serialize};

/// A set of warnings, stored as bits.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default, Serialize, Deserialize)]
pub struct Warnings(u32);

impl Warnings {
    /// No warning.
    pub const NONE: Warnings = Warnings(0);
    /// The Reynolds number lies outside the published validity range of the correlation.
    pub const REYNOLDS_OUT_OF_RANGE: Warnings = Warnings(1 << 0);
    /// The relative roughness lies outside the published validity range of the correlation.
    pub const ROUGHNESS_OUT_OF_RANGE: Warnings = Warnings(1 << 1);
    /// The flow is transitional (between the laminar and turbulent limits): the friction
    /// factor there is not well defined and its band spans both regimes.
    pub const TRANSITIONAL_FLOW: Warnings = Warnings(1 << 2);
    /// The section is not circular: turbulent correlations on the hydraulic diameter are
    /// less accurate than for round pipe.
    pub const NON_CIRCULAR_SECTION: Warnings = Warnings(1 << 3);
    /// A gas whose pressure loss exceeds 10 % of the inlet pressure: incompressible
    /// results are approximate (evaluated at the mean density up to 40 %).
    pub const GAS_COMPRESSIBILITY: Warnings = Warnings(1 << 4);
    /// The pressure falls below the liquid's vapour pressure somewhere: cavitation or
    /// flashing is likely.
    pub const BELOW_VAPOUR_PRESSURE: Warnings = Warnings(1 << 5);
    /// A fitting or equipment value used outside the range its data covers.
    pub const FITTING_OUT_OF_RANGE: Warnings = Warnings(1 << 6);

    /// The bore changes between two elements with no contraction or expansion element:
    /// counted as an abrupt change of section of its own.
    pub const BORE_CHANGE_WITHOUT_TRANSITION: Warnings = Warnings(1 << 7);

    /// A velocity above 15 m/s in a liquid or 80 m/s in a gas: likely a flow in the wrong
    /// unit (L/s or m³/h typed as m³/s).
    pub const IMPLAUSIBLE_VELOCITY: Warnings = Warnings(1 << 8);
    /// A bore under 2 mm or over 5 m: likely millimetres typed as metres.
    pub const IMPLAUSIBLE_BORE: Warnings = Warnings(1 << 9);
    /// A pipe longer than 200 km: likely millimetres or feet typed as metres.
    pub const IMPLAUSIBLE_LENGTH: Warnings = Warnings(1 << 10);
    /// A rated pressure drop under 10 Pa: likely bar or kPa typed as Pa.
    pub const IMPLAUSIBLE_RATED_DROP: Warnings = Warnings(1 << 11);
    /// A liquid's viscosity far above its density's kind (over 1 Pa·s below 1100 kg/m³,
    /// or over 0.1 Pa·s at 950…1050 kg/m³, the density of water): likely centipoise typed
    /// as Pa·s.
    pub const IMPLAUSIBLE_VISCOSITY: Warnings = Warnings(1 << 12);

    /// Every named warning with its stable snake_case name, in bit order.
    pub const ALL: [(Warnings, &'static str); 13] = [
        (Warnings::REYNOLDS_OUT_OF_RANGE, "reynolds_out_of_range"),
        (Warnings::ROUGHNESS_OUT_OF_RANGE, "roughness_out_of_range"),
        (Warnings::TRANSITIONAL_FLOW, "transitional_flow"),
        (Warnings::NON_CIRCULAR_SECTION, "non_circular_section"),
        (Warnings::GAS_COMPRESSIBILITY, "gas_compressibility"),
        (Warnings::BELOW_VAPOUR_PRESSURE, "below_vapour_pressure"),
        (Warnings::FITTING_OUT_OF_RANGE, "fitting_out_of_range"),
        (
            Warnings::BORE_CHANGE_WITHOUT_TRANSITION,
            "bore_change_without_transition",
        ),
        (Warnings::IMPLAUSIBLE_VELOCITY, "implausible_velocity"),
        (Warnings::IMPLAUSIBLE_BORE, "implausible_bore"),
        (Warnings::IMPLAUSIBLE_LENGTH, "implausible_length"),
        (Warnings::IMPLAUSIBLE_RATED_DROP, "implausible_rated_drop"),
        (Warnings::IMPLAUSIBLE_VISCOSITY, "implausible_viscosity"),
    ];

    /// The raw bits (the C ABI's bitmask).
    #[inline]
    pub const fn bits(self) -> u32 {
        self.0
    }

    /// Builds a set from raw bits, dropping unknown bits.
    #[inline]
    pub const fn from_bits_truncate(bits: u32) -> Self {
        let mut known = 0;
        let mut i = 0;
        while i < Self::ALL.len() {
            known |= Self::ALL[i].0.0;
            i += 1;
        }
        Warnings(bits & known)
    }

    /// True when no warning is set.
    #[inline]
    pub const fn is_empty(self) -> bool {
        self.0 == 0
    }

    /// True when every warning of `other` is set in `self`.
    #[inline]
    pub const fn contains(self, other: Warnings) -> bool {
        self.0 & other.0 == other.0
    }

    /// Adds the warnings of `other`.
    #[inline]
    pub fn insert(&mut self, other: Warnings) {
        self.0 |= other.0;
    }

    /// The union of two sets.
    #[inline]
    #[must_use]
    pub const fn union(self, other: Warnings) -> Warnings {
        Warnings(self.0 | other.0)
    }

    /// The names of the warnings that are set, in bit order.
    pub fn names(self) -> Vec<&'static str> {
        Self::ALL
            .iter()
            .filter(|(w, _)| self.contains(*w))
            .map(|(_, n)| *n)
            .collect()
    }
}

impl std::ops::BitOr for Warnings {
    type Output = Warnings;
    fn bitor(self, rhs: Warnings) -> Warnings {
        self.union(rhs)
    }
}

impl std::ops::BitOrAssign for Warnings {
    fn bitor_assign(&mut self, rhs: Warnings) {
        self.insert(rhs);
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn names_follow_bits() {
        let w = Warnings::TRANSITIONAL_FLOW | Warnings::REYNOLDS_OUT_OF_RANGE;
        assert_eq!(
            w.names(),
            vec!["reynolds_out_of_range", "transitional_flow"]
        );
        assert!(w.contains(Warnings::TRANSITIONAL_FLOW));
        assert!(!w.contains(Warnings::GAS_COMPRESSIBILITY));
        assert_eq!(Warnings::from_bits_truncate(w.bits()), w);
    }

    #[test]
    fn bits_are_distinct_and_all_named() {
        let mut seen = 0u32;
        for (w, _) in Warnings::ALL {
            assert_eq!(w.bits().count_ones(), 1);
            assert_eq!(seen & w.bits(), 0);
            seen |= w.bits();
        }
        assert_eq!(Warnings::from_bits_truncate(u32::MAX).bits(), seen);
    }
}

//! Sine and cosine: reduction by π/2 in three parts (Cody and Waite, 1980) and the
//! fdlibm minimax kernels on [−π/4, π/4] (Sun Microsystems, 1993).

// The published coefficients are kept digit for digit as printed in their sources.
#![allow(clippy::excessive_precision)]

const S1: f64 = -1.666_666_666_666_663_243_48e-1;
const S2: f64 = 8.333_333_333_322_489_461_24e-3;
const S3: f64 = -1.984_126_982_985_794_931_34e-4;
const S4: f64 = 2.755_731_370_707_006_767_89e-6;
const S5: f64 = -2.505_076_025_340_686_341_95e-8;
const S6: f64 = 1.589_690_995_211_550_102_21e-10;
const C1: f64 = 4.166_666_666_666_660_190_37e-2;
const C2: f64 = -1.388_888_888_887_410_957_49e-3;
const C3: f64 = 2.480_158_728_947_672_941_78e-5;
const C4: f64 = -2.755_731_435_139_066_330_35e-7;
const C5: f64 = 2.087_572_321_298_174_827_90e-9;
const C6: f64 = -1.135_964_755_778_819_482_65e-11;
/// π/2 in three 33-bit parts with their tails (fdlibm).
const PIO2_1: f64 = 1.570_796_326_734_125_614_17;
const PIO2_1T: f64 = 6.077_100_506_506_192_249_32e-11;
const PIO2_2: f64 = 6.077_100_506_303_965_976_60e-11;
const PIO2_2T: f64 = 2.022_266_248_795_950_631_54e-21;
const PIO2_3: f64 = 2.022_266_248_711_166_455_80e-21;
const PIO2_3T: f64 = 8.478_427_660_368_899_569_97e-32;
const TWO_OVER_PI: f64 = std::f64::consts::FRAC_2_PI;
const SHIFTER: f64 = 6_755_399_441_055_744.0;

/// sin(x + y) for |x| ≤ π/4, |y| ≪ ulp(x).
#[inline(always)]
fn k_sin(x: f64, y: f64) -> f64 {
    let z = x * x;
    let v = z * x;
    let r = S2 + z * (S3 + z * (S4 + z * (S5 + z * S6)));
    x - ((z * (0.5 * y - v * r) - y) - v * S1)
}

/// cos(x + y) for |x| ≤ π/4, |y| ≪ ulp(x).
#[inline(always)]
fn k_cos(x: f64, y: f64) -> f64 {
    let z = x * x;
    let r = z * (C1 + z * (C2 + z * (C3 + z * (C4 + z * (C5 + z * C6)))));
    let hz = 0.5 * z;
    let w = 1.0 - hz;
    w + (((1.0 - w) - hz) + (z * r - x * y))
}

/// x = n·π/2 + (y0 + y1) with |y0 + y1| ≤ π/4; returns (n mod 4, y0, y1). Good to full
/// precision for |x| below 2^19·π/2 (about 8e5).
#[inline(always)]
fn reduce(x: f64) -> (u64, f64, f64) {
    let exponent = |v: f64| ((v.to_bits() >> 52) & 0x7ff) as i64;
    let big = x * TWO_OVER_PI + SHIFTER;
    let n = big - SHIFTER;
    let q = big.to_bits() & 3;
    // n·PIO2_1 is exact (33 + 20 bits) and so is the subtraction (Sterbenz).
    let mut r = x - n * PIO2_1;
    let mut w = n * PIO2_1T;
    let mut y0 = r - w;
    let j = exponent(x);
    if j - exponent(y0) > 16 {
        // Cancellation: take the next 33 bits of π/2 (fdlibm's second and third rounds).
        let t = r;
        w = n * PIO2_2;
        r = t - w;
        w = n * PIO2_2T - ((t - r) - w);
        y0 = r - w;
        if j - exponent(y0) > 49 {
            let t = r;
            w = n * PIO2_3;
            r = t - w;
            w = n * PIO2_3T - ((t - r) - w);
            y0 = r - w;
        }
    }
    (q, y0, (r - y0) - w)
}

/// Sine of `x` in radians.
///
/// Accuracy: 0.66 ulp against mpmath over 0…2π (module table of [`super`]); full
/// precision for |x| up to about 8e5, beyond which the argument reduction loses bits.
///
/// ```
/// use hydrograde::math::sin;
/// assert_eq!(sin(0.0), 0.0);
/// assert!((sin(std::f64::consts::FRAC_PI_6) - 0.5).abs() <= f64::EPSILON / 2.0);
/// ```
pub fn sin(x: f64) -> f64 {
    if !x.is_finite() {
        return f64::NAN;
    }
    let (q, y0, y1) = reduce(x);
    match q {
        0 => k_sin(y0, y1),
        1 => k_cos(y0, y1),
        2 => -k_sin(y0, y1),
        _ => -k_cos(y0, y1),
    }
}

/// Cosine of `x` in radians.
///
/// Accuracy: 0.66 ulp against mpmath over 0…2π (module table of [`super`]); full
/// precision for |x| up to about 8e5.
///
/// ```
/// use hydrograde::math::cos;
/// assert_eq!(cos(0.0), 1.0);
/// ```
pub fn cos(x: f64) -> f64 {
    if !x.is_finite() {
        return f64::NAN;
    }
    let (q, y0, y1) = reduce(x);
    match q {
        0 => k_cos(y0, y1),
        1 => -k_sin(y0, y1),
        2 => -k_cos(y0, y1),
        _ => k_sin(y0, y1),
    }
}

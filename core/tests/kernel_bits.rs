//! The batch kernel on every instruction set this processor has gives the bits of one
//! `darcy_factor` call per point (exact check: same operations, same roundings), for
//! every correlation, over the Colebrook reference table's points and seeded random
//! points in and beyond the valid range.

mod common;

use hydrograde::friction::{Correlation, Isa, Options, darcy_factor, darcy_factor_batch_on};
use rand::{Rng, SeedableRng, rngs::StdRng};

fn points() -> (Vec<f64>, Vec<f64>) {
    let rows = common::read_csv("colebrook/colebrook.csv");
    let mut re: Vec<f64> = rows.iter().map(|r| r[0]).collect();
    let mut rr: Vec<f64> = rows.iter().map(|r| r[1]).collect();
    let mut rng = StdRng::seed_from_u64(17);
    for i in 0..20_000 {
        // Mostly turbulent, with laminar and transitional points mixed in so that blocks
        // fall back to the scalar path too; some subnormal and zero roughness.
        let r = 10f64.powf(rng.random_range(2.0..13.0));
        let e = match i % 7 {
            0 => 0.0,
            1 => 1e-310,
            _ => 10f64.powf(rng.random_range(-9.0..-0.302)),
        };
        re.push(r);
        rr.push(e);
    }
    (re, rr)
}

#[test]
fn every_instruction_set_gives_the_scalar_bits() {
    let (re, rr) = points();
    let available: Vec<Isa> = Isa::ALL.into_iter().filter(|i| i.is_available()).collect();
    println!("available: {:?}, detected {:?}", available, Isa::detected());
    assert!(available.contains(&Isa::Baseline));
    for corr in Correlation::ALL {
        let opts = Options::with_correlation(corr);
        let scalar: Vec<Option<u64>> = re
            .iter()
            .zip(&rr)
            .map(|(&r, &e)| darcy_factor(r, e, &opts).ok().map(|f| f.f.to_bits()))
            .collect();
        for &isa in &available {
            // Blocks of valid points only (the fully rough law refuses ε/D = 0).
            let (r2, e2): (Vec<f64>, Vec<f64>) = re
                .iter()
                .zip(&rr)
                .zip(&scalar)
                .filter(|(_, s)| s.is_some())
                .map(|((&r, &e), _)| (r, e))
                .unzip();
            let want: Vec<u64> = scalar.iter().flatten().copied().collect();
            let mut out = vec![0.0; r2.len()];
            darcy_factor_batch_on(isa, &r2, &e2, &opts, &mut out).unwrap();
            for (i, (o, w)) in out.iter().zip(&want).enumerate() {
                assert_eq!(
                    o.to_bits(),
                    *w,
                    "{corr} on {isa:?}: Re {} eps/D {}",
                    r2[i],
                    e2[i]
                );
            }
        }
    }
}

#[test]
fn an_unavailable_instruction_set_is_an_error_not_a_crash() {
    for isa in Isa::ALL.into_iter().filter(|i| !i.is_available()) {
        let mut out = [0.0];
        let e = darcy_factor_batch_on(isa, &[1e5], &[1e-4], &Options::default(), &mut out);
        assert!(e.unwrap_err().to_string().contains("not available"));
    }
}

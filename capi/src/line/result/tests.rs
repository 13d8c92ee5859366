//! A result read through C equals the core's result.

use super::*;
use crate::ffi::{HG_ERR_BUFFER_TOO_SMALL, HG_ERR_OUT_OF_RANGE, HG_OK};
use crate::fluid::{hg_fluid_free, hg_fluid_water};
use crate::line::*;
use hydrograde::fitting::Fitting;
use hydrograde::fluid::Fluid;
use hydrograde::line::{Element, Line};
use hydrograde::pipe::Pipe;

#[test]
fn a_result_read_through_c_equals_the_core_result() {
    let mut l: *mut hg_line = std::ptr::null_mut();
    let mut f: *mut hg_fluid = std::ptr::null_mut();
    // SAFETY: valid out-pointers and live handles throughout; freed at the end.
    unsafe {
        assert_eq!(hg_line_new(&mut l), HG_OK);
        assert_eq!(hg_fluid_water(293.15, 2e5, &mut f), HG_OK);
        assert_eq!(hg_line_add_pipe(l, 0.05, 30.0, 4.5e-5), HG_OK);
        assert_eq!(hg_line_add_fitting(l, c"gate_valve".as_ptr(), 0.0), HG_OK);
        assert_eq!(hg_line_add_rise(l, 4.0), HG_OK);
    }
    let core = Line::new(vec![
        Element::Pipe(Pipe::circular(0.05, 30.0, 4.5e-5).unwrap()),
        Element::Fitting(Fitting::named("gate_valve").unwrap()),
        Element::rise(4.0).unwrap(),
    ])
    .unwrap();
    let water = Fluid::water(293.15, 2e5).unwrap();
    for q in [0.0, 1e-5, 3e-3, -3e-3] {
        let want = core.evaluate(&water, q).unwrap();
        let mut r: *mut hg_line_result = std::ptr::null_mut();
        // SAFETY: live handles, valid out-pointer.
        assert_eq!(unsafe { hg_line_evaluate(l, f, q, &mut r) }, HG_OK);
        let mut t = totals_to_c(&want);
        t.head_loss = -1.0;
        // SAFETY: live handle, valid out-pointer.
        assert_eq!(unsafe { hg_line_result_totals(r, &mut t) }, HG_OK);
        assert_eq!(t, totals_to_c(&want));
        for (i, we) in want.elements.iter().enumerate() {
            let mut e = element_to_c(we);
            e.head_loss = -1.0;
            // SAFETY: live handle, valid out-pointer.
            assert_eq!(unsafe { hg_line_result_element(r, i, &mut e) }, HG_OK);
            assert_eq!(e, element_to_c(we));
        }
        // A rise has no velocity, K or friction factor: flagged, not 0 as a value.
        let rise = element_to_c(&want.elements[2]);
        assert_eq!((rise.has_velocity, rise.has_k), (0, 0));
        assert_eq!((rise.has_friction_factor, rise.regime), (0, HG_REGIME_NONE));
        let pipe = element_to_c(&want.elements[0]);
        // At zero flow the friction factor is undefined (no Reynolds number).
        assert_eq!(
            (pipe.has_k, pipe.has_friction_factor),
            (0, i32::from(q != 0.0))
        );
        assert_eq!(element_to_c(&want.elements[1]).has_k, i32::from(q != 0.0));
        // SAFETY: handle from hg_line_evaluate, not used afterwards.
        unsafe { hg_line_result_free(r) };
    }
    // SAFETY: handles from the constructors above, not used afterwards.
    unsafe {
        hg_line_free(l);
        hg_fluid_free(f);
        hg_line_result_free(std::ptr::null_mut());
    }
}

#[test]
fn a_band_source_that_does_not_fit_leaves_the_share_alone() {
    let water = Fluid::water(293.15, 2e5).unwrap();
    let core = Line::new(vec![Element::Pipe(
        Pipe::circular(0.05, 30.0, 4.5e-5).unwrap(),
    )])
    .unwrap();
    let want = core.evaluate(&water, 3e-3).unwrap();
    let first = want.head_loss_band.contributions[0].clone();
    let r = hg_line_result { result: want };
    let (mut need, mut share) = (0usize, -7.0);
    // SAFETY: a live result, valid out-pointers, no buffer with len 0.
    let s = unsafe {
        hg_line_result_band_source(&r, 0, std::ptr::null_mut(), 0, &mut need, &mut share)
    };
    assert_eq!(
        (s, need, share),
        (HG_ERR_BUFFER_TOO_SMALL, first.source.name().len(), -7.0)
    );
    let mut buf = [0 as c_char; 64];
    // SAFETY: as above, with a buffer of 64 bytes.
    let s =
        unsafe { hg_line_result_band_source(&r, 0, buf.as_mut_ptr(), 64, &mut need, &mut share) };
    assert_eq!((s, share), (HG_OK, first.share));
    // SAFETY: as above.
    let s = unsafe {
        hg_line_result_element_band_source(&r, 1, 0, buf.as_mut_ptr(), 64, &mut need, &mut share)
    };
    assert_eq!(s, HG_ERR_OUT_OF_RANGE);
}

#[test]
fn element_kinds_follow_the_core() {
    for (k, c) in [
        (ElementKind::Pipe, HG_ELEMENT_PIPE),
        (ElementKind::Fitting, HG_ELEMENT_FITTING),
        (ElementKind::Rise, HG_ELEMENT_RISE),
        (ElementKind::Equipment, HG_ELEMENT_EQUIPMENT),
        (ElementKind::SectionChange, HG_ELEMENT_SECTION_CHANGE),
        (ElementKind::Pump, HG_ELEMENT_PUMP),
    ] {
        assert_eq!(
            [
                "pipe",
                "fitting",
                "rise",
                "equipment",
                "section_change",
                "pump"
            ][c as usize],
            k.name()
        );
    }
}

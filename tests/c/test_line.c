#define _POSIX_C_SOURCE 200809L
/* Lines and fluid handles through the C ABI: results against the Rust core bit for bit
 * (the invented scenarios of capi/examples/core_reference.rs, built here the same way),
 * bad input and bad handles, the growable result struct, and 8 threads evaluating one
 * line at once.
 * Usage: test_line REFERENCE_FILE */
#include <math.h>
#include <pthread.h>
#include <stddef.h>
#include <stdlib.h>

#include "hydrograde.h"
#include "check.h"
#include "records.h"

static const char *ref_path;
static hg_line *lines[3];
static hg_fluid *fluids[3];

static size_t msg_len(void) { return hg_last_error(NULL, 0); }
static const char *last_msg(void) {
  static char buf[512];
  buf[0] = 0;
  hg_last_error(buf, sizeof buf);
  return buf;
}

/* Evaluating through the result handle: each helper evaluates, reads one thing and frees
 * the result, so the checks below read like one call. The caller sets struct_size. */
static int32_t totals(const hg_line *l, const hg_fluid *f, double q, hg_line_totals *x) {
  hg_line_result *r = NULL;
  int32_t s = hg_line_evaluate(l, f, q, &r);
  if (s == HG_OK) s = hg_line_result_totals(r, x);
  hg_line_result_free(r);
  return s;
}
static int32_t totals_at(const hg_line *l, const hg_fluid *f, double q, double p, hg_line_totals *x) {
  hg_line_result *r = NULL;
  int32_t s = hg_line_evaluate_at(l, f, q, p, &r);
  if (s == HG_OK) s = hg_line_result_totals(r, x);
  hg_line_result_free(r);
  return s;
}
static int32_t element_row(const hg_line *l, const hg_fluid *f, double q, size_t i, hg_element_result *e) {
  hg_line_result *r = NULL;
  int32_t s = hg_line_evaluate(l, f, q, &r);
  if (s == HG_OK) s = hg_line_result_element(r, i, e);
  hg_line_result_free(r);
  return s;
}
static int32_t element_label(const hg_line *l, const hg_fluid *f, double q, size_t i, char *buf, size_t len,
                             size_t *need) {
  hg_line_result *r = NULL;
  int32_t s = hg_line_evaluate(l, f, q, &r);
  if (s == HG_OK) s = hg_line_result_label(r, i, buf, len, need);
  hg_line_result_free(r);
  return s;
}
static int32_t band_source(const hg_line *l, const hg_fluid *f, double q, size_t k, char *buf, size_t len,
                           size_t *need, double *share) {
  hg_line_result *r = NULL;
  int32_t s = hg_line_evaluate(l, f, q, &r);
  if (s == HG_OK) s = hg_line_result_band_source(r, k, buf, len, need, share);
  hg_line_result_free(r);
  return s;
}
static int32_t element_band_source(const hg_line *l, const hg_fluid *f, double q, size_t i, size_t k, char *buf,
                                   size_t len, size_t *need, double *share) {
  hg_line_result *r = NULL;
  int32_t s = hg_line_evaluate(l, f, q, &r);
  if (s == HG_OK) s = hg_line_result_element_band_source(r, i, k, buf, len, need, share);
  hg_line_result_free(r);
  return s;
}

/* The same routes as `scenario` in capi/examples/core_reference.rs. */
static int32_t build_scenario(int n, hg_line **out) {
  int32_t s = hg_line_new(out);
  hg_line *l = *out;
  if (n == 0) {
    s |= hg_line_set_inlet_pressure(l, 3e5);
    s |= hg_line_add_pipe(l, 0.05, 30.0, 4.5e-5);
    s |= hg_line_add_fitting(l, "elbow_90_standard", 0.0);
    s |= hg_line_add_fitting(l, "swing_check_valve", 0.0);
    s |= hg_line_add_rise(l, 3.0);
    s |= hg_line_add_fitting_k(l, 0.5, 0.0);
    s |= hg_line_add_pipe(l, 0.04, 12.0, 1.5e-6);
    s |= hg_line_add_equipment(l, "strainer", 2e4, 2e-3);
  } else if (n == 2) {
    hg_uncertainty_options u;
    s |= hg_uncertainty_options_default(&u);
    u.diameter = 0.01;
    s |= hg_line_set_uncertainty(l, &u);
    s |= hg_line_set_turbulent_diameter(l, HG_TURBULENT_DIAMETER_LAMINAR_EQUIVALENT);
    s |= hg_line_add_from_tank(l, HG_EDGE_ROUNDED, 0.1);
    s |= hg_line_add_pipe_material(l, 0.1, 40.0, "commercial_steel");
    s |= hg_line_add_bend(l, 90.0, 1.5, 0.0);
    s |= hg_line_add_two_k(l, 800.0, 0.25, 0.0);
    s |= hg_line_add_three_k(l, 500.0, 0.15, 4.0, 0.0);
    s |= hg_line_add_cv(l, 120.0, 0.0);
    s |= hg_line_set_k_spread(l, 5, 0.2);
    s |= hg_line_add_kv(l, 100.0, 0.0);
    s |= hg_line_add_equivalent_length(l, 30.0, 0.0);
    s |= hg_line_add_expansion(l, 0.1, 0.15);
    s |= hg_line_add_custom_duct(l, 0.0177, 0.48, 62.0, 10.0, 1e-4);
    s |= hg_line_add_contraction(l, 0.15, 0.08);
    s |= hg_line_add_pipe(l, 0.08, 5.0, 1.5e-6);
    s |= hg_line_add_into_tank(l);
    s |= hg_line_add_from_tank(l, HG_EDGE_REENTRANT, 0.0);
    s |= hg_line_add_from_tank(l, HG_EDGE_SQUARE, 0.0);
    s |= hg_line_add_duct(l, HG_SECTION_RECTANGLE, 0.12, 0.06, 3.0, 5e-5);
    s |= hg_line_set_roughness_range(l, 11, 1e-6, 5e-6);
  } else {
    hg_friction_options o;
    s |= hg_friction_options_default(&o);
    o.correlation = HG_CORRELATION_HAALAND;
    s |= hg_line_set_friction_options(l, &o);
    s |= hg_line_add_fitting_k(l, 1.5, 0.15);
    s |= hg_line_add_duct(l, HG_SECTION_RECTANGLE, 0.2, 0.1, 50.0, 1e-4);
    s |= hg_line_add_rise(l, -2.0);
  }
  return s;
}

static long check_line_record(const record *r, int quiet) {
  const hg_line *l = lines[r->in[0].i];
  const hg_fluid *f = fluids[r->in[1].i];
  double got[64];
  int ngot = 0;
  int32_t s = -1;
  if (strcmp(r->tag, "line_eval") == 0) {
    hg_line_totals x;
    memset(&x, 0, sizeof x);
    x.struct_size = sizeof x;
    s = totals(l, f, r->in[2].d, &x);
    double g[] = {x.head_loss, x.pressure_loss, x.static_head, x.required_head, x.drequired_head_dflow,
                  x.density, x.outlet_pressure, x.warnings, (double)x.element_count, x.head_loss_low,
                  x.head_loss_high, x.required_head_low, x.required_head_high};
    memcpy(got, g, sizeof g), ngot = 13;
  } else if (strcmp(r->tag, "line_element") == 0) {
    hg_element_result e;
    memset(&e, 0, sizeof e);
    e.struct_size = sizeof e;
    s = element_row(l, f, r->in[2].d, (size_t)r->in[3].i, &e);
    double g[] = {e.velocity, e.reynolds, e.friction_factor, e.k, e.head_loss, e.dhead_dflow,
                  e.pressure_out, e.warnings, e.head_loss_low, e.head_loss_high};
    memcpy(got, g, sizeof g), ngot = 10;
  } else if (strcmp(r->tag, "line_required_head") == 0) {
    s = hg_line_required_head(l, f, r->in[2].d, &got[0], &got[1]), ngot = 2;
  } else if (strcmp(r->tag, "line_uniform") == 0) {
    hg_line *u = NULL;
    s = hg_line_with_uniform_diameter(l, r->in[2].d, &u);
    if (s == HG_OK) {
      hg_line_totals x;
      memset(&x, 0, sizeof x);
      x.struct_size = sizeof x;
      s = totals(u, f, 2e-3, &x);
      got[0] = x.head_loss, got[1] = x.required_head, got[2] = x.head_loss_high, ngot = 3;
    }
    hg_line_free(u);
  } else if (strcmp(r->tag, "line_flow_for_head") == 0) {
    s = hg_line_flow_for_head(l, f, r->in[2].d, &got[0], &got[1], &got[2]), ngot = 3;
  } else if (strcmp(r->tag, "line_band_source") == 0) {
    char name[64] = "";
    size_t need = 0;
    double share = -1;
    s = band_source(l, f, r->in[2].d, (size_t)r->in[3].i, name, sizeof name, &need, &share);
    int same = r->err ? s == code_of_kind(r->kind) && msg_len() > 0
                      : s == HG_OK && strcmp(name, r->out[0].s) == 0 && need == strlen(name) &&
                            bits_of(share) == bits_of(r->out[1].d);
    if (!quiet) CHECK(same, "band source %lld: status %d '%s'", r->in[3].i, s, name);
    return !same;
  } else if (strcmp(r->tag, "line_elem_source") == 0) {
    char name[64] = "";
    size_t need = 0;
    double share = -1;
    s = element_band_source(l, f, r->in[2].d, (size_t)r->in[3].i, (size_t)r->in[4].i, name, sizeof name,
                                    &need, &share);
    int same = r->err ? s == code_of_kind(r->kind) && msg_len() > 0
                      : s == HG_OK && strcmp(name, r->out[0].s) == 0 && need == strlen(name) &&
                            bits_of(share) == bits_of(r->out[1].d);
    if (!quiet) CHECK(same, "element %lld source %lld: status %d '%s'", r->in[3].i, r->in[4].i, s, name);
    return !same;
  } else if (strcmp(r->tag, "line_eval_at") == 0) {
    hg_line_totals x;
    memset(&x, 0, sizeof x);
    x.struct_size = sizeof x;
    s = totals_at(l, f, r->in[2].d, r->in[3].d, &x);
    double g[] = {x.head_loss, x.pressure_loss, x.required_head, x.inlet_pressure, x.outlet_pressure,
                  x.warnings, x.required_head_low, x.required_head_high};
    memcpy(got, g, sizeof g), ngot = 8;
  } else if (strcmp(r->tag, "line_monte_carlo") == 0) {
    hg_monte_carlo m;
    memset(&m, 0, sizeof m);
    m.struct_size = sizeof m;
    s = hg_line_monte_carlo(l, f, r->in[2].d, (size_t)r->in[3].i, (uint64_t)r->in[4].i, &m);
    double g[] = {m.mean, m.std_dev, m.low, m.high, (double)m.samples};
    memcpy(got, g, sizeof g), ngot = 5;
  } else if (strcmp(r->tag, "line_curve_band") == 0) {
    /* Low, nominal and high along the system curve, 20 flows through zero. */
    double q[20];
    for (int i = 0; i < 20; i++) q[i] = -5e-3 + 5e-4 * i;
    s = hg_line_system_curve_band(l, f, q, 20, got, got + 20, got + 40), ngot = 60;
  } else if (strcmp(r->tag, "line_band_mc") == 0) {
    hg_monte_carlo m;
    memset(&m, 0, sizeof m);
    m.struct_size = sizeof m;
    int32_t offered = -1;
    s = hg_line_band_monte_carlo(l, f, r->in[2].d, &offered, &m);
    got[0] = offered, ngot = 1;
    if (offered == 1) {
      double g[] = {m.mean, m.std_dev, m.low, m.high};
      memcpy(got + 1, g, sizeof g), ngot = 5;
    }
  } else if (strcmp(r->tag, "line_system_curve") == 0) {
    double q[50];
    for (int i = 0; i < 50; i++) q[i] = -5e-3 + 2.5e-4 * i;
    s = hg_line_system_curve(l, f, q, 50, got), ngot = 50;
    /* In place gives the same. */
    if (s == HG_OK && (hg_line_system_curve(l, f, q, 50, q) != HG_OK || memcmp(q, got, sizeof q) != 0)) s = -2;
  }
  if (strcmp(r->tag, "line_operating_point") == 0 || strcmp(r->tag, "line_split_flow") == 0 ||
      strcmp(r->tag, "line_split_bands") == 0 || strcmp(r->tag, "line_size") == 0)
    return 0; /* checked by check_solve_record */
  int same = r->err ? s == code_of_kind(r->kind) && msg_len() > 0 : s == HG_OK && same_outputs(r, got, ngot);
  if (!quiet) CHECK(same, "%s scenario %lld fluid %lld: status %d (want %s)", r->tag, r->in[0].i, r->in[1].i, s,
                    r->err ? r->kind : "HG_OK");
  return !same;
}

static void choice_tokens(const hg_size_choice *c, tok *got, int *n) {
  if (!c->found) {
    got[(*n)++] = tok_s("-");
    return;
  }
  got[(*n)++] = tok_s(c->nominal);
  got[(*n)++] = tok_d(c->inside_diameter), got[(*n)++] = tok_d(c->velocity);
  got[(*n)++] = tok_d(c->pressure_loss), got[(*n)++] = tok_d(c->pressure_loss_low);
  got[(*n)++] = tok_d(c->pressure_loss_high);
}

/* Pump operating point, parallel split and sizing, as in `line_solves` of the generator. */
static long check_solve_record(const record *r, int quiet) {
  if (strcmp(r->tag, "line_system_curve") == 0) return 0; /* checked by check_line_record */
  const hg_fluid *f = fluids[r->in[1].i];
  tok got[16];
  int n = 0;
  int32_t s = -1;
  if (strcmp(r->tag, "line_operating_point") == 0) {
    const double shut[3] = {40.0, 20.0, 2.0};
    double q[5] = {0.0, 1e-3, 2e-3, 3e-3, 4e-3}, h[5], o[6];
    for (int i = 0; i < 5; i++) h[i] = shut[r->in[2].i] * (1.0 - (q[i] / 5e-3) * (q[i] / 5e-3));
    s = hg_line_operating_point(lines[0], f, q, h, 5, &o[0], &o[1], &o[2], &o[3], &o[4], &o[5]);
    for (int i = 0; i < 6; i++) got[n++] = tok_d(o[i]);
  } else if (strcmp(r->tag, "line_split_flow") == 0) {
    const hg_line *pair[2] = {lines[0], lines[1]};
    double q[2], h;
    s = hg_line_split_flow(pair, 2, f, r->in[2].d, q, &h);
    got[n++] = tok_d(q[0]), got[n++] = tok_d(q[1]), got[n++] = tok_d(h);
  } else if (strcmp(r->tag, "line_split_bands") == 0) {
    const hg_line *pair[2] = {lines[0], lines[1]};
    double lo[2], hi[2], hl, hh;
    s = hg_line_split_flow_bands(pair, 2, f, r->in[2].d, lo, hi, &hl, &hh);
    got[n++] = tok_d(lo[0]), got[n++] = tok_d(hi[0]), got[n++] = tok_d(lo[1]), got[n++] = tok_d(hi[1]);
    got[n++] = tok_d(hl), got[n++] = tok_d(hh);
  } else if (strcmp(r->tag, "line_size") == 0) {
    const double limit_value[3] = {5e4, 2.0, -1.0};
    const int32_t limit[3] = {HG_LIMIT_PRESSURE_LOSS, HG_LIMIT_VELOCITY, HG_LIMIT_PRESSURE_LOSS};
    int none = strcmp(r->in[3].s, "-") == 0;
    hg_sizing z;
    memset(&z, 0, sizeof z);
    z.struct_size = sizeof z;
    s = hg_line_size(lines[0], f, 3e-3, limit[r->in[2].i], limit_value[r->in[2].i], none ? NULL : r->in[3].s,
                     none ? NULL : r->in[4].s, &z);
    got[n++] = tok_d(z.min_inside_diameter);
    choice_tokens(&z.standard, got, &n);
    choice_tokens(&z.standard_at_band, got, &n);
  }
  int same = r->err ? s == code_of_kind(r->kind) && msg_len() > 0 : s == HG_OK && same_tokens(r, got, n);
  if (!quiet) CHECK(same, "%s fluid %lld: status %d (want %s)", r->tag, r->in[1].i, s, r->err ? r->kind : "HG_OK");
  return !same;
}

static void test_solves_bad_input(void) {
  hg_fluid *f = fluids[0];
  const hg_line *l = lines[0];
  double q[3] = {0.0, 1e-3, 2e-3}, h[3] = {30, 25, 15}, o[6], fl[2], hd;
  CHECK(hg_line_operating_point(NULL, f, q, h, 3, &o[0], &o[1], &o[2], &o[3], &o[4], &o[5]) == HG_ERR_NULL_POINTER, "op NULL line");
  CHECK(hg_line_operating_point(l, NULL, q, h, 3, &o[0], &o[1], &o[2], &o[3], &o[4], &o[5]) == HG_ERR_NULL_POINTER, "op NULL fluid");
  CHECK(hg_line_operating_point(l, f, NULL, h, 3, &o[0], &o[1], &o[2], &o[3], &o[4], &o[5]) == HG_ERR_NULL_POINTER, "op NULL flows");
  CHECK(hg_line_operating_point(l, f, q, NULL, 3, &o[0], &o[1], &o[2], &o[3], &o[4], &o[5]) == HG_ERR_NULL_POINTER, "op NULL heads");
  for (int k = 0; k < 6; k++) {
    double *p[6] = {&o[0], &o[1], &o[2], &o[3], &o[4], &o[5]};
    p[k] = NULL;
    CHECK(hg_line_operating_point(l, f, q, h, 3, p[0], p[1], p[2], p[3], p[4], p[5]) == HG_ERR_NULL_POINTER, "op NULL %d", k);
  }
  CHECK(hg_line_operating_point(l, f, q, h, 0, &o[0], &o[1], &o[2], &o[3], &o[4], &o[5]) == HG_ERR_INVALID, "op n 0");
  CHECK(hg_line_operating_point(l, f, q, h, 2, &o[0], &o[1], &o[2], &o[3], &o[4], &o[5]) != HG_OK && msg_len() > 0, "op 2 points");
  {
    /* a pump whose shut-off head (2 m) is below the line's 3 m rise cannot meet it at any
       flow (exact: required head >= static head for every forward flow) */
    const double weak[3] = {2.0, 1.5, 1.0};
    CHECK(hg_line_operating_point(l, f, q, weak, 3, &o[0], &o[1], &o[2], &o[3], &o[4], &o[5]) == HG_ERR_NO_SOLUTION && msg_len() > 0,
          "op pump below the rise");
  }
  h[1] = NAN;
  CHECK(hg_line_operating_point(l, f, q, h, 3, &o[0], &o[1], &o[2], &o[3], &o[4], &o[5]) == HG_ERR_NOT_FINITE, "op NaN head");
  const hg_line *pair[2] = {lines[0], NULL};
  CHECK(hg_line_split_flow(pair, 2, f, 1e-3, fl, &hd) == HG_ERR_NULL_POINTER && msg_len() > 0, "split NULL branch");
  pair[1] = lines[1];
  CHECK(hg_line_split_flow(NULL, 2, f, 1e-3, fl, &hd) == HG_ERR_NULL_POINTER, "split NULL branches");
  CHECK(hg_line_split_flow(pair, 0, f, 1e-3, fl, &hd) == HG_ERR_INVALID, "split n 0");
  CHECK(hg_line_split_flow(pair, 2, NULL, 1e-3, fl, &hd) == HG_ERR_NULL_POINTER, "split NULL fluid");
  CHECK(hg_line_split_flow(pair, 2, f, 1e-3, NULL, &hd) == HG_ERR_NULL_POINTER, "split NULL flows");
  CHECK(hg_line_split_flow(pair, 2, f, 1e-3, fl, NULL) == HG_ERR_NULL_POINTER, "split NULL head");
  CHECK(hg_line_split_flow(pair, 2, f, INFINITY, fl, &hd) == HG_ERR_NOT_FINITE, "split inf");
  {
    double lo[2], hi[2], hl, hh;
    CHECK(hg_line_split_flow_bands(NULL, 2, f, 1e-3, lo, hi, &hl, &hh) == HG_ERR_NULL_POINTER, "split bands NULL branches");
    CHECK(hg_line_split_flow_bands(pair, 0, f, 1e-3, lo, hi, &hl, &hh) == HG_ERR_INVALID, "split bands n 0");
    CHECK(hg_line_split_flow_bands(pair, 2, NULL, 1e-3, lo, hi, &hl, &hh) == HG_ERR_NULL_POINTER, "split bands NULL fluid");
    CHECK(hg_line_split_flow_bands(pair, 2, f, 1e-3, NULL, hi, &hl, &hh) == HG_ERR_NULL_POINTER, "split bands NULL low");
    CHECK(hg_line_split_flow_bands(pair, 2, f, 1e-3, lo, NULL, &hl, &hh) == HG_ERR_NULL_POINTER, "split bands NULL high");
    CHECK(hg_line_split_flow_bands(pair, 2, f, 1e-3, lo, hi, NULL, &hh) == HG_ERR_NULL_POINTER, "split bands NULL head_low");
    CHECK(hg_line_split_flow_bands(pair, 2, f, 1e-3, lo, hi, &hl, NULL) == HG_ERR_NULL_POINTER, "split bands NULL head_high");
    CHECK(hg_line_split_flow_bands(pair, 2, f, NAN, lo, hi, &hl, &hh) == HG_ERR_NOT_FINITE && msg_len() > 0, "split bands NaN");
    CHECK(hg_line_split_flow_bands(pair, 2, f, -INFINITY, lo, hi, &hl, &hh) == HG_ERR_NOT_FINITE, "split bands -inf");
  }
  hg_sizing z;
  z.struct_size = sizeof z;
  CHECK(hg_line_size(l, f, 3e-3, HG_LIMIT_PRESSURE_LOSS, 5e4, NULL, NULL, &z) == HG_OK && z.min_inside_diameter > 0.0,
        "size a 50 kPa limit");
  CHECK(hg_line_size(NULL, f, 1e-3, 0, 5e4, NULL, NULL, &z) == HG_ERR_NULL_POINTER, "size NULL line");
  CHECK(hg_line_size(l, NULL, 1e-3, 0, 5e4, NULL, NULL, &z) == HG_ERR_NULL_POINTER, "size NULL fluid");
  CHECK(hg_line_size(l, f, 1e-3, 0, 5e4, NULL, NULL, NULL) == HG_ERR_NULL_POINTER, "size NULL out");
  CHECK(hg_line_size(l, f, 1e-3, 0, 5e4, "steel", NULL, &z) == HG_ERR_NULL_POINTER, "size NULL schedule");
  CHECK(hg_line_size(l, f, 1e-3, 2, 5e4, NULL, NULL, &z) == HG_ERR_OUT_OF_RANGE && msg_len() > 0, "limit 2");
  CHECK(hg_line_size(l, f, 0.0, 0, 5e4, NULL, NULL, &z) == HG_ERR_OUT_OF_RANGE, "size zero flow");
  CHECK(hg_line_size(l, f, NAN, 0, 5e4, NULL, NULL, &z) == HG_ERR_NOT_FINITE, "size NaN flow");
  CHECK(hg_line_size(l, f, 1e-3, 0, NAN, NULL, NULL, &z) == HG_ERR_NOT_FINITE, "size NaN limit");
  CHECK(hg_line_size(l, f, 1e-3, 1, 2.0, "cast_iron", "40", &z) == HG_ERR_UNKNOWN_NAME, "size unknown table");
  z.struct_size = 8;
  CHECK(hg_line_size(l, f, 1e-3, 1, 2.0, NULL, NULL, &z) == HG_ERR_INVALID, "size struct_size 8");
}

static void test_more_elements_bad_input(void) {
  hg_line *l = NULL;
  hg_fluid *f = NULL, *g = NULL;
  hg_uncertainty_options u;
  double a = 0, b = 0;
  CHECK(hg_line_new(&l) == HG_OK, "new");
  const double bad[] = {NAN, INFINITY, -1.0};
  for (int i = 0; i < 3; i++) {
    double v = bad[i];
    CHECK(hg_line_add_pipe_material(l, v, 10, "plastic") != HG_OK && msg_len() > 0, "material d %g", v);
    CHECK(hg_line_add_pipe_material(l, 0.1, v, "plastic") != HG_OK, "material L %g", v);
    CHECK(hg_line_add_custom_duct(l, v, 0.5, 60, 10, 0) != HG_OK, "custom area %g", v);
    CHECK(hg_line_add_custom_duct(l, 0.01, v, 60, 10, 0) != HG_OK, "custom perimeter %g", v);
    CHECK(hg_line_add_custom_duct(l, 0.01, 0.5, v, 10, 0) != HG_OK, "custom C %g", v);
    CHECK(hg_line_add_expansion(l, v, 0.2) != HG_OK && hg_line_add_expansion(l, 0.1, v) != HG_OK, "expansion %g", v);
    CHECK(hg_line_add_contraction(l, v, 0.1) != HG_OK && hg_line_add_contraction(l, 0.2, v) != HG_OK, "contraction %g", v);
    CHECK(hg_line_add_two_k(l, v, 0.1, 0) != HG_OK && hg_line_add_two_k(l, 500, v, 0) != HG_OK, "2-K %g", v);
    CHECK(hg_line_add_two_k(l, 500, 0.1, v) != HG_OK, "2-K diameter %g", v);
    CHECK(hg_line_add_three_k(l, v, 0.1, 4, 0) != HG_OK && hg_line_add_three_k(l, 500, 0.1, v, 0) != HG_OK, "3-K %g", v);
    CHECK(hg_line_add_cv(l, v, 0) != HG_OK && hg_line_add_kv(l, v, 0) != HG_OK && msg_len() > 0, "cv kv %g", v);
    CHECK(hg_line_add_equivalent_length(l, v, 0) != HG_OK, "L/D %g", v);
    CHECK(hg_line_add_bend(l, v, 1.5, 0) != HG_OK && hg_line_add_bend(l, 90, v, 0) != HG_OK, "bend %g", v);
    CHECK(hg_line_add_from_tank(l, HG_EDGE_ROUNDED, v) != HG_OK, "rounded %g", v);
    CHECK(hg_line_add_from_tank(l, HG_EDGE_SQUARE, v) != HG_OK, "square edge with radius %g", v);
    CHECK(hg_water_saturation_temperature(v, &a) != HG_OK && msg_len() > 0, "saturation %g", v);
    CHECK(hg_fluid_gas(v, 1.8e-5, 293, 1e5, &f) != HG_OK && f == NULL, "gas density %g", v);
    CHECK(hg_fluid_gas(1.2, 1.8e-5, v, 1e5, &f) != HG_OK && f == NULL, "gas temperature %g", v);
  }
  size_t n = 0;
  CHECK(hg_line_count(l, &n) == HG_OK && n == 0, "no bad element was added");
  CHECK(hg_line_add_pipe_material(l, 0.1, 10, "unobtainium") == HG_ERR_UNKNOWN_NAME, "unknown material");
  CHECK(hg_line_add_pipe_material(l, 0.1, 10, NULL) == HG_ERR_NULL_POINTER, "NULL material");
  CHECK(hg_line_add_custom_duct(l, 0.01, 0.1, 60, 10, 0) == HG_ERR_OUT_OF_RANGE, "perimeter below the circle's");
  CHECK(hg_line_add_from_tank(l, 3, 0) == HG_ERR_OUT_OF_RANGE && hg_line_add_from_tank(l, -1, 0) == HG_ERR_OUT_OF_RANGE, "edge");
  CHECK(hg_line_add_from_tank(l, HG_EDGE_SQUARE, 0.1) == HG_ERR_INVALID, "radius on a square edge");
  CHECK(hg_line_add_pipe(l, 0.05, 10, 3e-6) == HG_OK && hg_line_add_cv(l, 40, 0) == HG_OK, "pipe and valve");
  CHECK(hg_line_set_k_spread(l, 1, 0.5) == HG_OK, "spread");
  CHECK(hg_line_set_k_spread(l, 0, 0.5) == HG_ERR_OUT_OF_RANGE && msg_len() > 0, "spread on a pipe");
  CHECK(hg_line_set_k_spread(l, 7, 0.5) == HG_ERR_OUT_OF_RANGE, "spread past the end");
  CHECK(hg_line_set_k_spread(l, 1, 1.5) == HG_ERR_OUT_OF_RANGE && hg_line_set_k_spread(l, 1, NAN) == HG_ERR_NOT_FINITE, "spread value");
  CHECK(hg_line_set_roughness_range(l, 0, 1e-5, 1e-6) == HG_ERR_OUT_OF_RANGE && msg_len() > 0, "range reversed");
  CHECK(hg_line_set_roughness_range(l, 1, 1e-6, 1e-5) == HG_ERR_OUT_OF_RANGE, "range on a valve");
  CHECK(hg_line_set_roughness_range(l, 0, NAN, 1e-5) == HG_ERR_NOT_FINITE, "range NaN");
  CHECK(hg_line_set_roughness_range(l, 0, 1e-5, 2e-5) == HG_ERR_OUT_OF_RANGE && msg_len() > 0, "range without the nominal");
  CHECK(hg_line_set_roughness_range(l, 0, 1e-6, 1e-5) == HG_OK, "range");
  CHECK(hg_line_set_roughness_range(l, 0, 0, 1e-5) == HG_ERR_OUT_OF_RANGE, "range from 0 (log-uniform needs low > 0)");
  CHECK(hg_line_set_turbulent_diameter(l, 2) == HG_ERR_OUT_OF_RANGE, "mode 2");
  CHECK(hg_uncertainty_options_default(NULL) == HG_ERR_NULL_POINTER, "uncertainty NULL");
  CHECK(hg_uncertainty_options_default(&u) == HG_OK && u.struct_size == sizeof u && u.friction_model == 1, "defaults");
  u.fluid = 2;
  CHECK(hg_line_set_uncertainty(l, &u) == HG_ERR_OUT_OF_RANGE && msg_len() > 0, "flag 2");
  hg_uncertainty_options_default(&u);
  u.diameter = -0.1;
  CHECK(hg_line_set_uncertainty(l, &u) != HG_OK && msg_len() > 0, "negative tolerance");
  u.diameter = NAN;
  CHECK(hg_line_set_uncertainty(l, &u) == HG_ERR_NOT_FINITE, "NaN tolerance");
  hg_uncertainty_options_default(&u);
  u.struct_size = 4;
  CHECK(hg_line_set_uncertainty(l, &u) == HG_ERR_INVALID, "struct_size 4");
  CHECK(hg_line_set_uncertainty(l, NULL) == HG_ERR_NULL_POINTER, "NULL options");
  hg_uncertainty_options_default(&u);
  u.friction_model = 0, u.roughness = 0, u.fluid = 0, u.fittings = 0, u.equipment = 0;
  CHECK(hg_line_set_uncertainty(l, &u) == HG_OK, "no sources");
  CHECK(hg_fluid_liquid(998.2, 1e-3, &f) == HG_OK, "liquid");
  hg_line_totals x;
  x.struct_size = sizeof x;
  CHECK(totals(l, f, 2e-3, &x) == HG_OK && x.head_loss_low == x.head_loss && x.head_loss_high == x.head_loss,
        "a band without sources has no width");
  char name[32];
  size_t need;
  CHECK(band_source(l, f, 2e-3, 0, name, sizeof name, &need, &a) == HG_ERR_OUT_OF_RANGE, "no source");
  hg_uncertainty_options_default(&u);
  CHECK(hg_line_set_uncertainty(l, &u) == HG_OK, "default sources");
  CHECK(band_source(l, f, 2e-3, 0, name, sizeof name, &need, &a) == HG_OK && a > 0 && a <= 1, "dominant");
  CHECK(band_source(l, f, 2e-3, 0, name, 2, &need, &a) == HG_ERR_BUFFER_TOO_SMALL && strlen(name) == 1, "cut");
  CHECK(band_source(l, f, 2e-3, 0, name, sizeof name, NULL, &a) == HG_ERR_NULL_POINTER, "NULL needed");
  CHECK(band_source(l, f, 2e-3, 0, name, sizeof name, &need, NULL) == HG_ERR_NULL_POINTER, "NULL share");
  CHECK(band_source(NULL, f, 2e-3, 0, name, sizeof name, &need, &a) == HG_ERR_NULL_POINTER, "NULL line");
  CHECK(band_source(l, NULL, 2e-3, 0, name, sizeof name, &need, &a) == HG_ERR_NULL_POINTER, "NULL fluid");
  CHECK(band_source(l, f, NAN, 0, name, sizeof name, &need, &a) == HG_ERR_NOT_FINITE, "NaN flow");
  CHECK(hg_fluid_with_uncertainty(NULL, 0.1, 0.1, &g) == HG_ERR_NULL_POINTER && g == NULL, "with NULL fluid");
  CHECK(hg_fluid_with_uncertainty(f, 1.5, 0.1, &g) == HG_ERR_OUT_OF_RANGE && g == NULL, "uncertainty 1.5");
  CHECK(hg_fluid_with_uncertainty(f, 0.1, NAN, &g) == HG_ERR_NOT_FINITE && g == NULL, "uncertainty NaN");
  CHECK(hg_fluid_with_uncertainty(f, 0.1, 0.1, NULL) == HG_ERR_NULL_POINTER, "with NULL out");
  CHECK(hg_fluid_with_vapour_pressure(f, -1.0, &g) == HG_ERR_OUT_OF_RANGE && g == NULL, "vapour -1");
  CHECK(hg_fluid_with_vapour_pressure(NULL, 2e3, &g) == HG_ERR_NULL_POINTER, "vapour NULL fluid");
  CHECK(hg_fluid_with_vapour_pressure(f, 2e3, NULL) == HG_ERR_NULL_POINTER, "vapour NULL out");
  CHECK(hg_fluid_with_vapour_pressure(f, 2.5e5, &g) == HG_OK && g != NULL, "vapour pressure");
  CHECK(hg_line_set_inlet_pressure(l, 1.5e5) == HG_OK, "inlet");
  CHECK(totals(l, g, 5e-3, &x) == HG_OK && (x.warnings & HG_WARN_BELOW_VAPOUR_PRESSURE), "cavitation warned");
  CHECK(hg_fluid_properties(g, &a, &b) == HG_OK && a == 998.2 && b == 1e-3, "copy keeps the properties");
  CHECK(hg_fluid_gas(1.2, 1.8e-5, 293.15, 1e5, NULL) == HG_ERR_NULL_POINTER, "gas NULL out");
  CHECK(hg_water_saturation_temperature(1e5, NULL) == HG_ERR_NULL_POINTER, "saturation NULL");
  hg_fluid_free(g);
  hg_fluid_free(f);
  hg_line_free(l);
}

/* The per-call inlet pressure, the Monte Carlo check, the sources of one element's band
 * and ducts of catalogue materials: bad input, and the Monte Carlo interval against the
 * first-order band. */
static void test_checks(void) {
  const hg_line *l = lines[0];
  hg_fluid *f = fluids[1];
  hg_line_totals x, y;
  hg_monte_carlo m;
  x.struct_size = sizeof x, y.struct_size = sizeof y, m.struct_size = sizeof m;
  m.mean = 7.0;
  const double bad[] = {NAN, INFINITY, -INFINITY, -1.0};
  for (int i = 0; i < 4; i++) {
    double v = bad[i];
    CHECK(totals_at(l, f, 2e-3, v, &x) == (i < 3 ? HG_ERR_NOT_FINITE : HG_ERR_OUT_OF_RANGE) &&
              msg_len() > 0, "inlet %g", v);
    if (i < 3) CHECK(totals_at(l, f, v, 2e5, &x) == HG_ERR_NOT_FINITE, "evaluate_at flow %g", v);
    if (i < 3) CHECK(hg_line_monte_carlo(l, f, v, 200, 1, &m) == HG_ERR_NOT_FINITE && m.mean == 7.0 && msg_len() > 0,
                     "monte carlo flow %g", v);
  }
  /* 0 means no inlet pressure for this call, whatever the line holds (lines[0] holds 3e5). */
  CHECK(totals_at(l, f, 2e-3, 0.0, &x) == HG_OK && x.has_pressures == 0, "no inlet pressure");
  CHECK(totals_at(l, f, 2e-3, 3e5, &x) == HG_OK && totals(l, f, 2e-3, &y) == HG_OK &&
            memcmp(&x, &y, sizeof x) == 0, "at the line's own pressure: the same bytes");
  CHECK(totals_at(NULL, f, 2e-3, 2e5, &x) == HG_ERR_NULL_POINTER, "evaluate_at NULL line");
  CHECK(totals_at(l, NULL, 2e-3, 2e5, &x) == HG_ERR_NULL_POINTER, "evaluate_at NULL fluid");
  CHECK(totals_at(l, f, 2e-3, 2e5, NULL) == HG_ERR_NULL_POINTER, "evaluate_at NULL out");
  x.struct_size = 0;
  CHECK(totals_at(l, f, 2e-3, 2e5, &x) == HG_ERR_INVALID, "evaluate_at struct_size 0");
  x.struct_size = sizeof x;
  CHECK(hg_line_monte_carlo(NULL, f, 2e-3, 200, 1, &m) == HG_ERR_NULL_POINTER, "monte carlo NULL line");
  CHECK(hg_line_monte_carlo(l, NULL, 2e-3, 200, 1, &m) == HG_ERR_NULL_POINTER, "monte carlo NULL fluid");
  CHECK(hg_line_monte_carlo(l, f, 2e-3, 200, 1, NULL) == HG_ERR_NULL_POINTER, "monte carlo NULL out");
  {
    /* The offered interval: 20 m of smooth 20 mm tube at Re = 3000, inside the transition
     * 2300...4000 (common practice), flags its band; the offer is hg_line_monte_carlo with
     * 20,000 samples from seed 101, bit for bit. At 2 L/s in lines[0] nothing is offered
     * when the band is not flagged. */
    hg_line *t = NULL;
    hg_fluid *w = NULL;
    CHECK(hg_fluid_liquid(998.2, 1.002e-3, &w) == HG_OK && hg_line_new(&t) == HG_OK
          && hg_line_add_pipe(t, 0.02, 20.0, 0.0) == HG_OK, "transitional tube");
    double q = 3000.0 * (1.002e-3 / 998.2) * 3.14159265358979323846 * 0.02 / 4.0;
    hg_monte_carlo a, b;
    memset(&a, 0, sizeof a), memset(&b, 0, sizeof b);
    a.struct_size = sizeof a, b.struct_size = sizeof b;
    int32_t offered = -1;
    CHECK(hg_line_band_monte_carlo(t, w, q, &offered, &a) == HG_OK && offered == 1, "offered: %s", last_msg());
    CHECK(hg_line_monte_carlo(t, w, q, 20000, 101, &b) == HG_OK && memcmp(&a, &b, sizeof a) == 0,
          "the documented run, bit for bit");
    CHECK(a.low < a.mean && a.mean < a.high && a.samples == 20000, "an interval");
    CHECK(hg_line_band_monte_carlo(t, w, 1e-3, &offered, &a) == HG_OK && offered == 0 && a.samples == 0
          && a.low == 0.0 && a.high == 0.0, "turbulent: nothing offered, zeros written");
    CHECK(hg_line_band_monte_carlo(t, w, NAN, &offered, &a) == HG_ERR_NOT_FINITE && msg_len() > 0, "offer NaN flow");
    CHECK(hg_line_band_monte_carlo(NULL, w, q, &offered, &a) == HG_ERR_NULL_POINTER, "offer NULL line");
    CHECK(hg_line_band_monte_carlo(t, w, q, NULL, &a) == HG_ERR_NULL_POINTER, "offer NULL flag");
    CHECK(hg_line_band_monte_carlo(t, w, q, &offered, NULL) == HG_ERR_NULL_POINTER, "offer NULL out");
    a.struct_size = 0;
    CHECK(hg_line_band_monte_carlo(t, w, q, &offered, &a) == HG_ERR_INVALID, "offer struct_size 0");
    hg_line_free(t);
    hg_fluid_free(w);
  }
  CHECK(hg_line_monte_carlo(l, f, 2e-3, 0, 1, &m) == HG_ERR_OUT_OF_RANGE && msg_len() > 0, "0 samples");
  CHECK(hg_line_monte_carlo(l, f, 2e-3, 99, 1, &m) == HG_ERR_OUT_OF_RANGE, "99 samples");
  /* Far more samples than memory holds must be refused, not attempted. */
  CHECK(hg_line_monte_carlo(l, f, 2e-3, SIZE_MAX, 1, &m) == HG_ERR_OUT_OF_RANGE && m.mean == 7.0, "SIZE_MAX samples");
  CHECK(hg_line_monte_carlo(l, f, 2e-3, HG_MONTE_CARLO_MAX_SAMPLES + 1, 1, &m) == HG_ERR_OUT_OF_RANGE, "max + 1");
  m.struct_size = 8;
  CHECK(hg_line_monte_carlo(l, f, 2e-3, 200, 1, &m) == HG_ERR_INVALID, "monte carlo struct_size 8");
  m.struct_size = sizeof m;
  hg_monte_carlo m2 = m;
  CHECK(hg_line_monte_carlo(l, f, 2e-3, 500, 42, &m) == HG_OK && hg_line_monte_carlo(l, f, 2e-3, 500, 42, &m2) == HG_OK &&
            memcmp(&m, &m2, sizeof m) == 0 && m.samples == 500, "same seed, same bytes");
  /* JCGM 101:2008 §8: the first-order (GUM) interval is validated when its ends agree
   * with the Monte Carlo ones; here within 15 % of the band's width at 20000 samples. */
  CHECK(totals(l, f, 2e-3, &x) == HG_OK, "evaluate");
  CHECK(hg_line_monte_carlo(l, f, 2e-3, 20000, 2024, &m) == HG_OK, "20000 samples");
  double width = x.required_head_high - x.required_head_low;
  printf("test_checks: band %.6f … %.6f m, Monte Carlo %.6f … %.6f m (mean %.6f, sd %.6f)\n",
         x.required_head_low, x.required_head_high, m.low, m.high, m.mean, m.std_dev);
  CHECK(width > 0 && fabs(m.low - x.required_head_low) <= 0.15 * width &&
            fabs(m.high - x.required_head_high) <= 0.15 * width,
        "band %.6f..%.6f vs Monte Carlo %.6f..%.6f", x.required_head_low, x.required_head_high, m.low, m.high);
  CHECK(m.low < x.required_head && x.required_head < m.high, "the nominal head lies inside the interval");

  char name[64];
  size_t need = 0;
  double share = -1;
  CHECK(element_band_source(l, f, 2e-3, 0, 0, name, sizeof name, &need, &share) == HG_OK && share > 0 &&
            share <= 1 && strcmp(name, "friction model") == 0, "pipe band: '%s' %g", name, share);
  CHECK(element_band_source(l, f, 2e-3, 3, 0, name, sizeof name, &need, &share) == HG_ERR_OUT_OF_RANGE &&
            msg_len() > 0, "a rise has no sources");
  CHECK(element_band_source(l, f, 2e-3, 99, 0, name, sizeof name, &need, &share) == HG_ERR_OUT_OF_RANGE,
        "element past the end");
  CHECK(element_band_source(l, f, 2e-3, 0, SIZE_MAX, name, sizeof name, &need, &share) ==
            HG_ERR_OUT_OF_RANGE, "source SIZE_MAX");
  CHECK(element_band_source(l, f, 2e-3, 0, 0, name, 3, &need, &share) == HG_ERR_BUFFER_TOO_SMALL &&
            strlen(name) == 2 && need == strlen("friction model"), "cut");
  CHECK(element_band_source(l, f, 2e-3, 0, 0, NULL, 0, &need, &share) == HG_ERR_BUFFER_TOO_SMALL, "length");
  CHECK(element_band_source(l, f, 2e-3, 0, 0, NULL, 4, &need, &share) == HG_ERR_NULL_POINTER, "NULL buf");
  CHECK(element_band_source(l, f, 2e-3, 0, 0, name, 8, NULL, &share) == HG_ERR_NULL_POINTER, "NULL needed");
  CHECK(element_band_source(l, f, 2e-3, 0, 0, name, 8, &need, NULL) == HG_ERR_NULL_POINTER, "NULL share");
  CHECK(element_band_source(NULL, f, 2e-3, 0, 0, name, 8, &need, &share) == HG_ERR_NULL_POINTER, "NULL line");
  CHECK(element_band_source(l, NULL, 2e-3, 0, 0, name, 8, &need, &share) == HG_ERR_NULL_POINTER, "NULL fluid");
  CHECK(element_band_source(l, f, NAN, 0, 0, name, 8, &need, &share) == HG_ERR_NOT_FINITE, "NaN flow");
  CHECK(element_band_source(l, f, 0.0, 0, 0, name, 8, &need, &share) == HG_ERR_OUT_OF_RANGE,
        "no band at zero flow");

  hg_line *d = NULL;
  CHECK(hg_line_new(&d) == HG_OK, "new");
  const double dbad[] = {NAN, INFINITY, -INFINITY, -1.0, 0.0};
  for (int i = 0; i < 5; i++) {
    double v = dbad[i];
    CHECK(hg_line_add_duct_material(d, HG_SECTION_RECTANGLE, v, 0.2, 10, "galvanized_steel") != HG_OK &&
              msg_len() > 0, "duct material a %g", v);
    CHECK(hg_line_add_duct_material(d, HG_SECTION_RECTANGLE, 0.3, v, 10, "galvanized_steel") != HG_OK, "b %g", v);
    CHECK(hg_line_add_duct_material(d, HG_SECTION_RECTANGLE, 0.3, 0.2, v, "galvanized_steel") != HG_OK, "L %g", v);
  }
  CHECK(hg_line_add_duct_material(d, HG_SECTION_RECTANGLE, 0.3, 0.2, 10, "unobtainium") == HG_ERR_UNKNOWN_NAME &&
            msg_len() > 0, "unknown material");
  CHECK(hg_line_add_duct_material(d, HG_SECTION_RECTANGLE, 0.3, 0.2, 10, NULL) == HG_ERR_NULL_POINTER, "NULL material");
  CHECK(hg_line_add_duct_material(d, HG_SECTION_RECTANGLE, 0.3, 0.2, 10, "\xff") == HG_ERR_INVALID, "not UTF-8");
  CHECK(hg_line_add_duct_material(d, 9, 0.3, 0.2, 10, "galvanized_steel") == HG_ERR_OUT_OF_RANGE, "shape 9");
  CHECK(hg_line_add_duct_material(d, HG_SECTION_CIRCLE, 0.3, 0.2, 10, "galvanized_steel") == HG_ERR_INVALID, "circle b");
  CHECK(hg_line_add_duct_material(NULL, HG_SECTION_RECTANGLE, 0.3, 0.2, 10, "pvc") == HG_ERR_NULL_POINTER, "NULL line");
  size_t n = 9;
  CHECK(hg_line_count(d, &n) == HG_OK && n == 0, "no bad duct was added");
  /* The material's typical roughness and its range, as a duct of that roughness whose
   * range is set by hand. */
  double typical, low, high;
  hg_line *e = NULL;
  CHECK(hg_roughness("galvanized_steel", &typical, &low, &high) == HG_OK, "roughness");
  CHECK(hg_line_add_duct_material(d, HG_SECTION_RECTANGLE, 0.3, 0.2, 10, "galvanized_steel") == HG_OK, "duct");
  CHECK(hg_line_new(&e) == HG_OK && hg_line_add_duct(e, HG_SECTION_RECTANGLE, 0.3, 0.2, 10, typical) == HG_OK &&
            hg_line_set_roughness_range(e, 0, low, high) == HG_OK, "duct by hand");
  CHECK(totals(d, fluids[2], 0.5, &x) == HG_OK && totals(e, fluids[2], 0.5, &y) == HG_OK &&
            memcmp(&x, &y, sizeof x) == 0, "duct of a material equals the duct by hand");
  hg_line_free(d);
  hg_line_free(e);
}

static void test_handles_and_bad_input(void) {
  hg_line *l = NULL;
  hg_fluid *f = NULL;
  hg_line_totals x;
  hg_element_result e;
  double q = 1e-3, a, b, c;
  size_t n = 99, need = 0;
  char buf[32];
  x.struct_size = sizeof x, e.struct_size = sizeof e;
  hg_line_free(NULL);
  hg_fluid_free(NULL);
  CHECK(hg_line_new(NULL) == HG_ERR_NULL_POINTER && msg_len() > 0, "line_new NULL");
  CHECK(hg_fluid_water(293.15, 1e5, NULL) == HG_ERR_NULL_POINTER, "fluid NULL out");
  CHECK(hg_fluid_water(NAN, 1e5, &f) == HG_ERR_NOT_FINITE && f == NULL, "water NaN");
  CHECK(hg_fluid_air(150.0, 1e5, &f) == HG_ERR_OUT_OF_RANGE && f == NULL, "air too cold");
  CHECK(hg_fluid_liquid(-1.0, 1e-3, &f) == HG_ERR_OUT_OF_RANGE && f == NULL, "negative density");
  CHECK(hg_fluid_liquid(1000.0, INFINITY, &f) == HG_ERR_NOT_FINITE && f == NULL, "inf viscosity");
  CHECK(hg_fluid_air(293.15, 1e5, &f) == HG_OK && f != NULL, "air");
  CHECK(hg_fluid_properties(f, &a, &b) == HG_OK && a > 1.0 && a < 1.3 && b > 1e-5, "air properties");
  double rho, mu;
  CHECK(hg_air(293.15, 1e5, &rho, &mu) == HG_OK && bits_of(rho) == bits_of(a) && bits_of(mu) == bits_of(b),
        "hg_air equals the handle's");
  CHECK(hg_fluid_properties(NULL, &a, &b) == HG_ERR_NULL_POINTER, "properties NULL fluid");
  CHECK(hg_fluid_properties(f, NULL, &b) == HG_ERR_NULL_POINTER, "properties NULL out");
  CHECK(hg_fluid_properties(f, &a, NULL) == HG_ERR_NULL_POINTER, "properties NULL out");

  CHECK(hg_line_new(&l) == HG_OK && l != NULL, "line_new");
  CHECK(hg_line_count(l, &n) == HG_OK && n == 0, "empty count");
  CHECK(hg_line_count(NULL, &n) == HG_ERR_NULL_POINTER && hg_line_count(l, NULL) == HG_ERR_NULL_POINTER, "count NULL");
  CHECK(totals(l, f, q, &x) == HG_ERR_INVALID && msg_len() > 0, "empty line");
  CHECK(hg_line_add_fitting(l, "gate_valve", 0.0) == HG_OK, "fitting first");
  CHECK(totals(l, f, q, &x) == HG_ERR_INVALID && msg_len() > 0, "fitting with no pipe");
  CHECK(hg_line_add_pipe(l, 0.05, 10.0, 4.5e-5) == HG_OK, "pipe after it");
  CHECK(totals(l, f, q, &x) == HG_OK, "fitting takes the next pipe's bore");
  const double bad[] = {NAN, INFINITY, -INFINITY, -1.0, 0.0};
  for (int i = 0; i < 5; i++) {
    double v = bad[i];
    int neg_or_zero = i >= 3;
    CHECK(hg_line_add_pipe(l, v, 10, 0) != HG_OK && msg_len() > 0, "pipe diameter %g", v);
    CHECK(hg_line_add_pipe(l, 0.05, v, 0) != HG_OK && msg_len() > 0, "pipe length %g", v);
    if (i != 4) CHECK(hg_line_add_pipe(l, 0.05, 10, v) != HG_OK && msg_len() > 0, "pipe roughness %g", v);
    CHECK(hg_line_add_duct(l, HG_SECTION_RECTANGLE, v, 0.1, 10, 0) != HG_OK, "duct a %g", v);
    CHECK(hg_line_add_duct(l, HG_SECTION_RECTANGLE, 0.1, v, 10, 0) != HG_OK, "duct b %g", v);
    if (i != 4) CHECK(hg_line_add_fitting(l, "gate_valve", v) != HG_OK && msg_len() > 0, "fitting diameter %g", v);
    if (i != 4) CHECK(hg_line_add_fitting_k(l, v, 0.0) != HG_OK, "k %g", v);
    if (!neg_or_zero) CHECK(hg_line_add_rise(l, v) == HG_ERR_NOT_FINITE && msg_len() > 0, "rise %g", v);
    CHECK(hg_line_add_equipment(l, "meter", v, 1e-3) != HG_OK, "drop %g", v);
    CHECK(hg_line_add_equipment(l, "meter", 1e4, v) != HG_OK, "at_flow %g", v);
    if (i != 4) CHECK(hg_line_set_inlet_pressure(l, v) != HG_OK && msg_len() > 0, "inlet %g", v);
    int32_t st = totals(l, f, v, &x);
    /* -1 m3/s of air would lose far more than its inlet pressure: no solution. */
    CHECK(neg_or_zero ? st == HG_OK || (st == HG_ERR_NO_SOLUTION && msg_len() > 0) : st == HG_ERR_NOT_FINITE,
          "flow %g: %d", v, st);
    CHECK(hg_line_flow_for_head(l, f, v, &a, &b, &c) == (neg_or_zero ? HG_ERR_NO_SOLUTION : HG_ERR_NOT_FINITE) ||
              (neg_or_zero && hg_line_flow_for_head(l, f, v, &a, &b, &c) == HG_OK),
          "head %g", v);
  }
  CHECK(hg_line_count(l, &n) == HG_OK && n == 2, "bad elements were not added: %zu", n);
  CHECK(hg_line_add_duct(l, 7, 0.1, 0.1, 10, 0) == HG_ERR_OUT_OF_RANGE, "shape 7");
  CHECK(hg_line_add_fitting(l, "nonesuch", 0.0) == HG_ERR_UNKNOWN_NAME && msg_len() > 0, "unknown fitting");
  CHECK(hg_line_add_fitting(l, NULL, 0.0) == HG_ERR_NULL_POINTER, "fitting NULL name");
  CHECK(hg_line_add_equipment(l, NULL, 1e4, 1e-3) == HG_ERR_NULL_POINTER, "equipment NULL name");
  CHECK(hg_line_add_equipment(l, "\xff", 1e4, 1e-3) == HG_ERR_INVALID, "equipment not UTF-8");
  CHECK(hg_line_add_pipe(NULL, 0.05, 10, 0) == HG_ERR_NULL_POINTER, "add to NULL line");
  CHECK(hg_line_add_duct(NULL, 0, 0.05, 0, 10, 0) == HG_ERR_NULL_POINTER, "add to NULL line");
  CHECK(hg_line_add_fitting(NULL, "gate_valve", 0) == HG_ERR_NULL_POINTER, "add to NULL line");
  CHECK(hg_line_add_fitting_k(NULL, 1, 0) == HG_ERR_NULL_POINTER, "add to NULL line");
  CHECK(hg_line_add_rise(NULL, 1) == HG_ERR_NULL_POINTER, "add to NULL line");
  CHECK(hg_line_add_equipment(NULL, "m", 1e4, 1e-3) == HG_ERR_NULL_POINTER, "add to NULL line");
  CHECK(hg_line_set_inlet_pressure(NULL, 1e5) == HG_ERR_NULL_POINTER, "NULL line");
  CHECK(hg_line_set_friction_options(l, NULL) == HG_ERR_NULL_POINTER, "NULL options");
  {
    hg_friction_options fo;
    CHECK(hg_friction_options_default(&fo) == HG_OK && hg_line_set_friction_options(l, &fo) == HG_OK,
          "default friction options accepted");
  }
  hg_friction_options o;
  hg_friction_options_default(&o);
  CHECK(hg_line_set_friction_options(NULL, &o) == HG_ERR_NULL_POINTER, "NULL line");
  o.turbulent_limit = 1000.0;
  CHECK(hg_line_set_friction_options(l, &o) == HG_ERR_OUT_OF_RANGE && msg_len() > 0, "crossed limits");
  o.turbulent_limit = 4000.0, o.transition = HG_TRANSITION_REFUSE;
  CHECK(hg_line_set_friction_options(l, &o) == HG_OK, "refuse");
  double q_tr = 0.05 * 0.05 * 3.14159 / 4 * 3000.0 * 1.8e-5 / 1.19 / 0.05; /* Re about 3000 in air */
  CHECK(totals(l, f, q_tr, &x) == HG_ERR_NO_SOLUTION && msg_len() > 0, "transitional refused");
  hg_friction_options_default(&o);
  CHECK(hg_line_set_friction_options(l, &o) == HG_OK, "defaults back");
  CHECK(hg_line_set_inlet_pressure(l, 0.0) == HG_OK, "clear inlet pressure");

  CHECK(totals(NULL, f, q, &x) == HG_ERR_NULL_POINTER, "evaluate NULL line");
  CHECK(totals(l, NULL, q, &x) == HG_ERR_NULL_POINTER, "evaluate NULL fluid");
  CHECK(totals(l, f, q, NULL) == HG_ERR_NULL_POINTER, "evaluate NULL out");
  x.struct_size = offsetof(hg_line_totals, head_loss_low);
  CHECK(totals(l, f, q, &x) == HG_ERR_INVALID && msg_len() > 0, "struct_size below the first release");
  /* A newer caller's larger struct: the library fills what it knows and leaves the rest. */
  unsigned char big[sizeof(hg_line_totals) + 64];
  memset(big, 0xAB, sizeof big);
  hg_line_totals *xb = (hg_line_totals *)(void *)big;
  xb->struct_size = sizeof big;
  CHECK(totals(l, f, q, xb) == HG_OK && xb->struct_size == sizeof big, "larger struct");
  int tail_ok = 1;
  for (size_t i = sizeof(hg_line_totals); i < sizeof big; i++) tail_ok &= big[i] == 0xAB;
  CHECK(tail_ok && xb->element_count == 2, "bytes past our struct untouched");
  x.struct_size = sizeof x;
  CHECK(totals(l, f, q, &x) == HG_OK && x.has_pressures == 1 && x.inlet_pressure == 1e5,
        "a gas carries its own pressure");

  CHECK(element_row(l, f, q, 1, &e) == HG_OK && e.kind == HG_ELEMENT_PIPE && e.regime == HG_REGIME_LAMINAR && e.reynolds > 0,
        "element 1 is the pipe");
  CHECK(element_row(l, f, q, 0, &e) == HG_OK && e.kind == HG_ELEMENT_FITTING && e.regime == -1 && e.k > 0,
        "element 0 is the valve");
  CHECK(element_row(l, f, q, 2, &e) == HG_ERR_OUT_OF_RANGE && msg_len() > 0, "index past the end");
  CHECK(element_row(l, f, q, SIZE_MAX, &e) == HG_ERR_OUT_OF_RANGE, "index SIZE_MAX");
  CHECK(element_row(NULL, f, q, 0, &e) == HG_ERR_NULL_POINTER, "element NULL line");
  CHECK(element_row(l, NULL, q, 0, &e) == HG_ERR_NULL_POINTER, "element NULL fluid");
  CHECK(element_row(l, f, q, 0, NULL) == HG_ERR_NULL_POINTER, "element NULL out");
  CHECK(element_row(l, f, NAN, 0, &e) == HG_ERR_NOT_FINITE, "element NaN flow");
  e.struct_size = 0;
  CHECK(element_row(l, f, q, 0, &e) == HG_ERR_INVALID, "element struct_size 0");

  CHECK(element_label(l, f, q, 0, buf, sizeof buf, &need) == HG_OK && strcmp(buf, "gate_valve 0") == 0 &&
            need == 12, "label '%s'", buf);
  CHECK(element_label(l, f, q, 1, buf, sizeof buf, &need) == HG_OK && strcmp(buf, "pipe 1") == 0, "label pipe");
  CHECK(element_label(l, f, q, 0, buf, 4, &need) == HG_ERR_BUFFER_TOO_SMALL && strcmp(buf, "gat") == 0 &&
            need == 12, "label cut");
  CHECK(element_label(l, f, q, 0, NULL, 0, &need) == HG_ERR_BUFFER_TOO_SMALL && need == 12, "label length");
  CHECK(element_label(l, f, q, 0, NULL, 8, &need) == HG_ERR_NULL_POINTER, "label NULL buf");
  CHECK(element_label(l, f, q, 0, buf, sizeof buf, NULL) == HG_ERR_NULL_POINTER, "label NULL needed");
  CHECK(element_label(l, f, q, 5, buf, sizeof buf, &need) == HG_ERR_OUT_OF_RANGE, "label index");
  CHECK(element_label(NULL, f, q, 0, buf, sizeof buf, &need) == HG_ERR_NULL_POINTER, "label NULL line");

  CHECK(hg_line_required_head(NULL, f, q, &a, &b) == HG_ERR_NULL_POINTER, "required NULL line");
  CHECK(hg_line_required_head(l, NULL, q, &a, &b) == HG_ERR_NULL_POINTER, "required NULL fluid");
  CHECK(hg_line_required_head(l, f, q, NULL, &b) == HG_ERR_NULL_POINTER, "required NULL head");
  CHECK(hg_line_required_head(l, f, q, &a, NULL) == HG_ERR_NULL_POINTER, "required NULL slope");
  CHECK(hg_line_required_head(l, f, -INFINITY, &a, &b) == HG_ERR_NOT_FINITE && msg_len() > 0, "required -inf");
  hg_line *u = NULL;
  CHECK(hg_line_with_uniform_diameter(NULL, 0.05, &u) == HG_ERR_NULL_POINTER && u == NULL, "uniform NULL line");
  CHECK(hg_line_with_uniform_diameter(l, 0.05, NULL) == HG_ERR_NULL_POINTER, "uniform NULL out");
  CHECK(hg_line_with_uniform_diameter(l, -0.05, &u) == HG_ERR_OUT_OF_RANGE && u == NULL && msg_len() > 0, "uniform -d");
  CHECK(hg_line_with_uniform_diameter(l, NAN, &u) == HG_ERR_NOT_FINITE && u == NULL, "uniform NaN");
  CHECK(hg_line_with_uniform_diameter(l, 0.08, &u) == HG_OK && u != NULL, "uniform");
  CHECK(hg_line_add_rise(u, 1.0) == HG_OK && hg_line_count(u, &n) == HG_OK && n == 3, "the copy grows on its own");
  CHECK(hg_line_count(l, &n) == HG_OK && n == 2, "the original is unchanged");
  hg_line_free(u);
  CHECK(hg_line_flow_for_head(NULL, f, 1, &a, &b, &c) == HG_ERR_NULL_POINTER, "solve NULL line");
  CHECK(hg_line_flow_for_head(l, NULL, 1, &a, &b, &c) == HG_ERR_NULL_POINTER, "solve NULL fluid");
  CHECK(hg_line_flow_for_head(l, f, 1, NULL, &b, &c) == HG_ERR_NULL_POINTER, "solve NULL flow");
  CHECK(hg_line_flow_for_head(l, f, 1, &a, NULL, &c) == HG_ERR_NULL_POINTER, "solve NULL low");
  CHECK(hg_line_flow_for_head(l, f, 1, &a, &b, NULL) == HG_ERR_NULL_POINTER, "solve NULL high");
  CHECK(hg_line_flow_for_head(l, f, 1.0, &a, &b, &c) == HG_OK && b <= a && a <= c, "solve band");
  /* Round trip: the required head at the solved flow is the head asked for. */
  CHECK(totals(l, f, a, &x) == HG_OK && fabs(x.required_head - 1.0) < 1e-9, "round trip %.17g",
        x.required_head);

  double qs[3] = {1e-3, 2e-3, NAN}, hs[3] = {7, 7, 7};
  CHECK(hg_line_system_curve(l, f, qs, 3, hs) == HG_ERR_NOT_FINITE && hs[0] == 7 && msg_len() > 0, "curve NaN");
  CHECK(hg_line_system_curve(l, f, qs, 0, hs) == HG_ERR_INVALID && msg_len() > 0, "curve n 0");
  CHECK(hg_line_system_curve(l, f, NULL, 2, hs) == HG_ERR_NULL_POINTER, "curve NULL flows");
  CHECK(hg_line_system_curve(l, f, qs, 2, NULL) == HG_ERR_NULL_POINTER, "curve NULL heads");
  CHECK(hg_line_system_curve(NULL, f, qs, 2, hs) == HG_ERR_NULL_POINTER, "curve NULL line");
  CHECK(hg_line_system_curve(l, NULL, qs, 2, hs) == HG_ERR_NULL_POINTER, "curve NULL fluid");
  CHECK(hg_line_system_curve(l, f, qs, 2, hs) == HG_OK && hs[2] == 7, "curve writes n heads");
  hg_line_free(l);
  hg_fluid_free(f);
}

/* The result handle: one evaluation read many times, outputs untouched on failure, the
 * not-applicable flags, the smallest struct sizes of the first release, and a result that
 * outlives its line and fluid. */
static void test_result_handle(void) {
  hg_line *l = NULL;
  hg_fluid *f = NULL;
  CHECK(hg_line_new(&l) == HG_OK && hg_fluid_water(293.15, 2e5, &f) == HG_OK, "handles");
  CHECK(hg_line_add_pipe_material(l, 0.05, 30.0, "commercial_steel") == HG_OK && hg_line_add_rise(l, 2.0) == HG_OK &&
            hg_line_add_fitting(l, "gate_valve", 0.0) == HG_OK, "a pipe, a rise, a valve");
  hg_line_result *sentinel = (hg_line_result *)(void *)&sentinel, *r = sentinel;
  CHECK(hg_line_evaluate(l, f, NAN, &r) == HG_ERR_NOT_FINITE && r == sentinel, "failure leaves *out");
  CHECK(hg_line_evaluate_at(l, f, 2e-3, -1.0, &r) == HG_ERR_OUT_OF_RANGE && r == sentinel, "evaluate_at leaves *out");
  CHECK(hg_line_evaluate(NULL, f, 2e-3, &r) == HG_ERR_NULL_POINTER && r == sentinel, "NULL line");
  CHECK(hg_line_evaluate(l, NULL, 2e-3, &r) == HG_ERR_NULL_POINTER && r == sentinel, "NULL fluid");
  CHECK(hg_line_evaluate(l, f, 2e-3, NULL) == HG_ERR_NULL_POINTER && msg_len() > 0, "NULL out");
  CHECK(hg_line_evaluate_at(l, f, 2e-3, 0.0, NULL) == HG_ERR_NULL_POINTER, "evaluate_at NULL out");
  hg_line_result_free(NULL);
  CHECK(hg_line_evaluate(l, f, 2e-3, &r) == HG_OK && r != sentinel && r != NULL, "evaluate");
  /* The result keeps its own numbers: free the line and fluid first. */
  hg_line_free(l);
  hg_fluid_free(f);

  hg_line_totals t;
  memset(&t, 0x5A, sizeof t);
  t.struct_size = sizeof t;
  CHECK(hg_line_result_totals(NULL, &t) == HG_ERR_NULL_POINTER, "totals NULL result");
  CHECK(hg_line_result_totals(r, NULL) == HG_ERR_NULL_POINTER, "totals NULL out");
  CHECK(hg_line_result_totals(r, &t) == HG_OK && t.element_count == 3 && t.band_source_count > 0, "totals");
  double share_sum = 0, share = -7;
  char name[64];
  size_t need = 0;
  for (size_t k = 0; k < t.band_source_count; k++) {
    CHECK(hg_line_result_band_source(r, k, name, sizeof name, &need, &share) == HG_OK && need == strlen(name), "src");
    share_sum += share;
  }
  CHECK(fabs(share_sum - 1.0) < 1e-12, "the shares of a band sum to 1 (exact by construction): %.17g", share_sum);
  CHECK(hg_line_result_band_source(r, t.band_source_count, name, sizeof name, &need, &share) == HG_ERR_OUT_OF_RANGE &&
            msg_len() > 0, "past the last source");
  /* A NULL buffer asks for the length: *needed is written, *share is not. */
  share = -7, need = 0;
  CHECK(hg_line_result_band_source(r, 0, NULL, 0, &need, &share) == HG_ERR_BUFFER_TOO_SMALL && need > 0 && share == -7,
        "length only: share untouched");
  CHECK(hg_line_result_band_source(r, 0, name, 2, &need, &share) == HG_ERR_BUFFER_TOO_SMALL && strlen(name) == 1 &&
            share == -7, "cut name: share untouched");
  CHECK(hg_line_result_band_source(r, 0, NULL, 4, &need, &share) == HG_ERR_NULL_POINTER, "NULL buf, len 4");
  CHECK(hg_line_result_band_source(r, 0, name, sizeof name, NULL, &share) == HG_ERR_NULL_POINTER, "NULL needed");
  CHECK(hg_line_result_band_source(r, 0, name, sizeof name, &need, NULL) == HG_ERR_NULL_POINTER, "NULL share");
  CHECK(hg_line_result_band_source(NULL, 0, name, sizeof name, &need, &share) == HG_ERR_NULL_POINTER, "NULL result");

  hg_element_result e[3];
  for (size_t i = 0; i < 3; i++) {
    memset(&e[i], 0x5A, sizeof e[i]);
    e[i].struct_size = sizeof e[i];
    CHECK(hg_line_result_element(r, i, &e[i]) == HG_OK, "element %zu", i);
  }
  CHECK(e[0].kind == HG_ELEMENT_PIPE && e[0].has_velocity && e[0].has_friction_factor && !e[0].has_k &&
            e[0].k == 0 && e[0].regime == HG_REGIME_TURBULENT && e[0].band_source_count > 0, "pipe flags");
  CHECK(e[1].kind == HG_ELEMENT_RISE && !e[1].has_velocity && !e[1].has_friction_factor && !e[1].has_k &&
            e[1].velocity == 0 && e[1].regime == HG_REGIME_NONE && e[1].band_source_count == 0, "rise flags");
  CHECK(e[2].kind == HG_ELEMENT_FITTING && e[2].has_velocity && !e[2].has_friction_factor && e[2].has_k && e[2].k > 0,
        "valve flags");
  CHECK(hg_line_result_element(r, 3, &e[0]) == HG_ERR_OUT_OF_RANGE && msg_len() > 0, "index past the end");
  CHECK(hg_line_result_element(r, SIZE_MAX, &e[0]) == HG_ERR_OUT_OF_RANGE, "index SIZE_MAX");
  /* The message gives SIZE_MAX exactly, not rounded through a double. */
  char msg[256];
  hg_last_error(msg, sizeof msg);
  CHECK(strstr(msg, "18446744073709551615") != NULL || SIZE_MAX != 18446744073709551615ULL, "exact: %s", msg);
  CHECK(hg_line_result_element(NULL, 0, &e[0]) == HG_ERR_NULL_POINTER, "element NULL result");
  CHECK(hg_line_result_element(r, 0, NULL) == HG_ERR_NULL_POINTER, "element NULL out");
  share = -7;
  CHECK(hg_line_result_element_band_source(r, 0, 0, name, sizeof name, &need, &share) == HG_OK && share > 0 &&
            share <= 1, "pipe source '%s'", name);
  CHECK(hg_line_result_element_band_source(r, 1, 0, name, sizeof name, &need, &share) == HG_ERR_OUT_OF_RANGE,
        "a rise has no sources");
  CHECK(hg_line_result_element_band_source(r, 3, 0, name, sizeof name, &need, &share) == HG_ERR_OUT_OF_RANGE,
        "element past the end");
  share = -7;
  CHECK(hg_line_result_element_band_source(r, 0, 0, NULL, 0, &need, &share) == HG_ERR_BUFFER_TOO_SMALL && share == -7,
        "element source length only");
  CHECK(hg_line_result_element_band_source(NULL, 0, 0, name, sizeof name, &need, &share) == HG_ERR_NULL_POINTER,
        "element source NULL result");
  CHECK(hg_line_result_label(r, 2, name, sizeof name, &need) == HG_OK && strcmp(name, "gate_valve 2") == 0, "label");
  CHECK(hg_line_result_label(r, 1, name, sizeof name, &need) == HG_OK && strcmp(name, "rise 1") == 0, "rise label");
  CHECK(hg_line_result_label(r, 3, name, sizeof name, &need) == HG_ERR_OUT_OF_RANGE, "label past the end");
  CHECK(hg_line_result_label(NULL, 0, name, sizeof name, &need) == HG_ERR_NULL_POINTER, "label NULL result");

#if SIZE_MAX == 18446744073709551615ULL
  /* The first released layouts (64-bit sizes): a caller compiled against them keeps
   * working when fields are added, and one byte less is refused. */
  hg_line_totals t2;
  t2.struct_size = 152;
  CHECK(hg_line_result_totals(r, &t2) == HG_OK, "totals of the first release (152 bytes)");
  t2.struct_size = 151;
  CHECK(hg_line_result_totals(r, &t2) == HG_ERR_INVALID && msg_len() > 0, "151 bytes");
  hg_element_result e2;
  e2.struct_size = 144;
  CHECK(hg_line_result_element(r, 0, &e2) == HG_OK, "element of the first release (144 bytes)");
  e2.struct_size = 143;
  CHECK(hg_line_result_element(r, 0, &e2) == HG_ERR_INVALID, "143 bytes");
#endif
  hg_line_result_free(r);
}

typedef struct {
  long bad;
} thread_arg;

static void *worker(void *p) {
  thread_arg *t = p;
  t->bad += for_each_record(ref_path, "line_", check_line_record, 1);
  t->bad += for_each_record(ref_path, "line_operating_point", check_solve_record, 1);
  t->bad += for_each_record(ref_path, "line_s", check_solve_record, 1);
  return NULL;
}

/* hg_set_threads / hg_threads: bounds, and the same system curve with one thread and
 * with several. Under valgrind (HYDROGRADE_THREADS=1) no batch runs with more than one
 * thread, so no pool is ever started there. */
static void test_threads(void) {
  size_t n0 = hg_threads();
  CHECK(n0 >= 1, "threads default %zu", n0);
  CHECK(hg_set_threads(0) == HG_ERR_OUT_OF_RANGE && msg_len() > 0, "threads 0");
  CHECK(hg_set_threads(HG_MAX_THREADS + 1) == HG_ERR_OUT_OF_RANGE, "threads max + 1");
  CHECK(hg_threads() == n0, "a refused setting leaves the threads");
  CHECK(hg_set_threads(1) == HG_OK && hg_threads() == 1, "threads 1");
  if (n0 > 1) {
    enum { N = 5000 };
    static double q[N], one[N], many[N];
    for (int i = 0; i < N; i++) q[i] = 1e-3 * (i + 1) / N; /* forward: lines[0] may hold a check valve */
    CHECK(hg_line_system_curve(lines[0], fluids[0], q, N, one) == HG_OK, "curve, 1 thread");
    CHECK(hg_set_threads(2) == HG_OK && hg_threads() == 2, "threads 2");
    CHECK(hg_line_system_curve(lines[0], fluids[0], q, N, many) == HG_OK, "curve, 2 threads");
    CHECK(memcmp(one, many, sizeof one) == 0, "threads change no bit");
  }
  CHECK(hg_set_threads(n0) == HG_OK && hg_threads() == n0, "threads restored");
}

/* The system curve's band: nominal bit for bit the system curve, ends bracketing it,
   and shared against independent roughness of one material (exact arithmetic: two equal
   pipes sharing one error give √2 times the standard uncertainty of independent ones). */
static void test_curve_band(void) {
  hg_line *l = NULL;
  hg_fluid *f = NULL;
  CHECK(hg_line_new(&l) == HG_OK && hg_fluid_water(293.15, 2e5, &f) == HG_OK, "curve band setup");
  CHECK(hg_line_add_pipe_material(l, 0.08, 100, "cast_iron") == HG_OK, "pipe 1");
  CHECK(hg_line_add_pipe_material(l, 0.08, 100, "cast_iron") == HG_OK, "pipe 2");
  hg_uncertainty_options u;
  hg_uncertainty_options_default(&u);
  u.friction_model = 0, u.fluid = 0, u.fittings = 0, u.equipment = 0;
  CHECK(hg_line_set_uncertainty(l, &u) == HG_OK, "roughness only");
  double q[4] = {0.0025, 0.005, 0.0075, 0.01}, h[4], lo[4], mid[4], hi[4];
  CHECK(hg_line_system_curve(l, f, q, 4, h) == HG_OK, "curve");
  CHECK(hg_line_system_curve_band(l, f, q, 4, lo, mid, hi) == HG_OK, "curve band");
  for (int i = 0; i < 4; i++)
    CHECK(mid[i] == h[i] && lo[i] < mid[i] && mid[i] < hi[i], "curve band %d: %g %g %g", i, lo[i], mid[i], hi[i]);
  double lo2[4], mid2[4], hi2[4];
  CHECK(hg_line_set_material_independent(l, "cast_iron", 1) == HG_OK, "independent");
  CHECK(hg_line_system_curve_band(l, f, q, 4, lo2, mid2, hi2) == HG_OK, "curve band, independent");
  double r = (hi[3] - lo[3]) / (hi2[3] - lo2[3]);
  /* u is √2 times larger when shared; the single shared (rectangular) source takes the
     smaller coverage factor 0.95·√3 against a two-input sum's, so the width ratio lies
     between 1 and √2. */
  CHECK(r > 1.05 && r < sqrt(2.0), "shared / independent width %.12g", r);
  CHECK(hg_line_set_material_independent(l, "cast_iron", 0) == HG_OK, "shared again");
  CHECK(hg_line_system_curve_band(l, f, q, 4, lo2, mid2, hi2) == HG_OK && hi2[3] == hi[3], "shared again band");
  CHECK(hg_line_set_material_independent(l, "unobtainium", 1) == HG_ERR_UNKNOWN_NAME && msg_len() > 0, "unknown material");
  CHECK(hg_line_set_material_independent(l, "cast_iron", 2) == HG_ERR_OUT_OF_RANGE, "independent 2");
  CHECK(hg_line_set_material_independent(l, NULL, 1) == HG_ERR_NULL_POINTER, "NULL material");
  CHECK(hg_line_set_material_independent(NULL, "cast_iron", 1) == HG_ERR_NULL_POINTER, "NULL line");
  q[1] = NAN;
  lo[1] = 7;
  CHECK(hg_line_system_curve_band(l, f, q, 4, lo, mid, hi) == HG_ERR_NOT_FINITE && lo[1] == 7, "curve band NaN");
  CHECK(hg_line_system_curve_band(l, f, q, 0, lo, mid, hi) == HG_ERR_INVALID, "curve band n = 0");
  CHECK(hg_line_system_curve_band(l, f, q, 4, lo, NULL, hi) == HG_ERR_NULL_POINTER, "curve band NULL out");
  CHECK(hg_line_system_curve_band(l, NULL, q, 4, lo, mid, hi) == HG_ERR_NULL_POINTER, "curve band NULL fluid");
  hg_line_free(l);
  hg_fluid_free(f);
}

/* The non-linear flag of the bands: an invented 20 m smooth 20 mm tube at Re = 2200, just
   below the laminar limit 2300, whose Re band (3 % bore tolerance, 2 % viscosity) reaches
   into the transition; Monte Carlo then parts from the first-order band. Far from the
   transition (Re = 2e5) the flag stays 0. Re = 4Q/(pi d nu), exact. */
static void test_non_linear_flag(void) {
  hg_line *l = NULL;
  hg_fluid *plain = NULL, *f = NULL;
  hg_uncertainty_options u;
  CHECK(hg_line_new(&l) == HG_OK && hg_line_add_pipe(l, 0.02, 20.0, 0.0) == HG_OK, "tube");
  CHECK(hg_uncertainty_options_default(&u) == HG_OK, "defaults");
  u.diameter = 0.03;
  CHECK(hg_line_set_uncertainty(l, &u) == HG_OK, "bore tolerance");
  CHECK(hg_fluid_liquid(998.2, 1.002e-3, &plain) == HG_OK &&
            hg_fluid_with_uncertainty(plain, 0.001, 0.02, &f) == HG_OK,
        "water with uncertainties");
  double nu = 1.002e-3 / 998.2, pi = 3.14159265358979323846;
  double q = 2200.0 * nu * pi * 0.02 / 4.0;
  hg_line_totals t;
  memset(&t, 0, sizeof t);
  t.struct_size = sizeof t;
  CHECK(totals(l, f, q, &t) == HG_OK && t.band_non_linear == 1, "flagged near the transition");
  hg_monte_carlo mc;
  memset(&mc, 0, sizeof mc);
  mc.struct_size = sizeof mc;
  CHECK(hg_line_monte_carlo(l, f, q, 20000, 7, &mc) == HG_OK, "monte carlo");
  double width = t.required_head_high - t.required_head_low;
  CHECK(fabs(mc.high - t.required_head_high) > 0.05 * width, "Monte Carlo parts: %.6g vs %.6g",
        mc.high, t.required_head_high);
  /* Far from it, with the default sources (no bore tolerance: 3 % on D alone would give
     h ∝ D^-4.8 a half-width near 29 %, flagged by the width rule): not flagged. */
  CHECK(hg_uncertainty_options_default(&u) == HG_OK && hg_line_set_uncertainty(l, &u) == HG_OK, "defaults");
  CHECK(totals(l, f, 2e5 * nu * pi * 0.02 / 4.0, &t) == HG_OK && t.band_non_linear == 0 && t.band_reserved == 0,
        "not flagged at Re 2e5");
  hg_fluid_free(f);
  hg_fluid_free(plain);
  hg_line_free(l);
}

/* The air around a line and the direction flow may take (hand-worked values). */
static void test_line_model(void) {
  hg_line *l = NULL;
  hg_fluid *hot = NULL, *water = NULL;
  CHECK(hg_line_new(&l) == HG_OK && hg_fluid_air(473.15, 101325.0, &hot) == HG_OK &&
            hg_fluid_water(293.15, 101325.0, &water) == HG_OK, "handles");
  CHECK(hg_line_add_pipe(l, 0.3, 30.0, 1.5e-4) == HG_OK && hg_line_add_rise(l, 30.0) == HG_OK, "flue");
  /* Stack effect (hydrostatics): -(rho_amb - rho_hot) g 30 m with ideal-gas densities
     p M/(R T), M = 0.0289647 kg/mol (from memory), R = 8.314462618 J/(mol K) (SI 2019). */
  double ra = 101325.0 * 0.0289647 / (8.314462618 * 293.15), rh = 101325.0 * 0.0289647 / (8.314462618 * 473.15);
  double want = -(ra - rh) * 9.80665 * 30.0;
  hg_line_totals t;
  memset(&t, 0, sizeof t);
  t.struct_size = sizeof t;
  CHECK(totals(l, hot, 0.0, &t) == HG_OK && fabs(t.required_pressure - want) < 1e-9 * fabs(want),
        "stack effect %.17g vs %.17g", t.required_pressure, want);
  CHECK(hg_line_set_surroundings(l, water) == HG_ERR_INVALID && strstr(last_msg(), "surroundings") != NULL,
        "surroundings must be a gas: %s", last_msg());
  CHECK(hg_line_set_surroundings(l, hot) == HG_OK && totals(l, hot, 0.0, &t) == HG_OK && t.required_pressure == 0.0,
        "a column of the surroundings' own air adds nothing");
  CHECK(hg_line_set_surroundings(l, NULL) == HG_OK, "back to the default surroundings");
  int blocks = -1;
  CHECK(hg_line_blocks_reverse_flow(l, &blocks) == HG_OK && blocks == 0, "no check valve");
  CHECK(hg_line_add_fitting(l, "swing_check_valve", 0.0) == HG_OK, "check valve");
  CHECK(hg_line_blocks_reverse_flow(l, &blocks) == HG_OK && blocks == 1, "blocks");
  CHECK(hg_line_blocks_reverse_flow(NULL, &blocks) == HG_ERR_NULL_POINTER, "NULL line");
  CHECK(hg_line_blocks_reverse_flow(l, NULL) == HG_ERR_NULL_POINTER, "NULL out");
  double h = 0, d = 0;
  CHECK(hg_line_required_head(l, water, -1e-3, &h, &d) == HG_ERR_NO_SOLUTION &&
            strstr(last_msg(), "swing_check_valve (element 2)") != NULL,
        "reverse flow refused naming the valve: %s", last_msg());
  CHECK(hg_line_set_air_column_for_liquids(l, 2) == HG_ERR_OUT_OF_RANGE, "on must be 0 or 1");
  /* Each row names the bore its velocity refers to and a pipe its length (the route as
     typed): 300 mm pipe of 30 m, a rise with neither, the valve in the pipe's bore. */
  hg_line_result *r = NULL;
  CHECK(hg_line_evaluate(l, water, 1e-3, &r) == HG_OK, "evaluate");
  hg_element_result e;
  memset(&e, 0, sizeof e);
  e.struct_size = sizeof e;
  CHECK(hg_line_result_element(r, 0, &e) == HG_OK && e.has_bore == 1 && e.bore == 0.3 && e.has_length == 1 &&
            e.length == 30.0,
        "pipe bore %g length %g", e.bore, e.length);
  CHECK(hg_line_result_element(r, 1, &e) == HG_OK && e.has_bore == 0 && e.bore == 0.0 && e.has_length == 0,
        "rise has neither");
  CHECK(hg_line_result_element(r, 2, &e) == HG_OK && e.has_bore == 1 && e.bore == 0.3 && e.has_length == 0,
        "valve in the pipe's bore %g", e.bore);
  hg_line_result_free(r);
  hg_fluid_free(hot);
  hg_fluid_free(water);
  hg_line_free(l);
}

/* The builder: labels, counted fittings, slices and joins (hg_line wraps the core's
 * LineBuilder). */
static void test_builder(void) {
  hg_line *l = NULL, *part = NULL, *tail = NULL;
  hg_fluid *w = NULL;
  CHECK(hg_line_new(&l) == HG_OK && hg_fluid_liquid(998.0, 1.0e-3, &w) == HG_OK, "handles");
  CHECK(hg_line_add_pipe(l, 0.05, 10.0, 4.5e-5) == HG_OK && hg_line_add_fitting_k(l, 0.3, 0.0) == HG_OK &&
            hg_line_add_rise(l, 6.0) == HG_OK, "route");
  CHECK(hg_line_set_count(l, 1, 6) == HG_OK, "six elbows");
  CHECK(hg_line_set_label(l, 2, "up to the roof") == HG_OK, "label");
  double q = 2.0 * 3.14159265358979323846 * 0.05 * 0.05 / 4.0; /* 2 m/s in 50 mm */
  hg_line_result *r = NULL;
  CHECK(hg_line_evaluate(l, w, q, &r) == HG_OK, "evaluate");
  hg_element_result e;
  memset(&e, 0, sizeof e);
  e.struct_size = sizeof e;
  /* 6 * 0.3 * (2 m/s)^2 / (2 g): exact from the definition of K. */
  double want = 6.0 * 0.3 * 4.0 / (2.0 * 9.80665);
  CHECK(hg_line_result_element(r, 1, &e) == HG_OK && fabs(e.head_loss - want) < 1e-12 * want && e.count == 6,
        "counted row %.17g vs %.17g, count %zu", e.head_loss, want, e.count);
  CHECK(e.has_band_share == 1 && e.band_share > 0.0 && e.band_share < 1.0, "band share %g", e.band_share);
  char buf[64];
  size_t need = 0;
  CHECK(hg_line_result_label(r, 1, buf, sizeof buf, &need) == HG_OK && strcmp(buf, "6 × fitting 1") == 0,
        "counted label '%s'", buf);
  CHECK(hg_line_result_label(r, 2, buf, sizeof buf, &need) == HG_OK && strcmp(buf, "up to the roof") == 0,
        "user label '%s'", buf);
  CHECK(hg_line_result_label(r, 0, buf, sizeof buf, &need) == HG_OK && strcmp(buf, "pipe 0") == 0,
        "default label '%s'", buf);
  hg_line_result_free(r);

  /* Bad input names the parameter. */
  CHECK(hg_line_set_count(l, 1, 0) == HG_ERR_OUT_OF_RANGE && strstr(last_msg(), "count = 0") != NULL,
        "count 0: %s", last_msg());
  CHECK(hg_line_set_count(l, 0, 2) == HG_ERR_INVALID && strstr(last_msg(), "count") != NULL,
        "count on a pipe: %s", last_msg());
  CHECK(hg_line_set_count(l, 9, 2) == HG_ERR_OUT_OF_RANGE && strstr(last_msg(), "index = 9") != NULL,
        "count index: %s", last_msg());
  CHECK(hg_line_set_label(l, 9, "x") == HG_ERR_OUT_OF_RANGE && strstr(last_msg(), "index = 9") != NULL,
        "label index: %s", last_msg());
  char longer[200];
  memset(longer, 'x', sizeof longer - 1);
  longer[sizeof longer - 1] = 0;
  CHECK(hg_line_set_label(l, 0, longer) == HG_ERR_INVALID && strncmp(last_msg(), "label: ", 7) == 0,
        "label too long: %s", last_msg());
  CHECK(hg_line_set_label(l, 0, "\xff\xfe") == HG_ERR_INVALID && strncmp(last_msg(), "label: ", 7) == 0,
        "label not UTF-8: %s", last_msg());
  CHECK(hg_line_set_label(l, 0, "") == HG_ERR_INVALID, "empty label");
  CHECK(hg_line_set_label(NULL, 0, "x") == HG_ERR_NULL_POINTER, "NULL line");
  CHECK(hg_line_set_label(l, 2, NULL) == HG_OK, "NULL gives back the default label");

  /* Slices and joins. */
  CHECK(hg_line_slice(l, 1, 1, &part) == HG_ERR_INVALID && strncmp(last_msg(), "slice: ", 7) == 0,
        "empty slice: %s", last_msg());
  CHECK(hg_line_slice(l, 0, 9, &part) == HG_ERR_OUT_OF_RANGE && strstr(last_msg(), "end = 9") != NULL,
        "slice end: %s", last_msg());
  CHECK(hg_line_slice(l, 2, 1, &part) == HG_ERR_OUT_OF_RANGE && part == NULL, "slice reversed");
  CHECK(hg_line_slice(l, 0, 1, NULL) == HG_ERR_NULL_POINTER, "slice NULL out");
  CHECK(hg_line_slice(l, 0, 2, &part) == HG_OK && hg_line_slice(l, 2, 3, &tail) == HG_OK, "slices");
  size_t n = 0;
  CHECK(hg_line_count(part, &n) == HG_OK && n == 2, "slice length %zu", n);
  CHECK(hg_line_append_line(part, tail) == HG_OK && hg_line_count(part, &n) == HG_OK && n == 3, "joined");
  double h1 = 0, h2 = 0, d = 0;
  CHECK(hg_line_required_head(l, w, q, &h1, &d) == HG_OK && hg_line_required_head(part, w, q, &h2, &d) == HG_OK &&
            bits_of(h1) == bits_of(h2),
        "a line cut and joined again is the same line: %.17g vs %.17g", h1, h2);
  CHECK(hg_line_append_line(part, part) == HG_OK && hg_line_count(part, &n) == HG_OK && n == 6, "self-append");
  CHECK(hg_line_append_line(part, NULL) == HG_ERR_NULL_POINTER, "append NULL");
  hg_uncertainty_options u;
  memset(&u, 0, sizeof u);
  u.struct_size = sizeof u;
  CHECK(hg_line_set_uncertainty(tail, &u) == HG_OK, "tail without bands");
  CHECK(hg_line_append_line(l, tail) == HG_ERR_INVALID && strncmp(last_msg(), "other: ", 7) == 0,
        "options differ: %s", last_msg());
  hg_line_free(part);
  hg_line_free(tail);
  hg_fluid_free(w);
  hg_line_free(l);
}

/* Least-squares pump curves: points on H = 40 - 20000 Q^2 (exact quadratic) give that
 * parabola back (exact solution); the operating point with either curve meets the line's
 * required head; degree 0 is exactly hg_line_operating_point. */
static void test_pump_fit(void) {
  double q[7], h[7], c[4], rms, mx, hd, dh, o[6], p[6], need, dneed;
  for (int i = 0; i < 7; i++) {
    q[i] = 0.005 * i;
    h[i] = 40.0 - 20000.0 * q[i] * q[i];
  }
  CHECK(hg_pump_curve_fit(q, h, 7, 2, c, &rms, &mx) == HG_OK, "fit: %s", last_msg());
  CHECK(fabs(c[0] - 40.0) < 1e-11 && fabs(c[1]) < 1e-8 && fabs(c[2] / -20000.0 - 1) < 1e-11 && c[3] == 0.0,
        "fit coefficients %.17g %.17g %.17g %.17g", c[0], c[1], c[2], c[3]);
  CHECK(rms < 1e-12 && mx < 1e-12, "exact data: residual %g %g", rms, mx);
  CHECK(hg_pump_curve_fit_head(q, h, 7, 2, 0.015, &hd, &dh) == HG_OK && fabs(hd - 35.5) < 1e-11
        && fabs(dh / -600.0 - 1) < 1e-10, "fit head %.17g slope %.17g", hd, dh);
  hg_fluid *w = NULL;
  hg_line *l = NULL;
  CHECK(hg_fluid_water(293.15, 101325.0, &w) == HG_OK && hg_line_new(&l) == HG_OK, "handles");
  CHECK(hg_line_add_pipe(l, 0.08, 150.0, 4.5e-5) == HG_OK && hg_line_add_rise(l, 12.0) == HG_OK, "line");
  CHECK(hg_line_operating_point_fit(l, w, q, h, 7, 2, &o[0], &o[1], &o[2], &o[3], &o[4], &o[5]) == HG_OK,
        "op fit: %s", last_msg());
  CHECK(hg_line_required_head(l, w, o[0], &need, &dneed) == HG_OK && fabs(need / o[1] - 1) < 1e-9,
        "op fit meets the line: %.17g vs %.17g", need, o[1]);
  CHECK(hg_pump_curve_fit_head(q, h, 7, 2, o[0], &hd, &dh) == HG_OK && hd == o[1], "op head on the fit");
  CHECK(hg_line_operating_point_fit(l, w, q, h, 7, 0, &o[0], &o[1], &o[2], &o[3], &o[4], &o[5]) == HG_OK
        && hg_line_operating_point(l, w, q, h, 7, &p[0], &p[1], &p[2], &p[3], &p[4], &p[5]) == HG_OK
        && memcmp(o, p, sizeof o) == 0, "degree 0 is the monotone cubic, bit for bit");
  /* Bad input: degree, too few points, flows not increasing, NaN, NULL. */
  CHECK(hg_pump_curve_fit(q, h, 7, 4, c, &rms, &mx) == HG_ERR_OUT_OF_RANGE && msg_len() > 0, "degree 4");
  CHECK(hg_pump_curve_fit(q, h, 7, 0, c, &rms, &mx) == HG_ERR_OUT_OF_RANGE, "degree 0 is not a fit");
  CHECK(hg_pump_curve_fit(q, h, 3, 3, c, &rms, &mx) == HG_ERR_INVALID, "3 points for a cubic");
  CHECK(hg_line_operating_point_fit(l, w, q, h, 7, -1, &o[0], &o[1], &o[2], &o[3], &o[4], &o[5]) == HG_ERR_OUT_OF_RANGE,
        "op degree -1");
  double qq[4] = {0.0, 0.02, 0.01, 0.03};
  CHECK(hg_pump_curve_fit(qq, h, 4, 2, c, &rms, &mx) == HG_ERR_OUT_OF_RANGE, "flows not increasing");
  h[2] = NAN;
  CHECK(hg_pump_curve_fit(q, h, 7, 2, c, &rms, &mx) == HG_ERR_NOT_FINITE, "NaN head");
  CHECK(hg_pump_curve_fit(NULL, h, 7, 2, c, &rms, &mx) == HG_ERR_NULL_POINTER, "NULL flows");
  CHECK(hg_pump_curve_fit(q, h, 7, 2, NULL, &rms, &mx) == HG_ERR_NULL_POINTER, "NULL coefficients");
  CHECK(hg_pump_curve_fit_head(q, h, 7, 2, 0.01, NULL, &dh) == HG_ERR_NULL_POINTER, "NULL head");
  hg_line_free(l);
  hg_fluid_free(w);
}

/* NPSH available along a suction line, written out by hand: an open tank (101 325 Pa on
   its surface) feeds a square-edged inlet (K = 0.5, Crane TP-410, from memory) and a 3 m
   lift in a 100 mm bore at 20 L/s of a liquid of 998.2 kg/m3 with a vapour pressure of
   2339 Pa. Bernoulli with losses from the surface (V = 0) to the top of the lift:
   p_total = p_atm - rho g 3 - 0.5 (rho V^2 / 2); NPSHa = (p_total - p_v)/(rho g)
   (definition, e.g. ISO 9906). */
static void test_npsh(void) {
  hg_line *l = NULL;
  hg_fluid *liquid = NULL, *f = NULL;
  CHECK(hg_line_new(&l) == HG_OK && hg_fluid_liquid(998.2, 1.0e-3, &liquid) == HG_OK &&
            hg_fluid_with_vapour_pressure(liquid, 2339.0, &f) == HG_OK, "handles");
  CHECK(hg_line_add_from_tank(l, HG_EDGE_SQUARE, 0.0) == HG_OK && hg_line_add_rise(l, 3.0) == HG_OK &&
            hg_line_add_pipe(l, 0.1, 1.0, 4.5e-5) == HG_OK, "suction line");
  double q = 0.02, v = q / (3.14159265358979323846 * 0.1 * 0.1 / 4.0), rho = 998.2, g = 9.80665;
  double total = 101325.0 - rho * g * 3.0 - 0.5 * (0.5 * rho * v * v);
  double want = (total - 2339.0) / (rho * g);
  hg_line_result *r = NULL;
  double npsh = -1.0, avail = -1.0;
  int32_t ok = -1;
  CHECK(hg_line_evaluate_at(l, f, q, 101325.0, &r) == HG_OK, "evaluate");
  CHECK(hg_line_result_npsh_available(r, 1, &npsh) == HG_OK && fabs(npsh - want) < 1e-12 * want,
        "NPSHa %.17g vs %.17g", npsh, want);
  CHECK(hg_line_result_npsh_check(r, 1, 5.0, 0.5, &avail, &ok) == HG_OK && avail == npsh && ok == 1,
        "enough for 5 m + 0.5 m (NPSHa %.3f m)", avail);
  CHECK(hg_line_result_npsh_check(r, 1, want, 0.5, &avail, &ok) == HG_OK && ok == 0, "not enough with the margin");
  /* Bad questions: a row outside the line, a negative NPSH required, NULL pointers. */
  CHECK(hg_line_result_npsh_available(r, 3, &npsh) == HG_ERR_OUT_OF_RANGE && strstr(last_msg(), "index") != NULL,
        "index outside the line: %s", last_msg());
  avail = -7.0;
  CHECK(hg_line_result_npsh_check(r, 1, -1.0, 0.5, &avail, &ok) == HG_ERR_OUT_OF_RANGE &&
            strstr(last_msg(), "required") != NULL && avail == -7.0,
        "negative NPSH required: %s", last_msg());
  CHECK(hg_line_result_npsh_check(r, 1, NAN, 0.5, &avail, &ok) == HG_ERR_NOT_FINITE, "NaN required");
  CHECK(hg_line_result_npsh_available(r, 1, NULL) == HG_ERR_NULL_POINTER, "NULL out");
  CHECK(hg_line_result_npsh_check(r, 1, 1.0, 0.5, &avail, NULL) == HG_ERR_NULL_POINTER, "NULL sufficient");
  CHECK(hg_line_result_npsh_available(NULL, 1, &npsh) == HG_ERR_NULL_POINTER, "NULL result");
  hg_line_result_free(r);
  r = NULL;
  CHECK(hg_line_evaluate(l, liquid, q, &r) == HG_OK && hg_line_result_npsh_available(r, 1, &npsh) == HG_ERR_INVALID &&
            strstr(last_msg(), "inlet_pressure") != NULL,
        "no inlet pressure: %s", last_msg());
  hg_line_result_free(r);
  r = NULL;
  CHECK(hg_line_evaluate_at(l, liquid, q, 101325.0, &r) == HG_OK &&
            hg_line_result_npsh_available(r, 1, &npsh) == HG_ERR_INVALID && strstr(last_msg(), "vapour") != NULL,
        "no vapour pressure: %s", last_msg());
  hg_line_result_free(r);
  hg_fluid_free(liquid);
  hg_fluid_free(f);
  hg_line_free(l);
}

/* 1 when some message of the line evaluated at q contains `text`. */
static int says(const hg_line *l, const hg_fluid *f, double q, uint32_t bit, const char *text) {
  hg_line_result *r = NULL;
  hg_line_totals t;
  memset(&t, 0, sizeof t);
  t.struct_size = sizeof t;
  int found = 0;
  size_t n = 0, need = 0;
  char buf[512];
  if (hg_line_evaluate(l, f, q, &r) == HG_OK && hg_line_result_totals(r, &t) == HG_OK && (t.warnings & bit) &&
      hg_line_result_message_count(r, &n) == HG_OK)
    for (size_t i = 0; i < n && !found; i++)
      found = hg_line_result_message(r, i, buf, sizeof buf, &need) == HG_OK && strstr(buf, text) != NULL;
  hg_line_result_free(r);
  return found;
}

/* Unit slips warn with the likely unit (each conversion exact by SI prefixes and NIST
   SP 811); the same values in SI pass. */
static void test_unit_slips(void) {
  hg_fluid *water = NULL, *syrup = NULL;
  CHECK(hg_fluid_liquid(998.2, 1.002e-3, &water) == HG_OK && hg_fluid_liquid(975.0, 0.377, &syrup) == HG_OK, "fluids");
  hg_line *l = NULL;
  /* Bore 47.5 m (meant mm): 47.5 mm = 0.0475 m. */
  CHECK(hg_line_new(&l) == HG_OK && hg_line_add_pipe(l, 47.5, 100.0, 4.5e-5) == HG_OK, "line");
  CHECK(says(l, water, 4.5e-3, HG_WARN_IMPLAUSIBLE_BORE, "bore 47.5 m; inputs are SI: 47.5 mm is 0.0475 m"), "bore");
  hg_line_free(l);
  /* 4.5 m3/s in 50 mm: V = 4Q/(pi d^2) = 2292 m/s > 15 m/s; 4.5 L/s = 0.0045 m3/s. */
  CHECK(hg_line_new(&l) == HG_OK && hg_line_add_pipe(l, 0.05, 100.0, 4.5e-5) == HG_OK, "line");
  CHECK(says(l, water, 4.5, HG_WARN_IMPLAUSIBLE_VELOCITY, "4.5 L/s is 0.0045 m³/s"), "flow");
  CHECK(!says(l, water, 4.5e-3, HG_WARN_IMPLAUSIBLE_VELOCITY, "L/s"), "4.5 L/s passes");
  /* Viscosity 0.377 Pa s at water's density (meant cP): 0.377 cP = 0.000377 Pa s. */
  CHECK(says(l, syrup, 1e-3, HG_WARN_IMPLAUSIBLE_VISCOSITY, "0.377 cP is 0.000377 Pa·s"), "viscosity");
  /* Rated drop 1.5 Pa (meant bar): 1.5 bar = 150000 Pa. */
  CHECK(hg_line_add_equipment(l, "filter", 1.5, 0.005) == HG_OK, "filter");
  CHECK(says(l, water, 0.005, HG_WARN_IMPLAUSIBLE_RATED_DROP, "1.5 bar is 150000 Pa"), "rated drop");
  hg_line_free(l);
  /* 250 km of pipe: 250000 mm = 250 m. */
  CHECK(hg_line_new(&l) == HG_OK && hg_line_add_pipe(l, 0.5, 250e3, 4.5e-5) == HG_OK, "line");
  CHECK(says(l, water, 0.3, HG_WARN_IMPLAUSIBLE_LENGTH, "250000 mm is 250 m"), "length");
  /* Bad questions about messages. */
  hg_line_result *r = NULL;
  size_t n = 0, need = 0;
  CHECK(hg_line_evaluate(l, water, 0.3, &r) == HG_OK && hg_line_result_message_count(r, &n) == HG_OK && n == 1, "one");
  CHECK(hg_line_result_message(r, 1, NULL, 0, &need) == HG_ERR_OUT_OF_RANGE, "message index");
  CHECK(hg_line_result_message(r, 0, NULL, 0, &need) == HG_ERR_BUFFER_TOO_SMALL && need > 20, "length only");
  CHECK(hg_line_result_message_count(r, NULL) == HG_ERR_NULL_POINTER, "NULL count");
  hg_line_result_free(r);
  hg_line_free(l);
  hg_fluid_free(water);
  hg_fluid_free(syrup);
}

/* A strainer rated 20 kPa at 10 L/s with a fluid of 1000 kg/m3, passing 1100 kg/m3 at
   10 L/s: fixed K, dp = drop rho/rho_rating = 22 000 Pa (definition of K). */
static void test_rated_density(void) {
  hg_line *l = NULL;
  hg_fluid *glycol = NULL;
  CHECK(hg_line_new(&l) == HG_OK && hg_fluid_liquid(1100.0, 4e-3, &glycol) == HG_OK, "handles");
  CHECK(hg_line_add_equipment_rated(l, "strainer", 2e4, 0.01, 1000.0) == HG_OK, "rated equipment");
  hg_line_totals t;
  memset(&t, 0, sizeof t);
  t.struct_size = sizeof t;
  CHECK(totals(l, glycol, 0.01, &t) == HG_OK && fabs(t.pressure_loss - 22000.0) < 1e-9, "22 kPa: %.17g",
        t.pressure_loss);
  CHECK(hg_line_add_equipment_rated(l, "strainer", 2e4, 0.01, -1.0) == HG_ERR_OUT_OF_RANGE &&
            strstr(last_msg(), "rating_density") != NULL,
        "bad rating density: %s", last_msg());
  CHECK(hg_line_add_equipment_rated(l, NULL, 2e4, 0.01, 1000.0) == HG_ERR_NULL_POINTER, "NULL name");
  hg_fluid_free(glycol);
  hg_line_free(l);
  /* A header 12 m up needing 2.5 bar above the start: required head = dz + losses +
     p_end/(rho g) (energy balance); at zero flow 12 + 2.5e5/(998.2 g). */
  hg_fluid *water = NULL;
  CHECK(hg_line_new(&l) == HG_OK && hg_fluid_liquid(998.2, 1.002e-3, &water) == HG_OK, "handles");
  CHECK(hg_line_add_pipe(l, 0.05, 60.0, 4.5e-5) == HG_OK && hg_line_add_rise(l, 12.0) == HG_OK, "line");
  CHECK(hg_line_set_end_pressure(l, 2.5e5) == HG_OK, "end pressure");
  double h = 0, d = 0, want = 12.0 + 2.5e5 / (998.2 * 9.80665);
  CHECK(hg_line_required_head(l, water, 0.0, &h, &d) == HG_OK && fabs(h - want) < 1e-12, "%.17g vs %.17g", h, want);
  CHECK(hg_line_set_end_pressure(l, NAN) == HG_ERR_NOT_FINITE && strstr(last_msg(), "end_pressure") != NULL, "NaN");
  CHECK(hg_line_set_end_pressure(l, 0.0) == HG_OK && hg_line_required_head(l, water, 0.0, &h, &d) == HG_OK && h == 12.0,
        "0 clears it");
  CHECK(hg_line_set_end_pressure(NULL, 1.0) == HG_ERR_NULL_POINTER, "NULL line");
  hg_fluid_free(water);
  hg_line_free(l);
}

/* Sizing resizes what it should (laminar oil, Hagen-Poiseuille, exact:
   dp = 128 mu L Q / (pi D^4)). */
static void test_resize(void) {
  const double mu = 0.1, q = 1e-4, pi = 3.14159265358979323846;
  hg_line *l = NULL, *u = NULL;
  hg_fluid *oil = NULL, *water = NULL;
  CHECK(hg_line_new(&l) == HG_OK && hg_fluid_liquid(900.0, mu, &oil) == HG_OK &&
            hg_fluid_liquid(998.2, 1.002e-3, &water) == HG_OK,
        "handles");
  CHECK(hg_line_add_pipe(l, 0.1, 10.0, 4.5e-5) == HG_OK && hg_line_add_contraction(l, 0.1, 0.05) == HG_OK &&
            hg_line_add_pipe(l, 0.05, 10.0, 4.5e-5) == HG_OK,
        "line with a reducer");
  size_t n = 0;
  hg_line_totals t;
  memset(&t, 0, sizeof t);
  t.struct_size = sizeof t;
  /* The whole line at 30 mm: the reducer goes; the loss is 20 m of 30 mm pipe. */
  double want = 128.0 * mu * 20.0 * q / (pi * pow(0.03, 4));
  CHECK(hg_line_with_uniform_diameter(l, 0.03, &u) == HG_OK && hg_line_count(u, &n) == HG_OK && n == 2,
        "no phantom reducer: %zu elements", n);
  CHECK(totals(u, oil, q, &t) == HG_OK && fabs(t.pressure_loss - want) <= 1e-12 * want, "%.17g vs %.17g",
        t.pressure_loss, want);
  hg_line_free(u), u = NULL;
  /* The downstream pipe alone to 100 mm: the reducer joins equal bores and goes. */
  CHECK(hg_line_with_diameter_in(l, 0.1, 2, 3, NULL, &u) == HG_OK && hg_line_count(u, &n) == HG_OK && n == 2,
        "section: %zu elements", n);
  hg_line_free(u), u = NULL;
  /* In PVC: the same numbers as the line built of PVC pipes of 30 mm. */
  hg_line *pvc = NULL;
  hg_line_totals w;
  memset(&w, 0, sizeof w);
  w.struct_size = sizeof w;
  CHECK(hg_line_new(&pvc) == HG_OK && hg_line_add_pipe_material(pvc, 0.03, 10.0, "pvc") == HG_OK &&
            hg_line_add_pipe_material(pvc, 0.03, 10.0, "pvc") == HG_OK,
        "pvc line");
  CHECK(hg_line_with_diameter_in(l, 0.03, 0, 3, "pvc", &u) == HG_OK && totals(u, water, 2e-3, &t) == HG_OK &&
            totals(pvc, water, 2e-3, &w) == HG_OK && t.pressure_loss == w.pressure_loss,
        "pvc roughness: %.17g vs %.17g", t.pressure_loss, w.pressure_loss);
  hg_line_free(u), u = NULL;
  hg_line_free(pvc);
  /* Bad sections and materials name what is wrong. */
  CHECK(hg_line_with_diameter_in(l, 0.03, 2, 2, NULL, &u) == HG_ERR_OUT_OF_RANGE && u == NULL &&
            strstr(last_msg(), "start") != NULL,
        "empty section: %s", last_msg());
  CHECK(hg_line_with_diameter_in(l, 0.03, 0, 4, NULL, &u) == HG_ERR_OUT_OF_RANGE && strstr(last_msg(), "end") != NULL,
        "past the end: %s", last_msg());
  CHECK(hg_line_with_diameter_in(l, 0.03, 1, 2, NULL, &u) == HG_ERR_INVALID && strstr(last_msg(), "round pipe") != NULL,
        "no pipe: %s", last_msg());
  CHECK(hg_line_with_diameter_in(l, 0.03, 0, 3, "cheese", &u) == HG_ERR_UNKNOWN_NAME && u == NULL, "material");
  CHECK(hg_line_with_diameter_in(NULL, 0.03, 0, 3, NULL, &u) == HG_ERR_NULL_POINTER, "NULL line");
  CHECK(hg_line_with_diameter_in(l, 0.03, 0, 3, NULL, NULL) == HG_ERR_NULL_POINTER, "NULL out");
  /* A section sized to a velocity: D = sqrt(4Q/(pi v)), exact. */
  hg_sizing z;
  memset(&z, 0, sizeof z);
  z.struct_size = sizeof z;
  want = sqrt(4.0 * q / (pi * 1.0));
  CHECK(hg_line_size_in(l, oil, q, HG_LIMIT_VELOCITY, 1.0, NULL, NULL, 2, 3, NULL, &z) == HG_OK &&
            fabs(z.min_inside_diameter - want) <= 1e-15 * want,
        "%.17g vs %.17g", z.min_inside_diameter, want);
  CHECK(hg_line_size_in(l, oil, q, HG_LIMIT_VELOCITY, 1.0, "pvc", "40", 0, 1, "pvc", &z) == HG_OK &&
            z.standard.found == 1 && z.standard.inside_diameter >= want,
        "pvc table section");
  CHECK(hg_line_size_in(l, oil, q, HG_LIMIT_VELOCITY, 1.0, NULL, NULL, 0, 9, NULL, &z) == HG_ERR_OUT_OF_RANGE,
        "size past the end");
  CHECK(hg_line_size_in(l, oil, q, HG_LIMIT_VELOCITY, 1.0, NULL, NULL, 0, 3, NULL, NULL) == HG_ERR_NULL_POINTER,
        "size NULL out");
  hg_fluid_free(oil);
  hg_fluid_free(water);
  hg_line_free(l);
}

/* A pump as an element of a line (hg_line_add_pump) and the flow the line runs at by
 * itself (hg_line_pumped_flow): the pump line of core_reference.rs's pumps(), built here
 * the same way, against the Rust core bit for bit and against the closed form. */
static hg_line *pump_line;

static int32_t build_pump_line(hg_line **out) {
  double q[11], h[11];
  for (int i = 0; i < 11; i++) q[i] = 0.015 * (double)i / 10.0, h[i] = 40.0 - 1.5e5 * q[i] * q[i];
  int32_t s = hg_line_new(out);
  if (s == HG_OK) s = hg_line_add_fitting_k(*out, 2.5, 0.05);
  if (s == HG_OK) s = hg_line_add_pump(*out, q, h, 11, 2);
  if (s == HG_OK) s = hg_line_add_fitting_k(*out, 12.0, 0.05);
  if (s == HG_OK) s = hg_line_add_rise(*out, 15.0);
  if (s == HG_OK) s = hg_line_set_inlet_pressure(*out, 101325.0);
  return s;
}

static long check_pump_record(const record *r, int quiet) {
  const hg_fluid *f = fluids[r->in[0].i];
  tok got[4];
  int n = 0;
  int32_t s;
  if (strcmp(r->tag, "pump_flow") == 0) {
    double q, h, npsh;
    int32_t has;
    s = hg_line_pumped_flow(pump_line, f, &q, &h, &npsh, &has, NULL);
    got[n++] = tok_d(q), got[n++] = tok_d(h), got[n++] = tok_d(npsh), got[n++] = tok_d((double)has);
  } else {
    double h, d;
    s = hg_line_required_head(pump_line, f, r->in[1].d, &h, &d);
    got[n++] = tok_d(h), got[n++] = tok_d(d);
  }
  int same = r->err ? s == code_of_kind(r->kind) && msg_len() > 0 : s == HG_OK && same_tokens(r, got, n);
  if (!quiet) CHECK(same, "%s fluid %lld: status %d (want %s)", r->tag, r->in[0].i, s, r->err ? r->kind : "HG_OK");
  return !same;
}

static void test_pump_element(void) {
  CHECK(build_pump_line(&pump_line) == HG_OK, "pump line");
  long bad = for_each_record(ref_path, "pump_flow", check_pump_record, 0);
  CHECK(records_seen == 2, "pump_flow records: %ld", records_seen);
  bad += for_each_record(ref_path, "pump_eval", check_pump_record, 0);
  CHECK(records_seen == 6, "pump_eval records: %ld", records_seen);
  printf("bitwise: pump records, %ld differ\n", bad);
  /* Closed form (energy balance, definition of K): 40 - 1.5e5 Q^2 = 15 + (2.5 + 12) Q^2/(2 g A^2)
   * => Q = sqrt(25/(1.5e5 + 14.5/(2 g A^2))), A = pi 0.05^2/4. */
  const double g = 9.80665, a = 3.14159265358979323846 * 0.05 * 0.05 / 4.0;
  const double want = sqrt(25.0 / (1.5e5 + 14.5 / (2.0 * g * a * a)));
  double q = -1, h = -1, npsh = -1;
  int32_t has = -1;
  hg_line_result *r = NULL;
  CHECK(hg_line_pumped_flow(pump_line, fluids[1], &q, &h, &npsh, &has, &r) == HG_OK, "pumped flow: %s", last_msg());
  CHECK(fabs(q - want) < 1e-12 * want, "pumped flow %.17g vs %.17g", q, want);
  CHECK(fabs(h - (40.0 - 1.5e5 * want * want)) < 1e-9, "pump head %.17g", h);
  /* NPSH at the suction is the NPSH at the outlet of the strainer before the pump. */
  double before = -2;
  CHECK(has == 1 && hg_line_result_npsh_available(r, 0, &before) == HG_OK && before == npsh, "NPSH %g vs %g", npsh,
        before);
  hg_element_result e;
  memset(&e, 0, sizeof e);
  e.struct_size = sizeof e;
  CHECK(hg_line_result_element(r, 1, &e) == HG_OK && e.kind == HG_ELEMENT_PUMP && e.head_loss == -h,
        "pump row: kind %d, head loss %g", e.kind, e.head_loss);
  hg_line_result_free(r);
  /* Liquid without a vapour pressure: no NPSH, and no result asked for. */
  CHECK(hg_line_pumped_flow(pump_line, fluids[0], &q, &h, &npsh, &has, NULL) == HG_OK && has == 0 && npsh == 0.0,
        "no vapour pressure");
  /* Off the curve, reverse through the pump: errors naming the pump and its range. */
  double hh, dd;
  CHECK(hg_line_required_head(pump_line, fluids[0], 0.02, &hh, &dd) == HG_ERR_OUT_OF_RANGE &&
            strstr(last_msg(), "pump") != NULL && strstr(last_msg(), "0.015") != NULL,
        "beyond the curve: %s", last_msg());
  CHECK(hg_line_required_head(pump_line, fluids[0], -1e-3, &hh, &dd) == HG_ERR_OUT_OF_RANGE &&
            strstr(last_msg(), "reverse") != NULL,
        "reverse: %s", last_msg());
  /* Bad pumps: no curve, too few points, a rising monotone curve, a bad degree. */
  double pq[3] = {0.0, 0.01, 0.02}, ph[3] = {30.0, 32.0, 20.0};
  hg_line *l = NULL;
  CHECK(hg_line_new(&l) == HG_OK, "line");
  CHECK(hg_line_add_pump(NULL, pq, ph, 3, 0) == HG_ERR_NULL_POINTER, "NULL line");
  CHECK(hg_line_add_pump(l, NULL, ph, 3, 0) == HG_ERR_NULL_POINTER, "NULL flows");
  CHECK(hg_line_add_pump(l, pq, NULL, 3, 0) == HG_ERR_NULL_POINTER, "NULL heads");
  CHECK(hg_line_add_pump(l, pq, ph, 0, 0) == HG_ERR_INVALID && msg_len() > 0, "empty curve: %s", last_msg());
  CHECK(hg_line_add_pump(l, pq, ph, 3, 0) == HG_ERR_OUT_OF_RANGE && strstr(last_msg(), "heads") != NULL,
        "rising heads: %s", last_msg());
  CHECK(hg_line_add_pump(l, pq, ph, 3, 4) == HG_ERR_OUT_OF_RANGE && strstr(last_msg(), "degree") != NULL,
        "degree 4: %s", last_msg());
  ph[2] = NAN;
  CHECK(hg_line_add_pump(l, pq, ph, 3, 2) == HG_ERR_NOT_FINITE, "NaN head");
  /* No pump, or a lift the pump cannot reach: no flow of its own. */
  CHECK(hg_line_add_fitting_k(l, 1.0, 0.05) == HG_OK, "fitting");
  CHECK(hg_line_pumped_flow(l, fluids[0], &q, &h, &npsh, &has, NULL) == HG_ERR_INVALID &&
            strstr(last_msg(), "no pump") != NULL,
        "no pump: %s", last_msg());
  ph[1] = 25.0, ph[2] = 20.0;
  CHECK(hg_line_add_pump(l, pq, ph, 3, 0) == HG_OK && hg_line_add_rise(l, 50.0) == HG_OK, "weak pump");
  CHECK(hg_line_pumped_flow(l, fluids[0], &q, &h, &npsh, &has, NULL) == HG_ERR_NO_SOLUTION, "too weak: %s",
        last_msg());
  CHECK(hg_line_pumped_flow(NULL, fluids[0], &q, &h, &npsh, &has, NULL) == HG_ERR_NULL_POINTER, "NULL line");
  CHECK(hg_line_pumped_flow(l, NULL, &q, &h, &npsh, &has, NULL) == HG_ERR_NULL_POINTER, "NULL fluid");
  CHECK(hg_line_pumped_flow(l, fluids[0], NULL, &h, &npsh, &has, NULL) == HG_ERR_NULL_POINTER, "NULL flow");
  CHECK(hg_line_pumped_flow(l, fluids[0], &q, NULL, &npsh, &has, NULL) == HG_ERR_NULL_POINTER, "NULL head");
  CHECK(hg_line_pumped_flow(l, fluids[0], &q, &h, NULL, &has, NULL) == HG_ERR_NULL_POINTER, "NULL npsh");
  CHECK(hg_line_pumped_flow(l, fluids[0], &q, &h, &npsh, NULL, NULL) == HG_ERR_NULL_POINTER, "NULL has_npsh");
  hg_line_free(l);
  hg_line_free(pump_line);
  /* An outside pump too weak for scenario 0 (shut-off head 2 m, as its reference record):
   * the curves do not cross. */
  double oq[5] = {0.0, 1e-3, 2e-3, 3e-3, 4e-3}, oh[5], o[6];
  for (int i = 0; i < 5; i++) oh[i] = 2.0 * (1.0 - (oq[i] / 5e-3) * (oq[i] / 5e-3));
  CHECK(hg_line_operating_point(lines[0], fluids[0], oq, oh, 5, &o[0], &o[1], &o[2], &o[3], &o[4], &o[5]) ==
            HG_ERR_NO_SOLUTION,
        "weak outside pump: %s", last_msg());
}

int main(int argc, char **argv) {
  if (argc < 2) {
    fprintf(stderr, "usage: %s REFERENCE_FILE\n", argv[0]);
    return 2;
  }
  ref_path = argv[1];
  for (int i = 0; i < 3; i++) CHECK(build_scenario(i, &lines[i]) == HG_OK, "scenario %d", i);
  CHECK(hg_fluid_liquid(998.2, 1.002e-3, &fluids[0]) == HG_OK, "liquid");
  CHECK(hg_fluid_water(293.15, 2e5, &fluids[1]) == HG_OK, "water");
  hg_fluid *gas = NULL;
  CHECK(hg_fluid_gas(1.2, 1.8e-5, 293.15, 101325.0, &gas) == HG_OK, "gas");
  CHECK(hg_fluid_with_uncertainty(gas, 0.01, 0.02, &fluids[2]) == HG_OK, "gas with uncertainty");
  hg_fluid_free(gas);
  const char *tags[] = {"line_eval", "line_element", "line_band_source", "line_required_head", "line_uniform",
                        "line_flow_for_head", "line_system_curve", "line_operating_point", "line_split_flow", "line_split_bands",
                        "line_size", "line_elem_source", "line_eval_at", "line_monte_carlo", "line_curve_band",
                        "line_band_mc"};
  for (size_t i = 0; i < sizeof tags / sizeof *tags; i++) {
    for_each_record(ref_path, tags[i], check_line_record, 1);
    CHECK(records_seen > 0, "no reference record for %s", tags[i]);
  }
  long bad = for_each_record(ref_path, "line_", check_line_record, 0);
  bad += for_each_record(ref_path, "line_operating_point", check_solve_record, 0);
  bad += for_each_record(ref_path, "line_s", check_solve_record, 0);
  test_solves_bad_input();
  test_pump_fit();
  test_more_elements_bad_input();
  printf("bitwise: line records, %ld differ\n", bad);
  test_handles_and_bad_input();
  test_checks();
  test_result_handle();
  test_threads();
  test_curve_band();
  test_line_model();
  test_non_linear_flag();
  test_builder();
  test_npsh();
  test_unit_slips();
  test_rated_density();
  test_resize();
  test_pump_element();
  pthread_t th[8];
  thread_arg args[8];
  for (int i = 0; i < 8; i++) {
    args[i].bad = 0;
    CHECK(pthread_create(&th[i], NULL, worker, &args[i]) == 0, "thread %d", i);
  }
  for (int i = 0; i < 8; i++) {
    pthread_join(th[i], NULL);
    CHECK(args[i].bad == 0, "thread %d: %ld differences", i, args[i].bad);
  }
  for (int i = 0; i < 3; i++) hg_line_free(lines[i]), hg_fluid_free(fluids[i]);
  return check_summary("test_line");
}

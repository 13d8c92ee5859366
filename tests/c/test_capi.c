#define _POSIX_C_SOURCE 200809L
/* Calls every function of hydrograde.h: results against the Rust core bit for bit (from
 * the reference file written by capi/examples/core_reference.rs), bad input of every
 * kind, the last-error contract, and 8 threads at once.
 * Usage: test_capi REFERENCE_FILE EXPECTED_VERSION */
#include <math.h>
#include <pthread.h>
#include <stdlib.h>

#include "hydrograde.h"
#include "check.h"
#include "records.h"

/* ---------- reference data (the Rust core's own results) ---------- */

typedef struct {
  int ok, corr, regime;
  double re, rr, f, df_dre, df_drr;
  unsigned warnings;
  char kind[32];
} darcy_ref;

static darcy_ref *refs;
static size_t nrefs;

static void load_reference(const char *path) {
  FILE *fp = fopen(path, "r");
  if (!fp) {
    perror(path);
    exit(2);
  }
  char line[512];
  size_t cap = 0;
  while (fgets(line, sizeof line, fp)) {
    char tag[32], a[32], b[32], c[32], d[32], e[32];
    darcy_ref r;
    memset(&r, 0, sizeof r);
    if (sscanf(line, "%31s", tag) != 1) continue;
    if (nrefs == cap) {
      cap = cap ? 2 * cap : 1024;
      refs = realloc(refs, cap * sizeof *refs);
    }
    if (strcmp(tag, "darcy") == 0 &&
        sscanf(line, "%*s %d %31s %31s %31s %31s %31s %d %u", &r.corr, a, b, c, d, e, &r.regime,
               &r.warnings) == 8) {
      r.ok = 1;
      r.re = from_hex(a), r.rr = from_hex(b), r.f = from_hex(c), r.df_dre = from_hex(d),
      r.df_drr = from_hex(e);
      refs[nrefs++] = r;
    } else if (strcmp(tag, "darcy_err") == 0 &&
               sscanf(line, "%*s %d %31s %31s %31s", &r.corr, a, b, r.kind) == 4) {
      r.re = from_hex(a), r.rr = from_hex(b);
      refs[nrefs++] = r;
    }
  }
  fclose(fp);
}

static size_t msg_len(void) { return hg_last_error(NULL, 0); }

/* ---------- the other functions against the core (generic records) ---------- */

/* Calls the C function a record names; fills got[] (doubles, ints as doubles) and name. */
static int32_t call_record(const record *r, double *got, int *ngot, char *name, size_t namelen) {
  const tok *a = r->in;
  int32_t s = -1;
  *ngot = 0;
  if (strcmp(r->tag, "water") == 0) {
    s = hg_water(a[0].d, a[1].d, &got[0], &got[1]), *ngot = 2;
  } else if (strcmp(r->tag, "air") == 0) {
    s = hg_air(a[0].d, a[1].d, &got[0], &got[1]), *ngot = 2;
  } else if (strcmp(r->tag, "vapour") == 0) {
    s = hg_water_vapour_pressure(a[0].d, &got[0]), *ngot = 1;
  } else if (strcmp(r->tag, "convert") == 0) {
    s = hg_convert(a[0].d, a[1].s, a[2].s, &got[0]), *ngot = 1;
  } else if (strcmp(r->tag, "convert_head") == 0) {
    s = hg_convert_head(a[0].d, a[1].s, a[2].s, a[3].d, &got[0]), *ngot = 1;
  } else if (strcmp(r->tag, "unit_name") == 0 || strcmp(r->tag, "catalogue") == 0) {
    size_t need = 0;
    s = r->tag[0] == 'u' ? hg_unit_name((size_t)a[0].i, name, namelen, &need)
                         : hg_fitting_catalogue_name((size_t)a[0].i, name, namelen, &need);
    if (need != strlen(name)) s = -2;
  } else if (strcmp(r->tag, "fitting_k") == 0) {
    s = hg_fitting_k(a[0].s, a[1].d, a[2].d, a[3].d, &got[0], &got[1]), *ngot = 2;
  } else if (strcmp(r->tag, "section") == 0) {
    s = hg_section_properties((int32_t)a[0].i, a[1].d, a[2].d, &got[0], &got[1], &got[2], &got[3]);
    *ngot = 4;
  } else if (strcmp(r->tag, "pipe_head_loss") == 0) {
    s = hg_pipe_head_loss(a[0].d, a[1].d, a[2].d, a[3].d, a[4].d, a[5].d, &got[0], &got[1]);
    *ngot = 2;
    if (s == HG_OK) {
      /* The batch gives the same numbers, computing in place in the flow array. */
      double q[3] = {a[5].d, a[5].d, a[5].d}, d[3];
      int32_t sb = hg_pipe_head_loss_batch(a[0].d, a[1].d, a[2].d, a[3].d, a[4].d, q, 3, q, d);
      if (sb != HG_OK || bits_of(q[2]) != bits_of(got[0]) || bits_of(d[1]) != bits_of(got[1])) s = -3;
    }
  } else if (strcmp(r->tag, "turbulent_diameter") == 0) {
    s = hg_turbulent_diameter((int32_t)a[0].i, a[1].d, a[2].d, (int32_t)a[3].i, &got[0]), *ngot = 1;
  } else if (strcmp(r->tag, "reynolds") == 0) {
    s = hg_reynolds(a[0].d, a[1].d, a[2].d, a[3].d, &got[0]), *ngot = 1;
  } else if (strcmp(r->tag, "duct_flow_state") == 0) {
    hg_pipe_flow st;
    memset(&st, 0, sizeof st);
    st.struct_size = sizeof st;
    s = hg_duct_flow_state((int32_t)a[0].i, a[1].d, a[2].d, a[3].d, a[4].d, a[5].d, a[6].d, a[7].d, &st);
    got[0] = st.velocity, got[1] = st.reynolds, got[2] = st.friction_factor, got[3] = st.head_loss;
    got[4] = st.dhead_dflow, got[5] = st.regime, got[6] = st.warnings, *ngot = 7;
  }
  return s;
}

static const char *ref_path;

static long check_record(const record *r, int quiet) {
  double got[8];
  char name[64] = "";
  int ngot;
  int32_t s = call_record(r, got, &ngot, name, sizeof name);
  int same;
  if (r->err) {
    same = s == code_of_kind(r->kind) && msg_len() > 0;
  } else if (r->nout == 1 && r->out[0].type == 's') {
    same = s == HG_OK && strcmp(name, r->out[0].s) == 0;
  } else {
    same = s == HG_OK && same_outputs(r, got, ngot);
  }
  if (!quiet) CHECK(same, "%s: status %d (want %s)", r->tag, s, r->err ? r->kind : "HG_OK");
  return !same;
}

/* Materials and pipe sizes: outputs mix numbers and names. */
static long check_material_record(const record *r, int quiet) {
  const tok *a = r->in;
  tok got[8];
  int n = 0;
  int32_t s = -1;
  double x = 0, y = 0, z = 0;
  char name[64] = "";
  size_t need = 0;
  if (strcmp(r->tag, "material_name") == 0) {
    s = hg_roughness_material_name((size_t)a[0].i, name, sizeof name, &need);
    if (need != strlen(name)) s = -2;
    got[n++] = tok_s(name);
  } else if (strcmp(r->tag, "roughness") == 0) {
    s = hg_roughness(a[0].s, &x, &y, &z);
    got[n++] = tok_d(x), got[n++] = tok_d(y), got[n++] = tok_d(z);
  } else if (strcmp(r->tag, "roughness_aged") == 0) {
    s = hg_roughness_aged(a[0].d, a[1].d, a[2].d, &x);
    got[n++] = tok_d(x);
  } else if (strcmp(r->tag, "pipe_size") == 0) {
    s = hg_pipe_size(a[0].s, a[1].s, a[2].s, &x, &y, &z);
    got[n++] = tok_d(x), got[n++] = tok_d(y), got[n++] = tok_d(z);
  } else if (strcmp(r->tag, "validity") == 0) {
    double v[5];
    s = hg_correlation_validity((int32_t)a[0].i, &v[0], &v[1], &v[2], &v[3], &v[4]);
    for (int i = 0; i < 5; i++) got[n++] = tok_d(v[i]);
  } else if (strcmp(r->tag, "transition_limits") == 0) {
    s = hg_transition_limits(a[0].d, a[1].d, (int32_t)a[2].i, &x, &y);
    got[n++] = tok_d(x), got[n++] = tok_d(y);
  } else if (strcmp(r->tag, "pump_curve_head") == 0) {
    const double pq[4] = {0.0, 1e-3, 2e-3, 3e-3}, ph[4] = {30.0, 28.0, 22.0, 12.0};
    s = hg_pump_curve_head(pq, ph, 4, a[0].d, &x, &y);
    got[n++] = tok_d(x), got[n++] = tok_d(y);
  } else if (strcmp(r->tag, "saturation") == 0) {
    s = hg_water_saturation_temperature(a[0].d, &x);
    got[n++] = tok_d(x);
  } else if (strcmp(r->tag, "table_schedule") == 0 || strcmp(r->tag, "table_nominal") == 0) {
    s = r->tag[6] == 's' ? hg_pipe_table_schedule(a[0].s, (size_t)a[1].i, name, sizeof name, &need)
                         : hg_pipe_table_nominal(a[0].s, (size_t)a[1].i, name, sizeof name, &need);
    if (s == HG_OK && need != strlen(name)) s = -2;
    got[n++] = tok_s(name);
  } else if (strcmp(r->tag, "pipe_size_at_least") == 0) {
    s = hg_pipe_size_at_least(a[0].s, a[1].s, a[2].d, &x, name, sizeof name, &need);
    got[n++] = tok_d(x), got[n++] = tok_s(name);
  }
  int same = r->err ? s == code_of_kind(r->kind) && msg_len() > 0 : s == HG_OK && same_tokens(r, got, n);
  if (!quiet) CHECK(same, "%s: status %d (want %s)", r->tag, s, r->err ? r->kind : "HG_OK");
  return !same;
}

/* Every record of the functions other than the friction factor and the line. */
static long compare_records(int quiet) {
  const char *tags[] = {"water", "air", "vapour", "convert", "unit_name", "catalogue", "fitting_k",
                        "section", "turbulent_diameter", "pipe_head_loss", "reynolds", "duct_flow_state"};
  long bad = 0;
  for (size_t i = 0; i < sizeof tags / sizeof *tags; i++) {
    bad += for_each_record(ref_path, tags[i], check_record, quiet);
    if (!quiet) CHECK(records_seen > 0, "no reference record for %s", tags[i]);
  }
  const char *mtags[] = {"material_name", "roughness", "pipe_size", "validity", "saturation", "transition_limits",
                          "pump_curve_head", "table_schedule", "table_nominal"};
  for (size_t i = 0; i < sizeof mtags / sizeof *mtags; i++) {
    bad += for_each_record(ref_path, mtags[i], check_material_record, quiet);
    if (!quiet) CHECK(records_seen > 0, "no reference record for %s", mtags[i]);
  }
  return bad;
}

/* ---------- version, names ---------- */

static void test_meta(const char *expected_version) {
  char v[64];
  snprintf(v, sizeof v, "%d.%d.%d", HG_VERSION_MAJOR, HG_VERSION_MINOR, HG_VERSION_PATCH);
  CHECK(strcmp(v, expected_version) == 0, "macros %s vs Cargo.toml %s", v, expected_version);
  CHECK(strcmp(hg_version(), expected_version) == 0, "hg_version %s", hg_version());
  CHECK(hg_abi_version() == HG_ABI_VERSION, "abi %u", hg_abi_version());
  /* While 0.x the ABI version counts incompatible changes on its own. */
  CHECK(HG_VERSION_MAJOR == 0 || HG_ABI_VERSION == HG_VERSION_MAJOR, "abi is the major version");

  const struct { int32_t code; const char *name; } st[] = {
      {HG_OK, "HG_OK"},
      {HG_ERR_NOT_FINITE, "HG_ERR_NOT_FINITE"},
      {HG_ERR_OUT_OF_RANGE, "HG_ERR_OUT_OF_RANGE"},
      {HG_ERR_UNKNOWN_NAME, "HG_ERR_UNKNOWN_NAME"},
      {HG_ERR_INVALID, "HG_ERR_INVALID"},
      {HG_ERR_NO_SOLUTION, "HG_ERR_NO_SOLUTION"},
      {HG_ERR_NULL_POINTER, "HG_ERR_NULL_POINTER"},
      {HG_ERR_BUFFER_TOO_SMALL, "HG_ERR_BUFFER_TOO_SMALL"},
      {HG_ERR_INTERNAL, "HG_ERR_INTERNAL"},
  };
  for (size_t i = 0; i < sizeof st / sizeof *st; i++) {
    CHECK(strcmp(hg_status_name(st[i].code), st[i].name) == 0, "%s", st[i].name);
    for (size_t j = 0; j < i; j++) CHECK(st[i].code != st[j].code, "distinct codes");
  }
  CHECK(strcmp(hg_status_name(12345), "HG_UNKNOWN_STATUS") == 0, "unknown status");
  CHECK(strcmp(hg_status_name(-1), "HG_UNKNOWN_STATUS") == 0, "negative status");

  const char *corr[] = {"colebrook", "haaland", "swamee_jain", "churchill",
                        "serghides", "blasius", "fully_rough"};
  const int32_t cc[] = {HG_CORRELATION_COLEBROOK, HG_CORRELATION_HAALAND,
                        HG_CORRELATION_SWAMEE_JAIN, HG_CORRELATION_CHURCHILL,
                        HG_CORRELATION_SERGHIDES, HG_CORRELATION_BLASIUS,
                        HG_CORRELATION_FULLY_ROUGH};
  for (int i = 0; i < 7; i++) {
    int32_t c = -1;
    CHECK(hg_correlation_from_name(corr[i], &c) == HG_OK && c == cc[i], "%s", corr[i]);
    CHECK(hg_correlation_name(cc[i]) && strcmp(hg_correlation_name(cc[i]), corr[i]) == 0,
          "%s", corr[i]);
  }
  CHECK(hg_correlation_name(7) == NULL && hg_correlation_name(-1) == NULL, "bad correlation");
  int32_t c = 77;
  CHECK(hg_correlation_from_name("moody", &c) == HG_ERR_UNKNOWN_NAME && c == 77, "unknown");
  CHECK(msg_len() > 0, "message for unknown name");
  CHECK(hg_correlation_from_name("", &c) == HG_ERR_UNKNOWN_NAME, "empty name");
  CHECK(hg_correlation_from_name("\xff\xfe", &c) == HG_ERR_INVALID, "not UTF-8");
  CHECK(hg_correlation_from_name(NULL, &c) == HG_ERR_NULL_POINTER, "NULL name");
  CHECK(hg_correlation_from_name("haaland", NULL) == HG_ERR_NULL_POINTER, "NULL out");
  CHECK(msg_len() > 0, "message for NULL");

  CHECK(strcmp(hg_regime_name(HG_REGIME_LAMINAR), "laminar") == 0, "laminar");
  CHECK(strcmp(hg_regime_name(HG_REGIME_TRANSITIONAL), "transitional") == 0, "transitional");
  CHECK(strcmp(hg_regime_name(HG_REGIME_TURBULENT), "turbulent") == 0, "turbulent");
  CHECK(hg_regime_name(3) == NULL && hg_regime_name(-1) == NULL, "bad regime");

  const struct { uint32_t bit; const char *name; } w[] = {
      {HG_WARN_REYNOLDS_OUT_OF_RANGE, "reynolds_out_of_range"},
      {HG_WARN_ROUGHNESS_OUT_OF_RANGE, "roughness_out_of_range"},
      {HG_WARN_TRANSITIONAL_FLOW, "transitional_flow"},
      {HG_WARN_NON_CIRCULAR_SECTION, "non_circular_section"},
      {HG_WARN_GAS_COMPRESSIBILITY, "gas_compressibility"},
      {HG_WARN_BELOW_VAPOUR_PRESSURE, "below_vapour_pressure"},
      {HG_WARN_FITTING_OUT_OF_RANGE, "fitting_out_of_range"},
      {HG_WARN_BORE_CHANGE_WITHOUT_TRANSITION, "bore_change_without_transition"},
      {HG_WARN_IMPLAUSIBLE_VELOCITY, "implausible_velocity"},
      {HG_WARN_IMPLAUSIBLE_BORE, "implausible_bore"},
      {HG_WARN_IMPLAUSIBLE_LENGTH, "implausible_length"},
      {HG_WARN_IMPLAUSIBLE_RATED_DROP, "implausible_rated_drop"},
      {HG_WARN_IMPLAUSIBLE_VISCOSITY, "implausible_viscosity"},
  };
  for (size_t i = 0; i < sizeof w / sizeof *w; i++)
    CHECK(hg_warning_name(w[i].bit) && strcmp(hg_warning_name(w[i].bit), w[i].name) == 0,
          "%s", w[i].name);
  CHECK(hg_warning_name(0) == NULL && hg_warning_name(3) == NULL, "not one bit");
}

/* ---------- the last-error contract ---------- */

static void test_last_error(void) {
  double f = 7.0;
  CHECK(hg_darcy_factor(-1.0, 0.0, HG_CORRELATION_COLEBROOK, &f) == HG_ERR_OUT_OF_RANGE, "re<0");
  CHECK(f == 7.0, "output untouched on error");
  const char *want = "re = -1: must be greater than 0";
  size_t n = hg_last_error(NULL, 0);
  CHECK(n == strlen(want), "full length %zu", n);
  char big[128], small[6];
  memset(small, 'x', sizeof small);
  CHECK(hg_last_error(big, sizeof big) == n && strcmp(big, want) == 0, "message '%s'", big);
  CHECK(hg_last_error(small, sizeof small) == n && strcmp(small, "re = ") == 0, "cut '%s'", small);
  CHECK(hg_last_error(small, 0) == n && small[0] == 'r', "len 0 writes nothing");
  CHECK(hg_last_error(big, 1) == n && big[0] == '\0', "len 1 writes the NUL only");
  CHECK(hg_darcy_factor(1e5, 0.0, HG_CORRELATION_COLEBROOK, &f) == HG_OK, "ok");
  CHECK(hg_last_error(big, sizeof big) == 0 && big[0] == '\0', "success clears the message");
}

/* ---------- results equal the core's, bit for bit ---------- */

static long compare_reference(int quiet) {
  long bad = 0;
  for (size_t i = 0; i < nrefs; i++) {
    const darcy_ref *r = &refs[i];
    double f = -1, d1 = -1, d2 = -1;
    int32_t reg = -1;
    uint32_t w = 999;
    int32_t s = hg_darcy_factor_full(r->re, r->rr, r->corr, &f, &d1, &d2, &reg, &w);
    double f0 = -1;
    int32_t s0 = hg_darcy_factor(r->re, r->rr, r->corr, &f0);
    if (r->ok) {
      int same = s == HG_OK && s0 == HG_OK && bits_of(f) == bits_of(r->f) &&
                 bits_of(f0) == bits_of(r->f) && bits_of(d1) == bits_of(r->df_dre) &&
                 bits_of(d2) == bits_of(r->df_drr) && reg == r->regime && w == r->warnings;
      if (!same) bad++;
      if (!quiet) CHECK(same, "corr %d re %g rr %g: f %.17g vs %.17g", r->corr, r->re, r->rr, f, r->f);
    } else {
      int32_t want = code_of_kind(r->kind);
      int same = s == want && s0 == want && f == -1 && f0 == -1 && msg_len() > 0;
      if (!same) bad++;
      if (!quiet) CHECK(same, "corr %d re %g rr %g: status %d, want %d (%s)", r->corr, r->re, r->rr, s, want, r->kind);
    }
  }
  return bad;
}

static void test_opts_and_batch(void) {
  hg_friction_options o;
  memset(&o, 0, sizeof o);
  CHECK(hg_friction_options_default(&o) == HG_OK, "defaults");
  CHECK(o.struct_size == sizeof o, "struct_size %zu", o.struct_size);
  CHECK(o.correlation == HG_CORRELATION_COLEBROOK && o.transition == HG_TRANSITION_BLEND, "defaults");
  size_t nok = 0;
  for (size_t i = 0; i < nrefs; i++) {
    const darcy_ref *r = &refs[i];
    if (!r->ok) continue;
    nok++;
    o.correlation = r->corr;
    hg_friction out;
    memset(&out, 0, sizeof out);
    out.struct_size = sizeof out;
    int32_t s = hg_darcy_factor_opts(r->re, r->rr, &o, &out);
    CHECK(s == HG_OK && bits_of(out.f) == bits_of(r->f) && bits_of(out.df_dre) == bits_of(r->df_dre) &&
              bits_of(out.df_drel_roughness) == bits_of(r->df_drr) && out.regime == r->regime &&
              out.warnings == r->warnings && out.struct_size == sizeof out,
          "opts corr %d re %g", r->corr, r->re);
  }
  /* Batches per correlation, of every valid point, then in place. */
  double *re = malloc(nok * sizeof *re), *rr = malloc(nok * sizeof *rr), *f = malloc(nok * sizeof *f),
         *want = malloc(nok * sizeof *want);
  for (int c = 0; c < 7; c++) {
    size_t n = 0;
    for (size_t i = 0; i < nrefs; i++)
      if (refs[i].ok && refs[i].corr == c) re[n] = refs[i].re, rr[n] = refs[i].rr, want[n++] = refs[i].f;
    CHECK(hg_darcy_factor_batch(re, rr, n, c, f) == HG_OK, "batch %d", c);
    size_t same = 0;
    for (size_t i = 0; i < n; i++) same += bits_of(f[i]) == bits_of(want[i]);
    CHECK(same == n, "batch corr %d: %zu of %zu equal", c, same, n);
    CHECK(hg_darcy_factor_batch(re, rr, n, c, re) == HG_OK, "in place");
    same = 0;
    for (size_t i = 0; i < n; i++) same += bits_of(re[i]) == bits_of(want[i]);
    CHECK(same == n, "in-place batch corr %d", c);
  }
  /* A batch larger than the parallel threshold (16384) equals the scalar results. */
  size_t big = 40000;
  double *bre = malloc(big * sizeof *bre), *brr = malloc(big * sizeof *brr), *bf = malloc(big * sizeof *bf);
  for (size_t i = 0; i < big; i++) bre[i] = 100.0 + 25.0 * (double)i, brr[i] = 1e-6 * (double)(i % 500);
  CHECK(hg_darcy_factor_batch(bre, brr, big, HG_CORRELATION_COLEBROOK, bf) == HG_OK, "big batch");
  size_t same = 0;
  for (size_t i = 0; i < big; i += 7) {
    double f1 = 0;
    hg_darcy_factor(bre[i], brr[i], HG_CORRELATION_COLEBROOK, &f1);
    same += bits_of(f1) == bits_of(bf[i]);
  }
  CHECK(same == (big + 6) / 7, "big batch equals scalar: %zu", same);
  bre[big - 3] = NAN;
  CHECK(hg_darcy_factor_batch(bre, brr, big, HG_CORRELATION_COLEBROOK, bf) == HG_ERR_NOT_FINITE, "bad element");
  char m[128];
  hg_last_error(m, sizeof m);
  CHECK(strncmp(m, "element 39997: re = NaN", 23) == 0, "message '%s'", m);
  free(bre), free(brr), free(bf);
  free(re), free(rr), free(f), free(want);
}

/* ---------- bad input of every kind ---------- */

enum { REJ_NAN = 1, REJ_INF = 2, REJ_NEG = 4, REJ_ZERO = 8, REJ_ALL = 15, REJ_NONFINITE = 3 };

/* Calls a function with the arguments in a[] and writes its main output to *out. */
typedef int32_t (*caller)(const double *a, double *out);

typedef struct {
  const char *name;
  caller call;
  int nargs;
  double good[8];
  int reject[8];
} scalar_case;

static int32_t call_darcy(const double *a, double *out) { return hg_darcy_factor(a[0], a[1], 0, out); }
static int32_t call_darcy_full(const double *a, double *out) {
  double d1, d2;
  int32_t r;
  uint32_t w;
  return hg_darcy_factor_full(a[0], a[1], 0, out, &d1, &d2, &r, &w);
}
static int32_t call_darcy_opts(const double *a, double *out) {
  hg_friction_options o;
  hg_friction_options_default(&o);
  o.laminar_constant = a[2], o.laminar_limit = a[3], o.turbulent_limit = a[4];
  hg_friction r;
  r.struct_size = sizeof r;
  int32_t s = hg_darcy_factor_opts(a[0], a[1], &o, &r);
  if (s == HG_OK) *out = r.f;
  return s;
}
static int32_t call_batch(const double *a, double *out) {
  double re[3] = {1e5, a[0], 3e3}, rr[3] = {0.0, a[1], 1e-3}, f[3];
  int32_t s = hg_darcy_factor_batch(re, rr, 3, 0, f);
  if (s == HG_OK) *out = f[1];
  return s;
}

static const char *hg_test_fitting = "elbow_90_standard";
static int32_t call_water(const double *a, double *out) {
  double mu;
  return hg_water(a[0], a[1], out, &mu);
}
static int32_t call_air(const double *a, double *out) {
  double mu;
  return hg_air(a[0], a[1], out, &mu);
}
static int32_t call_vapour(const double *a, double *out) { return hg_water_vapour_pressure(a[0], out); }
static int32_t call_convert(const double *a, double *out) { return hg_convert(a[0], "degC", "K", out); }
static int32_t call_convert_head(const double *a, double *out) {
  return hg_convert_head(a[0], "m_head", "kPa", a[1], out);
}
static int32_t call_fitting_k(const double *a, double *out) {
  double dk;
  return hg_fitting_k(hg_test_fitting, a[0], a[1], a[2], out, &dk);
}
static int32_t call_section(const double *a, double *out) {
  double p, dh, c;
  return hg_section_properties(HG_SECTION_RECTANGLE, a[0], a[1], out, &p, &dh, &c);
}
static int32_t call_pipe(const double *a, double *out) {
  double d;
  return hg_pipe_head_loss(a[0], a[1], a[2], a[3], a[4], a[5], out, &d);
}
static int32_t call_pipe_batch(const double *a, double *out) {
  double q[2] = {1e-3, a[5]}, h[2], d[2];
  int32_t s = hg_pipe_head_loss_batch(a[0], a[1], a[2], a[3], a[4], q, 2, h, d);
  if (s == HG_OK) *out = h[1];
  return s;
}
static int32_t call_reynolds(const double *a, double *out) { return hg_reynolds(a[0], a[1], a[2], a[3], out); }
static int32_t call_duct(const double *a, double *out) {
  hg_pipe_flow st;
  st.struct_size = sizeof st;
  int32_t s = hg_duct_flow_state(HG_SECTION_ANNULUS, a[0], a[1], a[2], a[3], a[4], a[5], a[6], &st);
  if (s == HG_OK) *out = st.head_loss;
  return s;
}


static int32_t call_limits(const double *a, double *out) {
  double t;
  return hg_transition_limits(a[0], a[1], 0, out, &t);
}
static int32_t call_pump(const double *a, double *out) {
  const double pq[3] = {0.0, 1e-3, 2e-3}, ph[3] = {30.0, 25.0, 15.0};
  double d;
  return hg_pump_curve_head(pq, ph, 3, a[0], out, &d);
}
static int32_t call_saturation(const double *a, double *out) { return hg_water_saturation_temperature(a[0], out); }
static int32_t call_aged(const double *a, double *out) { return hg_roughness_aged(a[0], a[1], a[2], out); }
static int32_t call_at_least(const double *a, double *out) {
  char nominal[16];
  size_t need;
  return hg_pipe_size_at_least("copper", "K", a[0], out, nominal, sizeof nominal, &need);
}

static int32_t call_turbulent(const double *a, double *out) {
  return hg_turbulent_diameter(HG_SECTION_RECTANGLE, a[0], a[1], HG_TURBULENT_DIAMETER_LAMINAR_EQUIVALENT, out);
}

static const scalar_case cases[] = {
    {"hg_turbulent_diameter", call_turbulent, 2, {0.2, 0.1}, {REJ_ALL, REJ_ALL}},
    {"hg_transition_limits", call_limits, 2, {3000.0, 1e-3}, {REJ_ALL, REJ_NONFINITE | REJ_NEG}},
    {"hg_pump_curve_head", call_pump, 1, {1e-3}, {REJ_NONFINITE | REJ_NEG}},
    {"hg_water_saturation_temperature", call_saturation, 1, {1e5}, {REJ_ALL}},
    {"hg_roughness_aged", call_aged, 3, {1e-4, 1e-5, 20.0}, {REJ_NONFINITE | REJ_NEG, REJ_NONFINITE | REJ_NEG,
                                                              REJ_NONFINITE | REJ_NEG}},
    {"hg_pipe_size_at_least", call_at_least, 1, {0.02}, {REJ_ALL}},
    {"hg_darcy_factor", call_darcy, 2, {1e5, 1e-4}, {REJ_ALL, REJ_NONFINITE | REJ_NEG}},
    {"hg_darcy_factor_full", call_darcy_full, 2, {1e5, 1e-4}, {REJ_ALL, REJ_NONFINITE | REJ_NEG}},
    {"hg_darcy_factor_opts", call_darcy_opts, 5, {1e5, 1e-4, 64.0, 2300.0, 4000.0},
     {REJ_ALL, REJ_NONFINITE | REJ_NEG, REJ_ALL, REJ_ALL, REJ_ALL}},
    {"hg_darcy_factor_batch", call_batch, 2, {1e5, 1e-4}, {REJ_ALL, REJ_NONFINITE | REJ_NEG}},
    {"hg_water", call_water, 2, {293.15, 101325.0}, {REJ_ALL, REJ_ALL}},
    {"hg_air", call_air, 2, {293.15, 101325.0}, {REJ_ALL, REJ_ALL}},
    {"hg_water_vapour_pressure", call_vapour, 1, {293.15}, {REJ_ALL}},
    {"hg_convert", call_convert, 1, {20.0}, {REJ_NONFINITE}},
    {"hg_convert_head", call_convert_head, 2, {10.0, 998.2}, {REJ_NONFINITE, REJ_ALL}},
    {"hg_fitting_k", call_fitting_k, 3, {1e5, 0.05, 1e-3}, {REJ_ALL, REJ_ALL, REJ_NONFINITE | REJ_NEG}},
    {"hg_section_properties", call_section, 2, {0.2, 0.1}, {REJ_ALL, REJ_ALL}},
    {"hg_pipe_head_loss", call_pipe, 6, {0.05, 30.0, 4.5e-5, 998.2, 1.002e-3, 2e-3},
     {REJ_ALL, REJ_ALL, REJ_NONFINITE | REJ_NEG, REJ_ALL, REJ_ALL, REJ_NONFINITE}},
    {"hg_pipe_head_loss_batch", call_pipe_batch, 6, {0.05, 30.0, 4.5e-5, 998.2, 1.002e-3, 2e-3},
     {REJ_ALL, REJ_ALL, REJ_NONFINITE | REJ_NEG, REJ_ALL, REJ_ALL, REJ_NONFINITE}},
    {"hg_reynolds", call_reynolds, 4, {2e-3, 0.05, 998.2, 1.002e-3}, {REJ_NONFINITE, REJ_ALL, REJ_ALL, REJ_ALL}},
    {"hg_duct_flow_state", call_duct, 7, {0.1, 0.05, 20.0, 1e-4, 998.2, 1.002e-3, 5e-3},
     {REJ_ALL, REJ_ALL, REJ_ALL, REJ_NONFINITE | REJ_NEG, REJ_ALL, REJ_ALL, REJ_NONFINITE}},
};

static void test_bad_values(void) {
  const double bad[5] = {NAN, INFINITY, -1.5, 0.0, -INFINITY};
  const int kind[5] = {REJ_NAN, REJ_INF, REJ_NEG, REJ_ZERO, REJ_INF};
  for (size_t k = 0; k < sizeof cases / sizeof *cases; k++) {
    const scalar_case *c = &cases[k];
    double out = 12345.0;
    int32_t s = c->call(c->good, &out);
    CHECK(s == HG_OK && isfinite(out), "%s with good input: status %d", c->name, s);
    for (int i = 0; i < c->nargs; i++) {
      for (int b = 0; b < 5; b++) {
        double a[8];
        memcpy(a, c->good, sizeof a);
        a[i] = bad[b];
        out = 12345.0;
        s = c->call(a, &out);
        if (c->reject[i] & kind[b]) {
          CHECK(s != HG_OK && out == 12345.0 && msg_len() > 0, "%s arg %d = %g: status %d", c->name, i, bad[b], s);
          CHECK(strcmp(hg_status_name(s), "HG_UNKNOWN_STATUS") != 0 && s != HG_ERR_INTERNAL, "%s: known code", c->name);
        } else {
          CHECK(s == HG_OK ? isfinite(out) : msg_len() > 0, "%s arg %d = %g: finite or error", c->name, i, bad[b]);
        }
      }
    }
  }
}

static void test_bad_pointers_and_constants(void) {
  double f = 5.0, d1, d2, x[2] = {1e5, 1e5}, y[2] = {0, 0};
  int32_t reg;
  uint32_t w;
  CHECK(hg_darcy_factor(1e5, 0, 0, NULL) == HG_ERR_NULL_POINTER && msg_len() > 0, "NULL f");
  CHECK(hg_darcy_factor(1e5, 0, 7, &f) == HG_ERR_OUT_OF_RANGE && f == 5.0, "correlation 7");
  CHECK(hg_darcy_factor(1e5, 0, -1, &f) == HG_ERR_OUT_OF_RANGE && msg_len() > 0, "correlation -1");
  CHECK(hg_darcy_factor(1e5, 0, INT32_MAX, &f) == HG_ERR_OUT_OF_RANGE, "correlation max");
  CHECK(hg_darcy_factor(1e5, 0, HG_CORRELATION_FULLY_ROUGH, &f) == HG_ERR_OUT_OF_RANGE, "smooth fully rough");
  void *outs[5] = {&f, &d1, &d2, &reg, &w};
  for (int k = 0; k < 5; k++) {
    void *p[5];
    memcpy(p, outs, sizeof p);
    p[k] = NULL;
    f = 5.0;
    CHECK(hg_darcy_factor_full(1e5, 0, 0, p[0], p[1], p[2], p[3], p[4]) == HG_ERR_NULL_POINTER &&
              f == 5.0 && msg_len() > 0, "full NULL %d", k);
  }
  CHECK(hg_darcy_factor_full(1e5, 0, 9, &f, &d1, &d2, &reg, &w) == HG_ERR_OUT_OF_RANGE, "full corr 9");
  hg_friction_options o;
  hg_friction r;
  r.struct_size = sizeof r;
  CHECK(hg_friction_options_default(NULL) == HG_ERR_NULL_POINTER, "NULL opts");
  hg_friction_options_default(&o);
  CHECK(hg_darcy_factor_opts(1e5, 0, NULL, &r) == HG_ERR_NULL_POINTER, "NULL opts");
  CHECK(hg_darcy_factor_opts(1e5, 0, &o, NULL) == HG_ERR_NULL_POINTER, "NULL out");
  /* Exact: laminar f = 64/Re (Hagen–Poiseuille) at Re 1000. */
  CHECK(hg_darcy_factor_opts(1000, 0, &o, &r) == HG_OK && r.f == 0.064, "laminar with options");
  /* The smallest Reynolds number is 1e-100: below it f = 64/Re would overflow. */
  CHECK(hg_darcy_factor_opts(1e-300, 0, &o, &r) == HG_ERR_OUT_OF_RANGE && msg_len() > 0, "Re below 1e-100");
  o.transition = 3;
  CHECK(hg_darcy_factor_opts(1e5, 0, &o, &r) == HG_ERR_OUT_OF_RANGE, "transition 3");
  o.transition = HG_TRANSITION_REFUSE;
  CHECK(hg_darcy_factor_opts(3000, 0, &o, &r) == HG_ERR_NO_SOLUTION && msg_len() > 0, "refuse");
  o.transition = HG_TRANSITION_BLEND;
  o.correlation = -3;
  CHECK(hg_darcy_factor_opts(1e5, 0, &o, &r) == HG_ERR_OUT_OF_RANGE, "correlation -3");
  hg_friction_options_default(&o);
  o.laminar_limit = 5000;
  CHECK(hg_darcy_factor_opts(1e5, 0, &o, &r) == HG_ERR_OUT_OF_RANGE, "limits crossed");
  hg_friction_options_default(&o);
  o.struct_size = 0;
  CHECK(hg_darcy_factor_opts(1e5, 0, &o, &r) == HG_ERR_INVALID, "struct_size 0");
  hg_friction_options_default(&o);
  r.struct_size = 4;
  CHECK(hg_darcy_factor_opts(1e5, 0, &o, &r) == HG_ERR_INVALID && msg_len() > 0, "out struct_size 4");
  CHECK(hg_darcy_factor_batch(NULL, y, 2, 0, x) == HG_ERR_NULL_POINTER, "NULL re");
  CHECK(hg_darcy_factor_batch(x, NULL, 2, 0, x) == HG_ERR_NULL_POINTER, "NULL rr");
  CHECK(hg_darcy_factor_batch(x, y, 2, 0, NULL) == HG_ERR_NULL_POINTER, "NULL out");
  CHECK(hg_darcy_factor_batch(x, y, 0, 0, x) == HG_ERR_INVALID && msg_len() > 0, "n = 0");
  CHECK(hg_darcy_factor_batch(x, y, SIZE_MAX, 0, x) == HG_ERR_INVALID, "n = SIZE_MAX");
  CHECK(hg_darcy_factor_batch(x, y, 2, 8, x) == HG_ERR_OUT_OF_RANGE, "batch correlation 8");
  CHECK(hg_darcy_factor_batch((const double *)((const char *)x + 1), y, 1, 0, x) == HG_ERR_NULL_POINTER,
        "misaligned");
}

/* ---------- threads ---------- */

typedef struct {
  long bad;
  int id;
} thread_arg;

static void *worker(void *p) {
  thread_arg *t = p;
  for (int rep = 0; rep < 2; rep++) t->bad += compare_reference(1) + compare_records(1);
  /* Each thread's message is its own. */
  double f;
  char want[64], got[64];
  hg_darcy_factor(-(double)(t->id + 1), 0, 0, &f);
  snprintf(want, sizeof want, "re = -%d: must be greater than 0", t->id + 1);
  for (int i = 0; i < 1000; i++) hg_status_name(HG_OK);
  hg_last_error(got, sizeof got);
  if (strcmp(want, got) != 0) t->bad++;
  return NULL;
}

static void test_threads(void) {
  pthread_t th[8];
  thread_arg args[8];
  for (int i = 0; i < 8; i++) {
    args[i].bad = 0, args[i].id = i;
    CHECK(pthread_create(&th[i], NULL, worker, &args[i]) == 0, "thread %d", i);
  }
  for (int i = 0; i < 8; i++) {
    pthread_join(th[i], NULL);
    CHECK(args[i].bad == 0, "thread %d: %ld differences", i, args[i].bad);
  }
}

static void test_bad_pointers_others(void) {
  double x = 5.0, y = 5.0, z = 0, w;
  char buf[8];
  size_t need = 0;
  CHECK(hg_water(293.15, 1e5, NULL, &y) == HG_ERR_NULL_POINTER && y == 5.0 && msg_len() > 0, "water NULL");
  CHECK(hg_water(293.15, 1e5, &x, NULL) == HG_ERR_NULL_POINTER && x == 5.0, "water NULL");
  CHECK(hg_air(293.15, 1e5, NULL, &y) == HG_ERR_NULL_POINTER, "air NULL");
  CHECK(hg_air(293.15, 1e5, &x, NULL) == HG_ERR_NULL_POINTER, "air NULL");
  CHECK(hg_water_vapour_pressure(293.15, NULL) == HG_ERR_NULL_POINTER, "vapour NULL");
  CHECK(hg_convert(1, NULL, "m", &x) == HG_ERR_NULL_POINTER, "convert NULL from");
  CHECK(hg_convert(1, "m", NULL, &x) == HG_ERR_NULL_POINTER, "convert NULL to");
  CHECK(hg_convert(1, "m", "mm", NULL) == HG_ERR_NULL_POINTER, "convert NULL out");
  CHECK(hg_convert(1, "m", "\xc3", &x) == HG_ERR_INVALID, "convert not UTF-8");
  CHECK(hg_convert(1, "m", "", &x) == HG_ERR_UNKNOWN_NAME, "convert empty unit");
  x = 5.0;
  /* Exact: −300 °C is below absolute zero (−273.15 °C, SI definition). */
  CHECK(hg_convert(-300, "degC", "K", &x) == HG_ERR_OUT_OF_RANGE && x == 5.0 && msg_len() > 0,
        "convert below absolute zero");
  CHECK(hg_convert(1, "m", "Pa", &x) == HG_ERR_INVALID && msg_len() > 0, "convert mismatch");
  CHECK(hg_convert_head(1, NULL, "Pa", 1000, &x) == HG_ERR_NULL_POINTER, "head NULL");
  CHECK(hg_convert_head(1, "m_head", NULL, 1000, &x) == HG_ERR_NULL_POINTER, "head NULL");
  CHECK(hg_convert_head(1, "m_head", "Pa", 1000, NULL) == HG_ERR_NULL_POINTER, "head NULL");
  CHECK(hg_fitting_k(NULL, 1e5, 0.05, 0, &x, &y) == HG_ERR_NULL_POINTER, "fitting NULL name");
  CHECK(hg_fitting_k(hg_test_fitting, 1e5, 0.05, 0, NULL, &y) == HG_ERR_NULL_POINTER, "fitting NULL k");
  CHECK(hg_fitting_k(hg_test_fitting, 1e5, 0.05, 0, &x, NULL) == HG_ERR_NULL_POINTER, "fitting NULL dk");
  CHECK(hg_fitting_k("nonesuch", 1e5, 0.05, 0, &x, &y) == HG_ERR_UNKNOWN_NAME && msg_len() > 0, "unknown fitting");
  CHECK(hg_unit_name(0, buf, sizeof buf, NULL) == HG_ERR_NULL_POINTER, "unit NULL needed");
  CHECK(hg_unit_name(0, NULL, 4, &need) == HG_ERR_NULL_POINTER, "unit NULL buf");
  CHECK(hg_unit_name(0, NULL, 0, &need) == HG_ERR_BUFFER_TOO_SMALL && need > 0, "unit length query");
  CHECK(hg_unit_name(1000, buf, sizeof buf, &need) == HG_ERR_OUT_OF_RANGE && msg_len() > 0, "unit past end");
  CHECK(hg_unit_name(SIZE_MAX, buf, sizeof buf, &need) == HG_ERR_OUT_OF_RANGE, "unit SIZE_MAX");
  CHECK(hg_fitting_catalogue_name(0, buf, 2, &need) == HG_ERR_BUFFER_TOO_SMALL && strlen(buf) == 1 && need > 1,
        "catalogue cut");
  CHECK(hg_fitting_catalogue_name(0, NULL, 0, NULL) == HG_ERR_NULL_POINTER, "catalogue NULL");
  CHECK(hg_fitting_catalogue_name(100000, buf, sizeof buf, &need) == HG_ERR_OUT_OF_RANGE, "catalogue past end");
  for (int k = 0; k < 4; k++) {
    double *p[4] = {&x, &y, &z, &w};
    p[k] = NULL;
    CHECK(hg_section_properties(0, 0.1, 0, p[0], p[1], p[2], p[3]) == HG_ERR_NULL_POINTER, "section NULL %d", k);
  }
  CHECK(hg_section_properties(5, 0.1, 0, &x, &y, &z, &w) == HG_ERR_OUT_OF_RANGE, "shape 5");
  CHECK(hg_section_properties(-1, 0.1, 0, &x, &y, &z, &w) == HG_ERR_OUT_OF_RANGE, "shape -1");
  CHECK(hg_section_properties(HG_SECTION_CIRCLE, 0.1, 0.2, &x, &y, &z, &w) == HG_ERR_INVALID, "circle b");
  CHECK(hg_section_properties(HG_SECTION_TRIANGLE, 0.1, NAN, &x, &y, &z, &w) == HG_ERR_INVALID, "triangle b");
  CHECK(hg_pipe_head_loss(0.05, 1, 0, 998, 1e-3, 1e-3, NULL, &y) == HG_ERR_NULL_POINTER, "pipe NULL");
  CHECK(hg_pipe_head_loss(0.05, 1, 0, 998, 1e-3, 1e-3, &x, NULL) == HG_ERR_NULL_POINTER, "pipe NULL");
  CHECK(hg_reynolds(1e-3, 0.05, 998, 1e-3, NULL) == HG_ERR_NULL_POINTER, "reynolds NULL");
  /* Exact: Re = rho V D / mu with V = Q / (pi D^2 / 4) = 4 rho Q / (pi D mu); 1e5 here
   * to the last few bits (analytical). */
  double q_re = 1e5 * 3.141592653589793 * 0.05 * 1e-3 / (4.0 * 1000.0);
  CHECK(hg_reynolds(q_re, 0.05, 1000.0, 1e-3, &x) == HG_OK && fabs(x / 1e5 - 1.0) < 1e-14, "reynolds 1e5: %.17g", x);
  CHECK(hg_reynolds(-q_re, 0.05, 1000.0, 1e-3, &y) == HG_OK && y == x, "reynolds odd in the flow");
  x = 5.0;
  CHECK(hg_turbulent_diameter(0, 0.1, 0, 0, NULL) == HG_ERR_NULL_POINTER && msg_len() > 0, "turbulent NULL");
  CHECK(hg_turbulent_diameter(0, 0.1, 0, 2, &x) == HG_ERR_OUT_OF_RANGE && x == 5.0 && msg_len() > 0, "mode 2");
  CHECK(hg_turbulent_diameter(0, 0.1, 0, -1, &x) == HG_ERR_OUT_OF_RANGE, "mode -1");
  CHECK(hg_turbulent_diameter(7, 0.1, 0, 0, &x) == HG_ERR_OUT_OF_RANGE, "turbulent shape 7");
  CHECK(hg_turbulent_diameter(HG_SECTION_CIRCLE, 0.1, 0.2, 0, &x) == HG_ERR_INVALID, "turbulent circle b");
  /* A circle's turbulent diameter is its bore in either mode (exact). */
  CHECK(hg_turbulent_diameter(HG_SECTION_CIRCLE, 0.1, 0, HG_TURBULENT_DIAMETER_LAMINAR_EQUIVALENT, &x) == HG_OK &&
            x == 0.1, "circle: %.17g", x);
  /* A square's laminar-equivalent diameter is 64/56.91 of its side (Jones 1976, from
   * memory: C = 56.91 for a square), so larger than the side. */
  CHECK(hg_turbulent_diameter(HG_SECTION_RECTANGLE, 0.1, 0.1, HG_TURBULENT_DIAMETER_LAMINAR_EQUIVALENT, &x) ==
                HG_OK && fabs(x / (0.1 * 64.0 / 56.91) - 1.0) < 1e-3, "square: %.17g", x);
  for (int t = 0; t < 2; t++) {
    int32_t (*fn)(const char *, size_t, char *, size_t, size_t *) = t ? hg_pipe_table_nominal : hg_pipe_table_schedule;
    CHECK(fn(NULL, 0, buf, sizeof buf, &need) == HG_ERR_NULL_POINTER && msg_len() > 0, "table %d NULL table", t);
    CHECK(fn("steel", 0, buf, sizeof buf, NULL) == HG_ERR_NULL_POINTER, "table %d NULL needed", t);
    CHECK(fn("steel", 0, NULL, 4, &need) == HG_ERR_NULL_POINTER, "table %d NULL buf", t);
    CHECK(fn("steel", 0, NULL, 0, &need) == HG_ERR_BUFFER_TOO_SMALL && need > 0, "table %d length query", t);
    CHECK(fn("steel", SIZE_MAX, buf, sizeof buf, &need) == HG_ERR_OUT_OF_RANGE && msg_len() > 0, "table %d SIZE_MAX", t);
    CHECK(fn("cast_iron", 0, buf, sizeof buf, &need) == HG_ERR_UNKNOWN_NAME && msg_len() > 0, "table %d unknown", t);
    CHECK(fn("", 0, buf, sizeof buf, &need) == HG_ERR_UNKNOWN_NAME, "table %d empty name", t);
    CHECK(fn("\xff", 0, buf, sizeof buf, &need) == HG_ERR_INVALID, "table %d not UTF-8", t);
  }
  /* Every schedule and size listed by index is one hg_pipe_size knows (ASTM D1785 lists
   * schedule 40 PVC in 2-1/2; common practice). */
  size_t ns = 0, nn = 0;
  char sched[16], nom[16];
  while (hg_pipe_table_schedule("pvc", ns, sched, sizeof sched, &need) == HG_OK) ns++;
  while (hg_pipe_table_nominal("pvc", nn, nom, sizeof nom, &need) == HG_OK) nn++;
  CHECK(ns >= 2 && nn >= 10, "pvc: %zu schedules, %zu sizes", ns, nn);
  int found = 0;
  for (size_t i = 0; i < nn; i++) {
    hg_pipe_table_nominal("pvc", i, nom, sizeof nom, &need);
    found += strcmp(nom, "2-1/2") == 0 && hg_pipe_size("pvc", nom, "40", &x, &y, &z) == HG_OK;
  }
  CHECK(found == 1, "pvc 2-1/2 schedule 40 listed once");
  /* Table listing: the same twelve names in the same order as Rust's sizes::pipe_tables()
   * and Python's pipe_tables(); metric and plastic tables through hg_pipe_size. */
  size_t nt = 0;
  int has_pe = 0;
  char tname[64];
  while (hg_pipe_tables(nt, tname, sizeof tname, &need) == HG_OK) {
    has_pe += strcmp(tname, "pe_iso4427") == 0;
    nt++;
  }
  CHECK(nt == 12 && has_pe == 1, "%zu pipe tables", nt);
  CHECK(hg_pipe_tables(0, tname, sizeof tname, &need) == HG_OK && strcmp(tname, "steel") == 0, "first table");
  CHECK(hg_pipe_tables(12, tname, sizeof tname, &need) == HG_ERR_OUT_OF_RANGE && msg_len() > 0, "past the last table");
  CHECK(hg_pipe_tables(0, NULL, 0, NULL) == HG_ERR_NULL_POINTER, "tables NULL needed");
  char text[512];
  CHECK(hg_pipe_table_source("pe_iso4427", text, sizeof text, &need) == HG_OK && strstr(text, "ISO 4427"), "PE source");
  CHECK(hg_pipe_table_wall_rule("pvc", text, sizeof text, &need) == HG_OK && strstr(text, "mean wall"), "PVC wall rule");
  CHECK(hg_pipe_table_source(NULL, text, sizeof text, &need) == HG_ERR_NULL_POINTER, "source NULL table");
  /* PE 110 SDR 11: e_min 10.0 mm, tolerance 1.1 mm (ISO 4427-2 as printed in published
   * copies), mean wall 10.55 mm, bore 88.9 mm (exact arithmetic). */
  CHECK(hg_pipe_size("pe_iso4427", "110", "SDR 11", &x, &y, &z) == HG_OK && fabs(z - 0.0889) < 1e-15
        && fabs(y - 0.01055) < 1e-15, "PE 110 SDR 11: bore %.17g", z);
  /* DIN 11850 series 2, DN 25: 29 x 1.5 mm, bore 26 mm (DIN 11850:1985 Table 1, published copy). */
  CHECK(hg_pipe_size("hygienic_din11850", "29", "2", &x, &y, &z) == HG_OK && fabs(z - 0.026) < 1e-15, "DIN 11850 29 x 1.5");
  /* By DN: DIN 11850 DN 25 series 2 is 29 x 1.5 (DIN 11850:1985 Table 1, published copy);
   * EN 10220 DN 50 is 60.3 mm (published copies, see core/tests/sizes_metric.rs). */
  CHECK(hg_pipe_size_dn("hygienic_din11850", 25, "2", &x, &y, &z) == HG_OK && fabs(x - 0.029) < 1e-15
        && fabs(z - 0.026) < 1e-15, "DIN 11850 DN 25 series 2");
  CHECK(hg_pipe_size_dn("steel_en10220", 50, "2.9", &x, &y, &z) == HG_OK && fabs(x - 0.0603) < 1e-15, "DN 50");
  CHECK(hg_pipe_size_dn("steel_en10220", 55, "2.9", &x, &y, &z) == HG_ERR_UNKNOWN_NAME, "DN 55");
  hg_last_error(text, sizeof text);
  CHECK(strstr(text, "50, 65") != NULL, "DN list: %s", text);
  CHECK(hg_pipe_size_dn("pe_iso4427", 100, "SDR 11", &x, &y, &z) == HG_ERR_UNKNOWN_NAME, "PE has no DN");
  CHECK(hg_pipe_size_dn("steel_en10220", 50, "\xff", &x, &y, &z) == HG_ERR_INVALID, "DN schedule not UTF-8");
  CHECK(hg_pipe_size_dn("steel_en10220", 50, "2.9", NULL, &y, &z) == HG_ERR_NULL_POINTER, "DN NULL output");
  CHECK(hg_pipe_size_dn(NULL, 50, "2.9", &x, &y, &z) == HG_ERR_NULL_POINTER, "DN NULL table");
  CHECK(hg_pipe_size("stel", "2", "40", &x, &y, &z) == HG_ERR_UNKNOWN_NAME, "misspelt table");
  hg_last_error(text, sizeof text);
  CHECK(strstr(text, "did you mean \"steel\"?") != NULL, "suggestion: %s", text);
  CHECK(hg_pipe_size_at_least("copper_en1057", "1.0", 0.0195, &z, nom, sizeof nom, &need) == HG_OK
        && strcmp(nom, "22") == 0, "EN 1057 1.0 mm wall, 20 mm bore: %s", nom);
  hg_pipe_flow st;
  st.struct_size = 3;
  CHECK(hg_duct_flow_state(0, 0.05, 0, 1, 0, 998, 1e-3, 1e-3, &st) == HG_ERR_INVALID, "struct_size 3");
  CHECK(hg_duct_flow_state(0, 0.05, 0, 1, 0, 998, 1e-3, 1e-3, NULL) == HG_ERR_NULL_POINTER, "duct NULL");
  CHECK(hg_duct_flow_state(9, 0.05, 0, 1, 0, 998, 1e-3, 1e-3, &st) == HG_ERR_INVALID, "still struct_size first");
  st.struct_size = sizeof st;
  CHECK(hg_duct_flow_state(9, 0.05, 0, 1, 0, 998, 1e-3, 1e-3, &st) == HG_ERR_OUT_OF_RANGE, "duct shape 9");
  double q[2] = {1e-3, 2e-3}, h[2], d[2];
  CHECK(hg_pipe_head_loss_batch(0.05, 1, 0, 998, 1e-3, NULL, 2, h, d) == HG_ERR_NULL_POINTER, "batch NULL flow");
  CHECK(hg_pipe_head_loss_batch(0.05, 1, 0, 998, 1e-3, q, 2, NULL, d) == HG_ERR_NULL_POINTER, "batch NULL h");
  CHECK(hg_pipe_head_loss_batch(0.05, 1, 0, 998, 1e-3, q, 2, h, NULL) == HG_ERR_NULL_POINTER, "batch NULL d");
  CHECK(hg_pipe_head_loss_batch(0.05, 1, 0, 998, 1e-3, q, 0, h, d) == HG_ERR_INVALID && msg_len() > 0, "batch n 0");
  CHECK(hg_pipe_head_loss_batch(0.05, 1, 0, 998, 1e-3, q, 2, h, h) == HG_ERR_INVALID, "batch outputs alias");
  q[1] = INFINITY;
  CHECK(hg_pipe_head_loss_batch(0.05, 1, 0, 998, 1e-3, q, 2, h, d) == HG_ERR_NOT_FINITE, "batch inf flow");
  char m[64];
  hg_last_error(m, sizeof m);
  CHECK(strncmp(m, "element 1: flow = inf", 21) == 0, "batch message '%s'", m);
  double v[5];
  for (int k = 0; k < 5; k++) {
    double *p[5] = {&v[0], &v[1], &v[2], &v[3], &v[4]};
    p[k] = NULL;
    CHECK(hg_correlation_validity(0, p[0], p[1], p[2], p[3], p[4]) == HG_ERR_NULL_POINTER, "validity NULL %d", k);
  }
  CHECK(hg_correlation_validity(7, &v[0], &v[1], &v[2], &v[3], &v[4]) == HG_ERR_OUT_OF_RANGE && msg_len() > 0, "validity 7");
  CHECK(hg_transition_limits(3000, 0, 0, NULL, &y) == HG_ERR_NULL_POINTER, "limits NULL");
  CHECK(hg_transition_limits(3000, 0, 0, &x, NULL) == HG_ERR_NULL_POINTER, "limits NULL");
  CHECK(hg_transition_limits(NAN, 0, 0, &x, &y) == HG_ERR_NOT_FINITE && msg_len() > 0, "limits NaN");
  CHECK(hg_transition_limits(3000, 0, 9, &x, &y) == HG_ERR_OUT_OF_RANGE, "limits correlation 9");
  const double pq[3] = {0.0, 1e-3, 2e-3}, ph[3] = {30.0, 25.0, 15.0};
  /* exact: the monotone cubic passes through its own points */
  CHECK(hg_pump_curve_head(pq, ph, 3, 1e-3, &x, &y) == HG_OK && x == 25.0, "pump head at a point");
  CHECK(hg_pump_curve_head(NULL, ph, 3, 1e-3, &x, &y) == HG_ERR_NULL_POINTER, "pump NULL flows");
  CHECK(hg_pump_curve_head(pq, NULL, 3, 1e-3, &x, &y) == HG_ERR_NULL_POINTER, "pump NULL heads");
  CHECK(hg_pump_curve_head(pq, ph, 3, 1e-3, NULL, &y) == HG_ERR_NULL_POINTER, "pump NULL out");
  CHECK(hg_pump_curve_head(pq, ph, 3, 1e-3, &x, NULL) == HG_ERR_NULL_POINTER, "pump NULL out");
  CHECK(hg_pump_curve_head(pq, ph, 0, 1e-3, &x, &y) == HG_ERR_INVALID && msg_len() > 0, "pump n 0");
  CHECK(hg_pump_curve_head(pq, ph, 2, 1e-3, &x, &y) != HG_OK && msg_len() > 0, "pump 2 points");
  CHECK(hg_pump_curve_head(ph, pq, 3, 1e-3, &x, &y) != HG_OK, "pump flows decreasing");
  CHECK(hg_roughness(NULL, &x, &y, &z) == HG_ERR_NULL_POINTER, "roughness NULL name");
  CHECK(hg_roughness("plastic", NULL, &y, &z) == HG_ERR_NULL_POINTER, "roughness NULL");
  CHECK(hg_roughness("plastic", &x, NULL, &z) == HG_ERR_NULL_POINTER, "roughness NULL");
  CHECK(hg_roughness("plastic", &x, &y, NULL) == HG_ERR_NULL_POINTER && msg_len() > 0, "roughness NULL");
  CHECK(hg_roughness_material_name(0, buf, sizeof buf, NULL) == HG_ERR_NULL_POINTER, "material NULL");
  CHECK(hg_roughness_material_name(999, buf, sizeof buf, &need) == HG_ERR_OUT_OF_RANGE, "material past end");
  CHECK(hg_roughness_aged(1e-4, 1e-5, 3, NULL) == HG_ERR_NULL_POINTER, "aged NULL");
  CHECK(hg_pipe_size(NULL, "2", "40", &x, &y, &z) == HG_ERR_NULL_POINTER, "size NULL table");
  CHECK(hg_pipe_size("steel", NULL, "40", &x, &y, &z) == HG_ERR_NULL_POINTER, "size NULL nominal");
  CHECK(hg_pipe_size("steel", "2", NULL, &x, &y, &z) == HG_ERR_NULL_POINTER, "size NULL schedule");
  CHECK(hg_pipe_size("steel", "2", "40", NULL, &y, &z) == HG_ERR_NULL_POINTER, "size NULL out");
  CHECK(hg_pipe_size("steel", "2", "40", &x, NULL, &z) == HG_ERR_NULL_POINTER, "size NULL out");
  CHECK(hg_pipe_size("steel", "2", "40", &x, &y, NULL) == HG_ERR_NULL_POINTER, "size NULL out");
  CHECK(hg_pipe_size("steel", "2", "99", &x, &y, &z) == HG_ERR_UNKNOWN_NAME && msg_len() > 0, "schedule 99");
  CHECK(hg_pipe_size_at_least(NULL, "40", 0.05, &x, buf, sizeof buf, &need) == HG_ERR_NULL_POINTER, "at least NULL");
  CHECK(hg_pipe_size_at_least("steel", NULL, 0.05, &x, buf, sizeof buf, &need) == HG_ERR_NULL_POINTER, "at least NULL");
  CHECK(hg_pipe_size_at_least("steel", "40", 0.05, NULL, buf, sizeof buf, &need) == HG_ERR_NULL_POINTER, "at least NULL");
  CHECK(hg_pipe_size_at_least("steel", "40", 0.05, &x, NULL, 4, &need) == HG_ERR_NULL_POINTER, "at least NULL buf");
  CHECK(hg_pipe_size_at_least("steel", "40", 0.05, &x, buf, sizeof buf, NULL) == HG_ERR_NULL_POINTER, "at least NULL");
  x = 0;
  CHECK(hg_pipe_size_at_least("steel", "40", 0.05, &x, buf, 1, &need) == HG_ERR_BUFFER_TOO_SMALL && x > 0.05 &&
            buf[0] == 0 && need > 0, "at least: diameter written, name cut");
}


int main(int argc, char **argv) {
  if (argc < 3) {
    fprintf(stderr, "usage: %s REFERENCE_FILE EXPECTED_VERSION\n", argv[0]);
    return 2;
  }
  load_reference(argv[1]);
  ref_path = argv[1];
  CHECK(nrefs > 1000, "reference file has %zu lines", nrefs);
  test_meta(argv[2]);
  test_last_error();
  long bad = compare_reference(0);
  bad += compare_records(0);
  printf("bitwise: %zu friction points and the other functions' records, %ld differ\n", nrefs, bad);
  test_opts_and_batch();
  test_bad_values();
  test_bad_pointers_and_constants();
  test_bad_pointers_others();
  test_threads();
  free(refs);
  return check_summary("test_capi");
}

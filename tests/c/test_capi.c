/* Calls every function of hydrograde.h: results against the Rust core bit for bit (from
 * the reference file written by capi/examples/core_reference.rs), bad input of every
 * kind, the last-error contract, and 8 threads at once.
 * Usage: test_capi REFERENCE_FILE EXPECTED_VERSION */
#include <math.h>
#include <pthread.h>
#include <stdlib.h>

#include "hydrograde.h"
#include "check.h"

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

/* The status code a core error kind must map to: HG_ERR_<KIND>. */
static int32_t code_of_kind(const char *kind) {
  char want[64];
  snprintf(want, sizeof want, "HG_ERR_%s", kind);
  for (char *p = want; *p; p++)
    if (*p >= 'a' && *p <= 'z') *p = (char)(*p - 'a' + 'A');
  const int32_t codes[] = {HG_ERR_NOT_FINITE, HG_ERR_OUT_OF_RANGE, HG_ERR_UNKNOWN_NAME,
                           HG_ERR_INVALID, HG_ERR_NO_SOLUTION};
  for (size_t i = 0; i < sizeof codes / sizeof *codes; i++)
    if (strcmp(hg_status_name(codes[i]), want) == 0) return codes[i];
  return -1;
}

static size_t msg_len(void) { return hg_last_error(NULL, 0); }

/* ---------- version, names ---------- */

static void test_meta(const char *expected_version) {
  char v[64];
  snprintf(v, sizeof v, "%d.%d.%d", HG_VERSION_MAJOR, HG_VERSION_MINOR, HG_VERSION_PATCH);
  CHECK(strcmp(v, expected_version) == 0, "macros %s vs Cargo.toml %s", v, expected_version);
  CHECK(strcmp(hg_version(), expected_version) == 0, "hg_version %s", hg_version());
  CHECK(hg_abi_version() == HG_ABI_VERSION, "abi %u", hg_abi_version());
  CHECK(HG_ABI_VERSION == HG_VERSION_MAJOR, "abi is the major version");

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
  double good[6];
  int reject[6];
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

//@@MORE_CALLERS@@

static const scalar_case cases[] = {
    {"hg_darcy_factor", call_darcy, 2, {1e5, 1e-4}, {REJ_ALL, REJ_NONFINITE | REJ_NEG}},
    {"hg_darcy_factor_full", call_darcy_full, 2, {1e5, 1e-4}, {REJ_ALL, REJ_NONFINITE | REJ_NEG}},
    {"hg_darcy_factor_opts", call_darcy_opts, 5, {1e5, 1e-4, 64.0, 2300.0, 4000.0},
     {REJ_ALL, REJ_NONFINITE | REJ_NEG, REJ_ALL, REJ_ALL, REJ_ALL}},
    {"hg_darcy_factor_batch", call_batch, 2, {1e5, 1e-4}, {REJ_ALL, REJ_NONFINITE | REJ_NEG}},
//@@MORE_CASES@@
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
        double a[6];
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
  for (int rep = 0; rep < 2; rep++) t->bad += compare_reference(1);
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

//@@MORE_TESTS@@

int main(int argc, char **argv) {
  if (argc < 3) {
    fprintf(stderr, "usage: %s REFERENCE_FILE EXPECTED_VERSION\n", argv[0]);
    return 2;
  }
  load_reference(argv[1]);
  CHECK(nrefs > 1000, "reference file has %zu lines", nrefs);
  test_meta(argv[2]);
  test_last_error();
  long bad = compare_reference(0);
  printf("bitwise: %zu reference points, %ld differ\n", nrefs, bad);
  test_opts_and_batch();
  test_bad_values();
  test_bad_pointers_and_constants();
//@@MORE_CALLS@@
  test_threads();
  free(refs);
  return check_summary("test_capi");
}

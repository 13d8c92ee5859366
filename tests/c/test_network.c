/* Networks through the C ABI: an invented three-reservoir layout against an independent
 * solve, a check valve held shut, the breakdown of a link, and every bad input. */
#include <math.h>
#include "check.h"
#include "hydrograde.h"

#define PI 3.14159265358979323846
#define G 9.80665 /* standard gravity, m/s^2 (CGPM 1901, exact) */

/* The calling thread's last error message. */
static const char *last_error(void) {
  static char buf[512];
  hg_last_error(buf, sizeof buf);
  return buf;
}

/* A line of one fully rough pipe: its loss is r*Q|Q| with f independent of Reynolds. */
static hg_line *rough_pipe(double d, double l, double e) {
  hg_line *line = NULL;
  hg_friction_options o;
  o.struct_size = sizeof o;
  CHECK(hg_friction_options_default(&o) == HG_OK, "defaults");
  o.correlation = HG_CORRELATION_FULLY_ROUGH;
  CHECK(hg_line_new(&line) == HG_OK, "line");
  CHECK(hg_line_add_pipe(line, d, l, e) == HG_OK, "pipe");
  CHECK(hg_line_set_friction_options(line, &o) == HG_OK, "options");
  return line;
}

/* r of r*Q|Q|: f = [2 log10(3.7 D/e)]^-2 (von Karman's rough-wall law), Darcy-Weisbach. */
static double rough_r(double d, double l, double e) {
  double f = 1.0 / pow(2.0 * log10(3.7 * d / e), 2.0);
  return 8.0 * f * l / (G * PI * PI * pow(d, 5.0));
}

/* Bands of a solved network: each interval holds its nominal value, which is the
 * solution's own number; a fixed head is exact; bad indices and a solution of another
 * network are refused. */
static void test_bands(const hg_network *net, const hg_network_solution *s, const hg_fluid *water) {
  hg_network_bands *b = NULL;
  CHECK(hg_network_bands_new(net, water, s, &b) == HG_OK, "bands: %s", last_error());
  double hl, h, hh, pl, p, ph, z, out, ql, q, qh;
  CHECK(hg_network_bands_node(b, 0, &hl, &h, &hh, &pl, &p, &ph) == HG_OK, "node band");
  double head, sp;
  CHECK(hg_network_solution_node(s, 0, &head, &z, &sp, &out) == HG_OK, "node");
  CHECK(h == head && p == sp, "nominal is the solution's head %g %g", h, head);
  CHECK(hl < h && h < hh && pl < p && p < ph, "junction band %g %g %g", hl, h, hh);
  CHECK(hg_network_bands_node(b, 1, &hl, &h, &hh, &pl, &p, &ph) == HG_OK && hl == hh, "fixed head exact");
  CHECK(hg_network_bands_flow(b, 0, &ql, &q, &qh) == HG_OK && ql < q && q < qh, "flow band %g %g %g", ql, q, qh);
  CHECK(hg_network_bands_flow(b, 3, &ql, &q, &qh) == HG_ERR_OUT_OF_RANGE, "link index past the end");
  CHECK(hg_network_bands_node(b, 9, &hl, &h, &hh, &pl, &p, &ph) == HG_ERR_OUT_OF_RANGE, "node index past the end");
  CHECK(hg_network_bands_flow(b, 0, NULL, &q, &qh) == HG_ERR_NULL_POINTER, "NULL out");
  hg_network_bands_free(b);
  hg_network_bands_free(NULL);
  /* A solution of another network. */
  hg_network *other = NULL;
  hg_network_bands *none = NULL;
  CHECK(hg_network_new(&other) == HG_OK, "other");
  CHECK(hg_network_bands_new(other, water, s, &none) == HG_ERR_INVALID && none == NULL, "another network's solution");
  CHECK(strstr(last_error(), "solution") != NULL, "%s", last_error());
  hg_network_free(other);
}

/* JSON documents: refused with HG_ERR_INVALID and a message naming the fault. */
static void test_json(void) {
  hg_network *net = NULL;
  CHECK(hg_network_from_json("not json", &net) == HG_ERR_INVALID && net == NULL, "not JSON");
  CHECK(hg_network_from_json("{\"hydrograde_network\": 2, \"nodes\": [], \"links\": []}", &net) == HG_ERR_INVALID, "version 2");
  CHECK(strstr(last_error(), "version 2") != NULL, "%s", last_error());
  CHECK(hg_network_from_json("{\"hydrograde_network\": 1, \"nodes\": [{\"name\": \"t\", \"head\": 10.0}, {\"name\": \"a\", \"elevation\": 0.0, \"outflow\": 0.001}], \"links\": []}", &net) == HG_OK && net != NULL, "nodes only: %s", last_error());
  size_t nn = 0, nl = 9;
  CHECK(hg_network_counts(net, &nn, &nl) == HG_OK && nn == 2 && nl == 0, "counts %zu %zu", nn, nl);
  hg_network_free(net);
  net = NULL;
  CHECK(hg_network_from_json("{\"hydrograde_network\": 1, \"nodes\": [{\"name\": \"a\"}], \"links\": []}", &net) == HG_ERR_INVALID, "junction without elevation");
  CHECK(strstr(last_error(), "node 0 (\"a\")") != NULL, "%s", last_error());
  CHECK(hg_network_from_json(NULL, &net) == HG_ERR_NULL_POINTER, "NULL text");
  CHECK(hg_network_from_json("{}", NULL) == HG_ERR_NULL_POINTER, "NULL out");
}

static void test_three_reservoirs(const hg_fluid *water) {
  const double d[3] = {0.3, 0.25, 0.2}, len[3] = {1500.0, 1000.0, 2000.0}, level[3] = {100.0, 80.0, 40.0};
  const char *tanks[3] = {"t0", "t1", "t2"}, *pipes[3] = {"p0", "p1", "p2"};
  hg_network *net = NULL;
  CHECK(hg_network_new(&net) == HG_OK, "new");
  CHECK(hg_network_add_node(net, "j", 30.0, 0.02) == HG_OK, "junction");
  for (int i = 0; i < 3; i++) {
    hg_line *l = rough_pipe(d[i], len[i], 1e-3);
    CHECK(hg_network_add_fixed_head(net, tanks[i], level[i], NULL) == HG_OK, "tank %d", i);
    CHECK(hg_network_add_link(net, pipes[i], tanks[i], "j", l) == HG_OK, "link %d", i);
    hg_line_free(l); /* the network holds its own copy */
  }
  size_t nn = 0, nl = 0, idx = 99;
  CHECK(hg_network_counts(net, &nn, &nl) == HG_OK && nn == 4 && nl == 3, "counts %zu %zu", nn, nl);
  CHECK(hg_network_index(net, "p2", 1, &idx) == HG_OK && idx == 2, "link index %zu", idx);
  CHECK(hg_network_index(net, "j", 0, &idx) == HG_OK && idx == 0, "node index %zu", idx);
  hg_network_solution *s = NULL;
  CHECK(hg_network_solve(net, water, &s) == HG_OK, "solve: %s", last_error());
  /* Independent solve: bisection on the junction head, each flow sqrt(|dH|/r). */
  double lo = -1000.0, hi = 1000.0;
  for (int it = 0; it < 200; it++) {
    double mid = 0.5 * (lo + hi), in = -0.02;
    for (int i = 0; i < 3; i++) {
      double dh = level[i] - mid;
      in += (dh > 0 ? 1.0 : -1.0) * sqrt(fabs(dh) / rough_r(d[i], len[i], 1e-3));
    }
    if (in > 0) lo = mid; else hi = mid;
  }
  double hj = 0.5 * (lo + hi), head, z, p, out, sum = 0.0;
  CHECK(hg_network_solution_node(s, 0, &head, &z, &p, &out) == HG_OK, "node");
  CHECK(fabs(head - hj) < 1e-9, "junction head %.15g, expected %.15g", head, hj);
  CHECK(z == 30.0 && out == 0.02, "elevation %g outflow %g", z, out);
  for (int i = 0; i < 3; i++) {
    double q, v, drop;
    int32_t hv, closed;
    uint32_t w;
    CHECK(hg_network_solution_link(s, (size_t)i, &q, &v, &hv, &drop, &closed, &w) == HG_OK, "link %d", i);
    double dh = level[i] - hj, expect = (dh > 0 ? 1.0 : -1.0) * sqrt(fabs(dh) / rough_r(d[i], len[i], 1e-3));
    CHECK(fabs(q - expect) <= 1e-9 * fabs(expect), "p%d flow %.15g expected %.15g", i, q, expect);
    CHECK(hv == 1 && fabs(v - q / (PI * d[i] * d[i] / 4.0)) <= 1e-12 * fabs(v), "p%d velocity %g", i, v);
    CHECK(closed == 0, "p%d open", i);
    sum += q;
  }
  /* Continuity at the junction (exact balance up to the linear solve's rounding). */
  CHECK(fabs(sum - 0.02) <= 1e-12 * 0.1, "continuity %.17g", sum);
  size_t iters, nw;
  double dq, imb;
  CHECK(hg_network_solution_summary(s, &iters, &dq, &imb, &nw) == HG_OK && iters > 0 && iters < 50, "iterations %zu", iters);
  CHECK(hg_network_solution_node(s, 4, &head, &z, &p, &out) == HG_ERR_OUT_OF_RANGE, "node index past the end");
  test_bands(net, s, water);
  hg_network_solution_free(s);
  hg_network_free(net);
}

static void test_check_valve(const hg_fluid *water) {
  hg_network *net = NULL;
  hg_line *feed = NULL, *guarded = NULL;
  CHECK(hg_line_new(&feed) == HG_OK && hg_line_add_pipe(feed, 0.1, 200.0, 4.5e-5) == HG_OK, "feed");
  CHECK(hg_line_new(&guarded) == HG_OK && hg_line_add_pipe(guarded, 0.1, 150.0, 4.5e-5) == HG_OK &&
            hg_line_add_fitting(guarded, "swing_check_valve", 0.0) == HG_OK, "guarded");
  CHECK(hg_network_new(&net) == HG_OK, "new");
  CHECK(hg_network_add_fixed_head(net, "A", 50.0, NULL) == HG_OK, "A");
  CHECK(hg_network_add_node(net, "J", 5.0, 0.01) == HG_OK, "J");
  double z_b = 55.0;
  CHECK(hg_network_add_fixed_head(net, "B", 60.0, &z_b) == HG_OK, "B");
  CHECK(hg_network_add_link(net, "feed", "A", "J", feed) == HG_OK, "feed link");
  CHECK(hg_network_add_link(net, "guarded", "J", "B", guarded) == HG_OK, "guarded link");
  hg_network_solution *s = NULL;
  CHECK(hg_network_solve(net, water, &s) == HG_OK, "solve: %s", last_error());
  /* A junction fed only through a check valve laid the wrong way round is cut off: the
     solve has no solution and says so (continuity cannot hold at J2). */
  hg_network *cut = NULL;
  hg_network_solution *none = NULL;
  CHECK(hg_network_new(&cut) == HG_OK && hg_network_add_fixed_head(cut, "T", 30.0, NULL) == HG_OK &&
            hg_network_add_node(cut, "J2", 0.0, 0.002) == HG_OK &&
            hg_network_add_link(cut, "backwards", "J2", "T", guarded) == HG_OK,
        "cut-off network");
  CHECK(hg_network_solve(cut, water, &none) == HG_ERR_NO_SOLUTION && none == NULL, "cut off: %s", last_error());
  hg_network_free(cut);
  double q, v, drop, head, z, p, out;
  int32_t hv, closed, kind = -1;
  uint32_t w;
  CHECK(hg_network_solution_link(s, 1, &q, &v, &hv, &drop, &closed, &w) == HG_OK, "link");
  CHECK(closed == 1 && q == 0.0, "valve shut: closed %d flow %g", closed, q);
  CHECK(hg_network_solution_link(s, 0, &q, &v, &hv, &drop, &closed, &w) == HG_OK, "feed");
  CHECK(fabs(q - 0.01) <= 1e-12 * 0.01, "all from A: %.17g", q);
  /* B's pressure is read at its stated elevation: rho g (60 - 55). */
  CHECK(hg_network_solution_node(s, 2, &head, &z, &p, &out) == HG_OK, "B");
  CHECK(fabs(p - 999.1 * G * 5.0) < 1e-9, "B pressure %.17g", p);
  /* The warning names the link; a one-byte buffer gets the needed length. */
  size_t nw = 0, iters, needed = 0;
  double dq, imb;
  CHECK(hg_network_solution_summary(s, &iters, &dq, &imb, &nw) == HG_OK && nw >= 1, "warnings %zu", nw);
  char buf[256], tiny[1];
  int found = 0;
  for (size_t i = 0; i < nw; i++) {
    CHECK(hg_network_solution_warning(s, i, &kind, buf, sizeof buf, &needed) == HG_OK, "warning %zu", i);
    if (kind == HG_NETWORK_WARNING_CHECK_VALVE_CLOSED && strstr(buf, "\"guarded\"")) found = 1;
  }
  CHECK(found, "a check-valve warning names the link");
  CHECK(hg_network_solution_warning(s, 0, &kind, tiny, sizeof tiny, &needed) == HG_ERR_BUFFER_TOO_SMALL && needed > 1, "small buffer");
  /* The breakdown of the feed is its line at the solved flow. */
  hg_line_result *r = NULL, *direct = NULL;
  hg_line_totals a, b;
  a.struct_size = sizeof a;
  b.struct_size = sizeof b;
  CHECK(hg_network_link_result(net, s, water, 0, &r) == HG_OK, "breakdown");
  CHECK(hg_line_evaluate(feed, water, 0.01, &direct) == HG_OK, "direct");
  CHECK(hg_line_result_totals(r, &a) == HG_OK && hg_line_result_totals(direct, &b) == HG_OK, "totals");
  CHECK(fabs(a.required_head - b.required_head) <= 1e-12 * b.required_head, "same line result");
  CHECK(hg_network_link_result(net, s, water, 5, &r) == HG_ERR_OUT_OF_RANGE, "link index past the end");
  hg_line_result_free(r);
  hg_line_result_free(direct);
  hg_network_solution_free(s);
  hg_network_free(net);
  hg_line_free(feed);
  hg_line_free(guarded);
}

static void test_bad_input(const hg_fluid *water) {
  hg_network *net = NULL;
  hg_line *l = NULL;
  hg_network_solution *s = NULL;
  CHECK(hg_line_new(&l) == HG_OK && hg_line_add_pipe(l, 0.1, 100.0, 4.5e-5) == HG_OK, "line");
  CHECK(hg_network_new(&net) == HG_OK, "new");
  CHECK(hg_network_add_node(net, "a", 0.0, 0.001) == HG_OK, "a");
  CHECK(hg_network_add_node(net, "a", 0.0, 0.0) == HG_ERR_INVALID, "duplicate node");
  CHECK(strstr(last_error(), "\"a\"") != NULL, "message names it: %s", last_error());
  CHECK(hg_network_add_node(net, "deep", -5e4, 0.0) == HG_ERR_OUT_OF_RANGE, "elevation");
  CHECK(hg_network_add_node(net, "nan", 0.0, NAN) == HG_ERR_NOT_FINITE, "NaN outflow");
  CHECK(hg_network_add_link(net, "x", "a", "nowhere", l) == HG_ERR_UNKNOWN_NAME, "unknown node");
  CHECK(strstr(last_error(), "nowhere") != NULL, "message names it: %s", last_error());
  CHECK(hg_network_add_link(net, "self", "a", "a", l) == HG_ERR_INVALID, "link to itself");
  CHECK(hg_network_add_node(net, "b", 0.0, 0.0) == HG_OK, "b");
  CHECK(hg_network_add_link(net, "p", "a", "b", l) == HG_OK, "p");
  CHECK(hg_network_solve(net, water, &s) == HG_ERR_INVALID && s == NULL, "no fixed head");
  CHECK(strstr(last_error(), "fixed-head") != NULL, "%s", last_error());
  CHECK(hg_network_add_link(net, "p", "a", "b", l) == HG_ERR_INVALID, "duplicate link");
  CHECK(hg_network_add_node(NULL, "c", 0.0, 0.0) == HG_ERR_NULL_POINTER, "NULL network");
  CHECK(hg_network_add_node(net, NULL, 0.0, 0.0) == HG_ERR_NULL_POINTER, "NULL name");
  CHECK(hg_network_add_link(net, "q", "a", "b", NULL) == HG_ERR_NULL_POINTER, "NULL line");
  CHECK(hg_network_solve(net, NULL, &s) == HG_ERR_NULL_POINTER, "NULL fluid");
  CHECK(hg_network_solve(net, water, NULL) == HG_ERR_NULL_POINTER, "NULL out");
  size_t idx;
  CHECK(hg_network_index(net, "zz", 0, &idx) == HG_ERR_UNKNOWN_NAME, "unknown index");
  hg_network_free(NULL);
  hg_network_solution_free(NULL);
  hg_network_free(net);
  hg_line_free(l);
}

/* The flow of a pipe with friction head h over it, exactly: Colebrook (1939) with
 * Darcy-Weisbach gives Re*sqrt(f) = D*sqrt(2 g D S)/nu (S = h/L), so
 * V = -2 sqrt(2 g D S) log10(e/(3.7 D) + 2.51 nu/(D sqrt(2 g D S))) without iteration. */
static double colebrook_flow(double rho, double mu, double d, double l, double e, double h) {
  double root = sqrt(2.0 * G * d * h / l), nu = mu / rho;
  double v = -2.0 * root * log10(e / (3.7 * d) + 2.51 * nu / (d * root));
  return v * PI * d * d / 4.0;
}

static void test_available_flow(const hg_fluid *water) {
  const double rho = 999.1, mu = 1.138e-3, d = 0.15, len = 400.0, e = 4.5e-5;
  const double tank = 45.0, z = 2.0, base = 0.01, p_min = 1.4e5;
  hg_network *net = NULL;
  hg_line *l = NULL;
  CHECK(hg_line_new(&l) == HG_OK && hg_line_add_pipe(l, d, len, e) == HG_OK, "line");
  CHECK(hg_network_new(&net) == HG_OK, "new");
  CHECK(hg_network_add_fixed_head(net, "tank", tank, NULL) == HG_OK, "tank");
  CHECK(hg_network_add_node(net, "hydrant", z, base) == HG_OK, "hydrant");
  CHECK(hg_network_add_link(net, "main", "tank", "hydrant", l) == HG_OK, "main");
  double flow = 0.0, pressure = 0.0, x = -1.0, y = -1.0;
  size_t critical = 99;
  int32_t placed = -1;
  hg_network_solution *s = NULL;
  CHECK(hg_network_available_flow(net, water, "hydrant", p_min, 0, &flow, &pressure, &critical, &s) == HG_OK,
        "available: %s", last_error());
  /* Energy: tank - (z + p_min/(rho g)) is the friction head at the total flow. */
  double expected = colebrook_flow(rho, mu, d, len, e, tank - z - p_min / (rho * G)) - base;
  CHECK(fabs(flow - expected) < 1e-8 * expected, "flow %.17g vs %.17g", flow, expected);
  CHECK(fabs(pressure - p_min) < 1e-3 && critical == 1, "pressure %.17g at %zu", pressure, critical);
  double head, elev, p, out;
  CHECK(hg_network_solution_node(s, 1, &head, &elev, &p, &out) == HG_OK && out == base + flow, "drawn %g", out);
  hg_network_solution_free(s);
  /* Without a solution wanted, the same flow. */
  double again = 0.0;
  CHECK(hg_network_available_flow(net, water, "hydrant", p_min, 1, &again, &pressure, &critical, NULL) == HG_OK &&
            again == flow, "every junction, no solution out");
  CHECK(hg_network_available_flow(net, water, "tank", p_min, 0, &flow, &pressure, &critical, NULL) == HG_ERR_INVALID,
        "fixed head");
  CHECK(hg_network_available_flow(net, water, "nowhere", p_min, 0, &flow, &pressure, &critical, NULL) ==
            HG_ERR_UNKNOWN_NAME, "unknown");
  CHECK(hg_network_available_flow(net, water, "hydrant", NAN, 0, &flow, &pressure, &critical, NULL) ==
            HG_ERR_NOT_FINITE, "NaN");
  CHECK(hg_network_available_flow(net, water, "hydrant", -2e5, 0, &flow, &pressure, &critical, NULL) ==
            HG_ERR_OUT_OF_RANGE, "below vacuum");
  /* 45 m of water is about 441 kPa (rho g h): 500 kPa cannot be met even at no draw. */
  CHECK(hg_network_available_flow(net, water, "hydrant", 5e5, 0, &flow, &pressure, &critical, NULL) ==
            HG_ERR_NO_SOLUTION, "too high");
  CHECK(strstr(last_error(), "hydrant") != NULL, "names it: %s", last_error());
  CHECK(hg_network_available_flow(net, water, "hydrant", p_min, 0, NULL, &pressure, &critical, NULL) ==
            HG_ERR_NULL_POINTER, "NULL flow");
  /* Plan positions. */
  CHECK(hg_network_node_position(net, 1, &x, &y, &placed) == HG_OK && placed == 0 && x == 0.0, "unplaced");
  CHECK(hg_network_place_node(net, "hydrant", 250.0, -40.5) == HG_OK, "place");
  CHECK(hg_network_node_position(net, 1, &x, &y, &placed) == HG_OK && placed == 1 && x == 250.0 && y == -40.5,
        "placed %g %g", x, y);
  CHECK(hg_network_node_position(net, 2, &x, &y, &placed) == HG_ERR_OUT_OF_RANGE, "index");
  CHECK(hg_network_node_position(net, 0, NULL, &y, &placed) == HG_ERR_NULL_POINTER, "NULL x");
  CHECK(hg_network_place_node(net, "nowhere", 0.0, 0.0) == HG_ERR_UNKNOWN_NAME, "unknown");
  CHECK(hg_network_place_node(net, "hydrant", INFINITY, 0.0) == HG_ERR_NOT_FINITE, "inf");
  CHECK(hg_network_place_node(net, "hydrant", 0.0, 1e9) == HG_ERR_OUT_OF_RANGE, "far");
  CHECK(hg_network_place_node(net, NULL, 0.0, 0.0) == HG_ERR_NULL_POINTER, "NULL name");
  hg_network_free(net);
  hg_line_free(l);
}

int main(void) {
  hg_fluid *water = NULL;
  CHECK(hg_fluid_liquid(999.1, 1.138e-3, &water) == HG_OK, "fluid");
  test_three_reservoirs(water);
  test_check_valve(water);
  test_bad_input(water);
  test_available_flow(water);
  test_json();
  hg_fluid_free(water);
  return check_summary("test_network");
}

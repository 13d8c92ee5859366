// Networks through the C++17 wrapper (hydrograde.hpp): the same numbers as the C calls
// bit for bit, failures throw hydrograde::error with the library's status and message,
// the try_* variants return the status instead, and RAII handles free themselves
// (valgrind checks no leak).
#include "hydrograde.hpp"

#include <cmath>
#include <cstdio>
#include <cstring>
#include <string>
#include <utility>

static long run = 0, failed = 0;
#define CHECK(cond, what)                                                             \
  do {                                                                                \
    ++run;                                                                            \
    if (!(cond)) {                                                                    \
      ++failed;                                                                       \
      std::fprintf(stderr, "FAIL %s:%d: %s (%s)\n", __FILE__, __LINE__, #cond, what); \
    }                                                                                 \
  } while (0)

namespace hg = hydrograde;

template <class F>
static std::pair<int32_t, std::string> thrown(F f) {
  try {
    f();
  } catch (const hg::error& e) {
    return {e.status(), e.what()};
  }
  return {HG_OK, ""};
}

static bool same_bits(double a, double b) { return std::memcmp(&a, &b, sizeof a) == 0; }

// An invented two-loop layout: a tank feeding four junctions through five pipes.
static const char* kNodes[4] = {"a", "b", "c", "d"};
static const double kElevation[4] = {10.0, 12.0, 8.0, 15.0};
static const double kOutflow[4] = {0.004, 0.006, 0.005, 0.003};
struct pipe_def {
  const char *name, *up, *down;
  double d, l;
};
static const pipe_def kPipes[6] = {{"feed", "tank", "a", 0.2, 300.0}, {"ab", "a", "b", 0.15, 250.0},
                                   {"ac", "a", "c", 0.15, 200.0},     {"bd", "b", "d", 0.1, 220.0},
                                   {"cd", "c", "d", 0.1, 260.0},      {"bc", "b", "c", 0.1, 180.0}};

static hg::network build_cpp() {
  hg::network net;
  net.add_fixed_head("tank", 55.0);
  for (int i = 0; i < 4; i++) net.add_node(kNodes[i], kElevation[i], kOutflow[i]);
  for (const pipe_def& p : kPipes) {
    hg::line l;
    l.add_pipe(p.d, p.l, 4.5e-5);
    net.add_link(p.name, p.up, p.down, l);
  }
  return net;
}

static hg_network* build_c() {
  hg_network* net = nullptr;
  hg_network_new(&net);
  hg_network_add_fixed_head(net, "tank", 55.0, nullptr);
  for (int i = 0; i < 4; i++) hg_network_add_node(net, kNodes[i], kElevation[i], kOutflow[i]);
  for (const pipe_def& p : kPipes) {
    hg_line* l = nullptr;
    hg_line_new(&l);
    hg_line_add_pipe(l, p.d, p.l, 4.5e-5);
    hg_network_add_link(net, p.name, p.up, p.down, l);
    hg_line_free(l);
  }
  return net;
}

static void test_same_bits_as_c() {
  hg::fluid water = hg::fluid::water(288.15, 101325.0);
  hg::network net = build_cpp();
  CHECK(net.counts() == std::make_pair(std::size_t{5}, std::size_t{6}), "counts");
  CHECK(net.node_index("c") == 3 && net.link_index("bd") == 3, "indices");
  hg::network_solution s = net.solve(water);
  hg_network* cnet = build_c();
  hg_network_solution* cs = nullptr;
  CHECK(hg_network_solve(cnet, water.get(), &cs) == HG_OK, "C solve");
  for (std::size_t i = 0; i < 5; i++) {
    hg::network_node n = s.node(i);
    double h, z, p, q;
    hg_network_solution_node(cs, i, &h, &z, &p, &q);
    CHECK(same_bits(n.head, h) && same_bits(n.pressure, p) && same_bits(n.outflow, q), "node bits");
    CHECK(s.try_node(i).ok() && same_bits(s.try_node(i).value.head, h), "try_node");
  }
  for (std::size_t k = 0; k < 6; k++) {
    hg::network_link l = s.link(k);
    double q, v, dh;
    int32_t hv, cl;
    uint32_t w;
    hg_network_solution_link(cs, k, &q, &v, &hv, &dh, &cl, &w);
    CHECK(same_bits(l.flow, q) && same_bits(l.velocity, v) && same_bits(l.head_drop, dh), "link bits");
    CHECK(l.has_velocity && !l.closed, "flags");
  }
  // Continuity at junction b (links ab in; bd, bc out): exact to rounding of the flows.
  double in_b = s.link(1).flow - s.link(3).flow - s.link(5).flow;
  CHECK(std::fabs(in_b - kOutflow[1]) < 1e-12 * s.link(0).flow, "continuity at b");
  hg::network_summary m = s.summary();
  CHECK(m.iterations > 0 && m.iterations < 50, "iterations");
  hg::line_result r = net.link_result(s, water, 0);
  CHECK(same_bits(r.totals().flow, s.link(0).flow), "breakdown at the solved flow");

  // Available flow at d with at least 150 kPa at every junction: the same bits as C.
  hg::available_flow_result a = net.available_flow(water, "d", 1.5e5, true);
  double cflow, cp;
  std::size_t crit;
  CHECK(hg_network_available_flow(cnet, water.get(), "d", 1.5e5, 1, &cflow, &cp, &crit, nullptr) == HG_OK,
        "C available");
  CHECK(same_bits(a.flow, cflow) && same_bits(a.pressure, cp) && a.critical == crit, "available bits");
  CHECK(a.flow > 0.0 && a.solution.node(crit).pressure >= 1.5e5, "the minimum holds where it binds");
  hg::status_or<double> t = net.try_available_flow(water, "d", 1.5e5, true);
  CHECK(t.ok() && same_bits(t.value, cflow), "try_available_flow");
  hg_network_solution_free(cs);
  hg_network_free(cnet);

  net.place("a", 10.0, 20.0);
  hg::network::position pa = net.node_position(net.node_index("a"));
  CHECK(pa.has_position && pa.x == 10.0 && pa.y == 20.0, "position");
  CHECK(!net.node_position(0).has_position, "tank not placed");
}

static void test_errors_throw_or_return_status() {
  hg::fluid water = hg::fluid::water(288.15, 101325.0);
  hg::network net = build_cpp();
  auto e = thrown([&] { net.add_node("a", 0.0); });
  CHECK(e.first == HG_ERR_INVALID && e.second.find("\"a\"") != std::string::npos, "duplicate");
  e = thrown([&] { net.add_link("x", "a", "nowhere", hg::line().add_pipe(0.1, 10.0, 1e-5)); });
  CHECK(e.first == HG_ERR_UNKNOWN_NAME && e.second.find("nowhere") != std::string::npos, "unknown node");
  e = thrown([&] { net.available_flow(water, "tank", 1e5); });
  CHECK(e.first == HG_ERR_INVALID, "fixed head");
  e = thrown([&] { net.available_flow(water, "d", 9e5); });
  CHECK(e.first == HG_ERR_NO_SOLUTION, "minimum above the supply");
  CHECK(net.try_available_flow(water, "d", NAN).status == HG_ERR_NOT_FINITE, "try: NaN");
  e = thrown([&] { net.place("a", 0.0, 1e9); });
  CHECK(e.first == HG_ERR_OUT_OF_RANGE, "far position");
  hg::network_solution s = net.solve(water);
  e = thrown([&] { s.node(99); });
  CHECK(e.first == HG_ERR_OUT_OF_RANGE, "node index");
  CHECK(s.try_link(99).status == HG_ERR_OUT_OF_RANGE, "try_link index");
  // No fixed head: the solve fails; try_solve reports it without throwing.
  hg::network lone;
  lone.add_node("p", 0.0, 0.001).add_node("q", 0.0, 0.0);
  lone.add_link("pq", "p", "q", hg::line().add_pipe(0.1, 10.0, 1e-5));
  hg::status_or<hg::network_solution> t = lone.try_solve(water);
  CHECK(t.status == HG_ERR_INVALID && t.value.get() == nullptr, "try_solve");
  e = thrown([&] { lone.solve(water); });
  CHECK(e.first == HG_ERR_INVALID && e.second.find("fixed-head") != std::string::npos, "solve throws");
  // Moves leave the source empty and free once.
  hg::network moved = std::move(lone);
  CHECK(lone.get() == nullptr && moved.get() != nullptr, "move");
}

int main() {
  test_same_bits_as_c();
  test_errors_throw_or_return_status();
  std::printf("test_network_cpp: %ld checks, %ld failed\n", run, failed);
  return failed == 0 ? 0 : 1;
}

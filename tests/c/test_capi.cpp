// Calls the C++17 wrapper (hydrograde.hpp): values equal the C calls bit for bit, every
// failure throws hydrograde::error with the library's message and status, RAII handles
// free themselves (valgrind checks no leak).
#include "hydrograde.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstring>
#include <limits>
#include <string>
#include <utility>
#include <vector>

static long run = 0, failed = 0;
#define CHECK(cond, what)                                                        \
  do {                                                                           \
    ++run;                                                                       \
    if (!(cond)) {                                                               \
      ++failed;                                                                  \
      std::fprintf(stderr, "FAIL %s:%d: %s (%s)\n", __FILE__, __LINE__, #cond, what); \
    }                                                                            \
  } while (0)

template <class F>
static std::pair<int32_t, std::string> thrown(F f) {
  try {
    f();
  } catch (const hydrograde::error& e) {
    return {e.status(), e.what()};
  }
  return {HG_OK, ""};
}

static bool same_bits(double a, double b) { return std::memcmp(&a, &b, sizeof a) == 0; }

static void test_friction() {
  namespace hg = hydrograde;
  CHECK(hg::version() == hg_version(), "version");
  CHECK(hg::abi_matches(), "abi");
  for (int c = 0; c < 7; ++c) {
    double re = 2.5e5, rr = 2e-4, f = 0;
    hg_darcy_factor(re, rr, c, &f);
    CHECK(same_bits(hg::darcy_factor(re, rr, c), f), "scalar");
    hg_friction full = hg::darcy_factor_full(re, rr, c);
    CHECK(same_bits(full.f, f) && full.regime == HG_REGIME_TURBULENT, "full");
    hg_friction_options o = hg::friction_options();
    o.correlation = c;
    hg_friction viaopts = hg::darcy_factor(re, rr, o);
    CHECK(same_bits(viaopts.f, f) && same_bits(viaopts.df_dre, full.df_dre), "opts");
  }
  std::vector<double> re{1e3, 3e3, 1e5, 1e7}, rr{0, 1e-4, 1e-3, 1e-2};
  std::vector<double> f = hg::darcy_factor(re, rr);
  for (size_t i = 0; i < re.size(); ++i) CHECK(same_bits(f[i], hg::darcy_factor(re[i], rr[i])), "batch");
  CHECK(hg::correlation_from_name("serghides") == HG_CORRELATION_SERGHIDES, "name");

  auto e = thrown([] { hg::darcy_factor(-2.0, 0.0); });
  CHECK(e.first == HG_ERR_OUT_OF_RANGE && e.second == "re = -2: must be greater than 0", e.second.c_str());
  e = thrown([] { hg::darcy_factor(std::nan(""), 0.0); });
  CHECK(e.first == HG_ERR_NOT_FINITE && !e.second.empty(), e.second.c_str());
  e = thrown([] { hg::correlation_from_name("moody"); });
  CHECK(e.first == HG_ERR_UNKNOWN_NAME && e.second.find("colebrook") != std::string::npos, e.second.c_str());
  CHECK(hg::darcy_factor(std::vector<double>{}, std::vector<double>{}).empty(), "empty batch");
  e = thrown([] { hg::darcy_factor(std::vector<double>{1e5}, std::vector<double>{}); });
  CHECK(e.first == HG_ERR_INVALID, e.second.c_str());
  try {
    hg::darcy_factor(1e5, 0.0, 42);
    CHECK(false, "no throw");
  } catch (const hg::error& err) {
    CHECK(std::strcmp(err.status_name(), "HG_ERR_OUT_OF_RANGE") == 0, err.what());
  }
  CHECK(hg::last_error().find("correlation = 42") == 0, hg::last_error().c_str());
}

static void test_others() {
  namespace hg = hydrograde;
  double rho = 0, mu = 0, x = 0, y = 0;
  hg_water(293.15, 101325.0, &rho, &mu);
  hg::properties w = hg::water(293.15, 101325.0);
  CHECK(same_bits(w.density, rho) && same_bits(w.viscosity, mu), "water");
  hg_air(300.0, 2e5, &rho, &mu);
  hg::properties a = hg::air(300.0, 2e5);
  CHECK(same_bits(a.density, rho) && same_bits(a.viscosity, mu), "air");
  hg_water_vapour_pressure(350.0, &x);
  CHECK(same_bits(hg::water_vapour_pressure(350.0), x), "vapour");
  hg_convert(2.0, "in", "mm", &x);
  CHECK(same_bits(hg::convert(2.0, "in", "mm"), x), "convert");
  hg_convert_head(10.0, "m_head", "kPa", 998.2, &x);
  CHECK(same_bits(hg::convert_head(10.0, "m_head", "kPa", 998.2), x), "convert_head");
  std::vector<std::string> units = hg::unit_names(), cat = hg::fitting_catalogue();
  CHECK(units.size() > 10 && std::find(units.begin(), units.end(), "gpm") != units.end(), "units");
  CHECK(cat.size() > 10 && std::find(cat.begin(), cat.end(), "gate_valve") != cat.end(), "catalogue");
  for (const std::string& n : cat) {
    hg_fitting_k(n.c_str(), 1e5, 0.05, 1e-3, &x, &y);
    hg::fitting_k_result k = hg::fitting_k(n, 1e5, 0.05, 1e-3);
    CHECK(same_bits(k.k, x) && same_bits(k.dk_dre, y), n.c_str());
  }
  double s1, s2, s3, s4;
  hg_section_properties(HG_SECTION_ANNULUS, 0.1, 0.04, &s1, &s2, &s3, &s4);
  hg::section_geometry g = hg::section(HG_SECTION_ANNULUS, 0.1, 0.04);
  CHECK(same_bits(g.area, s1) && same_bits(g.wetted_perimeter, s2) && same_bits(g.hydraulic_diameter, s3) &&
            same_bits(g.laminar_constant, s4), "section");
  CHECK(hg::section(HG_SECTION_CIRCLE, 0.1).laminar_constant == 64.0, "circle 64");  // exact: Hagen–Poiseuille
  hg_pipe_head_loss(0.05, 30, 4.5e-5, 998.2, 1.002e-3, 2e-3, &x, &y);
  hg::head_loss_result h = hg::pipe_head_loss(0.05, 30, 4.5e-5, 998.2, 1.002e-3, 2e-3);
  CHECK(same_bits(h.head_loss, x) && same_bits(h.dhead_dflow, y), "pipe");
  std::vector<hg::head_loss_result> hb = hg::pipe_head_loss(0.05, 30, 4.5e-5, 998.2, 1.002e-3, {1e-3, 2e-3});
  CHECK(hb.size() == 2 && same_bits(hb[1].head_loss, x), "pipe batch");
  CHECK(hg::pipe_head_loss(0.05, 30, 4.5e-5, 998.2, 1.002e-3, std::vector<double>{}).empty(), "empty batch");
  hg_pipe_flow st = hg::duct_flow_state(HG_SECTION_RECTANGLE, 0.2, 0.1, 20, 1e-4, 998.2, 1.002e-3, 5e-3);
  CHECK(st.regime == HG_REGIME_TURBULENT && (st.warnings & HG_WARN_NON_CIRCULAR_SECTION), "duct");
  hg_reynolds(2e-3, 0.05, 998.2, 1.002e-3, &x);
  CHECK(same_bits(hg::reynolds(2e-3, 0.05, 998.2, 1.002e-3), x), "reynolds");

  hg::roughness_range rr = hg::roughness("commercial_steel");
  CHECK(rr.low <= rr.typical && rr.typical <= rr.high, "roughness range");
  CHECK(hg::roughness_materials().size() > 5, "materials");
  hg_roughness_aged(1e-4, 2e-5, 10, &x);
  CHECK(same_bits(hg::roughness_aged(1e-4, 2e-5, 10), x), "aged");
  hg::pipe_dimensions pd = hg::pipe_size("steel", "2", "40");
  CHECK(std::fabs(pd.inside_diameter - (pd.outside_diameter - 2 * pd.wall)) < 1e-15, "pipe size");
  auto al = hg::pipe_size_at_least("copper", "L", 0.03);
  CHECK(al.second >= 0.03 && !al.first.empty(), "at least");
  auto e = thrown([] { hg::water(200.0, 1e5); });
  CHECK(e.first == HG_ERR_OUT_OF_RANGE && e.second.find("temperature") != std::string::npos, e.second.c_str());
  e = thrown([] { hg::convert(1.0, "m", "furlong"); });
  CHECK(e.first == HG_ERR_UNKNOWN_NAME, e.second.c_str());
  e = thrown([] { hg::fitting_k("nonesuch", 1e5, 0.05); });
  CHECK(e.first == HG_ERR_UNKNOWN_NAME && e.second.find("gate_valve") != std::string::npos, e.second.c_str());
  e = thrown([] { hg::section(HG_SECTION_CIRCLE, 0.1, 0.2); });
  CHECK(e.first == HG_ERR_INVALID, e.second.c_str());
  e = thrown([] { hg::pipe_head_loss(0.05, -1, 0, 998, 1e-3, 1e-3); });
  CHECK(e.first == HG_ERR_OUT_OF_RANGE && e.second.rfind("length = -1", 0) == 0, e.second.c_str());
}

static void test_line() {
  namespace hg = hydrograde;
  hg::fluid water = hg::fluid::water(293.15, 2e5);
  hg::line l;
  l.add_pipe(0.05, 30, 4.5e-5).add_fitting("elbow_90_standard").add_rise(3.0).add_fitting_k(0.5);
  l.add_duct(HG_SECTION_CIRCLE, 0.05, 0, 12, 1.5e-6).add_equipment("strainer", 2e4, 2e-3);
  l.set_inlet_pressure(3e5);
  CHECK(l.size() == 6, "size");
  hg::line_result res = l.evaluate(water, 2e-3);
  hg_line_totals r = res.totals();
  hg_line_totals rc{};
  rc.struct_size = sizeof rc;
  hg_line_result* cres = nullptr;
  CHECK(hg_line_evaluate(l.get(), water.get(), 2e-3, &cres) == HG_OK && hg_line_result_totals(cres, &rc) == HG_OK,
        "C evaluate");
  hg_line_result_free(cres);
  CHECK(std::memcmp(&r, &rc, sizeof r) == 0, "evaluate equals C");
  CHECK(r.static_head == 3.0 && r.required_head > r.static_head && r.element_count == 6, "totals");
  CHECK(r.head_loss_low < r.head_loss && r.head_loss < r.head_loss_high, "band");
  CHECK(res.element(0).kind == HG_ELEMENT_PIPE && res.size() == 6, "element");
  CHECK(res.label(1) == "elbow_90_standard 1" && res.label(5) == "strainer", "labels");
  {
    // Labels, counts, slices and joins through the wrapper (the core's builder).
    hg::line b;
    b.add_pipe(0.05, 10, 4.5e-5).add_fitting_k(0.3).set_count(1, 6).set_label(0, "suction");
    hg::line_result br = b.evaluate(water, 2e-3);
    CHECK(br.label(0) == "suction" && br.label(1) == "6 × fitting 1" && br.element(1).count == 6, "tagged rows");
    hg::line head = b.slice(0, 1);
    hg::line tail;
    tail.add_fitting_k(0.3, 0.05).set_count(0, 6);  // a fitting alone needs its own bore
    head.append(tail);
    double h1 = head.evaluate(water, 2e-3).totals().required_head, h0 = br.totals().required_head;
    CHECK(head.size() == 2 && std::fabs(h1 - h0) <= 1e-12 * h0, "slice and append give the same line");
    bool threw = false;
    try {
      b.set_count(0, 2);
    } catch (const hg::error& e) {
      threw = std::string(e.what()).find("count") != std::string::npos;
    }
    CHECK(threw, "a count on a pipe throws naming count");
  }
  CHECK(!res.element(2).has_velocity && res.element(1).has_k && !res.element(0).has_k, "not-applicable flags");
  hg::flow_solution s = l.flow_for_head(water, r.required_head);
  CHECK(std::fabs(s.flow - 2e-3) < 1e-12 && s.flow_low < s.flow && s.flow < s.flow_high, "flow for head");
  std::vector<double> curve = l.system_curve(water, {0.0, 1e-3, 2e-3});
  // The core sums the curve's heads in another order than evaluate's: equal to rounding.
  CHECK(curve.size() == 3 && std::fabs(curve[2] - r.required_head) <= 1e-12 * r.required_head, "system curve");
  CHECK(curve[0] == 3.0, "zero flow: the static head alone");
  CHECK(l.system_curve(water, {}).empty(), "empty curve");
  hg::line moved = std::move(l);
  CHECK(moved.size() == 6, "moved line");
  hg::fluid f2 = hg::fluid::liquid(870.0, 0.03);
  f2 = hg::fluid::air(300.0, 1e5);
  CHECK(f2.props().density < 2.0, "moved fluid");

  hg::operating_point op = moved.operating_point(water, {0.0, 2e-3, 4e-3}, {40.0, 32.0, 8.0});
  CHECK(op.flow > 0 && op.flow_low < op.flow && op.flow < op.flow_high, "operating point");
  CHECK(std::fabs(moved.evaluate(water, op.flow).totals().required_head - op.head) < 1e-9 * op.head, "on the system curve");
  hg::line branch;
  branch.add_pipe(0.08, 20, 4.5e-5);
  auto sp = hg::split_flow({&moved, &branch}, water, 5e-3);
  CHECK(sp.first.size() == 2 && std::fabs(sp.first[0] + sp.first[1] - 5e-3) < 1e-15, "split adds up");
  auto sb = hg::split_flow_bands({&moved, &branch}, water, 5e-3);
  CHECK(sb.flows.size() == 2 && sb.flows[0].first <= sp.first[0] && sp.first[0] <= sb.flows[0].second &&
            sb.head.first <= sp.second && sp.second <= sb.head.second,
        "split bands contain the split");
  hg_sizing z = moved.size(water, 3e-3, HG_LIMIT_VELOCITY, 2.0, "steel", "40");
  CHECK(z.standard.found == 1 && z.standard.inside_diameter >= z.min_inside_diameter &&
            std::string(z.standard.nominal) == hg::pipe_size_at_least("steel", "40", z.min_inside_diameter).first,
        "sizing picks the smallest standard size");
  hg::line all;
  hg_uncertainty_options uo = hg::uncertainty_options();
  uo.diameter = 0.01;
  all.set_uncertainty(uo).set_turbulent_diameter(HG_TURBULENT_DIAMETER_LAMINAR_EQUIVALENT);
  all.add_from_tank(HG_EDGE_ROUNDED, 0.1).add_pipe_material(0.1, 40, "commercial_steel").add_bend(90, 1.5);
  all.add_two_k(800, 0.25).add_three_k(500, 0.15, 4).add_cv(120).set_k_spread(5, 0.2).add_kv(100);
  all.add_equivalent_length(30).add_expansion(0.1, 0.15).add_custom_duct(0.0177, 0.48, 62, 10, 1e-4);
  all.add_contraction(0.15, 0.08).add_pipe(0.08, 5, 1.5e-6).add_into_tank();
  all.set_roughness_range(11, 1e-6, 5e-6);
  CHECK(all.size() == 13, "every kind of element");
  auto sources = all.band_sources(water, 5e-3);
  double total = 0;
  for (auto& s : sources) total += s.second;
  CHECK(!sources.empty() && std::fabs(total - 1.0) < 1e-12, "shares sum to 1");
  auto esrc = all.evaluate(water, 5e-3).element_band_sources(1);
  double etotal = 0;
  for (auto& s : esrc) etotal += s.second;
  CHECK(!esrc.empty() && std::fabs(etotal - 1.0) < 1e-12, "element shares sum to 1");
  CHECK(thrown([&] { all.evaluate(water, 5e-3).element_band_sources(99); }).first == HG_ERR_OUT_OF_RANGE,
        "element 99");
  hg_monte_carlo mc = all.monte_carlo(water, 5e-3, 2000, 3);
  hg_line_totals ev = all.evaluate(water, 5e-3).totals();
  CHECK(mc.samples == 2000 && mc.low < ev.required_head && ev.required_head < mc.high, "Monte Carlo brackets");
  CHECK(thrown([&] { all.monte_carlo(water, 5e-3, 10, 3); }).first == HG_ERR_OUT_OF_RANGE, "10 samples");
  CHECK(all.evaluate_at(water, 5e-3, 2e5).totals().inlet_pressure == 2e5 &&
            all.evaluate_at(water, 5e-3, 0).totals().has_pressures == 0,
        "inlet pressure per call");
  hg::line duct;
  duct.add_duct_material(HG_SECTION_RECTANGLE, 0.3, 0.2, 10, "galvanized_steel");
  CHECK(duct.size() == 1, "duct of a material");
  // A circle's turbulent diameter is its bore (exact).
  CHECK(hg::turbulent_diameter(HG_SECTION_CIRCLE, 0.1, 0, HG_TURBULENT_DIAMETER_LAMINAR_EQUIVALENT) == 0.1, "circle");
  auto scheds = hg::pipe_table_schedules("pvc");
  auto noms = hg::pipe_table_nominal_sizes("pvc");
  CHECK(std::count(scheds.begin(), scheds.end(), "40") == 1 && std::count(noms.begin(), noms.end(), "2-1/2") == 1,
        "pvc table lists schedule 40 and 2-1/2 (ASTM D1785; common practice)");
  CHECK(thrown([] { hg::pipe_table_schedules("cast_iron"); }).first == HG_ERR_UNKNOWN_NAME, "unknown table");
  hg::fluid wet = water.with_uncertainty(0.001, 0.02).with_vapour_pressure(2.5e5);
  all.set_inlet_pressure(1.5e5);
  CHECK(all.evaluate(wet, 5e-3).totals().warnings & HG_WARN_BELOW_VAPOUR_PRESSURE, "cavitation");
  CHECK(hg::fluid::gas(1.2, 1.8e-5, 293.15, 1e5).props().density == 1.2, "gas");
  CHECK(hg::correlation_validity(HG_CORRELATION_BLASIUS).re_max == 1e5, "Blasius to 1e5 (Blasius 1913)");
  auto lim = hg::transition_limits(3000.0, 1e-3);
  CHECK(lim.first == 64.0 / 3000.0 && lim.second > 0.0, "laminar limit 64/Re");  // exact: Hagen–Poiseuille
  auto ph = hg::pump_curve_head({0.0, 1e-3, 2e-3}, {30.0, 25.0, 15.0}, 1e-3);
  CHECK(ph.first == 25.0 && ph.second < 0.0, "pump curve through its points");
  {
    // Points on H = 40 - 20000 Q² (an exact quadratic) give that parabola back (exact
    // solution); the wrapper's numbers equal the C calls' bit for bit.
    std::vector<double> q, h;
    for (int i = 0; i < 7; i++) {
      q.push_back(0.005 * i);
      h.push_back(40.0 - 20000.0 * q.back() * q.back());
    }
    hg::pump_fit pf = hg::pump_curve_fit(q, h);
    double c[4], rms, mx;
    CHECK(hg_pump_curve_fit(q.data(), h.data(), q.size(), 2, c, &rms, &mx) == HG_OK, "C fit");
    CHECK(std::memcmp(c, pf.coefficients.data(), sizeof c) == 0 && same_bits(rms, pf.rms_residual) &&
              same_bits(mx, pf.max_residual),
          "fit equals the C call bit for bit");
    CHECK(std::fabs(pf.coefficients[0] - 40.0) < 1e-11 && std::fabs(pf.coefficients[2] / -20000.0 - 1) < 1e-11 &&
              pf.coefficients[3] == 0.0 && pf.rms_residual < 1e-12,
          "quadratic recovered");
    CHECK(hg::pump_curve_fit(q, h, 3).max_residual < 1e-11, "cubic through a quadratic");
    auto fh = hg::pump_curve_fit_head(q, h, 2, 0.015);
    CHECK(std::fabs(fh.first - 35.5) < 1e-11 && std::fabs(fh.second / -600.0 - 1) < 1e-10, "fit head and slope");
    hg::line pl;
    pl.add_pipe(0.08, 150.0, 4.5e-5).add_rise(12.0);
    hg::operating_point o2 = pl.operating_point_fit(water, q, h, 2);
    CHECK(std::fabs(pl.required_head(water, o2.flow).head_loss / o2.head - 1) < 1e-9, "fit op on the line");
    CHECK(same_bits(hg::pump_curve_fit_head(q, h, 2, o2.flow).first, o2.head), "fit op on the fit");
    hg::operating_point o0 = pl.operating_point_fit(water, q, h, 0);
    hg::operating_point oc = pl.operating_point(water, q, h);
    CHECK(std::memcmp(&o0, &oc, sizeof o0) == 0, "degree 0 is the monotone cubic, bit for bit");
    auto fe = thrown([&] { hg::pump_curve_fit(q, h, 4); });
    CHECK(fe.first == HG_ERR_OUT_OF_RANGE && fe.second.find("degree") != std::string::npos, fe.second.c_str());
    CHECK(thrown([&] { pl.operating_point_fit(water, q, h, -1); }).first == HG_ERR_OUT_OF_RANGE, "op degree");
    CHECK(thrown([&] { hg::pump_curve_fit(q, {1.0}); }).first == HG_ERR_INVALID, "lengths differ");
    // EN 10220 DN 50 is 60.3 mm (published copies, see core/tests/sizes_metric.rs);
    // 60.3 x 2.9 bore 54.5 mm (exact arithmetic).
    hg::pipe_dimensions dn = hg::pipe_size_dn("steel_en10220", 50, "2.9");
    hg::pipe_dimensions od = hg::pipe_size("steel_en10220", "60.3", "2.9");
    CHECK(same_bits(dn.inside_diameter, od.inside_diameter) && std::fabs(dn.inside_diameter - 0.0545) < 1e-15,
          "DN 50 is 60.3 x 2.9");
    auto de = thrown([] { hg::pipe_size_dn("copper", 50, "L"); });
    CHECK(de.first == HG_ERR_UNKNOWN_NAME && de.second.find("steel_en10220") != std::string::npos, de.second.c_str());
  }
  hg::head_loss_result rh = all.required_head(wet, 5e-3);
  CHECK(rh.dhead_dflow > 0.0 && std::fabs(rh.head_loss - all.evaluate(wet, 5e-3).totals().required_head) <= 1e-12 * rh.head_loss,
        "required head");
  hg::line u = all.with_uniform_diameter(0.1);
  CHECK(u.size() == all.size(), "uniform diameter copy");
  CHECK(std::fabs(hg::water_saturation_temperature(101325.0) - 373.124) < 0.01, "boiling point");  // IAPWS-IF97, from memory
  auto e = thrown([] { hg::line().evaluate(hg::fluid::liquid(1000, 1e-3), 1e-3); });
  CHECK(e.first == HG_ERR_INVALID && !e.second.empty(), e.second.c_str());
  e = thrown([] { hg::line().add_pipe(0.05, 10, 0).add_fitting("nonesuch"); });
  CHECK(e.first == HG_ERR_UNKNOWN_NAME, e.second.c_str());
  e = thrown([&] { moved.evaluate(water, 1e-3).element(6); });
  CHECK(e.first == HG_ERR_OUT_OF_RANGE, e.second.c_str());
  e = thrown([] { hg::fluid::liquid(-1, 1e-3); });
  CHECK(e.first == HG_ERR_OUT_OF_RANGE, e.second.c_str());
}

// Pointer + length overloads, enum class values and the non-throwing try_* calls: the
// same doubles as the vector and throwing forms, and a status instead of an exception.
static void test_spans_enums_and_try() {
  namespace hg = hydrograde;
  const double re[3] = {1e4, 1e5, 1e6}, rr[3] = {1e-4, 1e-4, 1e-3};
  double out[3] = {7, 7, 7};
  hg::darcy_factor(re, rr, 3, out, hg::correlation::haaland);
  std::vector<double> v = hg::darcy_factor({1e4, 1e5, 1e6}, {1e-4, 1e-4, 1e-3}, HG_CORRELATION_HAALAND);
  CHECK(std::memcmp(out, v.data(), sizeof out) == 0, "span equals vector");
  CHECK(hg::darcy_factor(1e5, 1e-4, hg::correlation::haaland) == hg::darcy_factor(1e5, 1e-4, HG_CORRELATION_HAALAND),
        "enum class equals the constant");
  const double bad[2] = {1e5, std::nan("")};
  double kept[2] = {7, 7};
  CHECK(thrown([&] { hg::darcy_factor(bad, rr, 2, kept); }).first == HG_ERR_NOT_FINITE && kept[0] == 7,
        "span: throws, output unchanged");
  hg::darcy_factor(re, rr, 0, nullptr);  // n = 0 does nothing
  auto t = hg::try_darcy_factor(1e5, 1e-4);
  CHECK(t.ok() && t.value == hg::darcy_factor(1e5, 1e-4), "try_ equals the throwing call");
  auto tf = hg::try_darcy_factor(-1.0, 1e-4);
  CHECK(!tf.ok() && tf.status == HG_ERR_OUT_OF_RANGE && !hg::last_error().empty(), "try_ gives the status");
  double h[3], d[3];
  const double q[3] = {1e-3, 2e-3, 3e-3};
  hg::pipe_head_loss(0.05, 30, 4.5e-5, 998.2, 1.002e-3, q, 3, h, d);
  auto hv = hg::pipe_head_loss(0.05, 30, 4.5e-5, 998.2, 1.002e-3, std::vector<double>(q, q + 3));
  CHECK(h[2] == hv[2].head_loss && d[1] == hv[1].dhead_dflow, "pipe span equals vector");

  // Every warning the library names is in the enum class, and nothing else.
  std::size_t named = 0;
  for (uint32_t bit = 1; bit != 0; bit <<= 1) named += hg_warning_name(bit) != nullptr;
  CHECK(named == sizeof hg::all_warnings / sizeof *hg::all_warnings, "every warning in the enum class");
  for (hg::warning w : hg::all_warnings) CHECK(hg_warning_name(static_cast<uint32_t>(w)) != nullptr, "named");
  CHECK(hg::warnings_of(HG_WARN_TRANSITIONAL_FLOW | HG_WARN_GAS_COMPRESSIBILITY).size() == 2 &&
            hg::has(HG_WARN_TRANSITIONAL_FLOW, hg::warning::transitional_flow),
        "warnings_of");
  for (int32_t c = 0;; ++c) {
    if (!hg_correlation_name(c)) {
      CHECK(c == static_cast<int32_t>(hg::correlation::fully_rough) + 1, "every correlation in the enum class");
      break;
    }
  }

  hg::fluid water = hg::fluid::water(293.15, 2e5);
  hg::line l;
  l.add_pipe(0.05, 30, 4.5e-5).add_fitting("gate_valve").add_rise(2.0);
  auto rh = l.try_required_head(water, 2e-3);
  CHECK(rh.ok() && rh.value.head_loss == l.required_head(water, 2e-3).head_loss, "try_required_head");
  CHECK(l.try_required_head(water, std::nan("")).status == HG_ERR_NOT_FINITE, "try_required_head NaN");
  double heads[3];
  l.system_curve(water, q, 3, heads);
  CHECK(heads[1] == l.system_curve(water, std::vector<double>(q, q + 3))[1], "system curve span");
  double inplace[2] = {1e-3, std::nan("")};
  CHECK(l.try_system_curve(water, inplace, 2, inplace) == HG_ERR_NOT_FINITE && inplace[0] == 1e-3,
        "try_system_curve: status, heads unchanged");
  hg::line_result r = l.evaluate(water, 2e-3);
  CHECK(hg::regime_of(r.element(0).regime) == hg::regime::turbulent &&
            hg::regime_of(r.element(2).regime) == hg::regime::none,
        "regime enum class");
}

// A pump in a line through the wrapper: the same bits as the C calls, the closed form of
// its operating point, NPSH at its suction, and the wrappers of the NPSH, message, rated
// equipment, end pressure and sectioned sizing calls.
static void test_pump_line() {
  namespace hg = hydrograde;
  std::vector<double> q(11), h(11);
  for (int i = 0; i < 11; ++i) q[i] = 0.015 * i / 10.0, h[i] = 40.0 - 1.5e5 * q[i] * q[i];
  hg::line l;
  l.add_fitting_k(2.5, 0.05).add_pump(q, h, 2).add_fitting_k(12.0, 0.05).add_rise(15.0).set_inlet_pressure(101325.0);
  hg::fluid water = hg::fluid::water(293.15, 2e5);
  hg::line::pumped_flow_result p = l.pumped_flow(water);
  // Closed form (energy balance, definition of K): Q = sqrt(25/(1.5e5 + 14.5/(2 g A²))).
  const double g = 9.80665, a = 3.14159265358979323846 * 0.05 * 0.05 / 4.0;
  const double want = std::sqrt(25.0 / (1.5e5 + 14.5 / (2.0 * g * a * a)));
  CHECK(std::fabs(p.flow - want) < 1e-12 * want, "pumped flow");
  double cq, ch, cn;
  int32_t has;
  CHECK(hg_line_pumped_flow(l.get(), water.get(), &cq, &ch, &cn, &has, nullptr) == HG_OK, "C call");
  CHECK(same_bits(p.flow, cq) && same_bits(p.pump_head, ch) && same_bits(p.npsh_available, cn) && p.has_npsh,
        "C++ equals C");
  CHECK(same_bits(p.result.npsh_available(0), p.npsh_available), "NPSH at the suction");
  std::pair<double, bool> c = p.result.npsh_check(0, 2.0, 0.5);
  CHECK(same_bits(c.first, p.npsh_available) && c.second == (c.first >= 2.5), "NPSH check");
  CHECK(p.result.element(1).kind == HG_ELEMENT_PUMP && p.result.element(1).head_loss == -p.pump_head, "pump row");
  std::pair<int32_t, std::string> e = thrown([&] { l.required_head(water, 0.02); });
  CHECK(e.first == HG_ERR_OUT_OF_RANGE && e.second.find("pump") != std::string::npos, e.second.c_str());
  e = thrown([&] { l.required_head(water, -1e-3); });
  CHECK(e.first == HG_ERR_OUT_OF_RANGE && e.second.find("reverse") != std::string::npos, e.second.c_str());
  e = thrown([&] { hg::line().add_pump({}, {}); });
  CHECK(e.first == HG_ERR_INVALID, e.second.c_str());
  e = thrown([&] { hg::line().add_pump({0.0, 0.01}, {30.0}); });
  CHECK(e.first == HG_ERR_INVALID, e.second.c_str());
  e = thrown([&] { hg::line().add_fitting_k(1.0, 0.05).pumped_flow(water); });
  CHECK(e.first == HG_ERR_INVALID && e.second.find("no pump") != std::string::npos, e.second.c_str());
  // Rated equipment, an end pressure and the result's messages: a filter rated 1.5 Pa (a
  // unit slip, common practice: under 10 Pa) is counted and warned about.
  hg::line r;
  r.add_pipe(0.05, 10.0, 4.5e-5).add_equipment_rated("filter", 1.5, 1e-3, 1000.0).set_end_pressure(2e5);
  hg::line_result rr = r.evaluate(water, 2e-3);
  std::vector<std::string> m = rr.messages();
  size_t n = 0;
  CHECK(hg_line_result_message_count(rr.get(), &n) == HG_OK && n == m.size() && !m.empty(), "messages");
  CHECK(std::any_of(m.begin(), m.end(), [](const std::string& s) { return s.find("filter") != std::string::npos; }),
        "the slip names the filter");
  e = thrown([&] { r.set_end_pressure(NAN); });
  CHECK(e.first == HG_ERR_NOT_FINITE, e.second.c_str());
  // Sectioned sizing and resizing: the same as the C calls.
  hg::line two;
  two.add_pipe(0.05, 20.0, 4.5e-5).add_pipe(0.08, 20.0, 4.5e-5);
  hg_sizing z = two.size_in(water, 3e-3, HG_LIMIT_VELOCITY, 2.0, 0, 1);
  hg_sizing zc{};
  zc.struct_size = sizeof zc;
  CHECK(hg_line_size_in(two.get(), water.get(), 3e-3, HG_LIMIT_VELOCITY, 2.0, nullptr, nullptr, 0, 1, nullptr, &zc) ==
                HG_OK &&
            same_bits(z.min_inside_diameter, zc.min_inside_diameter),
        "size_in");
  hg::line wider = two.with_diameter_in(0.06, 0, 1);
  CHECK(wider.evaluate(water, 3e-3).element(0).bore == 0.06, "with_diameter_in");
  e = thrown([&] { two.with_diameter_in(0.06, 1, 5); });
  CHECK(e.first != HG_OK && !e.second.empty(), e.second.c_str());
}

int main() {
  test_spans_enums_and_try();
  test_friction();
  test_others();
  test_line();
  test_pump_line();
  std::printf("test_capi_cpp: %ld checks, %ld failed\n", run, failed);
  return failed == 0 ? 0 : 1;
}

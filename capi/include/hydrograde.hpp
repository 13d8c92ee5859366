// hydrograde.hpp: header-only C++17 wrapper of the hydrograde C ABI (hydrograde.h).
//
// Every call that fails throws hydrograde::error, which carries the library's message
// and its HG_ERR_* status; for hot loops the try_* functions return a status_or<T>
// instead and never throw. Arrays come as std::vector or as pointer + length (any
// contiguous storage). Handles are RAII types (movable, not copyable). Units are SI.
// Results are engineering estimates with stated uncertainty; designs must be checked by
// a competent engineer (licensed or registered where the law requires it) against the
// codes and standards that apply where they are built.
#ifndef HYDROGRADE_HPP
#define HYDROGRADE_HPP

#include "hydrograde.h"

#include <array>
#include <cstddef>
#include <cstdint>
#include <stdexcept>
#include <string>
#include <utility>
#include <vector>

namespace hydrograde {

/// A failed call: what() is the library's message; status() the HG_ERR_* code.
class error : public std::runtime_error {
 public:
  error(int32_t status, const std::string& message)
      : std::runtime_error(message), status_(status) {}
  /// The HG_ERR_* status code.
  int32_t status() const noexcept { return status_; }
  /// The status code's name, e.g. "HG_ERR_OUT_OF_RANGE".
  const char* status_name() const noexcept { return hg_status_name(status_); }

 private:
  int32_t status_;
};

/// The calling thread's last error message (empty after a successful call).
inline std::string last_error() {
  std::size_t n = hg_last_error(nullptr, 0);
  std::string s(n, '\0');
  if (n > 0) hg_last_error(&s[0], n + 1);
  return s;
}

/// Throws hydrograde::error unless status is HG_OK.
inline void check(int32_t status) {
  if (status != HG_OK) throw error(status, last_error());
}

/// A value or the status of the failed call that should have made it (never throws).
template <class T>
struct status_or {
  /// HG_OK or an HG_ERR_* code; hg_last_error / last_error() give the message.
  int32_t status;
  /// The value; meaningful only when ok().
  T value;
  /// True when status is HG_OK.
  bool ok() const noexcept { return status == HG_OK; }
};

/// Friction correlations (the HG_CORRELATION_* values).
enum class correlation : int32_t {
  colebrook = HG_CORRELATION_COLEBROOK,
  haaland = HG_CORRELATION_HAALAND,
  swamee_jain = HG_CORRELATION_SWAMEE_JAIN,
  churchill = HG_CORRELATION_CHURCHILL,
  serghides = HG_CORRELATION_SERGHIDES,
  blasius = HG_CORRELATION_BLASIUS,
  fully_rough = HG_CORRELATION_FULLY_ROUGH,
};

/// Flow regimes (the HG_REGIME_* values); none for an element without one.
enum class regime : int32_t {
  none = HG_REGIME_NONE,
  laminar = HG_REGIME_LAMINAR,
  transitional = HG_REGIME_TRANSITIONAL,
  turbulent = HG_REGIME_TURBULENT,
};

/// Warning bits (the HG_WARN_* values) of a result's `warnings` field.
enum class warning : uint32_t {
  reynolds_out_of_range = HG_WARN_REYNOLDS_OUT_OF_RANGE,
  roughness_out_of_range = HG_WARN_ROUGHNESS_OUT_OF_RANGE,
  transitional_flow = HG_WARN_TRANSITIONAL_FLOW,
  non_circular_section = HG_WARN_NON_CIRCULAR_SECTION,
  gas_compressibility = HG_WARN_GAS_COMPRESSIBILITY,
  below_vapour_pressure = HG_WARN_BELOW_VAPOUR_PRESSURE,
  fitting_out_of_range = HG_WARN_FITTING_OUT_OF_RANGE,
  bore_change_without_transition = HG_WARN_BORE_CHANGE_WITHOUT_TRANSITION,
  implausible_velocity = HG_WARN_IMPLAUSIBLE_VELOCITY,
  implausible_bore = HG_WARN_IMPLAUSIBLE_BORE,
  implausible_length = HG_WARN_IMPLAUSIBLE_LENGTH,
  implausible_rated_drop = HG_WARN_IMPLAUSIBLE_RATED_DROP,
  implausible_viscosity = HG_WARN_IMPLAUSIBLE_VISCOSITY,
};

/// Every warning, in bit order.
constexpr warning all_warnings[] = {
    warning::reynolds_out_of_range, warning::roughness_out_of_range, warning::transitional_flow,
    warning::non_circular_section,  warning::gas_compressibility,    warning::below_vapour_pressure,
    warning::fitting_out_of_range,  warning::bore_change_without_transition, warning::implausible_velocity,
    warning::implausible_bore,      warning::implausible_length,     warning::implausible_rated_drop,
    warning::implausible_viscosity,
};

/// True when the warning bits `bits` hold `w`.
constexpr bool has(uint32_t bits, warning w) noexcept { return (bits & static_cast<uint32_t>(w)) != 0; }

/// The warnings set in `bits`, in bit order.
inline std::vector<warning> warnings_of(uint32_t bits) {
  std::vector<warning> out;
  for (warning w : all_warnings)
    if (has(bits, w)) out.push_back(w);
  return out;
}

/// The regime of an HG_REGIME_* value.
constexpr regime regime_of(int32_t code) noexcept { return static_cast<regime>(code); }

/// The library version, e.g. "0.1.0".
inline std::string version() { return hg_version(); }

/// True when the loaded library has the ABI this header was written for.
inline bool abi_matches() noexcept { return hg_abi_version() == HG_ABI_VERSION; }

/// The HG_CORRELATION_* value of a name ("colebrook", "haaland", ...).
inline int32_t correlation_from_name(const std::string& name) {
  int32_t c = 0;
  check(hg_correlation_from_name(name.c_str(), &c));
  return c;
}

/// Darcy friction factor at Reynolds number re and relative roughness rel_roughness.
inline double darcy_factor(double re, double rel_roughness,
                           int32_t correlation = HG_CORRELATION_COLEBROOK) {
  double f = 0.0;
  check(hg_darcy_factor(re, rel_roughness, correlation, &f));
  return f;
}

/// Darcy friction factor by a correlation given as an enum class value.
inline double darcy_factor(double re, double rel_roughness, correlation c) {
  return darcy_factor(re, rel_roughness, static_cast<int32_t>(c));
}

/// Darcy friction factor without exceptions, for hot loops.
inline status_or<double> try_darcy_factor(double re, double rel_roughness,
                                          correlation c = correlation::colebrook) noexcept {
  status_or<double> r{HG_OK, 0.0};
  r.status = hg_darcy_factor(re, rel_roughness, static_cast<int32_t>(c), &r.value);
  return r;
}

/// A friction factor with its derivatives, regime and warnings (see hg_friction).
inline hg_friction darcy_factor_full(double re, double rel_roughness,
                                     int32_t correlation = HG_CORRELATION_COLEBROOK) {
  hg_friction r{};
  r.struct_size = sizeof r;
  check(hg_darcy_factor_full(re, rel_roughness, correlation, &r.f, &r.df_dre,
                             &r.df_drel_roughness, &r.regime, &r.warnings));
  return r;
}

/// Default friction options (from the library).
inline hg_friction_options friction_options() {
  hg_friction_options o{};
  check(hg_friction_options_default(&o));
  return o;
}

/// A friction factor with full options.
inline hg_friction darcy_factor(double re, double rel_roughness, const hg_friction_options& opts) {
  hg_friction r{};
  r.struct_size = sizeof r;
  check(hg_darcy_factor_opts(re, rel_roughness, &opts, &r));
  return r;
}

/// Friction factors of n points from any contiguous storage into out[0..n) (n = 0 does
/// nothing; out may be one of the inputs). On failure out is unchanged.
inline void darcy_factor(const double* re, const double* rel_roughness, std::size_t n, double* out,
                         correlation c = correlation::colebrook) {
  if (n == 0) return;
  check(hg_darcy_factor_batch(re, rel_roughness, n, static_cast<int32_t>(c), out));
}

/// Friction factors of many points (re and rel_roughness of equal length; empty in,
/// empty out).
inline std::vector<double> darcy_factor(const std::vector<double>& re,
                                        const std::vector<double>& rel_roughness,
                                        int32_t correlation = HG_CORRELATION_COLEBROOK) {
  if (re.size() != rel_roughness.size())
    throw error(HG_ERR_INVALID, "rel_roughness: length " + std::to_string(rel_roughness.size()) +
                                    " differs from re's " + std::to_string(re.size()));
  std::vector<double> out(re.size());
  if (re.empty()) return out;
  check(hg_darcy_factor_batch(re.data(), rel_roughness.data(), re.size(), correlation,
                              out.data()));
  return out;
}

/// Density (kg/m³) and dynamic viscosity (Pa·s) of a fluid state.
struct properties {
  double density;
  double viscosity;
};

/// Liquid water at temperature (K) and absolute pressure (Pa).
inline properties water(double temperature, double pressure) {
  properties p{};
  check(hg_water(temperature, pressure, &p.density, &p.viscosity));
  return p;
}

/// Dry air at temperature (K) and absolute pressure (Pa).
inline properties air(double temperature, double pressure) {
  properties p{};
  check(hg_air(temperature, pressure, &p.density, &p.viscosity));
  return p;
}

/// Vapour pressure of water (Pa) at temperature (K).
inline double water_vapour_pressure(double temperature) {
  double p = 0.0;
  check(hg_water_vapour_pressure(temperature, &p));
  return p;
}

/// value converted from unit `from` to unit `to` (e.g. "in" to "mm").
inline double convert(double value, const std::string& from, const std::string& to) {
  double out = 0.0;
  check(hg_convert(value, from.c_str(), to.c_str(), &out));
  return out;
}

/// Pressure and head of a liquid of `density` (kg/m³) converted into each other.
inline double convert_head(double value, const std::string& from, const std::string& to,
                           double density) {
  double out = 0.0;
  check(hg_convert_head(value, from.c_str(), to.c_str(), density, &out));
  return out;
}

namespace detail {
template <class F>
inline std::vector<std::string> names(F get) {
  std::vector<std::string> out;
  for (std::size_t i = 0;; ++i) {
    std::size_t need = 0;
    int32_t s = get(i, nullptr, 0, &need);
    if (s == HG_ERR_OUT_OF_RANGE) break;
    if (s != HG_ERR_BUFFER_TOO_SMALL) check(s);
    std::string name(need, '\0');
    check(get(i, &name[0], need + 1, &need));
    out.push_back(name);
  }
  return out;
}

/// A string from a call that fills a buffer like snprintf (asked twice: length, text).
template <class F>
inline std::string text(F get) {
  std::size_t need = 0;
  int32_t s = get(nullptr, 0, &need);
  if (s != HG_ERR_BUFFER_TOO_SMALL) check(s);
  std::string out(need, '\0');
  check(get(&out[0], need + 1, &need));
  return out;
}

/// A band source (name and share) from a call that fills a buffer like snprintf.
template <class F>
inline std::pair<std::string, double> source(F get) {
  double share = 0.0;
  std::string name = text([&](char* buf, std::size_t len, std::size_t* need) {
    return get(buf, len, need, &share);
  });
  return {name, share};
}
}  // namespace detail

/// Every unit name hg_convert accepts.
inline std::vector<std::string> unit_names() { return detail::names(hg_unit_name); }

/// Every pipe table name ("steel", "stainless", "copper", "pvc", "steel_en10220", …).
inline std::vector<std::string> pipe_tables() { return detail::names(hg_pipe_tables); }

/// The source of a pipe table (standard, and what was checked).
inline std::string pipe_table_source(const std::string& table) {
  return detail::text([&](char* buf, std::size_t len, std::size_t* need) {
    return hg_pipe_table_source(table.c_str(), buf, len, need);
  });
}

/// The schedules (or tube types, SDR series, walls) of a pipe table.
inline std::vector<std::string> pipe_table_schedules(const std::string& table) {
  return detail::names([&](std::size_t i, char* buf, std::size_t len, std::size_t* need) {
    return hg_pipe_table_schedule(table.c_str(), i, buf, len, need);
  });
}

/// The nominal sizes of a pipe table, smallest first.
inline std::vector<std::string> pipe_table_nominal_sizes(const std::string& table) {
  return detail::names([&](std::size_t i, char* buf, std::size_t len, std::size_t* need) {
    return hg_pipe_table_nominal(table.c_str(), i, buf, len, need);
  });
}

/// Every catalogue fitting name.
inline std::vector<std::string> fitting_catalogue() {
  return detail::names(hg_fitting_catalogue_name);
}

/// K and dK/dRe of a catalogue fitting.
struct fitting_k_result {
  double k;
  double dk_dre;
};

/// K of the catalogue fitting `name` at Reynolds number re in bore (m), beside a pipe of
/// relative roughness pipe_rel_roughness.
inline fitting_k_result fitting_k(const std::string& name, double re, double bore,
                                  double pipe_rel_roughness = 0.0) {
  fitting_k_result r{};
  check(hg_fitting_k(name.c_str(), re, bore, pipe_rel_roughness, &r.k, &r.dk_dre));
  return r;
}

/// Geometry of a cross-section.
struct section_geometry {
  double area;
  double wetted_perimeter;
  double hydraulic_diameter;
  double laminar_constant;
};

/// Geometry of section `shape` (HG_SECTION_*) with dimensions a, b (m; b = 0 for
/// one-dimension shapes).
inline section_geometry section(int32_t shape, double a, double b = 0.0) {
  section_geometry g{};
  check(hg_section_properties(shape, a, b, &g.area, &g.wetted_perimeter, &g.hydraulic_diameter,
                              &g.laminar_constant));
  return g;
}

/// Head loss (m) and its derivative (s/m²) of a round pipe at a flow.
struct head_loss_result {
  double head_loss;
  double dhead_dflow;
};

/// Head loss of a round pipe (diameter, length, roughness in m) for a fluid of density
/// (kg/m³) and viscosity (Pa·s) at flow (m³/s, signed).
inline head_loss_result pipe_head_loss(double diameter, double length, double roughness,
                                       double density, double viscosity, double flow) {
  head_loss_result r{};
  check(hg_pipe_head_loss(diameter, length, roughness, density, viscosity, flow, &r.head_loss,
                          &r.dhead_dflow));
  return r;
}

/// Head losses of one pipe at many flows.
inline std::vector<head_loss_result> pipe_head_loss(double diameter, double length,
                                                    double roughness, double density,
                                                    double viscosity,
                                                    const std::vector<double>& flows) {
  std::vector<double> h(flows.size()), d(flows.size());
  std::vector<head_loss_result> out(flows.size());
  if (flows.empty()) return out;
  check(hg_pipe_head_loss_batch(diameter, length, roughness, density, viscosity, flows.data(),
                                flows.size(), h.data(), d.data()));
  for (std::size_t i = 0; i < flows.size(); ++i) out[i] = {h[i], d[i]};
  return out;
}

/// Head losses (m) and derivatives (s/m²) of one round pipe at n flows from any
/// contiguous storage (n = 0 does nothing). On failure the outputs are unchanged.
inline void pipe_head_loss(double diameter, double length, double roughness, double density,
                           double viscosity, const double* flows, std::size_t n, double* head_loss,
                           double* dhead_dflow) {
  if (n == 0) return;
  check(hg_pipe_head_loss_batch(diameter, length, roughness, density, viscosity, flows, n, head_loss,
                                dhead_dflow));
}

/// The flow state of a straight duct of any section.
inline hg_pipe_flow duct_flow_state(int32_t shape, double a, double b, double length,
                                    double roughness, double density, double viscosity,
                                    double flow) {
  hg_pipe_flow r{};
  r.struct_size = sizeof r;
  check(hg_duct_flow_state(shape, a, b, length, roughness, density, viscosity, flow, &r));
  return r;
}

/// Reynolds number of flow (m³/s) in a round pipe of diameter (m).
inline double reynolds(double flow, double diameter, double density, double viscosity) {
  double re = 0.0;
  check(hg_reynolds(flow, diameter, density, viscosity, &re));
  return re;
}

/// The diameter (m) turbulent flow in a section uses under mode HG_TURBULENT_DIAMETER_*.
inline double turbulent_diameter(int32_t shape, double a, double b, int32_t mode) {
  double d = 0.0;
  check(hg_turbulent_diameter(shape, a, b, mode, &d));
  return d;
}

/// The published range of a correlation (an unbounded end is +infinity) and its
/// published largest relative error.
struct validity {
  double re_min, re_max, rel_roughness_min, rel_roughness_max, accuracy;
};

/// Published validity range and accuracy of a correlation (HG_CORRELATION_*).
inline validity correlation_validity(int32_t correlation) {
  validity v{};
  check(hg_correlation_validity(correlation, &v.re_min, &v.re_max, &v.rel_roughness_min,
                                &v.rel_roughness_max, &v.accuracy));
  return v;
}

/// The laminar and turbulent limits a transitional friction factor lies between.
inline std::pair<double, double> transition_limits(double re, double rel_roughness,
                                                   int32_t correlation = HG_CORRELATION_COLEBROOK) {
  double l = 0.0, t = 0.0;
  check(hg_transition_limits(re, rel_roughness, correlation, &l, &t));
  return {l, t};
}

/// Head (m) and slope (s/m²) of a pump curve through points at a flow (m³/s).
inline std::pair<double, double> pump_curve_head(const std::vector<double>& flows,
                                                 const std::vector<double>& heads, double flow) {
  if (flows.size() != heads.size()) throw error(HG_ERR_INVALID, "heads: length differs from flows'");
  double h = 0.0, d = 0.0;
  check(hg_pump_curve_head(flows.data(), heads.data(), flows.size(), flow, &h, &d));
  return {h, d};
}

/// A least-squares pump curve H(Q) = c0 + c1 Q + c2 Q² + c3 Q³ (SI units; c3 = 0 for a
/// quadratic) with its residuals at the points (m).
struct pump_fit {
  std::array<double, 4> coefficients;
  double rms_residual;
  double max_residual;
};

/// The least-squares polynomial of degree 2 or 3 through pump points (flows increasing,
/// m³/s; heads, m).
inline pump_fit pump_curve_fit(const std::vector<double>& flows, const std::vector<double>& heads,
                               int32_t degree = 2) {
  if (flows.size() != heads.size()) throw error(HG_ERR_INVALID, "heads: length differs from flows'");
  pump_fit f{};
  check(hg_pump_curve_fit(flows.data(), heads.data(), flows.size(), degree, f.coefficients.data(),
                          &f.rms_residual, &f.max_residual));
  return f;
}

/// Head (m) and slope (s/m²) at a flow (m³/s) of the pump curve of `degree` through the
/// points: 0 the monotone cubic (as pump_curve_head), 2 or 3 the least-squares fit.
inline std::pair<double, double> pump_curve_fit_head(const std::vector<double>& flows,
                                                     const std::vector<double>& heads,
                                                     int32_t degree, double flow) {
  if (flows.size() != heads.size()) throw error(HG_ERR_INVALID, "heads: length differs from flows'");
  double h = 0.0, d = 0.0;
  check(hg_pump_curve_fit_head(flows.data(), heads.data(), flows.size(), degree, flow, &h, &d));
  return {h, d};
}

/// Saturation temperature of water (K) at absolute pressure (Pa).
inline double water_saturation_temperature(double pressure) {
  double t = 0.0;
  check(hg_water_saturation_temperature(pressure, &t));
  return t;
}

/// Default uncertainty sources of the bands.
inline hg_uncertainty_options uncertainty_options() {
  hg_uncertainty_options o{};
  check(hg_uncertainty_options_default(&o));
  return o;
}

/// Roughness of a catalogue material: typical value and quoted range, m.
struct roughness_range {
  double typical;
  double low;
  double high;
};

/// Roughness of new pipe of the catalogue material (e.g. "commercial_steel").
inline roughness_range roughness(const std::string& material) {
  roughness_range r{};
  check(hg_roughness(material.c_str(), &r.typical, &r.low, &r.high));
  return r;
}

/// Every catalogue material name.
inline std::vector<std::string> roughness_materials() {
  return detail::names(hg_roughness_material_name);
}

/// Roughness (m) after years of service, growing from initial (m) at rate (m/year).
inline double roughness_aged(double initial, double rate, double years) {
  double r = 0.0;
  check(hg_roughness_aged(initial, rate, years, &r));
  return r;
}

/// Dimensions of a standard pipe, m.
struct pipe_dimensions {
  double outside_diameter;
  double wall;
  double inside_diameter;
};

/// A standard pipe by table ("steel", "stainless", "copper", "pvc"), nominal size and
/// schedule as printed.
inline pipe_dimensions pipe_size(const std::string& table, const std::string& nominal,
                                 const std::string& schedule) {
  pipe_dimensions d{};
  check(hg_pipe_size(table.c_str(), nominal.c_str(), schedule.c_str(), &d.outside_diameter,
                     &d.wall, &d.inside_diameter));
  return d;
}

/// A metric tube by nominal size DN ("steel_en10220", "stainless_iso1127",
/// "hygienic_din11850") and schedule, wall or series as printed.
inline pipe_dimensions pipe_size_dn(const std::string& table, uint32_t dn,
                                    const std::string& schedule) {
  pipe_dimensions d{};
  check(hg_pipe_size_dn(table.c_str(), dn, schedule.c_str(), &d.outside_diameter, &d.wall,
                        &d.inside_diameter));
  return d;
}

/// The smallest standard pipe with an inside diameter of at least min_inside_diameter (m):
/// its nominal size and inside diameter.
inline std::pair<std::string, double> pipe_size_at_least(const std::string& table,
                                                         const std::string& schedule,
                                                         double min_inside_diameter) {
  double d = 0.0;
  std::size_t need = 0;
  int32_t s = hg_pipe_size_at_least(table.c_str(), schedule.c_str(), min_inside_diameter, &d,
                                    nullptr, 0, &need);
  if (s != HG_ERR_BUFFER_TOO_SMALL) check(s);
  std::string nominal(need, '\0');
  check(hg_pipe_size_at_least(table.c_str(), schedule.c_str(), min_inside_diameter, &d,
                              &nominal[0], need + 1, &need));
  return {nominal, d};
}

/// A fluid for line evaluations (owns an hg_fluid; movable, not copyable).
class fluid {
 public:
  /// Liquid water at temperature (K) and absolute pressure (Pa).
  static fluid water(double temperature, double pressure) {
    hg_fluid* f = nullptr;
    check(hg_fluid_water(temperature, pressure, &f));
    return fluid(f);
  }
  /// Dry air at temperature (K) and absolute pressure (Pa).
  static fluid air(double temperature, double pressure) {
    hg_fluid* f = nullptr;
    check(hg_fluid_air(temperature, pressure, &f));
    return fluid(f);
  }
  /// A liquid of density (kg/m³) and viscosity (Pa·s).
  static fluid liquid(double density, double viscosity) {
    hg_fluid* f = nullptr;
    check(hg_fluid_liquid(density, viscosity, &f));
    return fluid(f);
  }
  /// A gas of density and viscosity stated at temperature (K) and pressure (Pa).
  static fluid gas(double density, double viscosity, double temperature, double pressure) {
    hg_fluid* f = nullptr;
    check(hg_fluid_gas(density, viscosity, temperature, pressure, &f));
    return fluid(f);
  }
  /// A copy with relative standard uncertainties of density and viscosity.
  fluid with_uncertainty(double density_rel, double viscosity_rel) const {
    hg_fluid* f = nullptr;
    check(hg_fluid_with_uncertainty(f_, density_rel, viscosity_rel, &f));
    return fluid(f);
  }
  /// A copy with its vapour pressure (Pa) set.
  fluid with_vapour_pressure(double vapour_pressure) const {
    hg_fluid* f = nullptr;
    check(hg_fluid_with_vapour_pressure(f_, vapour_pressure, &f));
    return fluid(f);
  }
  fluid(fluid&& o) noexcept : f_(o.f_) { o.f_ = nullptr; }
  fluid& operator=(fluid&& o) noexcept {
    std::swap(f_, o.f_);
    return *this;
  }
  fluid(const fluid&) = delete;
  fluid& operator=(const fluid&) = delete;
  ~fluid() { hg_fluid_free(f_); }
  /// Density and viscosity.
  properties props() const {
    properties p{};
    check(hg_fluid_properties(f_, &p.density, &p.viscosity));
    return p;
  }
  /// The C handle (still owned by this object).
  const hg_fluid* get() const noexcept { return f_; }

 private:
  explicit fluid(hg_fluid* f) : f_(f) {}
  hg_fluid* f_;
};

/// The flow that meets a head, with its uncertainty band (m³/s).
struct flow_solution {
  double flow;
  double flow_low;
  double flow_high;
};

/// Where a pump curve meets a system curve, with the uncertainty bands.
struct operating_point {
  double flow, head, flow_low, flow_high, head_low, head_high;
};


/// A line evaluated at one flow (owns an hg_line_result; movable, not copyable). Every
/// accessor reads the stored result; nothing is evaluated again. It stays valid after
/// the line and fluid it came from are gone.
class line_result {
 public:
  line_result(line_result&& o) noexcept : r_(o.r_) { o.r_ = nullptr; }
  line_result& operator=(line_result&& o) noexcept {
    std::swap(r_, o.r_);
    return *this;
  }
  line_result(const line_result&) = delete;
  line_result& operator=(const line_result&) = delete;
  ~line_result() { hg_line_result_free(r_); }

  /// Flow, losses, heads with bands, pressures, warnings and counts.
  hg_line_totals totals() const {
    hg_line_totals t{};
    t.struct_size = sizeof t;
    check(hg_line_result_totals(r_, &t));
    return t;
  }
  /// The number of elements.
  std::size_t size() const { return totals().element_count; }
  /// The row of element `index` (route order); quantities that do not apply have their
  /// has_* flag at 0.
  hg_element_result element(std::size_t index) const {
    hg_element_result e{};
    e.struct_size = sizeof e;
    check(hg_line_result_element(r_, index, &e));
    return e;
  }
  /// The label of element `index` ("pipe", "rise", a fitting's or equipment's name).
  std::string label(std::size_t index) const {
    return detail::text([&](char* buf, std::size_t len, std::size_t* need) {
      return hg_line_result_label(r_, index, buf, len, need);
    });
  }
  /// The sources of the line's head-loss band, largest share first.
  std::vector<std::pair<std::string, double>> band_sources() const {
    std::vector<std::pair<std::string, double>> out;
    std::size_t n = totals().band_source_count;
    for (std::size_t k = 0; k < n; ++k)
      out.push_back(detail::source([&](char* buf, std::size_t len, std::size_t* need, double* share) {
        return hg_line_result_band_source(r_, k, buf, len, need, share);
      }));
    return out;
  }
  /// The sources of element `index`'s head-loss band, largest share first.
  std::vector<std::pair<std::string, double>> element_band_sources(std::size_t index) const {
    std::vector<std::pair<std::string, double>> out;
    std::size_t n = element(index).band_source_count;
    for (std::size_t k = 0; k < n; ++k)
      out.push_back(detail::source([&](char* buf, std::size_t len, std::size_t* need, double* share) {
        return hg_line_result_element_band_source(r_, index, k, buf, len, need, share);
      }));
    return out;
  }
  /// NPSH available (m) at the outlet of row `index` (needs an inlet pressure and a
  /// vapour pressure).
  double npsh_available(std::size_t index) const {
    double v = 0.0;
    check(hg_line_result_npsh_available(r_, index, &v));
    return v;
  }
  /// NPSH available (m) at the outlet of row `index` against `required` + `margin` (m):
  /// (available, sufficient).
  std::pair<double, bool> npsh_check(std::size_t index, double required, double margin) const {
    double v = 0.0;
    int32_t ok = 0;
    check(hg_line_result_npsh_check(r_, index, required, margin, &v, &ok));
    return {v, ok != 0};
  }
  /// What each warning found, in words.
  std::vector<std::string> messages() const {
    std::size_t n = 0;
    check(hg_line_result_message_count(r_, &n));
    std::vector<std::string> out;
    for (std::size_t i = 0; i < n; ++i)
      out.push_back(detail::text([&](char* buf, std::size_t len, std::size_t* need) {
        return hg_line_result_message(r_, i, buf, len, need);
      }));
    return out;
  }
  /// The C handle (still owned by this object).
  const hg_line_result* get() const noexcept { return r_; }

 private:
  friend class line;
  friend class network;
  explicit line_result(hg_line_result* r) : r_(r) {}
  hg_line_result* r_;
};

/// A route of elements in series (owns an hg_line; movable, not copyable). The add_*
/// methods return *this for chaining.
class line {
 public:
  line() { check(hg_line_new(&l_)); }
  line(line&& o) noexcept : l_(o.l_) { o.l_ = nullptr; }
  line& operator=(line&& o) noexcept {
    std::swap(l_, o.l_);
    return *this;
  }
  line(const line&) = delete;
  line& operator=(const line&) = delete;
  ~line() { hg_line_free(l_); }

  /// A round pipe: inside diameter, length and absolute roughness, m.
  line& add_pipe(double diameter, double length, double roughness) {
    check(hg_line_add_pipe(l_, diameter, length, roughness));
    return *this;
  }
  /// A duct of section `shape` (HG_SECTION_*, dimensions a, b in m), length and
  /// roughness in m.
  line& add_duct(int32_t shape, double a, double b, double length, double roughness) {
    check(hg_line_add_duct(l_, shape, a, b, length, roughness));
    return *this;
  }
  /// A catalogue fitting; diameter 0 = the adjoining pipe's bore.
  line& add_fitting(const std::string& name, double diameter = 0.0) {
    check(hg_line_add_fitting(l_, name.c_str(), diameter));
    return *this;
  }
  /// A fitting of fixed K on the velocity in diameter (0 = the adjoining pipe's bore).
  line& add_fitting_k(double k, double diameter = 0.0) {
    check(hg_line_add_fitting_k(l_, k, diameter));
    return *this;
  }
  /// An elevation change, m (up in the flow direction; negative for a drop).
  line& add_rise(double height) {
    check(hg_line_add_rise(l_, height));
    return *this;
  }
  /// Rated equipment: pressure drop (Pa) at a rating flow (m³/s).
  line& add_equipment(const std::string& name, double drop, double at_flow) {
    check(hg_line_add_equipment(l_, name.c_str(), drop, at_flow));
    return *this;
  }
  /// Friction options of every pipe (correlation, regime limits, transition).
  /// Rated equipment: `drop` (Pa) at `at_flow` (m³/s) with a fluid of `rating_density`
  /// (kg/m³).
  line& add_equipment_rated(const std::string& name, double drop, double at_flow, double rating_density) {
    check(hg_line_add_equipment_rated(l_, name.c_str(), drop, at_flow, rating_density));
    return *this;
  }
  /// A pump whose curve passes through (flow m³/s, head m) points: `degree` 0 the
  /// monotone cubic through them, 2 or 3 a least-squares fit. Its head is the negative
  /// loss −H(Q), inside the curve's flow range only.
  line& add_pump(const std::vector<double>& flows, const std::vector<double>& heads, int32_t degree = 0) {
    if (flows.size() != heads.size()) throw error(HG_ERR_INVALID, "heads: length differs from flows'");
    // An empty vector's data() may be null: pass a valid pointer so that the core says
    // what is wrong with the curve (too few points), not that a pointer is NULL.
    static const double none = 0.0;
    check(hg_line_add_pump(l_, flows.empty() ? &none : flows.data(), heads.empty() ? &none : heads.data(),
                           flows.size(), degree));
    return *this;
  }
  /// The pressure (Pa) the line must deliver at its end, counted in the required head.
  line& set_end_pressure(double pressure) {
    check(hg_line_set_end_pressure(l_, pressure));
    return *this;
  }
  line& set_friction_options(const hg_friction_options& o) {
    check(hg_line_set_friction_options(l_, &o));
    return *this;
  }
  /// A round pipe whose roughness and its range come from a catalogue material.
  line& add_pipe_material(double diameter, double length, const std::string& material) {
    check(hg_line_add_pipe_material(l_, diameter, length, material.c_str()));
    return *this;
  }
  /// A duct of any shape by area (m²), wetted perimeter (m) and laminar f·Re.
  line& add_custom_duct(double area, double perimeter, double laminar_constant, double length,
                        double roughness) {
    check(hg_line_add_custom_duct(l_, area, perimeter, laminar_constant, length, roughness));
    return *this;
  }
  /// A sudden expansion between two bores, m.
  line& add_expansion(double d_in, double d_out) {
    check(hg_line_add_expansion(l_, d_in, d_out));
    return *this;
  }
  /// A sudden contraction between two bores, m.
  line& add_contraction(double d_in, double d_out) {
    check(hg_line_add_contraction(l_, d_in, d_out));
    return *this;
  }
  /// A fitting by the two-K method (coefficients k1, k_inf; see hg_line_add_two_k).
  line& add_two_k(double k1, double k_inf, double diameter = 0.0) {
    check(hg_line_add_two_k(l_, k1, k_inf, diameter));
    return *this;
  }
  /// A fitting by the three-K method (coefficients k1, k_inf, k_d; see hg_line_add_three_k).
  line& add_three_k(double k1, double k_inf, double k_d, double diameter = 0.0) {
    check(hg_line_add_three_k(l_, k1, k_inf, k_d, diameter));
    return *this;
  }
  /// A valve by its flow coefficient Cv (US gal/min at 1 psi).
  line& add_cv(double cv, double diameter = 0.0) {
    check(hg_line_add_cv(l_, cv, diameter));
    return *this;
  }
  /// A valve by its flow coefficient Kv (m³/h at 1 bar).
  line& add_kv(double kv, double diameter = 0.0) {
    check(hg_line_add_kv(l_, kv, diameter));
    return *this;
  }
  /// A fitting by its equivalent length in bores (L/D).
  line& add_equivalent_length(double l_over_d, double diameter = 0.0) {
    check(hg_line_add_equivalent_length(l_, l_over_d, diameter));
    return *this;
  }
  /// A bend of angle (degrees) and relative radius r/D.
  line& add_bend(double angle_deg, double r_over_d, double diameter = 0.0) {
    check(hg_line_add_bend(l_, angle_deg, r_over_d, diameter));
    return *this;
  }
  /// An inlet from a tank through a pipe end with edge HG_EDGE_* (r/D for a rounded one).
  line& add_from_tank(int32_t edge, double r_over_d = 0.0) {
    check(hg_line_add_from_tank(l_, edge, r_over_d));
    return *this;
  }
  /// An outlet into a tank (K = 1).
  line& add_into_tank() {
    check(hg_line_add_into_tank(l_));
    return *this;
  }
  /// The relative spread of fitting `index`'s K (rectangular, for the bands).
  line& set_k_spread(std::size_t index, double spread) {
    check(hg_line_set_k_spread(l_, index, spread));
    return *this;
  }
  /// The label of element `index` shown in its result row (empty: back to the default).
  line& set_label(std::size_t index, const std::string& label) {
    check(hg_line_set_label(l_, index, label.empty() ? nullptr : label.c_str()));
    return *this;
  }
  /// Makes fitting `index` stand for `count` identical fittings (one row, count·K).
  line& set_count(std::size_t index, uint32_t count) {
    check(hg_line_set_count(l_, index, count));
    return *this;
  }
  /// Appends the elements of `other` (labels and counts kept; the options must match).
  line& append(const line& other) {
    check(hg_line_append_line(l_, other.l_));
    return *this;
  }
  /// A new line of elements [start, end) with their labels and counts.
  line slice(std::size_t start, std::size_t end) const {
    hg_line* out = nullptr;
    check(hg_line_slice(l_, start, end, &out));
    return line(out);
  }
  /// The roughness range (m) of pipe `index` for the bands.
  line& set_roughness_range(std::size_t index, double low, double high) {
    check(hg_line_set_roughness_range(l_, index, low, high));
    return *this;
  }
  /// The diameter turbulent flow in non-circular ducts uses (HG_TURBULENT_DIAMETER_*).
  line& set_turbulent_diameter(int32_t mode) {
    check(hg_line_set_turbulent_diameter(l_, mode));
    return *this;
  }
  /// The uncertainty sources of the bands.
  line& set_uncertainty(const hg_uncertainty_options& o) {
    check(hg_line_set_uncertainty(l_, &o));
    return *this;
  }
  /// A duct of section `shape` whose wall is a catalogue material.
  line& add_duct_material(int32_t shape, double a, double b, double length,
                          const std::string& material) {
    check(hg_line_add_duct_material(l_, shape, a, b, length, material.c_str()));
    return *this;
  }
  /// Evaluates once with an inlet pressure (Pa absolute) for this call only; 0 for none.
  line_result evaluate_at(const fluid& f, double flow, double inlet_pressure) const {
    hg_line_result* r = nullptr;
    check(hg_line_evaluate_at(l_, f.get(), flow, inlet_pressure, &r));
    return line_result(r);
  }
  /// The Monte Carlo check of the required head's band (samples ≥ 100, reproducible seed).
  hg_monte_carlo monte_carlo(const fluid& f, double flow, std::size_t samples,
                             uint64_t seed) const {
    hg_monte_carlo r{};
    r.struct_size = sizeof r;
    check(hg_line_monte_carlo(l_, f.get(), flow, samples, seed, &r));
    return r;
  }
  /// The static pressure at the inlet, Pa absolute (0 clears it).
  line& set_inlet_pressure(double pressure) {
    check(hg_line_set_inlet_pressure(l_, pressure));
    return *this;
  }
  /// The number of elements.
  std::size_t size() const {
    std::size_t n = 0;
    check(hg_line_count(l_, &n));
    return n;
  }
  /// Evaluates once at a flow (m³/s); read the totals, rows, labels and band sources
  /// from the result without evaluating again.
  line_result evaluate(const fluid& f, double flow) const {
    hg_line_result* r = nullptr;
    check(hg_line_evaluate(l_, f.get(), flow, &r));
    return line_result(r);
  }
  /// The sources of the head-loss band at a flow, largest share first (one evaluation).
  std::vector<std::pair<std::string, double>> band_sources(const fluid& f, double flow) const {
    return evaluate(f, flow).band_sources();
  }
  /// Required head and its derivative without exceptions, for a simulator's Newton loop.
  status_or<head_loss_result> try_required_head(const fluid& f, double flow) const noexcept {
    status_or<head_loss_result> r{HG_OK, {0.0, 0.0}};
    r.status = hg_line_required_head(l_, f.get(), flow, &r.value.head_loss, &r.value.dhead_dflow);
    return r;
  }
  /// Required head (m) and its derivative (s/m²) at a flow: a simulator's Newton call.
  head_loss_result required_head(const fluid& f, double flow) const {
    head_loss_result r{};
    check(hg_line_required_head(l_, f.get(), flow, &r.head_loss, &r.dhead_dflow));
    return r;
  }
  /// A new line with every round pipe set to one inside diameter (m).
  line with_uniform_diameter(double diameter) const {
    hg_line* out = nullptr;
    check(hg_line_with_uniform_diameter(l_, diameter, &out));
    return line(out);
  }
  /// The flow (m³/s) at which the required head is `head` (m), with its band.
  flow_solution flow_for_head(const fluid& f, double head) const {
    flow_solution s{};
    check(hg_line_flow_for_head(l_, f.get(), head, &s.flow, &s.flow_low, &s.flow_high));
    return s;
  }
  /// Required heads (m) at n flows (m³/s) from any contiguous storage into heads[0..n)
  /// (heads may be flows itself; n = 0 does nothing). On failure heads is unchanged.
  void system_curve(const fluid& f, const double* flows, std::size_t n, double* heads) const {
    if (n == 0) return;
    check(hg_line_system_curve(l_, f.get(), flows, n, heads));
  }
  /// Required heads without exceptions, for a simulator's hot loop: the status of the
  /// call (heads unchanged on failure).
  int32_t try_system_curve(const fluid& f, const double* flows, std::size_t n,
                           double* heads) const noexcept {
    return hg_line_system_curve(l_, f.get(), flows, n, heads);
  }
  /// The system curve: the required head (m) at each flow (m³/s).
  std::vector<double> system_curve(const fluid& f, const std::vector<double>& flows) const {
    std::vector<double> heads(flows.size());
    if (flows.empty()) return heads;
    check(hg_line_system_curve(l_, f.get(), flows.data(), flows.size(), heads.data()));
    return heads;
  }
  /// The operating point of a pump curve given by points (flows increasing, m³/s; heads, m).
  hydrograde::operating_point operating_point(const fluid& f, const std::vector<double>& pump_flows,
                                              const std::vector<double>& pump_heads) const {
    if (pump_flows.size() != pump_heads.size())
      throw error(HG_ERR_INVALID, "pump_heads: length differs from pump_flows'");
    hydrograde::operating_point p{};
    check(hg_line_operating_point(l_, f.get(), pump_flows.data(), pump_heads.data(),
                                  pump_flows.size(), &p.flow, &p.head, &p.flow_low, &p.flow_high,
                                  &p.head_low, &p.head_high));
    return p;
  }
  /// The operating point with the pump curve of `degree`: 0 the monotone cubic through
  /// the points (as operating_point), 2 or 3 the least-squares fit (pump_curve_fit).
  hydrograde::operating_point operating_point_fit(const fluid& f,
                                                  const std::vector<double>& pump_flows,
                                                  const std::vector<double>& pump_heads,
                                                  int32_t degree) const {
    if (pump_flows.size() != pump_heads.size())
      throw error(HG_ERR_INVALID, "pump_heads: length differs from pump_flows'");
    hydrograde::operating_point p{};
    check(hg_line_operating_point_fit(l_, f.get(), pump_flows.data(), pump_heads.data(),
                                      pump_flows.size(), degree, &p.flow, &p.head, &p.flow_low,
                                      &p.flow_high, &p.head_low, &p.head_high));
    return p;
  }
  /// Sizes the round pipes for flow under a limit (HG_LIMIT_*), optionally to a standard
  /// table and schedule (empty strings for none).
  hg_sizing size(const fluid& f, double flow, int32_t limit, double limit_value,
                 const std::string& table = "", const std::string& schedule = "") const {
    hg_sizing z{};
    z.struct_size = sizeof z;
    bool none = table.empty() && schedule.empty();
    check(hg_line_size(l_, f.get(), flow, limit, limit_value, none ? nullptr : table.c_str(),
                       none ? nullptr : schedule.c_str(), &z));
    return z;
  }
  /// Sizes the round pipes of elements [start, end) only (optionally of `material`;
  /// empty for each pipe's own).
  hg_sizing size_in(const fluid& f, double flow, int32_t limit, double limit_value, std::size_t start,
                    std::size_t end, const std::string& table = "", const std::string& schedule = "",
                    const std::string& material = "") const {
    hg_sizing z{};
    z.struct_size = sizeof z;
    bool none = table.empty() && schedule.empty();
    check(hg_line_size_in(l_, f.get(), flow, limit, limit_value, none ? nullptr : table.c_str(),
                          none ? nullptr : schedule.c_str(), start, end,
                          material.empty() ? nullptr : material.c_str(), &z));
    return z;
  }
  /// A new line with the round pipes of elements [start, end) set to `diameter` (m),
  /// optionally of `material` (empty for each pipe's own).
  line with_diameter_in(double diameter, std::size_t start, std::size_t end,
                        const std::string& material = "") const {
    hg_line* out = nullptr;
    check(hg_line_with_diameter_in(l_, diameter, start, end, material.empty() ? nullptr : material.c_str(), &out));
    return line(out);
  }
  /// Where a line with its own pump runs by itself (its required head zero), with the
  /// pump's head, the NPSH available at its suction (when known) and the line there.
  struct pumped_flow_result;
  pumped_flow_result pumped_flow(const fluid& f) const;
  /// The C handle (still owned by this object).
  hg_line* get() noexcept { return l_; }
  /// The C handle (still owned by this object).
  const hg_line* get() const noexcept { return l_; }

 private:
  explicit line(hg_line* l) : l_(l) {}
  hg_line* l_ = nullptr;
};

/// The flow a line with its own pump runs at (m³/s), the pump's head there (m), the NPSH
/// available at its suction (m; `has_npsh` false without an inlet or vapour pressure),
/// and the line evaluated there.
struct line::pumped_flow_result {
  double flow, pump_head, npsh_available;
  bool has_npsh;
  line_result result;
};

inline line::pumped_flow_result line::pumped_flow(const fluid& f) const {
  double q = 0.0, h = 0.0, npsh = 0.0;
  int32_t has = 0;
  hg_line_result* r = nullptr;
  check(hg_line_pumped_flow(l_, f.get(), &q, &h, &npsh, &has, &r));
  return pumped_flow_result{q, h, npsh, has != 0, line_result(r)};
}

/// Splits total (m³/s) between parallel lines so that all need the same head: the flow
/// of each branch and the common head (m).
inline std::pair<std::vector<double>, double> split_flow(const std::vector<const line*>& branches,
                                                         const fluid& f, double total) {
  std::vector<const hg_line*> b;
  for (const line* l : branches) b.push_back(l ? l->get() : nullptr);
  std::vector<double> flows(b.size());
  double head = 0.0;
  if (b.empty()) throw error(HG_ERR_INVALID, "branches: need at least one branch");
  check(hg_line_split_flow(b.data(), b.size(), f.get(), total, flows.data(), &head));
  return {flows, head};
}

/// Bands (k = 2) of split_flow: per branch (low, high) flows in m³/s, then the common
/// head's (low, high) in m.
struct split_bands {
  std::vector<std::pair<double, double>> flows;
  std::pair<double, double> head;
};

inline split_bands split_flow_bands(const std::vector<const line*>& branches, const fluid& f, double total) {
  std::vector<const hg_line*> b;
  for (const line* l : branches) b.push_back(l ? l->get() : nullptr);
  if (b.empty()) throw error(HG_ERR_INVALID, "branches: need at least one branch");
  std::vector<double> lo(b.size()), hi(b.size());
  split_bands out;
  check(hg_line_split_flow_bands(b.data(), b.size(), f.get(), total, lo.data(), hi.data(), &out.head.first,
                                 &out.head.second));
  for (size_t i = 0; i < b.size(); i++) out.flows.emplace_back(lo[i], hi[i]);
  return out;
}


/// One node of a solved network (SI units).
struct network_node {
  double head;       ///< piezometric head, m
  double elevation;  ///< m
  double pressure;   ///< static gauge pressure rho*g*(head - elevation), Pa
  double outflow;    ///< m³/s leaving the system (at a fixed head: negative when it feeds)
};

/// One link of a solved network (SI units).
struct network_link {
  double flow;        ///< m³/s, positive from upstream to downstream
  double velocity;    ///< largest along the line, m/s; meaningful when has_velocity
  bool has_velocity;  ///< false for a line with no bore
  double head_drop;   ///< upstream head minus downstream head, m
  bool closed;        ///< a check valve holds the link shut
  uint32_t warnings;  ///< the line's own HG_WARN_* bits at the solved flow
};

/// Iterations, last flow change (m³/s), largest energy imbalance (m), warning count.
struct network_summary {
  std::size_t iterations;
  double flow_change;
  double head_imbalance;
  std::size_t warnings;
};

/// A solved network (owns an hg_network_solution; movable, not copyable). Every accessor
/// reads the stored solution; nothing is solved again. It stays valid after the network
/// and fluid it came from are gone.
class network_solution {
 public:
  network_solution(network_solution&& o) noexcept : s_(o.s_) { o.s_ = nullptr; }
  network_solution& operator=(network_solution&& o) noexcept {
    std::swap(s_, o.s_);
    return *this;
  }
  network_solution(const network_solution&) = delete;
  network_solution& operator=(const network_solution&) = delete;
  ~network_solution() { hg_network_solution_free(s_); }

  /// Iterations, convergence measures and the number of warnings.
  network_summary summary() const {
    network_summary m{};
    check(hg_network_solution_summary(s_, &m.iterations, &m.flow_change, &m.head_imbalance,
                                      &m.warnings));
    return m;
  }
  /// Node `index` (in the order added).
  network_node node(std::size_t index) const {
    network_node n{};
    check(hg_network_solution_node(s_, index, &n.head, &n.elevation, &n.pressure, &n.outflow));
    return n;
  }
  /// Node `index` without exceptions.
  status_or<network_node> try_node(std::size_t index) const noexcept {
    status_or<network_node> r{HG_OK, {}};
    r.status = hg_network_solution_node(s_, index, &r.value.head, &r.value.elevation,
                                        &r.value.pressure, &r.value.outflow);
    return r;
  }
  /// Link `index` (in the order added).
  network_link link(std::size_t index) const {
    status_or<network_link> r = try_link(index);
    check(r.status);
    return r.value;
  }
  /// Link `index` without exceptions.
  status_or<network_link> try_link(std::size_t index) const noexcept {
    status_or<network_link> r{HG_OK, {}};
    int32_t has_v = 0, closed = 0;
    r.status = hg_network_solution_link(s_, index, &r.value.flow, &r.value.velocity, &has_v,
                                        &r.value.head_drop, &closed, &r.value.warnings);
    r.value.has_velocity = has_v != 0;
    r.value.closed = closed != 0;
    return r;
  }
  /// Warning `index`: its HG_NETWORK_WARNING_* kind and message.
  std::pair<int32_t, std::string> warning(std::size_t index) const {
    int32_t kind = -1;
    std::string text = detail::text([&](char* buf, std::size_t len, std::size_t* need) {
      return hg_network_solution_warning(s_, index, &kind, buf, len, need);
    });
    return {kind, text};
  }
  /// The C handle (still owned by this object).
  const hg_network_solution* get() const noexcept { return s_; }

 private:
  friend class network;
  explicit network_solution(hg_network_solution* s) : s_(s) {}
  hg_network_solution* s_;
};

/// The flow available at a junction at a minimum residual pressure.
struct available_flow_result {
  double flow;               ///< extra outflow beyond the node's demand, m³/s
  double pressure;           ///< the node's static gauge pressure with it drawn, Pa
  std::size_t critical;      ///< index of the junction where the minimum binds
  network_solution solution; ///< the network solved with the flow drawn
};

/// Nodes joined by lines, solved for heads and flows together (owns an hg_network;
/// movable, not copyable). Add nodes first, then the links; the add_* methods return
/// *this for chaining.
class network {
 public:
  network() { check(hg_network_new(&n_)); }
  network(network&& o) noexcept : n_(o.n_) { o.n_ = nullptr; }
  network& operator=(network&& o) noexcept {
    std::swap(n_, o.n_);
    return *this;
  }
  network(const network&) = delete;
  network& operator=(const network&) = delete;
  ~network() { hg_network_free(n_); }

  /// A junction at elevation (m) where outflow (m³/s) leaves the system.
  network& add_node(const std::string& name, double elevation, double outflow = 0.0) {
    check(hg_network_add_node(n_, name.c_str(), elevation, outflow));
    return *this;
  }
  /// A node held at head (m), with its pressure read at the head (a free surface).
  network& add_fixed_head(const std::string& name, double head) {
    check(hg_network_add_fixed_head(n_, name.c_str(), head, nullptr));
    return *this;
  }
  /// A node held at head (m), with its pressure read at elevation (m).
  network& add_fixed_head(const std::string& name, double head, double elevation) {
    check(hg_network_add_fixed_head(n_, name.c_str(), head, &elevation));
    return *this;
  }
  /// A link carrying a copy of `route` from upstream to downstream.
  network& add_link(const std::string& name, const std::string& upstream,
                    const std::string& downstream, const line& route) {
    check(hg_network_add_link(n_, name.c_str(), upstream.c_str(), downstream.c_str(),
                              route.get()));
    return *this;
  }
  /// Places node `name` at plan position (x, y) for drawing.
  network& place(const std::string& name, double x, double y) {
    check(hg_network_place_node(n_, name.c_str(), x, y));
    return *this;
  }
  /// The plan position of node `index`; has_position false when never placed.
  struct position {
    double x, y;
    bool has_position;
  };
  position node_position(std::size_t index) const {
    position p{};
    int32_t has = 0;
    check(hg_network_node_position(n_, index, &p.x, &p.y, &has));
    p.has_position = has != 0;
    return p;
  }
  /// Number of nodes and links.
  std::pair<std::size_t, std::size_t> counts() const {
    std::size_t nodes = 0, links = 0;
    check(hg_network_counts(n_, &nodes, &links));
    return {nodes, links};
  }
  /// Index of node `name` (in the order added).
  std::size_t node_index(const std::string& name) const {
    std::size_t i = 0;
    check(hg_network_index(n_, name.c_str(), 0, &i));
    return i;
  }
  /// Index of link `name` (in the order added).
  std::size_t link_index(const std::string& name) const {
    std::size_t i = 0;
    check(hg_network_index(n_, name.c_str(), 1, &i));
    return i;
  }
  /// Solves for fluid f (global gradient method).
  network_solution solve(const fluid& f) const {
    hg_network_solution* s = nullptr;
    check(hg_network_solve(n_, f.get(), &s));
    return network_solution(s);
  }
  /// Solves without exceptions: the status, and the solution when it is HG_OK.
  status_or<network_solution> try_solve(const fluid& f) const noexcept {
    hg_network_solution* s = nullptr;
    int32_t status = hg_network_solve(n_, f.get(), &s);
    return {status, network_solution(s)};
  }
  /// The per-element breakdown of link `index` at the flow of `s`.
  line_result link_result(const network_solution& s, const fluid& f, std::size_t index) const {
    hg_line_result* r = nullptr;
    check(hg_network_link_result(n_, s.get(), f.get(), index, &r));
    return line_result(r);
  }
  /// The largest extra outflow at junction `node` keeping the static pressure at or above
  /// min_pressure (Pa) at the node, or at every junction when every_junction is true.
  available_flow_result available_flow(const fluid& f, const std::string& node,
                                       double min_pressure, bool every_junction = false) const {
    double flow = 0.0, pressure = 0.0;
    std::size_t critical = 0;
    hg_network_solution* s = nullptr;
    check(hg_network_available_flow(n_, f.get(), node.c_str(), min_pressure,
                                    every_junction ? 1 : 0, &flow, &pressure, &critical, &s));
    return {flow, pressure, critical, network_solution(s)};
  }
  /// The available flow (m³/s) alone, without exceptions.
  status_or<double> try_available_flow(const fluid& f, const std::string& node,
                                       double min_pressure, bool every_junction = false) const noexcept {
    status_or<double> r{HG_OK, 0.0};
    double pressure = 0.0;
    std::size_t critical = 0;
    r.status = hg_network_available_flow(n_, f.get(), node.c_str(), min_pressure,
                                          every_junction ? 1 : 0, &r.value, &pressure, &critical,
                                          nullptr);
    return r;
  }
  /// The C handle (still owned by this object).
  hg_network* get() noexcept { return n_; }
  /// The C handle (still owned by this object).
  const hg_network* get() const noexcept { return n_; }

 private:
  hg_network* n_ = nullptr;
};

}  // namespace hydrograde

#endif  // HYDROGRADE_HPP

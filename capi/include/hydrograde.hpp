// hydrograde.hpp: header-only C++17 wrapper of the hydrograde C ABI (hydrograde.h).
//
// Every call that fails throws hydrograde::error, which carries the library's message
// and its HG_ERR_* status. Handles are RAII types (movable, not copyable). Units are SI.
// Results are engineering estimates with stated uncertainty; designs must be checked by
// a competent engineer against the codes and standards that apply where they are built.
#ifndef HYDROGRADE_HPP
#define HYDROGRADE_HPP

#include "hydrograde.h"

#include <cstddef>
#include <cstdint>
#include <stdexcept>
#include <string>
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

//@@MORE@@

}  // namespace hydrograde

#endif  // HYDROGRADE_HPP

// Calls the C++17 wrapper (hydrograde.hpp): values equal the C calls bit for bit, every
// failure throws hydrograde::error with the library's message and status, RAII handles
// free themselves (valgrind checks no leak).
#include "hydrograde.hpp"

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

//@@MORE_CPP@@

int main() {
  test_friction();
//@@MORE_CPP_CALLS@@
  std::printf("test_capi_cpp: %ld checks, %ld failed\n", run, failed);
  return failed == 0 ? 0 : 1;
}

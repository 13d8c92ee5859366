// Prints one friction factor through the C++ wrapper; the test compares it with the
// Rust core's value passed on the command line (hex bits).
#include "hydrograde.hpp"

#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <cstdint>

int main(int argc, char** argv) {
  if (argc < 2) return 2;
  double f = hydrograde::darcy_factor(1e5, 1e-4);
  std::uint64_t bits = 0, want = std::strtoull(argv[1], nullptr, 16);
  std::memcpy(&bits, &f, sizeof f);
  std::printf("hydrograde %s: f(1e5, 1e-4) = %.17g\n", hydrograde::version().c_str(), f);
  return bits == want && hydrograde::abi_matches() ? 0 : 1;
}

/* A minimal check framework shared by the C test programs. */
#ifndef HG_TEST_CHECK_H
#define HG_TEST_CHECK_H
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <stdint.h>

static long hg_checks_run = 0, hg_checks_failed = 0;

#define CHECK(cond, ...)                                                    \
  do {                                                                      \
    hg_checks_run++;                                                        \
    if (!(cond)) {                                                          \
      hg_checks_failed++;                                                   \
      if (hg_checks_failed <= 50) {                                         \
        fprintf(stderr, "FAIL %s:%d: %s: ", __FILE__, __LINE__, #cond);     \
        fprintf(stderr, __VA_ARGS__);                                       \
        fputc('\n', stderr);                                                \
      }                                                                     \
    }                                                                       \
  } while (0)

static inline uint64_t bits_of(double x) {
  uint64_t u;
  memcpy(&u, &x, sizeof u);
  return u;
}

static inline double from_hex(const char *s) {
  uint64_t u = (uint64_t)strtoull(s, NULL, 16);
  double x;
  memcpy(&x, &u, sizeof x);
  return x;
}

static inline int check_summary(const char *what) {
  printf("%s: %ld checks, %ld failed\n", what, hg_checks_run, hg_checks_failed);
  return hg_checks_failed == 0 ? 0 : 1;
}
#endif

/* Streams the generic records of the reference file written by
 * capi/examples/core_reference.rs: `<tag> <inputs...> | <outputs...>` or `... | !<kind>`,
 * where a token is a double (16 hex digits of its bits), `s:<name>` or `i:<integer>`.
 * Thread-safe (each call reads the file itself). */
#ifndef HG_TEST_RECORDS_H
#define HG_TEST_RECORDS_H
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "check.h"
#include "hydrograde.h"

typedef struct {
  int type; /* 'd', 's', 'i' */
  double d;
  long long i;
  char s[96];
} tok;

typedef struct {
  char tag[24];
  int nin, nout, err;
  tok in[8], out[64];
  char kind[24];
} record;

static void parse_tok(const char *w, tok *t) {
  memset(t, 0, sizeof *t);
  if (strncmp(w, "s:", 2) == 0) {
    t->type = 's';
    snprintf(t->s, sizeof t->s, "%s", w + 2);
    for (char *c = t->s; *c; c++)
      if (*c == '~') *c = ' '; /* names travel with '~' for ' ' */
  } else if (strncmp(w, "i:", 2) == 0) {
    t->type = 'i';
    t->i = strtoll(w + 2, NULL, 10);
  } else {
    t->type = 'd';
    t->d = from_hex(w);
  }
}

/* Calls fn on every record whose tag starts with `prefix`; returns the sum of what fn
 * returns (the number of differences). */
typedef long (*record_fn)(const record *r, int quiet);

/* How many records the calling thread's last for_each_record visited. */
static __thread long records_seen;

static long for_each_record(const char *path, const char *prefix, record_fn fn, int quiet) {
  FILE *fp = fopen(path, "r");
  if (!fp) {
    perror(path);
    exit(2);
  }
  static __thread char line[16384];
  static __thread record r;
  long bad = 0;
  records_seen = 0;
  size_t plen = strlen(prefix);
  while (fgets(line, sizeof line, fp)) {
    if (strncmp(line, prefix, plen) != 0 || strncmp(line, "darcy", 5) == 0) continue;
    memset(&r, 0, sizeof r);
    int side = 0;
    char *save = NULL;
    for (char *w = strtok_r(line, " \n", &save); w; w = strtok_r(NULL, " \n", &save)) {
      if (!r.tag[0]) {
        snprintf(r.tag, sizeof r.tag, "%s", w);
      } else if (strcmp(w, "|") == 0) {
        side = 1;
      } else if (side && w[0] == '!') {
        r.err = 1;
        snprintf(r.kind, sizeof r.kind, "%s", w + 1);
      } else if (side) {
        if (r.nout < 64) parse_tok(w, &r.out[r.nout++]);
      } else if (r.nin < 8) {
        parse_tok(w, &r.in[r.nin++]);
      }
    }
    records_seen++;
    bad += fn(&r, quiet);
  }
  fclose(fp);
  return bad;
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


/* Compares what a call gave (doubles; ints stored as doubles) with a record's outputs. */
static int same_outputs(const record *r, const double *got, int ngot) {
  if (ngot != r->nout) return 0;
  for (int i = 0; i < r->nout; i++) {
    if (r->out[i].type == 'd' ? bits_of(got[i]) != bits_of(r->out[i].d) : got[i] != (double)r->out[i].i)
      return 0;
  }
  return 1;
}

static tok tok_d(double d) {
  tok t;
  memset(&t, 0, sizeof t);
  t.type = 'd', t.d = d;
  return t;
}

static tok tok_s(const char *s) {
  tok t;
  memset(&t, 0, sizeof t);
  t.type = 's';
  snprintf(t.s, sizeof t.s, "%s", s);
  return t;
}

/* Compares tokens a call gave with a record's outputs: doubles bit for bit. */
static int same_tokens(const record *r, const tok *got, int ngot) {
  if (ngot != r->nout) return 0;
  for (int i = 0; i < ngot; i++) {
    if (got[i].type != r->out[i].type && !(got[i].type == 'd' && r->out[i].type == 'i')) return 0;
    if (r->out[i].type == 's' && strcmp(got[i].s, r->out[i].s) != 0) return 0;
    if (r->out[i].type == 'd' && bits_of(got[i].d) != bits_of(r->out[i].d)) return 0;
    if (r->out[i].type == 'i' && got[i].d != (double)r->out[i].i) return 0;
  }
  return 1;
}
#endif

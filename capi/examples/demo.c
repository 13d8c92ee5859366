/* The demo of the C ABI behind `./run.sh demo` (built and run by scripts/demo-c.sh): the
 * same two invented scenarios as core/examples/demo.rs, element for element, printed as
 * the same table.
 *
 * 1. A hillside orchard's irrigation main: water at 12 °C pumped from a pond through
 *    about 400 m of PVC and steel pipe, fifteen fittings and valves and 38 m of rise to a
 *    header tank.
 * 2. A workshop's rectangular exhaust duct: air at 30 °C through two duct sizes.
 * 3. A small industrial estate's looped fire-and-service main fed by an elevated tank
 *    and a booster station: node pressures, and the flow available at one hydrant at a
 *    minimum residual pressure.
 *
 * All data are invented for the demonstration.
 *
 *   demo            the tables
 *   demo --numbers  the key results as `name value` lines with %.17g (every digit), for
 *                   the check in scripts/test-c.sh that they equal the Rust demo's bit
 *                   for bit
 */
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "hydrograde.h"

/* Inside diameters of the orchard main, m (PVC 3 in and steel 2-1/2 in, schedule 40). */
#define PVC_BORE 0.0779
#define STEEL_BORE 0.0627

/* Stops the demo with the library's message when a call fails. */
static void check(int32_t status, const char *what) {
  if (status == HG_OK) return;
  char msg[512];
  hg_last_error(msg, sizeof msg);
  fprintf(stderr, "error: %s: %s (%s)\n", what, msg, hg_status_name(status));
  exit(1);
}
#define TRY(call) check((call), #call)

/* Prints `s` padded with spaces to `width` characters (not bytes: "…" is one character),
 * on the left when `right` is set, as Rust's {:>w} and {:<w} do. */
static void padded(const char *s, int width, int right) {
  int chars = 0;
  for (const char *p = s; *p; p++) chars += ((unsigned char)*p & 0xC0) != 0x80;
  if (!right) fputs(s, stdout);
  for (int i = chars; i < width; i++) putchar(' ');
  if (right) fputs(s, stdout);
}

static void band_text(char *buf, size_t len, double low, double high) {
  snprintf(buf, len, "%.3f … %.3f", low, high);
}

static hg_line *orchard_line(void) {
  hg_line *l = NULL;
  TRY(hg_line_new(&l));
  TRY(hg_line_add_from_tank(l, HG_EDGE_SQUARE, 0.0));
  TRY(hg_line_add_fitting(l, "y_strainer", 0.0));
  TRY(hg_line_add_pipe_material(l, PVC_BORE, 6.0, "pvc"));
  TRY(hg_line_add_fitting(l, "gate_valve", 0.0));
  TRY(hg_line_add_fitting(l, "elbow_90_standard", 0.0));
  TRY(hg_line_add_pipe_material(l, PVC_BORE, 140.0, "pvc"));
  TRY(hg_line_add_fitting(l, "elbow_45_standard", 0.0));
  TRY(hg_line_add_pipe_material(l, PVC_BORE, 120.0, "pvc"));
  TRY(hg_line_add_fitting(l, "tee_run_flanged", 0.0));
  TRY(hg_line_add_contraction(l, PVC_BORE, STEEL_BORE));
  TRY(hg_line_add_pipe_material(l, STEEL_BORE, 95.0, "commercial_steel"));
  TRY(hg_line_add_fitting(l, "elbow_90_long_radius", 0.0));
  TRY(hg_line_add_fitting(l, "elbow_90_long_radius", 0.0));
  TRY(hg_line_add_pipe_material(l, STEEL_BORE, 45.0, "commercial_steel"));
  TRY(hg_line_add_fitting(l, "elbow_45_long_radius", 0.0));
  TRY(hg_line_add_fitting(l, "ball_valve", 0.0));
  TRY(hg_line_add_fitting(l, "globe_valve", 0.0));
  TRY(hg_line_add_rise(l, 38.0));
  TRY(hg_line_add_into_tank(l));
  return l;
}

static hg_line *duct_line(void) {
  double area, perimeter, d1, d2, c;
  TRY(hg_section_properties(HG_SECTION_RECTANGLE, 0.40, 0.25, &area, &perimeter, &d1, &c));
  TRY(hg_section_properties(HG_SECTION_RECTANGLE, 0.30, 0.20, &area, &perimeter, &d2, &c));
  hg_line *l = NULL;
  TRY(hg_line_new(&l));
  TRY(hg_line_add_from_tank(l, HG_EDGE_ROUNDED, 0.1));
  /* Rated by its maker with air at 20 °C and 101 325 Pa. */
  double rated_air = 0.0, rated_mu = 0.0;
  TRY(hg_air(293.15, 101325.0, &rated_air, &rated_mu));
  TRY(hg_line_add_equipment_rated(l, "grease filter", 120.0, 0.9, rated_air));
  TRY(hg_line_add_duct_material(l, HG_SECTION_RECTANGLE, 0.40, 0.25, 18.0, "galvanized_steel"));
  TRY(hg_line_add_bend(l, 90.0, 1.5, 0.0));
  TRY(hg_line_add_contraction(l, d1, d2));
  TRY(hg_line_add_duct_material(l, HG_SECTION_RECTANGLE, 0.30, 0.20, 12.0, "galvanized_steel"));
  TRY(hg_line_add_bend(l, 45.0, 1.5, 0.0));
  TRY(hg_line_add_rise(l, 4.5));
  TRY(hg_line_add_into_tank(l));
  return l;
}

/* The name of the source with the largest share of element `index`'s band ("" when the
 * band has no sources), or of the whole line's band when `index` is SIZE_MAX. */
static void dominant(const hg_line_result *r, size_t index, char *buf, size_t len) {
  size_t need = 0;
  double share = 0.0;
  int32_t s = index == SIZE_MAX ? hg_line_result_band_source(r, 0, buf, len, &need, &share)
                                : hg_line_result_element_band_source(r, index, 0, buf, len, &need, &share);
  if (s == HG_ERR_OUT_OF_RANGE) buf[0] = '\0'; /* a band without sources */
  else check(s, "band source");
}

/* Evaluates once and prints every element's row from the one result; the totals are
 * left in *t. */
static void print_breakdown(const hg_line *l, const hg_fluid *f, double q, hg_line_totals *t) {
  char text[128], band[64];
  hg_line_result *r = NULL;
  TRY(hg_line_evaluate(l, f, q, &r));
  t->struct_size = sizeof *t;
  TRY(hg_line_result_totals(r, t));
  printf("  %2s  %-22s %6s %9s %8s  %9s  ", "#", "element", "V m/s", "Re", "f or K", "loss m");
  padded("band (95 %) m", 17, 0);
  printf(" %-22s warnings\n", "largest source");
  double elevation = 0.0;
  for (size_t i = 0; i < t->element_count; i++) {
    hg_element_result e;
    e.struct_size = sizeof e;
    TRY(hg_line_result_element(r, i, &e));
    char label[64], coef[32] = "", v[32] = "", re[32] = "", source[128], warn[256] = "";
    size_t need;
    TRY(hg_line_result_label(r, i, label, sizeof label, &need));
    int rise = e.static_head != 0.0;
    /* A rise prints its geometric height; its loss column is the head the fluid feels. */
    if (rise) snprintf(label, sizeof label, "rise %+.1f m", e.elevation_out - elevation);
    elevation = e.elevation_out;
    if (e.has_friction_factor) snprintf(coef, sizeof coef, "f %.4f", e.friction_factor);
    else if (e.has_k) snprintf(coef, sizeof coef, "K %.3f", e.k);
    /* Rises and rated drops have no velocity of their own. */
    if (e.has_velocity) {
      snprintf(v, sizeof v, "%.2f", e.velocity);
      snprintf(re, sizeof re, "%.0f", e.reynolds);
    }
    if (rise) band[0] = '\0';
    else band_text(band, sizeof band, e.head_loss_low, e.head_loss_high);
    dominant(r, i, source, sizeof source);
    for (uint32_t bit = 1; bit != 0; bit <<= 1) {
      const char *name = (e.warnings & bit) ? hg_warning_name(bit) : NULL;
      if (!name) continue;
      if (warn[0]) strncat(warn, ", ", sizeof warn - strlen(warn) - 1);
      strncat(warn, name, sizeof warn - strlen(warn) - 1);
    }
    printf("  %2zu  %-22s %6s %9s %8s  %9.3f  ", i, label, v, re, coef, rise ? e.static_head : e.head_loss);
    padded(band, 17, 0);
    printf(" %-22s %s\n", source, warn);
  }
  band_text(band, sizeof band, t->head_loss_low, t->head_loss_high);
  printf("  friction + minor loss %.3f m (%s), pressure loss %.1f kPa, static head %.2f m\n", t->head_loss, band,
         t->pressure_loss / 1e3, t->static_head);
  band_text(band, sizeof band, t->required_head_low, t->required_head_high);
  printf("  required head %.3f m, band %s m\n", t->required_head, band);
  /* The required-head band is the loss band shifted by the static head: same sources. */
  printf("  band sources: ");
  for (size_t k = 0; k < 3 && k < t->band_source_count; k++) {
    size_t need;
    double share;
    TRY(hg_line_result_band_source(r, k, text, sizeof text, &need, &share));
    printf("%s%s %.0f %%", k ? ", " : "", text, 100.0 * share);
  }
  printf("\n");
  hg_line_result_free(r);
}

/* The invented pump: flow L/s against head m. */
static const double pump_q[6] = {0.0 * 1e-3, 2.0 * 1e-3, 4.0 * 1e-3, 6.0 * 1e-3, 8.0 * 1e-3, 10.0 * 1e-3};
static const double pump_h[6] = {78.0, 77.0, 74.0, 68.5, 60.0, 47.0};

static void orchard(void) {
  printf("\n1. Hillside orchard irrigation main (water 12 °C, design flow 6.0 L/s)\n\n");
  hg_fluid *water = NULL;
  TRY(hg_fluid_water(285.15, 101325.0, &water));
  hg_line *line = orchard_line();
  hg_line_totals r;
  print_breakdown(line, water, 6.0e-3, &r);

  printf("\n  system curve against the pump\n");
  printf("  %8s %12s %10s\n", "Q L/s", "system m", "pump m");
  double flows[11], curve[11];
  for (int i = 0; i <= 10; i++) flows[i] = (double)i * 1e-3;
  TRY(hg_line_system_curve(line, water, flows, 11, curve));
  for (int i = 0; i <= 10; i++) {
    double hp, dp;
    TRY(hg_pump_curve_head(pump_q, pump_h, 6, flows[i], &hp, &dp));
    printf("  %8.1f %12.2f %10.2f\n", flows[i] * 1e3, curve[i], hp);
  }
  double q, h, q_lo, q_hi, h_lo, h_hi;
  TRY(hg_line_operating_point(line, water, pump_q, pump_h, 6, &q, &h, &q_lo, &q_hi, &h_lo, &h_hi));
  /* The flow band at the operating point is the head band divided by the slope
   * difference of the two curves, so its largest source is the line's at that flow. */
  char source[128];
  hg_line_result *at_q = NULL;
  TRY(hg_line_evaluate(line, water, q, &at_q));
  dominant(at_q, SIZE_MAX, source, sizeof source);
  hg_line_result_free(at_q);
  printf("  operating point: %.2f L/s at %.2f m (flow band %.2f … %.2f L/s, largest source: %s)\n", q * 1e3, h,
         q_lo * 1e3, q_hi * 1e3, source[0] ? source : "-");

  double back, back_lo, back_hi;
  TRY(hg_line_flow_for_head(line, water, 0.0, &back, &back_lo, &back_hi));
  printf("  run backwards by gravity from the tank (pump bypassed): %.2f L/s (%.2f … %.2f L/s)\n", -back * 1e3,
         -back_hi * 1e3, -back_lo * 1e3);

  hg_sizing z;
  z.struct_size = sizeof z;
  size_t n_el = 0; /* sized in PVC: the new pipes take PVC's roughness, the reducer goes */
  TRY(hg_line_count(line, &n_el));
  TRY(hg_line_size_in(line, water, 6.0e-3, HG_LIMIT_VELOCITY, 2.0, "pvc", "40", 0, n_el, "pvc", &z));
  printf("  one size for the whole main in PVC, velocity ≤ 2 m/s at 6 L/s: inside diameter ≥ %.1f mm\n",
         z.min_inside_diameter * 1e3);
  if (z.standard.found)
    printf("  smallest PVC schedule 40: NPS %s (ID %.1f mm, %.2f m/s, loss %.1f kPa)\n", z.standard.nominal,
           z.standard.inside_diameter * 1e3, z.standard.velocity, z.standard.pressure_loss / 1e3);
  hg_line_free(line);
  hg_fluid_free(water);
}

static void duct(void) {
  printf("\n2. Workshop exhaust duct (air 30 °C, 0.9 m³/s, galvanised rectangular duct)\n\n");
  hg_fluid *air = NULL;
  TRY(hg_fluid_air(303.15, 101325.0, &air));
  hg_line *line = duct_line();
  hg_line_totals r;
  print_breakdown(line, air, 0.9, &r);
  /* A gas line leads with pressure: rho g (required head), losses plus the stack effect. */
  double rho_g = r.density * 9.80665;
  printf("  fan must supply %.0f Pa (%.0f … %.0f Pa): losses %.0f Pa, stack effect %.0f Pa\n", r.required_pressure,
         r.required_head_low * rho_g, r.required_head_high * rho_g, r.pressure_loss,
         r.required_pressure - r.pressure_loss);
  hg_line_free(line);
  hg_fluid_free(air);
}

/* The estate's junctions: name, elevation m, service demand L/s (invented). */
static const struct {
  const char *name;
  double z, q;
} estate_nodes[6] = {{"gate", 18.0, 2.0},       {"unit_1", 19.0, 1.5}, {"unit_2", 21.0, 2.5},
                     {"hydrant_h3", 23.0, 0.0}, {"unit_3", 22.0, 1.0}, {"yard", 20.0, 0.5}};
/* The estate's pipes (cement-lined ductile iron, each with a gate valve; the booster main
 * also a check valve). */
static const struct {
  const char *name, *up, *down;
  double d, len;
} estate_links[9] = {
    {"tank_main", "tower_tank", "gate", 0.200, 350.0}, {"booster_main", "break_tank", "unit_3", 0.150, 250.0},
    {"north_1", "gate", "unit_1", 0.150, 220.0},       {"north_2", "unit_1", "unit_2", 0.150, 200.0},
    {"east_1", "unit_2", "hydrant_h3", 0.150, 120.0},  {"east_2", "hydrant_h3", "unit_3", 0.150, 120.0},
    {"south", "unit_3", "yard", 0.100, 180.0},         {"west", "yard", "gate", 0.150, 260.0},
    {"cross", "unit_1", "yard", 0.100, 150.0},
};
#define TOWER_LEVEL 62.0
#define BREAK_TANK_LEVEL 19.0 /* the booster station's break tank, m above the datum */
/* The booster pump's curve (invented): flow L/s, head m. */
static const double booster_flows[6] = {0.0, 40.0, 80.0, 120.0, 160.0, 200.0};
static const double booster_heads[6] = {42.0, 41.0, 38.5, 34.0, 27.5, 19.0};
#define HYDRANT "hydrant_h3"
#define RESIDUAL_PRESSURE 140e3 /* Pa: an invented illustration, not a code value */

static hg_network *estate_network(void) {
  hg_network *net = NULL;
  double break_z = 17.0;
  TRY(hg_network_new(&net));
  TRY(hg_network_add_fixed_head(net, "tower_tank", TOWER_LEVEL, NULL));
  TRY(hg_network_add_fixed_head(net, "break_tank", BREAK_TANK_LEVEL, &break_z));
  for (int i = 0; i < 6; i++) TRY(hg_network_add_node(net, estate_nodes[i].name, estate_nodes[i].z, estate_nodes[i].q * 1e-3));
  for (int i = 0; i < 9; i++) {
    hg_line *l = NULL;
    TRY(hg_line_new(&l));
    if (i == 1) { /* the booster station: its pump and its non-return valve */
      double q[6];
      for (int k = 0; k < 6; k++) q[k] = booster_flows[k] * 1e-3;
      TRY(hg_line_add_pump(l, q, booster_heads, 6, 0));
      TRY(hg_line_add_fitting(l, "swing_check_valve", 0.0));
    }
    TRY(hg_line_add_pipe_material(l, estate_links[i].d, estate_links[i].len, "cement_lined_ductile_iron"));
    TRY(hg_line_add_fitting(l, "gate_valve", 0.0));
    TRY(hg_network_add_link(net, estate_links[i].name, estate_links[i].up, estate_links[i].down, l));
    hg_line_free(l);
  }
  return net;
}

static void print_network(const hg_network_solution *s) {
  printf("  %-12s %7s %8s %10s %9s\n", "node", "z m", "head m", "p kPa", "out L/s");
  const char *names[8] = {"tower_tank", "break_tank"};
  for (int i = 0; i < 6; i++) names[i + 2] = estate_nodes[i].name;
  for (size_t i = 0; i < 8; i++) {
    double h, z, p, q;
    TRY(hg_network_solution_node(s, i, &h, &z, &p, &q));
    printf("  %-12s %7.1f %8.2f %10.1f %9.2f\n", names[i], z, h, p / 1e3, q * 1e3);
  }
  printf("  %-13s %9s %8s\n", "link", "Q L/s", "V m/s");
  for (size_t k = 0; k < 9; k++) {
    double q, v, dh;
    int32_t has_v, closed;
    uint32_t w;
    TRY(hg_network_solution_link(s, k, &q, &v, &has_v, &dh, &closed, &w));
    printf("  %-13s %9.2f %8.2f\n", estate_links[k].name, q * 1e3, v);
  }
}

static void estate(void) {
  printf("\n3. Industrial estate fire-and-service main (water 10 °C, looped, tower tank and booster)\n\n");
  printf("  tower tank level %.1f m; booster pump (shut-off head %.0f m) from a break tank at %.1f m\n", TOWER_LEVEL,
         booster_heads[0], BREAK_TANK_LEVEL);
  hg_fluid *water = NULL;
  TRY(hg_fluid_water(283.15, 101325.0, &water));
  hg_network *net = estate_network();
  hg_network_solution *s = NULL, *all = NULL;
  TRY(hg_network_solve(net, water, &s));
  size_t iterations, n_warn;
  double dq, dh;
  TRY(hg_network_solution_summary(s, &iterations, &dq, &dh, &n_warn));
  printf("  service demands only (%zu Newton iterations):\n", iterations);
  print_network(s);
  double at_node, everywhere, p;
  size_t critical;
  TRY(hg_network_available_flow(net, water, HYDRANT, RESIDUAL_PRESSURE, 0, &at_node, &p, &critical, NULL));
  TRY(hg_network_available_flow(net, water, HYDRANT, RESIDUAL_PRESSURE, 1, &everywhere, &p, &critical, &all));
  printf("\n  flow available at %s with %.0f kPa residual there: %.1f L/s on top of the service demands\n", HYDRANT,
         RESIDUAL_PRESSURE / 1e3, at_node * 1e3);
  printf("  with %.0f kPa kept at every junction: %.1f L/s (the limit binds at %s)\n", RESIDUAL_PRESSURE / 1e3,
         everywhere * 1e3, critical >= 2 ? estate_nodes[critical - 2].name : "a fixed head");
  const char *fixed[2] = {"tower_tank", "break_tank"};
  for (size_t i = 0; i < 2; i++) {
    double h, z, q;
    TRY(hg_network_solution_node(all, i, &h, &z, &p, &q));
    printf("  %s supplies %.1f L/s\n", fixed[i], -q * 1e3);
  }
  TRY(hg_network_solution_summary(all, &iterations, &dq, &dh, &n_warn));
  for (size_t i = 0; i < n_warn; i++) {
    char msg[512];
    size_t need;
    int32_t kind;
    TRY(hg_network_solution_warning(all, i, &kind, msg, sizeof msg, &need));
    if (kind != HG_NETWORK_WARNING_LINE_WARNINGS) printf("  warning: %s\n", msg);
  }
  printf("  Fire flow: the fire-protection codes that apply, and the authority that enforces them, set the\n"
         "  required flow, duration and residual pressure; the %.0f kPa here is an invented figure. These\n"
         "  are estimates (friction ±10 %%, roughness of a main in service uncertain), to be confirmed by\n"
         "  a competent engineer and by a flow test on the real main.\n",
         RESIDUAL_PRESSURE / 1e3);
  hg_network_solution_free(s);
  hg_network_solution_free(all);
  hg_network_free(net);
  hg_fluid_free(water);
}

/* The same `name value` lines as the Rust demo's --numbers, with every digit. */
static void numbers(void) {
  hg_fluid *water = NULL, *air = NULL;
  TRY(hg_fluid_water(285.15, 101325.0, &water));
  TRY(hg_fluid_air(303.15, 101325.0, &air));
  hg_line *line = orchard_line(), *dl = duct_line();
  hg_line_totals r, d;
  r.struct_size = sizeof r, d.struct_size = sizeof d;
  hg_line_result *res = NULL;
  TRY(hg_line_evaluate(line, water, 6.0e-3, &res));
  TRY(hg_line_result_totals(res, &r));
  hg_line_result_free(res);
  double q, h, x[4], back, back_lo, back_hi;
  TRY(hg_line_operating_point(line, water, pump_q, pump_h, 6, &q, &h, &x[0], &x[1], &x[2], &x[3]));
  TRY(hg_line_flow_for_head(line, water, 0.0, &back, &back_lo, &back_hi));
  hg_sizing z;
  z.struct_size = sizeof z;
  size_t n_el = 0; /* sized in PVC: the new pipes take PVC's roughness, the reducer goes */
  TRY(hg_line_count(line, &n_el));
  TRY(hg_line_size_in(line, water, 6.0e-3, HG_LIMIT_VELOCITY, 2.0, "pvc", "40", 0, n_el, "pvc", &z));
  TRY(hg_line_evaluate(dl, air, 0.9, &res));
  TRY(hg_line_result_totals(res, &d));
  hg_line_result_free(res);
  hg_fluid *water10 = NULL;
  TRY(hg_fluid_water(283.15, 101325.0, &water10));
  hg_network *net = estate_network();
  hg_network_solution *es = NULL;
  TRY(hg_network_solve(net, water10, &es));
  double e_hydrant_p, e_tank_q, e_booster_q, e_at_node, e_everywhere, e_pressure, u1, u2, u3;
  int32_t i1, i2;
  uint32_t w1;
  size_t hydrant, critical;
  TRY(hg_network_index(net, HYDRANT, 0, &hydrant));
  TRY(hg_network_solution_node(es, hydrant, &u1, &u2, &e_hydrant_p, &u3));
  TRY(hg_network_solution_link(es, 0, &e_tank_q, &u1, &i1, &u2, &i2, &w1));
  TRY(hg_network_solution_link(es, 1, &e_booster_q, &u1, &i1, &u2, &i2, &w1));
  TRY(hg_network_available_flow(net, water10, HYDRANT, RESIDUAL_PRESSURE, 0, &e_at_node, &u1, &critical, NULL));
  TRY(hg_network_available_flow(net, water10, HYDRANT, RESIDUAL_PRESSURE, 1, &e_everywhere, &e_pressure, &critical,
                                NULL));
  hg_network_solution_free(es);
  hg_network_free(net);
  hg_fluid_free(water10);
  const struct {
    const char *name;
    double value;
  } rows[] = {
      {"orchard_required_head", r.required_head},
      {"orchard_required_head_low", r.required_head_low},
      {"orchard_required_head_high", r.required_head_high},
      {"orchard_pressure_loss", r.pressure_loss},
      {"orchard_operating_flow", q},
      {"orchard_operating_head", h},
      {"orchard_gravity_flow", back},
      {"orchard_min_inside_diameter", z.min_inside_diameter},
      {"orchard_standard_inside_diameter", z.standard.found ? z.standard.inside_diameter : 0.0 / 0.0},
      {"duct_pressure_loss", d.pressure_loss},
      {"duct_pressure_loss_low", d.pressure_loss_low},
      {"duct_pressure_loss_high", d.pressure_loss_high},
      {"estate_hydrant_pressure", e_hydrant_p},
      {"estate_tank_main_flow", e_tank_q},
      {"estate_booster_main_flow", e_booster_q},
      {"estate_available_at_hydrant", e_at_node},
      {"estate_available_everywhere", e_everywhere},
      {"estate_available_pressure", e_pressure},
  };
  for (size_t i = 0; i < sizeof rows / sizeof *rows; i++) printf("%s %.17g\n", rows[i].name, rows[i].value);
  hg_line_free(line);
  hg_line_free(dl);
  hg_fluid_free(water);
  hg_fluid_free(air);
}

int main(int argc, char **argv) {
  if (hg_abi_version() != HG_ABI_VERSION) {
    fprintf(stderr, "error: libhydrograde ABI %u, this program was built for %d\n", hg_abi_version(),
            HG_ABI_VERSION);
    return 1;
  }
  for (int i = 1; i < argc; i++) {
    if (strcmp(argv[i], "--numbers") == 0) {
      numbers();
      return 0;
    }
  }
  printf("hydrograde %s demo: invented scenarios, engineering estimates with 95 %% bands.\n", hg_version());
  orchard();
  duct();
  estate();
  printf("\nCaution: these are engineering estimates with stated uncertainty. A design built on "
         "them must be checked by a competent engineer (licensed or registered where the law requires it) against the codes and standards that apply where it is built.\n");
  return 0;
}

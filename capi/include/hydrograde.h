/*
 * hydrograde: pipe-flow friction, head loss and minor losses (C ABI).
 *
 * Conventions
 *  - Every function that can fail returns an int32_t status: HG_OK (0) or one of the
 *    HG_ERR_* codes below, whose numbers never change meaning. Results come back through
 *    out-pointers, which are left untouched on failure, with one exception: a call that
 *    fills a text buffer and returns HG_ERR_BUFFER_TOO_SMALL still stores the needed
 *    length and a cut, NUL-terminated copy (like snprintf), and nothing else.
 *    hg_last_error() gives the calling thread's message for its last failed call,
 *    hg_status_name() names a code.
 *  - Units are SI everywhere: m, s, kg, Pa, K, m^3/s, Pa*s, kg/m^3. Flow is signed.
 *  - NaN and +-inf are always rejected (HG_ERR_NOT_FINITE); NULL pointers give
 *    HG_ERR_NULL_POINTER; array lengths of 0 give HG_ERR_INVALID. No call aborts the
 *    process on bad input.
 *  - Structs that may grow start with size_t struct_size: set it to sizeof the struct.
 *    Fields are only ever added at the end, and the size of a struct's first release
 *    stays accepted, so a program compiled against an older header keeps working.
 *  - Handles (hg_fluid, hg_line, hg_line_result) are opaque, made by one call and
 *    released by their _free function; _free(NULL) does nothing.
 *  - ABI: HG_ABI_VERSION, the number in the SONAME libhydrograde.so.<abi>. While the
 *    library is 0.x it counts incompatible changes on its own. ABI 1: hg_line_evaluate
 *    returns an hg_line_result handle (hg_line_result_* accessors); the accessors that
 *    evaluated the line again are gone.
 *  - Thread-safety: every function may be called from any number of threads at once,
 *    except that one hg_line must not be changed (hg_line_add_*, hg_line_free) while
 *    another thread uses it. Reading a line from several threads at once is safe.
 *  - The hydro_* exports of the DLL (stdcall on 32-bit Windows, ANSI text) serve the
 *    spreadsheet module capi/excel/hydrograde.bas and are not declared here.
 *
 * Index (the header follows this order)
 *  Errors     HG_OK, HG_ERR_*; hg_status_name, hg_last_error
 *  Friction   HG_CORRELATION_*, HG_REGIME_*, HG_TRANSITION_*, hg_friction_options,
 *             hg_friction; hg_friction_options_default, hg_darcy_factor,
 *             hg_darcy_factor_full, hg_darcy_factor_opts, hg_darcy_factor_batch,
 *             hg_correlation_name, hg_correlation_from_name, hg_correlation_validity,
 *             hg_regime_name, hg_transition_limits
 *  Fluids     hg_fluid (handle); hg_water, hg_air, hg_water_vapour_pressure,
 *             hg_water_saturation_temperature, hg_fluid_water, hg_fluid_air,
 *             hg_fluid_liquid, hg_fluid_gas, hg_fluid_with_uncertainty,
 *             hg_fluid_with_vapour_pressure, hg_fluid_properties, hg_fluid_free
 *  Sections   HG_SECTION_*; hg_section_properties, hg_turbulent_diameter
 *  Fittings   hg_fitting_k, hg_fitting_catalogue_name
 *  Roughness and pipe sizes
 *             hg_roughness, hg_roughness_material_name, hg_roughness_aged,
 *             hg_pipe_size, hg_pipe_size_at_least, hg_pipe_size_dn, hg_pipe_table_schedule,
 *             hg_pipe_table_nominal, hg_pipe_tables,
 *             hg_pipe_table_source, hg_pipe_table_wall_rule
 *  Pipes      hg_pipe_flow; hg_pipe_head_loss, hg_pipe_head_loss_batch,
 *             hg_duct_flow_state, hg_reynolds
 *  Lines      hg_line (handle), HG_EDGE_*, HG_TURBULENT_DIAMETER_*, HG_LIMIT_*,
 *             hg_sizing; hg_line_new, hg_line_free, hg_line_count, hg_line_add_*,
 *             hg_line_set_*, hg_line_flow_for_head, hg_line_system_curve,
 *             hg_line_operating_point, hg_line_required_head, hg_pump_curve_head,
 *             hg_pump_curve_fit, hg_pump_curve_fit_head, hg_line_operating_point_fit,
 *             hg_line_pumped_flow,
 *             hg_line_with_uniform_diameter, hg_line_size, hg_line_split_flow,
 *             hg_line_split_flow_bands, hg_line_blocks_reverse_flow,
 *             hg_line_set_air_column_for_liquids, hg_line_set_label,
 *             hg_line_set_count, hg_line_slice, hg_line_append_line,
 *             hg_line_add_equipment_rated, hg_line_set_end_pressure,
 *             hg_line_size_in, hg_line_with_diameter_in
 *  Results    hg_line_result (handle), hg_line_totals, hg_element_result,
 *             HG_ELEMENT_*, HG_REGIME_NONE; hg_line_evaluate, hg_line_evaluate_at,
 *             hg_line_result_totals, hg_line_result_element, hg_line_result_label,
 *             hg_line_result_band_source, hg_line_result_element_band_source,
 *             hg_line_result_npsh_available, hg_line_result_npsh_check,
 *             hg_line_result_message_count, hg_line_result_message,
 *             hg_line_result_free
 *  Networks   hg_network (handle), hg_network_solution (handle),
 *             HG_NETWORK_WARNING_*; hg_network_new, hg_network_free,
 *             hg_network_add_node, hg_network_add_fixed_head, hg_network_add_link,
 *             hg_network_place_node, hg_network_node_position,
 *             hg_network_counts, hg_network_index, hg_network_solve,
 *             hg_network_solution_free, hg_network_solution_summary,
 *             hg_network_solution_node, hg_network_solution_link,
 *             hg_network_solution_warning, hg_network_link_result,
 *             hg_network_available_flow
 *             hg_network_from_json; hg_network_bands (handle),
 *             hg_network_bands_new, hg_network_bands_free, hg_network_bands_node,
 *             hg_network_bands_flow
 *  Bands      hg_uncertainty_options, hg_monte_carlo, HG_MONTE_CARLO_MAX_SAMPLES;
 *             hg_line_system_curve_band,
 *             hg_uncertainty_options_default, hg_line_set_uncertainty,
 *             hg_line_monte_carlo, hg_line_band_monte_carlo
 *  Units      hg_convert, hg_convert_head, hg_unit_name
 *  Warnings   HG_WARN_*; hg_warning_name
 *  Version    HG_VERSION_*, HG_ABI_VERSION; hg_version, hg_abi_version
 *  Threads    HG_MAX_THREADS; hg_set_threads, hg_threads
 *
 * Safety: results are engineering estimates with stated uncertainty (friction
 * correlations are good to about +-10 %). Designs must be checked by a competent engineer
 * (licensed or registered where the law requires it) against the codes and standards that
 * apply where they are built.
 */

#ifndef HYDROGRADE_H
#define HYDROGRADE_H

/* Generated by cbindgen from capi/src; do not edit. Regenerate with scripts/test-c.sh --regenerate. */

#include <stddef.h>
#include <stdint.h>

/**
 * Success.
 */
#define HG_OK 0

/**
 * A number that must be finite was NaN or ±infinity.
 */
#define HG_ERR_NOT_FINITE 10

/**
 * A finite number outside its accepted range (or an unknown `HG_*` constant value).
 */
#define HG_ERR_OUT_OF_RANGE 11

/**
 * A name (correlation, fitting, unit…) that the library does not know.
 */
#define HG_ERR_UNKNOWN_NAME 12

/**
 * Input malformed as a whole: a zero length, an empty line, a string that is not UTF-8,
 * a struct whose `struct_size` is too small.
 */
#define HG_ERR_INVALID 13

/**
 * The question has no answer (e.g. a head that no flow meets).
 */
#define HG_ERR_NO_SOLUTION 20

/**
 * A pointer argument that must not be NULL was NULL (or was misaligned).
 */
#define HG_ERR_NULL_POINTER 30

/**
 * A caller's buffer is too small for the result.
 */
#define HG_ERR_BUFFER_TOO_SMALL 31

/**
 * A bug in hydrograde (a panic was caught at the boundary); please report it.
 */
#define HG_ERR_INTERNAL 99

/**
 * Colebrook–White, solved exactly (the default correlation).
 */
#define HG_CORRELATION_COLEBROOK 0

/**
 * Haaland (1983), explicit.
 */
#define HG_CORRELATION_HAALAND 1

/**
 * Swamee and Jain (1976), explicit.
 */
#define HG_CORRELATION_SWAMEE_JAIN 2

/**
 * Churchill (1977), explicit, one formula for all regimes.
 */
#define HG_CORRELATION_CHURCHILL 3

/**
 * Serghides (1984), explicit.
 */
#define HG_CORRELATION_SERGHIDES 4

/**
 * Blasius (1913), smooth pipes only.
 */
#define HG_CORRELATION_BLASIUS 5

/**
 * The fully rough wall law, independent of Re.
 */
#define HG_CORRELATION_FULLY_ROUGH 6

/**
 * Laminar flow (Re below the laminar limit, 2300 by default).
 */
#define HG_REGIME_LAMINAR 0

/**
 * Transitional flow (between the laminar and turbulent limits).
 */
#define HG_REGIME_TRANSITIONAL 1

/**
 * Turbulent flow (Re above the turbulent limit, 4000 by default).
 */
#define HG_REGIME_TURBULENT 2

/**
 * In the transitional band, a C¹ blend of the laminar and turbulent values (default).
 */
#define HG_TRANSITION_BLEND 0

/**
 * In the transitional band, the turbulent correlation down to the laminar limit.
 */
#define HG_TRANSITION_TURBULENT 1

/**
 * In the transitional band, refuse with `HG_ERR_NO_SOLUTION`.
 */
#define HG_TRANSITION_REFUSE 2

/**
 * Round pipe: `a` = inside diameter (m), `b` = 0.
 */
#define HG_SECTION_CIRCLE 0

/**
 * Concentric annulus: `a` = bore of the outer pipe, `b` = outside diameter of the inner
 * tube (m), 0 < b < a.
 */
#define HG_SECTION_ANNULUS 1

/**
 * Rectangle: `a` = width, `b` = height (m).
 */
#define HG_SECTION_RECTANGLE 2

/**
 * Ellipse: `a` = major axis, `b` = minor axis (full axes, m), b ≤ a.
 */
#define HG_SECTION_ELLIPSE 3

/**
 * Equilateral triangle: `a` = side (m), `b` = 0.
 */
#define HG_SECTION_TRIANGLE 4

/**
 * Inlet from a tank through a square (sharp-edged) pipe end, K = 0.5 (`r_over_d` must be 0).
 */
#define HG_EDGE_SQUARE 0

/**
 * Inlet from a tank through a pipe end rounded with radius `r_over_d` times the bore.
 */
#define HG_EDGE_ROUNDED 1

/**
 * Inlet from a tank through a pipe end projecting into it (re-entrant entrance), K = 0.78
 * (`r_over_d` must be 0).
 */
#define HG_EDGE_REENTRANT 2

/**
 * Turbulent flow in non-circular ducts on the hydraulic diameter (default).
 */
#define HG_TURBULENT_DIAMETER_HYDRAULIC 0

/**
 * Turbulent flow in rectangles and annuli on the laminar-equivalent diameter (Jones
 * 1976; Jones & Leung 1981).
 */
#define HG_TURBULENT_DIAMETER_LAMINAR_EQUIVALENT 1

/**
 * Sizing limit: the line's pressure loss (friction + minor, without rises), Pa.
 */
#define HG_LIMIT_PRESSURE_LOSS 0

/**
 * Sizing limit: the mean velocity in the round pipes, m/s.
 */
#define HG_LIMIT_VELOCITY 1

/**
 * A straight run (pipe or duct).
 */
#define HG_ELEMENT_PIPE 0

/**
 * A fitting (minor loss).
 */
#define HG_ELEMENT_FITTING 1

/**
 * An elevation change.
 */
#define HG_ELEMENT_RISE 2

/**
 * Rated equipment.
 */
#define HG_ELEMENT_EQUIPMENT 3

/**
 * An abrupt change of section the route implies between two elements of different bore
 * with no contraction or expansion element: a row of its own (not an element of the
 * line), with `HG_WARN_BORE_CHANGE_WITHOUT_TRANSITION`.
 */
#define HG_ELEMENT_SECTION_CHANGE 4

/**
 * A pump (`hg_line_add_pump`): its head loss is the negative of the head it adds.
 */
#define HG_ELEMENT_PUMP 5

/**
 * The `regime` of an element that has none (every element but a pipe).
 */
#define HG_REGIME_NONE -1

/**
 * The largest number of samples `hg_line_monte_carlo` accepts: the samples are kept in
 * memory (8 bytes each), and a larger request is far more than any check needs. The
 * same limit holds in every binding.
 */
#define HG_MONTE_CARLO_MAX_SAMPLES 10000000

/**
 * A check or foot valve holds a link closed (`hg_network_solution_warning`).
 */
#define HG_NETWORK_WARNING_CHECK_VALVE_CLOSED 0

/**
 * A link's velocity is above the limit (3 m/s).
 */
#define HG_NETWORK_WARNING_VELOCITY_ABOVE_LIMIT 1

/**
 * A junction's pressure is below atmospheric.
 */
#define HG_NETWORK_WARNING_PRESSURE_BELOW_ATMOSPHERIC 2

/**
 * A junction's absolute pressure is below the liquid's vapour pressure.
 */
#define HG_NETWORK_WARNING_BELOW_VAPOUR_PRESSURE 3

/**
 * A link's line has warnings of its own at the solved flow (`HG_WARN_*` bits of
 * `hg_network_solution_link`).
 */
#define HG_NETWORK_WARNING_LINE_WARNINGS 4

/**
 * The Reynolds number lies outside the published range of the correlation.
 */
#define HG_WARN_REYNOLDS_OUT_OF_RANGE 1

/**
 * The relative roughness lies outside the published range of the correlation.
 */
#define HG_WARN_ROUGHNESS_OUT_OF_RANGE 2

/**
 * Transitional flow: the friction factor is not well defined; its band spans both regimes.
 */
#define HG_WARN_TRANSITIONAL_FLOW 4

/**
 * A non-circular section: turbulent results on the hydraulic diameter are less accurate.
 */
#define HG_WARN_NON_CIRCULAR_SECTION 8

/**
 * A gas whose pressure loss exceeds 10 % of the inlet pressure: results are approximate.
 */
#define HG_WARN_GAS_COMPRESSIBILITY 16

/**
 * The pressure falls below the vapour pressure: cavitation or flashing is likely.
 */
#define HG_WARN_BELOW_VAPOUR_PRESSURE 32

/**
 * A fitting or equipment value used outside the range its data covers.
 */
#define HG_WARN_FITTING_OUT_OF_RANGE 64

/**
 * The bore changes between two elements with no contraction or expansion element: the
 * change is counted as an abrupt contraction or expansion row of its own.
 */
#define HG_WARN_BORE_CHANGE_WITHOUT_TRANSITION 128

/**
 * A velocity above 15 m/s in a liquid or 80 m/s in a gas: likely a flow in the wrong
 * unit (L/s or m³/h typed as m³/s).
 */
#define HG_WARN_IMPLAUSIBLE_VELOCITY 256

/**
 * A bore under 2 mm or over 5 m: likely millimetres typed as metres.
 */
#define HG_WARN_IMPLAUSIBLE_BORE 512

/**
 * A pipe longer than 200 km: likely millimetres or feet typed as metres.
 */
#define HG_WARN_IMPLAUSIBLE_LENGTH 1024

/**
 * A rated pressure drop under 10 Pa: likely bar or kPa typed as Pa.
 */
#define HG_WARN_IMPLAUSIBLE_RATED_DROP 2048

/**
 * A liquid's viscosity far above its density's kind: likely centipoise typed as Pa·s.
 */
#define HG_WARN_IMPLAUSIBLE_VISCOSITY 4096

/**
 * Major version of the library (from Cargo.toml; the build fails if they disagree).
 */
#define HG_VERSION_MAJOR 0

/**
 * Minor version of the library (from Cargo.toml; the build fails if they disagree).
 */
#define HG_VERSION_MINOR 1

/**
 * Patch version of the library (from Cargo.toml; the build fails if they disagree).
 */
#define HG_VERSION_PATCH 0

/**
 * ABI version: the number in the shared library's SONAME (`libhydrograde.so.<abi>`).
 * While the library is 0.x it counts the incompatible changes of the C ABI on its own
 * (from 1.0 on it will equal the major version). ABI 1 (library 0.1): `hg_line_evaluate`
 * returns an `hg_line_result` handle read by the `hg_line_result_*` accessors, and the
 * accessors that evaluated the line again (`hg_line_element`, `hg_line_element_label`,
 * `hg_line_band_source`, `hg_line_element_band_source`) are gone. A program compiled
 * against this header should check `hg_abi_version() == HG_ABI_VERSION` at start-up.
 */
#define HG_ABI_VERSION 1

/**
 * The largest number of threads `hg_set_threads` accepts.
 */
#define HG_MAX_THREADS 1024

/**
 * A fluid for line evaluations: opaque; made by `hg_fluid_water`, `hg_fluid_air` or
 * `hg_fluid_liquid`, released with `hg_fluid_free`. A fluid never changes after it is
 * made, so any number of threads may use one at once.
 */
typedef struct hg_fluid hg_fluid;

/**
 * A route of pipes, fittings, rises and equipment in series: opaque. Made by
 * `hg_line_new`, released by `hg_line_free`. Adding elements or changing options needs
 * exclusive use of the handle; evaluating only reads it, so several threads may
 * evaluate one line at once.
 */
typedef struct hg_line hg_line;

/**
 * A line evaluated at one flow: opaque. Made by `hg_line_evaluate` or
 * `hg_line_evaluate_at`, released by `hg_line_result_free`. It owns a copy of every
 * number, so it stays valid after the line and the fluid are freed. Reading it is
 * thread-safe.
 */
typedef struct hg_line_result hg_line_result;

/**
 * A network of nodes joined by lines: opaque. Made by `hg_network_new`, released by
 * `hg_network_free`. Adding nodes and links needs exclusive use of the handle; solving
 * only reads it.
 */
typedef struct hg_network hg_network;

/**
 * The 95 % bands of a solved network: opaque. Made by `hg_network_bands_new`, released
 * by `hg_network_bands_free`. It owns every number, so reading it computes nothing.
 */
typedef struct hg_network_bands hg_network_bands;

/**
 * A solved network: opaque. Made by `hg_network_solve`, released by
 * `hg_network_solution_free`. It owns every number, so reading it computes nothing and
 * it stays valid after the network and the fluid are freed.
 */
typedef struct hg_network_solution hg_network_solution;

/**
 * Options of `hg_darcy_factor_opts`. Fill it with `hg_friction_options_default`, then
 * change what you need; `struct_size` must be `sizeof(hg_friction_options)`.
 */
typedef struct hg_friction_options {
  /**
   * Size of this struct in bytes, set by `hg_friction_options_default`.
   */
  size_t struct_size;
  /**
   * Turbulent correlation, one of `HG_CORRELATION_*`.
   */
  int32_t correlation;
  /**
   * Treatment of the transitional band, one of `HG_TRANSITION_*`.
   */
  int32_t transition;
  /**
   * Laminar constant C = f·Re of the section (64 for a circle), > 0, dimensionless.
   */
  double laminar_constant;
  /**
   * Reynolds number below which flow is laminar (default 2300), > 0.
   */
  double laminar_limit;
  /**
   * Reynolds number above which flow is turbulent (default 4000), ≥ `laminar_limit`.
   */
  double turbulent_limit;
} hg_friction_options;

/**
 * A friction factor with its sensitivities. Set `struct_size` to `sizeof(hg_friction)`
 * before the call; the library fills the other fields.
 */
typedef struct hg_friction {
  /**
   * Size of this struct in bytes, set by the caller.
   */
  size_t struct_size;
  /**
   * Darcy friction factor, dimensionless.
   */
  double f;
  /**
   * ∂f/∂Re, dimensionless.
   */
  double df_dre;
  /**
   * ∂f/∂(ε/D), dimensionless.
   */
  double df_drel_roughness;
  /**
   * Flow regime, one of `HG_REGIME_*`.
   */
  int32_t regime;
  /**
   * Warning bits, `HG_WARN_*`.
   */
  uint32_t warnings;
} hg_friction;

/**
 * The state of flow in a straight run at one flow rate. Set `struct_size` to
 * `sizeof(hg_pipe_flow)` before the call.
 */
typedef struct hg_pipe_flow {
  /**
   * Size of this struct in bytes, set by the caller.
   */
  size_t struct_size;
  /**
   * Mean velocity Q/A, m/s, signed with the flow.
   */
  double velocity;
  /**
   * Reynolds number on the hydraulic diameter, |V|·D_h·ρ/μ.
   */
  double reynolds;
  /**
   * Darcy friction factor; 0 at zero flow, where it is undefined (`regime` is then
   * laminar).
   */
  double friction_factor;
  /**
   * Head loss, m of the flowing fluid, signed with the flow.
   */
  double head_loss;
  /**
   * ∂(head loss)/∂Q, s/m² (continuous through zero flow and the transition).
   */
  double dhead_dflow;
  /**
   * Flow regime, `HG_REGIME_*`.
   */
  int32_t regime;
  /**
   * Warning bits, `HG_WARN_*`.
   */
  uint32_t warnings;
} hg_pipe_flow;

/**
 * A standard size chosen by `hg_line_size`: zero everywhere when `found` is 0.
 */
typedef struct hg_size_choice {
  /**
   * 1 when a standard size was found, else 0.
   */
  int32_t found;
  /**
   * Nominal size as printed, NUL-terminated (e.g. "1-1/2").
   */
  char nominal[16];
  /**
   * Inside diameter, m.
   */
  double inside_diameter;
  /**
   * Velocity in it, m/s.
   */
  double velocity;
  /**
   * Pressure loss of the line with it, Pa.
   */
  double pressure_loss;
  /**
   * Lower end of the pressure-loss band, Pa.
   */
  double pressure_loss_low;
  /**
   * Upper end of the pressure-loss band, Pa.
   */
  double pressure_loss_high;
} hg_size_choice;

/**
 * The answer of `hg_line_size`. Set `struct_size` to `sizeof(hg_sizing)` first.
 */
typedef struct hg_sizing {
  /**
   * Size of this struct in bytes, set by the caller.
   */
  size_t struct_size;
  /**
   * The smallest inside diameter that meets the limit at the nominal values, m.
   */
  double min_inside_diameter;
  /**
   * The smallest standard size that meets it at the nominal values.
   */
  struct hg_size_choice standard;
  /**
   * The smallest standard size that still meets it at the unfavourable end of the
   * band (the high end of the pressure-loss band).
   */
  struct hg_size_choice standard_at_band;
} hg_sizing;

/**
 * The totals of a line evaluated at one flow, from `hg_line_result_totals`. Set
 * `struct_size` to `sizeof(hg_line_totals)` before the call; fields added in later
 * versions go after the existing ones, so an old caller's smaller struct keeps working.
 * Heads are in m of the flowing fluid. The `*_low` and `*_high` fields bound the
 * expanded uncertainty (coverage factor k = 2).
 */
typedef struct hg_line_totals {
  /**
   * Size of this struct in bytes, set by the caller.
   */
  size_t struct_size;
  /**
   * The flow, m³/s (signed).
   */
  double flow;
  /**
   * Friction plus minor losses, m (signed with the flow).
   */
  double head_loss;
  /**
   * ρ·g·head_loss, Pa.
   */
  double pressure_loss;
  /**
   * Sum of the rises, m.
   */
  double static_head;
  /**
   * head_loss + static_head, m.
   */
  double required_head;
  /**
   * d(required_head)/dQ, s/m².
   */
  double drequired_head_dflow;
  /**
   * Density the heads refer to, kg/m³ (the mean density for a gas).
   */
  double density;
  /**
   * Static pressure at the inlet, Pa absolute; meaningful only when `has_pressures`
   * is 1 (else 0).
   */
  double inlet_pressure;
  /**
   * Static pressure at the outlet, Pa absolute; meaningful only when `has_pressures`
   * is 1 (else 0).
   */
  double outlet_pressure;
  /**
   * 1 when the inlet pressure is known (set, or the gas's own), else 0.
   */
  int32_t has_pressures;
  /**
   * Warning bits of the whole line, `HG_WARN_*`.
   */
  uint32_t warnings;
  /**
   * Number of elements (rows through `hg_line_result_element`).
   */
  size_t element_count;
  /**
   * Number of sources of the head-loss band (through `hg_line_result_band_source`);
   * 0 for a band of zero width.
   */
  size_t band_source_count;
  /**
   * Lower end of the head-loss band, m.
   */
  double head_loss_low;
  /**
   * Upper end of the head-loss band, m.
   */
  double head_loss_high;
  /**
   * Lower end of the pressure-loss band, Pa.
   */
  double pressure_loss_low;
  /**
   * Upper end of the pressure-loss band, Pa.
   */
  double pressure_loss_high;
  /**
   * Lower end of the required-head band, m.
   */
  double required_head_low;
  /**
   * Upper end of the required-head band, m.
   */
  double required_head_high;
  /**
   * ρ·g·required_head, Pa: the pressure rise a pump, fan or blower must supply (for a
   * gas the figure to lead with; a rise counts (ρ − ρ_surroundings)·g·Δz). Added after
   * the first layout: read it only when `struct_size` covers it.
   */
  double required_pressure;
  /**
   * 1 when the first-order bands above are flagged non-linear (wider than 20 % of
   * their nominal value, or a pipe's Reynolds number reaches into the laminar–turbulent
   * transition within its own 95 % range): take the interval from
   * `hg_line_monte_carlo` instead; else 0. Added after the first layout: read it only
   * when `struct_size` covers it.
   */
  int32_t band_non_linear;
  /**
   * Always 0 (keeps the struct free of padding, so whole structs compare bytewise).
   */
  int32_t band_reserved;
} hg_line_totals;

/**
 * One element's row of a line evaluated at one flow, from `hg_line_result_element`. Set
 * `struct_size` to `sizeof(hg_element_result)` before the call. A quantity the element
 * does not have (a rise's velocity, a pipe's K) has its `has_*` flag at 0 and the value
 * 0, which is then not a value.
 */
typedef struct hg_element_result {
  /**
   * Size of this struct in bytes, set by the caller.
   */
  size_t struct_size;
  /**
   * What the element is, `HG_ELEMENT_*`.
   */
  int32_t kind;
  /**
   * Flow regime of a pipe, `HG_REGIME_*`; `HG_REGIME_NONE` for other elements.
   */
  int32_t regime;
  /**
   * Mean velocity in the element's bore, m/s (signed); only when `has_velocity`.
   */
  double velocity;
  /**
   * Reynolds number in that bore; only when `has_velocity`.
   */
  double reynolds;
  /**
   * Darcy friction factor; only when `has_friction_factor` (pipes).
   */
  double friction_factor;
  /**
   * Resistance coefficient K at this Reynolds number; only when `has_k` (fittings,
   * fixed-K equipment).
   */
  double k;
  /**
   * Head loss, m (signed with the flow; 0 for rises).
   */
  double head_loss;
  /**
   * d(head loss)/dQ, s/m².
   */
  double dhead_dflow;
  /**
   * Elevation change, m (rises; 0 for the others).
   */
  double static_head;
  /**
   * Static pressure at the element's outlet, Pa absolute; only when `has_pressure`.
   */
  double pressure_out;
  /**
   * Warning bits of this element, `HG_WARN_*`.
   */
  uint32_t warnings;
  /**
   * 1 when `pressure_out` is known, else 0.
   */
  int32_t has_pressure;
  /**
   * Lower end of the head-loss band, m.
   */
  double head_loss_low;
  /**
   * Upper end of the head-loss band, m.
   */
  double head_loss_high;
  /**
   * Lower end of the friction-factor band; only when `has_friction_factor`.
   */
  double friction_factor_low;
  /**
   * Upper end of the friction-factor band; only when `has_friction_factor`.
   */
  double friction_factor_high;
  /**
   * 1 when `velocity` and `reynolds` apply (elements with a bore: not a rise nor a
   * rated pressure drop), else 0.
   */
  int32_t has_velocity;
  /**
   * 1 when `friction_factor` and its band apply (pipes), else 0.
   */
  int32_t has_friction_factor;
  /**
   * 1 when `k` applies (fittings, fixed-K equipment), else 0.
   */
  int32_t has_k;
  /**
   * Reserved, 0 (keeps the next field aligned alike on every platform).
   */
  int32_t reserved;
  /**
   * Number of sources of this element's head-loss band (through
   * `hg_line_result_element_band_source`); 0 for a band of zero width (a rise).
   */
  size_t band_source_count;
  /**
   * How many identical fittings the row stands for (`hg_line_set_count`; 1 for every
   * other row). This and the fields after it came after the struct's first layout: a
   * caller whose `struct_size` ends before them does not get them.
   */
  size_t count;
  /**
   * The row's share of the variance of the line's head loss: the covariance of its
   * loss with the total over the total's variance (the shares of all rows sum to 1; a
   * negative share offsets the rest); only when `has_band_share`.
   */
  double band_share;
  /**
   * 1 when `band_share` applies (the line's head-loss band has a width), else 0.
   */
  int32_t has_band_share;
  /**
   * Reserved, 0.
   */
  int32_t reserved_end;
  /**
   * Elevation of the element's outlet above the line's inlet, m (a rise's geometric
   * height is the change of this from the row before).
   */
  double elevation_out;
  /**
   * Total pressure (static + ½ρV²) at the outlet, Pa absolute; valid when
   * `has_pressure`.
   */
  double total_pressure_out;
  /**
   * The bore the velocity is referred to, m (a pipe's hydraulic diameter, a fitting's
   * bore at its position in the flow path); only when `has_bore`.
   */
  double bore;
  /**
   * Length of a pipe, m; only when `has_length`.
   */
  double length;
  /**
   * 1 when `bore` applies (not a rise nor a rated drop), else 0.
   */
  int32_t has_bore;
  /**
   * 1 when `length` applies (pipes), else 0.
   */
  int32_t has_length;
} hg_element_result;

/**
 * Which uncertainty sources the bands of a line include, and their sizes (relative
 * standard uncertainties, k = 1). Fill it with `hg_uncertainty_options_default`.
 */
typedef struct hg_uncertainty_options {
  /**
   * Size of this struct in bytes, set by `hg_uncertainty_options_default`.
   */
  size_t struct_size;
  /**
   * 1 to include the friction correlation's model uncertainty, else 0.
   */
  int32_t friction_model;
  /**
   * 1 to include wall roughness, else 0.
   */
  int32_t roughness;
  /**
   * 1 to include the fluid's density and viscosity uncertainties, else 0.
   */
  int32_t fluid;
  /**
   * 1 to include fitting K spreads, else 0.
   */
  int32_t fittings;
  /**
   * 1 to include equipment spreads, else 0.
   */
  int32_t equipment;
  /**
   * Model uncertainty of turbulent flow in round pipe.
   */
  double turbulent_model;
  /**
   * Model uncertainty of laminar flow.
   */
  double laminar_model;
  /**
   * Model uncertainty of turbulent flow in non-circular ducts.
   */
  double non_circular_model;
  /**
   * Relative uncertainty of roughness where a pipe states no range.
   */
  double roughness_default;
  /**
   * Relative uncertainty of every bore (manufacturing tolerance).
   */
  double diameter;
} hg_uncertainty_options;

/**
 * The result of `hg_line_monte_carlo`: the required head sampled with the line's
 * uncertainty sources. Set `struct_size` to `sizeof(hg_monte_carlo)` before the call.
 */
typedef struct hg_monte_carlo {
  /**
   * Size of this struct in bytes, set by the caller.
   */
  size_t struct_size;
  /**
   * Sample mean of the required head, m.
   */
  double mean;
  /**
   * Sample standard deviation, m.
   */
  double std_dev;
  /**
   * 2.5 % quantile, m (the low end of the 95 % probabilistically symmetric interval).
   */
  double low;
  /**
   * 97.5 % quantile, m.
   */
  double high;
  /**
   * Number of samples drawn.
   */
  size_t samples;
} hg_monte_carlo;

#ifdef __cplusplus
extern "C" {
#endif // __cplusplus

/**
 * The name of a status code as a static string, e.g. "HG_ERR_OUT_OF_RANGE"; for a code
 * that is not one of the `HG_*` status codes, "HG_UNKNOWN_STATUS". Never NULL, never
 * freed. Thread-safe.
 */
const char *hg_status_name(int32_t status);

/**
 * The message of the last failed call on the calling thread, e.g.
 * "re = -1: must be greater than 0" (empty when the thread's last call succeeded).
 *
 * Copies at most `len - 1` bytes of UTF-8 and a terminating NUL into `buf` (nothing when
 * `buf` is NULL or `len` is 0) and returns the message's full length in bytes, without
 * the NUL, like `snprintf`: a return value ≥ `len` means the copy was cut short.
 * Does not change the thread's last error. Thread-safe: each thread has its own message.
 *
 * # Safety
 * `buf` must be NULL or valid for writing `len` bytes.
 */
size_t hg_last_error(char *buf,
                     size_t len);

/**
 * Fills `opts` with the library's default friction options (Colebrook, regime limits
 * 2300 and 4000, laminar constant 64, C¹ blend in the transitional band) and sets
 * `opts->struct_size`.
 *
 * Returns `HG_OK`, or `HG_ERR_NULL_POINTER` when `opts` is NULL. Thread-safe.
 *
 * # Safety
 * `opts` must be NULL or point to a writable `hg_friction_options`.
 */
int32_t hg_friction_options_default(struct hg_friction_options *opts);

/**
 * The Darcy friction factor `*f` at Reynolds number `re` and relative roughness
 * `rel_roughness` = ε/D (both dimensionless), with the turbulent correlation
 * `correlation` (`HG_CORRELATION_*`) and the default regime treatment: laminar
 * f = 64/Re below Re 2300, the correlation above 4000, a C¹ blend between.
 *
 * Valid ranges: 1e-100 ≤ re ≤ 1e13; 0 ≤ rel_roughness ≤ 0.5 (≥ 1e-100 for the fully rough law).
 * Outside a correlation's published range the value still computes (see
 * `hg_darcy_factor_full` for the warnings).
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE` for NaN or ±inf; `HG_ERR_OUT_OF_RANGE` for values
 * outside the ranges or an unknown correlation; `HG_ERR_NULL_POINTER` when `f` is NULL.
 * On error `*f` is unchanged and `hg_last_error` says why. Thread-safe.
 *
 * # Safety
 * `f` must be NULL or point to a writable double.
 */
int32_t hg_darcy_factor(double re,
                        double rel_roughness,
                        int32_t correlation,
                        double *f);

/**
 * Like `hg_darcy_factor`, and also gives `*df_dre` = ∂f/∂Re, `*df_drel_roughness` =
 * ∂f/∂(ε/D), `*regime` (`HG_REGIME_*`) and `*warnings` (`HG_WARN_*` bits: Reynolds number
 * or roughness outside the correlation's published range, transitional flow).
 *
 * Same ranges and status codes as `hg_darcy_factor`; every pointer must be non-NULL
 * (`HG_ERR_NULL_POINTER` otherwise, with nothing written). Thread-safe.
 *
 * # Safety
 * Each pointer must be NULL or point to a writable value of its type.
 */
int32_t hg_darcy_factor_full(double re,
                             double rel_roughness,
                             int32_t correlation,
                             double *f,
                             double *df_dre,
                             double *df_drel_roughness,
                             int32_t *regime,
                             uint32_t *warnings);

/**
 * The friction factor with full options: `opts` (from `hg_friction_options_default`,
 * then edited) chooses the correlation, the laminar constant of the section and the
 * regime limits and treatment; the result goes to `*out` (set `out->struct_size` first).
 *
 * Ranges as `hg_darcy_factor`, plus: laminar_constant, laminar_limit, turbulent_limit
 * finite and > 0, turbulent_limit ≥ laminar_limit.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`, `HG_ERR_OUT_OF_RANGE` for bad numbers or
 * constants; `HG_ERR_NO_SOLUTION` for transitional flow with `HG_TRANSITION_REFUSE`;
 * `HG_ERR_NULL_POINTER`; `HG_ERR_INVALID` when a `struct_size` is too small.
 * Thread-safe.
 *
 * # Safety
 * `opts` must be NULL or point to a readable `hg_friction_options`; `out` NULL or a
 * writable `hg_friction` of at least `out->struct_size` bytes.
 */
int32_t hg_darcy_factor_opts(double re,
                             double rel_roughness,
                             const struct hg_friction_options *opts,
                             struct hg_friction *out);

/**
 * Friction factors of `n` points: `out[i]` = the factor at `re[i]`, `rel_roughness[i]`
 * with `correlation` (as `hg_darcy_factor`). Uses all cores above 16384 points; the
 * results equal the scalar call's bit for bit. `out` may be the same array as an input.
 *
 * Returns `HG_OK`; the status of the first failing element (the message starts
 * "element <i>: "), with `out` partly written; `HG_ERR_NULL_POINTER` for a NULL array;
 * `HG_ERR_INVALID` for `n` = 0. Thread-safe.
 *
 * # Safety
 * `re`, `rel_roughness` and `out` must be NULL or valid for `n` doubles.
 */
int32_t hg_darcy_factor_batch(const double *re,
                              const double *rel_roughness,
                              size_t n,
                              int32_t correlation,
                              double *out);

/**
 * The `HG_CORRELATION_*` value of a correlation name: "colebrook", "haaland",
 * "swamee_jain", "churchill", "serghides", "blasius", "fully_rough".
 *
 * Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` (the message lists the known names);
 * `HG_ERR_NULL_POINTER`; `HG_ERR_INVALID` for a name that is not UTF-8. Thread-safe.
 *
 * # Safety
 * `name` must be NULL or a NUL-terminated string; `correlation` NULL or writable.
 */
int32_t hg_correlation_from_name(const char *name,
                                 int32_t *correlation);

/**
 * The name of an `HG_CORRELATION_*` value as a static string ("colebrook", …); NULL for
 * an unknown value. Thread-safe.
 */
const char *hg_correlation_name(int32_t correlation);

/**
 * The name of an `HG_REGIME_*` value as a static string ("laminar", "transitional",
 * "turbulent"); NULL for an unknown value. Thread-safe.
 */
const char *hg_regime_name(int32_t regime);

/**
 * The published validity range and accuracy of correlation `correlation`
 * (`HG_CORRELATION_*`): Reynolds numbers `*re_min`…`*re_max`, relative roughness
 * `*rel_roughness_min`…`*rel_roughness_max`, and `*accuracy`, the published largest
 * relative deviation from Colebrook inside that range (0 for Colebrook itself). An
 * unbounded end is +infinity. Outside the range a result carries a warning.
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an unknown correlation;
 * `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * The outputs must be NULL or point to writable doubles.
 */
int32_t hg_correlation_validity(int32_t correlation,
                                double *re_min,
                                double *re_max,
                                double *rel_roughness_min,
                                double *rel_roughness_max,
                                double *accuracy);

/**
 * The two limits a transitional friction factor lies between, at Reynolds number `re`
 * and relative roughness `rel_roughness` (as `hg_darcy_factor`): `*laminar` = 64/Re and
 * `*turbulent` = the correlation's value. The band of a transitional result spans both.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Thread-safe.
 *
 * # Safety
 * The outputs must be NULL or point to writable doubles.
 */
int32_t hg_transition_limits(double re,
                             double rel_roughness,
                             int32_t correlation,
                             double *laminar,
                             double *turbulent);

/**
 * Density (kg/m³) and dynamic viscosity (Pa·s) of liquid water at `temperature` (K) and
 * absolute `pressure` (Pa): IAPWS-IF97 region 1 and the IAPWS 2008 viscosity.
 *
 * Valid ranges: 273.15 K ≤ temperature ≤ 623.15 K; the saturation pressure at that
 * temperature ≤ pressure ≤ 100 MPa (below it the water would boil).
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` outside the ranges;
 * `HG_ERR_NULL_POINTER` when an output is NULL (nothing is written). Thread-safe.
 *
 * # Safety
 * `density` and `viscosity` must be NULL or point to writable doubles.
 */
int32_t hg_water(double temperature,
                 double pressure,
                 double *density,
                 double *viscosity);

/**
 * Density (kg/m³) and dynamic viscosity (Pa·s) of dry air at `temperature` (K) and
 * absolute `pressure` (Pa): ideal gas and Sutherland's law.
 *
 * Valid ranges: 200 K ≤ temperature ≤ 1000 K; 0 < pressure ≤ 2 MPa.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` outside the ranges;
 * `HG_ERR_NULL_POINTER` when an output is NULL (nothing is written). Thread-safe.
 *
 * # Safety
 * `density` and `viscosity` must be NULL or point to writable doubles.
 */
int32_t hg_air(double temperature,
               double pressure,
               double *density,
               double *viscosity);

/**
 * Vapour (saturation) pressure of water (Pa) at `temperature` (K), IAPWS-IF97.
 *
 * Valid range: 273.15 K ≤ temperature ≤ 647.096 K (the critical point).
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Thread-safe.
 *
 * # Safety
 * `pressure` must be NULL or point to a writable double.
 */
int32_t hg_water_vapour_pressure(double temperature,
                                 double *pressure);

/**
 * Makes liquid water at `temperature` (K) and absolute `pressure` (Pa), as `hg_water`,
 * with its vapour pressure (for cavitation warnings) and property uncertainties (for the
 * bands). Stores the handle in `*out`; free it with `hg_fluid_free`.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Thread-safe.
 *
 * # Safety
 * `out` must be NULL or point to a writable `hg_fluid *`.
 */
int32_t hg_fluid_water(double temperature,
                       double pressure,
                       struct hg_fluid **out);

/**
 * Makes dry air at `temperature` (K) and absolute `pressure` (Pa), as `hg_air`; lines
 * evaluated with a gas warn when the pressure loss exceeds 10 % of the inlet pressure.
 * Stores the handle in `*out`; free it with `hg_fluid_free`.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Thread-safe.
 *
 * # Safety
 * `out` must be NULL or point to a writable `hg_fluid *`.
 */
int32_t hg_fluid_air(double temperature,
                     double pressure,
                     struct hg_fluid **out);

/**
 * Makes a liquid of `density` (kg/m³, > 0) and dynamic `viscosity` (Pa·s, > 0), with
 * no stated uncertainty and no vapour pressure. Stores the handle in `*out`; free it
 * with `hg_fluid_free`.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Thread-safe.
 *
 * # Safety
 * `out` must be NULL or point to a writable `hg_fluid *`.
 */
int32_t hg_fluid_liquid(double density,
                        double viscosity,
                        struct hg_fluid **out);

/**
 * Density (kg/m³) and dynamic viscosity (Pa·s) of a fluid handle.
 *
 * Returns `HG_OK` or `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `fluid` must be NULL or a live handle; the outputs NULL or writable doubles.
 */
int32_t hg_fluid_properties(const struct hg_fluid *fluid,
                            double *density,
                            double *viscosity);

/**
 * Releases a fluid made by `hg_fluid_*`. NULL is accepted and ignored. Not thread-safe
 * with respect to other uses of the same handle.
 *
 * # Safety
 * `fluid` must be NULL or a live handle from `hg_fluid_*`, not used afterwards.
 */
void hg_fluid_free(struct hg_fluid *fluid);

/**
 * Saturation temperature of water (K) at absolute `pressure` (Pa), IAPWS-IF97.
 *
 * Valid range: 611.213 Pa ≤ pressure ≤ 22.064 MPa (the critical point).
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Thread-safe.
 *
 * # Safety
 * `temperature` must be NULL or point to a writable double.
 */
int32_t hg_water_saturation_temperature(double pressure,
                                        double *temperature);

/**
 * Makes a gas of `density` (kg/m³, > 0) and `viscosity` (Pa·s, > 0) stated at
 * `temperature` (K, > 0) and absolute `pressure` (Pa, > 0); its density follows the
 * ideal-gas law at other pressures. Free it with `hg_fluid_free`.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Thread-safe.
 *
 * # Safety
 * `out` must be NULL or point to a writable `hg_fluid *`.
 */
int32_t hg_fluid_gas(double density,
                     double viscosity,
                     double temperature,
                     double pressure,
                     struct hg_fluid **out);

/**
 * Makes a copy of `fluid` with the relative standard uncertainties (k = 1, 0 ≤ u < 1)
 * of its density `density_rel` and viscosity `viscosity_rel`, for the bands. Free the
 * new handle with `hg_fluid_free`; `fluid` is unchanged.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Thread-safe.
 *
 * # Safety
 * `fluid` must be NULL or a live handle; `out` NULL or a writable `hg_fluid *`.
 */
int32_t hg_fluid_with_uncertainty(const struct hg_fluid *fluid,
                                  double density_rel,
                                  double viscosity_rel,
                                  struct hg_fluid **out);

/**
 * Makes a copy of `fluid` with its vapour pressure `vapour_pressure` (Pa, ≥ 0) set, for
 * cavitation warnings. Free the new handle with `hg_fluid_free`; `fluid` is unchanged.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Thread-safe.
 *
 * # Safety
 * `fluid` must be NULL or a live handle; `out` NULL or a writable `hg_fluid *`.
 */
int32_t hg_fluid_with_vapour_pressure(const struct hg_fluid *fluid,
                                      double vapour_pressure,
                                      struct hg_fluid **out);

/**
 * Geometry of a cross-section `shape` (`HG_SECTION_*`) with dimensions `a`, `b` (m; see
 * each constant): `*area` (m²), `*wetted_perimeter` (m), `*hydraulic_diameter` = 4A/P
 * (m) and `*laminar_constant` = f·Re of fully developed laminar flow on the hydraulic
 * diameter (dimensionless, exact for each shape: 64 for a circle).
 *
 * Valid ranges: dimensions finite and > 0 (b = 0 for a circle and a triangle); annulus
 * b < a; ellipse b ≤ a.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a bad dimension or
 * shape; `HG_ERR_INVALID` for b ≠ 0 on a one-dimension shape; `HG_ERR_NULL_POINTER`
 * when an output is NULL (nothing is written). Thread-safe.
 *
 * # Safety
 * Each output must be NULL or point to a writable double.
 */
int32_t hg_section_properties(int32_t shape,
                              double a,
                              double b,
                              double *area,
                              double *wetted_perimeter,
                              double *hydraulic_diameter,
                              double *laminar_constant);

/**
 * The diameter `*diameter` (m) turbulent flow in the section `shape` (`HG_SECTION_*`,
 * dimensions `a`, `b` as for `hg_section_properties`) is computed on under `mode`
 * (`HG_TURBULENT_DIAMETER_*`): the hydraulic diameter, or with
 * `HG_TURBULENT_DIAMETER_LAMINAR_EQUIVALENT` for rectangles and annuli the
 * laminar-equivalent diameter 64/C·D_h (Jones 1976; Jones & Leung 1981). Lines choose
 * the mode with `hg_line_set_turbulent_diameter`.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a bad dimension, shape
 * or mode; `HG_ERR_INVALID` for b ≠ 0 on a one-dimension shape; `HG_ERR_NULL_POINTER`.
 * Thread-safe.
 *
 * # Safety
 * `diameter` must be NULL or point to a writable double.
 */
int32_t hg_turbulent_diameter(int32_t shape,
                              double a,
                              double b,
                              int32_t mode,
                              double *diameter);

/**
 * The resistance coefficient K (dimensionless) of the catalogue fitting `name` and its
 * derivative ∂K/∂Re, at Reynolds number `re` (1e-100 or more, in `bore`), for the velocity in
 * `bore` (m, > 0), next to a pipe of relative roughness `pipe_rel_roughness`
 * (0 ≤ ε/D ≤ 0.5; used by fittings whose K follows the pipe's fully rough friction
 * factor). K(Re) = k_viscous/Re + k_inertial; fitting data scatter by ±20–50 %.
 * `hg_fitting_catalogue_name` lists the names.
 *
 * Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` (the message lists the catalogue);
 * `HG_ERR_NOT_FINITE`, `HG_ERR_OUT_OF_RANGE` for bad numbers; `HG_ERR_NULL_POINTER`;
 * `HG_ERR_INVALID` for a name that is not UTF-8. Thread-safe.
 *
 * # Safety
 * `name` must be NULL or a NUL-terminated string; `k` and `dk_dre` NULL or writable.
 */
int32_t hg_fitting_k(const char *name,
                     double re,
                     double bore,
                     double pipe_rel_roughness,
                     double *k,
                     double *dk_dre);

/**
 * Copies the name of catalogue fitting number `index` (0-based, catalogue order) into
 * `buf` (at most `len - 1` bytes and a NUL) and stores its full length in `*needed`.
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` when `index` is past the end (use it to count
 * the entries); `HG_ERR_NULL_POINTER` for a NULL `needed`, or a NULL `buf` with
 * `len` > 0; `HG_ERR_BUFFER_TOO_SMALL` when the name did not fit (the cut copy is still
 * written). Thread-safe.
 *
 * # Safety
 * `buf` must be NULL or valid for writing `len` bytes; `needed` NULL or writable.
 */
int32_t hg_fitting_catalogue_name(size_t index,
                                  char *buf,
                                  size_t len,
                                  size_t *needed);

/**
 * Absolute roughness of new pipe of the catalogue material `material` (e.g.
 * "commercial_steel"; see `hg_roughness_material_name`): `*typical`, and the quoted
 * range `*low` to `*high`, all in m (handbook values; common practice).
 *
 * Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` (the message lists the catalogue);
 * `HG_ERR_INVALID` for a name not UTF-8; `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `material` must be NULL or a NUL-terminated string; the outputs NULL or writable.
 */
int32_t hg_roughness(const char *material,
                     double *typical,
                     double *low,
                     double *high);

/**
 * Copies the name of catalogue material number `index` (0-based) into `buf` (at most
 * `len - 1` bytes and a NUL) and stores its full length in `*needed`.
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` past the end; `HG_ERR_BUFFER_TOO_SMALL` when
 * the name did not fit (the cut copy is still written); `HG_ERR_NULL_POINTER` for a NULL
 * `needed`, or a NULL `buf` with `len` > 0. Thread-safe.
 *
 * # Safety
 * `buf` must be NULL or valid for writing `len` bytes; `needed` NULL or writable.
 */
int32_t hg_roughness_material_name(size_t index,
                                   char *buf,
                                   size_t len,
                                   size_t *needed);

/**
 * Roughness `*roughness` (m) after `years` of service growing linearly from `initial`
 * (m) at `rate` (m per year): ε = ε₀ + α·t (Colebrook & White 1937 aging model).
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a negative argument;
 * `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `roughness` must be NULL or point to a writable double.
 */
int32_t hg_roughness_aged(double initial,
                          double rate,
                          double years,
                          double *roughness);

/**
 * Dimensions of a standard pipe: `table` ("steel" ASME B36.10M, "stainless" ASME
 * B36.19M, "copper" ASTM B88, "pvc" ASTM D1785, "steel_en10220" EN 10220 / ISO 4200,
 * "stainless_iso1127" ISO 1127, "copper_en1057" EN 1057, "pe_iso4427" ISO 4427-2,
 * "pvc_iso1452" ISO 1452-2, "hygienic_bpe" ASME BPE, "hygienic_din11850" DIN 11850,
 * "hygienic_iso2037" ISO 2037; `hg_pipe_tables` lists them), `nominal` size as printed
 * ("2", "1-1/2", "3/4"; metric tube by outside diameter "60.3", plastic pipe by dn
 * "110") and `schedule`, tube type, SDR series or wall ("40", "STD", "10S", "K",
 * "SDR 11", "2.9"): outside diameter, wall thickness and inside diameter, all in m. For
 * plastic pipe the wall is the mean wall the standard's tolerance implies
 * (`hg_pipe_table_wall_rule`), and the inside diameter follows from it.
 *
 * Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` for a table, size or schedule not listed (the
 * message suggests close names and lists the known ones); `HG_ERR_INVALID` for a string
 * not UTF-8; `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * The strings must be NULL or NUL-terminated; the outputs NULL or writable doubles.
 */
int32_t hg_pipe_size(const char *table,
                     const char *nominal,
                     const char *schedule,
                     double *outside_diameter,
                     double *wall,
                     double *inside_diameter);

/**
 * Dimensions of a metric tube by its nominal size `dn` (DN): `table` "steel_en10220" or
 * "stainless_iso1127" (series 1 outside diameters: DN 50 is 60.3 mm) or
 * "hygienic_din11850" (the series picks the outside diameter: DN 25 in series "2" is
 * 29 × 1.5 mm), `schedule` as `hg_pipe_size` (a wall "2.9", a series "2"): outside
 * diameter, wall thickness and inside diameter, all in m, the same as `hg_pipe_size`
 * with the row's outside diameter.
 *
 * Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` for a table that assigns no DN (the message
 * names those that do), a DN the table does not list (the message lists them) or a
 * schedule not made at that DN; `HG_ERR_INVALID` for a string not UTF-8;
 * `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * The strings must be NULL or NUL-terminated; the outputs NULL or writable doubles.
 */
int32_t hg_pipe_size_dn(const char *table,
                        uint32_t dn,
                        const char *schedule,
                        double *outside_diameter,
                        double *wall,
                        double *inside_diameter);

/**
 * The smallest standard pipe of `table` in `schedule` (as `hg_pipe_size`) whose inside
 * diameter is at least `min_inside_diameter` (m, > 0): its inside diameter in
 * `*inside_diameter` (m) and its nominal size copied into `nominal` (at most `len - 1`
 * bytes and a NUL; full length in `*needed`).
 *
 * Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`
 * for a diameter ≤ 0 or larger than the table's largest; `HG_ERR_BUFFER_TOO_SMALL`
 * when the nominal size did not fit (the diameter is still written);
 * `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * The strings must be NULL or NUL-terminated; `nominal` NULL or valid for `len` bytes;
 * `needed` and `inside_diameter` NULL or writable.
 */
int32_t hg_pipe_size_at_least(const char *table,
                              const char *schedule,
                              double min_inside_diameter,
                              double *inside_diameter,
                              char *nominal,
                              size_t len,
                              size_t *needed);

/**
 * Copies schedule (or tube type) number `index` (0-based, the table's order, e.g. "40",
 * "STD", "K") of pipe `table` (as `hg_pipe_size`) into `buf` (at most `len - 1` bytes and
 * a NUL) and stores its full length in `*needed`.
 *
 * Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` for a table; `HG_ERR_OUT_OF_RANGE` when `index`
 * is past the end (use it to count the schedules); `HG_ERR_BUFFER_TOO_SMALL` when the
 * name did not fit (the cut copy is still written); `HG_ERR_INVALID` for a table name
 * not UTF-8; `HG_ERR_NULL_POINTER` for a NULL `table` or `needed`, or a NULL `buf` with
 * `len` > 0. Thread-safe.
 *
 * # Safety
 * `table` must be NULL or NUL-terminated; `buf` NULL or valid for writing `len` bytes;
 * `needed` NULL or writable.
 */
int32_t hg_pipe_table_schedule(const char *table,
                               size_t index,
                               char *buf,
                               size_t len,
                               size_t *needed);

/**
 * Copies nominal size number `index` (0-based, smallest first, as printed: "1/2", "2",
 * "1-1/2") of pipe `table` (as `hg_pipe_size`) into `buf` (at most `len - 1` bytes and a
 * NUL) and stores its full length in `*needed`. Not every size exists in every schedule.
 *
 * Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` for a table; `HG_ERR_OUT_OF_RANGE` when `index`
 * is past the end (use it to count the sizes); `HG_ERR_BUFFER_TOO_SMALL` when the name
 * did not fit (the cut copy is still written); `HG_ERR_INVALID` for a table name not
 * UTF-8; `HG_ERR_NULL_POINTER` for a NULL `table` or `needed`, or a NULL `buf` with
 * `len` > 0. Thread-safe.
 *
 * # Safety
 * `table` must be NULL or NUL-terminated; `buf` NULL or valid for writing `len` bytes;
 * `needed` NULL or writable.
 */
int32_t hg_pipe_table_nominal(const char *table,
                              size_t index,
                              char *buf,
                              size_t len,
                              size_t *needed);

/**
 * Copies the name of pipe table number `index` (0-based, a fixed order: "steel",
 * "stainless", "copper", "pvc", "steel_en10220", …) into `buf` (at most `len - 1` bytes
 * and a NUL) and stores its full length in `*needed`. The same list as Rust's
 * `sizes::pipe_tables()` and Python's `pipe_tables()`.
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` when `index` is past the end (use it to count
 * the tables); `HG_ERR_BUFFER_TOO_SMALL` when the name did not fit (the cut copy is
 * still written); `HG_ERR_NULL_POINTER` for a NULL `needed`, or a NULL `buf` with
 * `len` > 0. Thread-safe.
 *
 * # Safety
 * `buf` NULL or valid for writing `len` bytes; `needed` NULL or writable.
 */
int32_t hg_pipe_tables(size_t index,
                       char *buf,
                       size_t len,
                       size_t *needed);

/**
 * Copies the source of pipe `table` (as `hg_pipe_size`: the standard, and "from memory"
 * or what was checked against published copies) into `buf` (at most `len - 1` bytes and
 * a NUL) and stores its full length in `*needed`.
 *
 * Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` for a table (the message suggests close
 * names); `HG_ERR_BUFFER_TOO_SMALL` when the text did not fit (the cut copy is still
 * written); `HG_ERR_INVALID` for a name not UTF-8; `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `table` must be NULL or NUL-terminated; `buf` NULL or valid for writing `len` bytes;
 * `needed` NULL or writable.
 */
int32_t hg_pipe_table_source(const char *table,
                             char *buf,
                             size_t len,
                             size_t *needed);

/**
 * Copies how pipe `table` works out the wall its bore comes from (nominal wall, or for
 * plastic pipe the mean wall e_min + tolerance/2 with the tolerance rule and its source)
 * into `buf`, as `hg_pipe_table_source`.
 *
 * Returns and thread-safety as `hg_pipe_table_source`.
 *
 * # Safety
 * As `hg_pipe_table_source`.
 */
int32_t hg_pipe_table_wall_rule(const char *table,
                                char *buf,
                                size_t len,
                                size_t *needed);

/**
 * Head loss `*head_loss` (m of fluid, signed with the flow) and its derivative
 * `*dhead_dflow` (s/m²) of a round pipe at volumetric flow `flow` (m³/s, signed): the
 * call a simulator's Newton loop makes. Darcy–Weisbach with the exact Colebrook
 * friction factor, laminar f = 64/Re and a C¹ blend between Re 2300 and 4000; the loss
 * is odd in the flow and zero at zero flow, with a continuous derivative.
 *
 * Pipe: inside `diameter` (m, > 0), `length` (m, > 0), absolute wall `roughness` (m,
 * ≥ 0, at most half the diameter). Fluid: `density` (kg/m³, > 0) and dynamic
 * `viscosity` (Pa·s, > 0), e.g. from `hg_water`.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a bad pipe or fluid;
 * `HG_ERR_NULL_POINTER` when an output is NULL (nothing is written). Thread-safe.
 *
 * # Safety
 * `head_loss` and `dhead_dflow` must be NULL or point to writable doubles.
 */
int32_t hg_pipe_head_loss(double diameter,
                          double length,
                          double roughness,
                          double density,
                          double viscosity,
                          double flow,
                          double *head_loss,
                          double *dhead_dflow);

/**
 * The full flow state of a straight run of any section `shape` (`HG_SECTION_*`, with
 * dimensions `a`, `b` as for `hg_section_properties`), `length` (m, > 0) and absolute
 * `roughness` (m, ≥ 0, at most half the hydraulic diameter) at flow `flow` (m³/s,
 * signed), for a fluid of `density` (kg/m³, > 0) and `viscosity` (Pa·s, > 0). Laminar
 * flow uses the section's exact laminar constant; turbulent flow the hydraulic diameter
 * (with `HG_WARN_NON_CIRCULAR_SECTION` for other shapes than a circle).
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_INVALID` for a
 * `struct_size` too small or b ≠ 0 on a one-dimension shape; `HG_ERR_NULL_POINTER`.
 * Thread-safe.
 *
 * # Safety
 * `out` must be NULL or point to a writable `hg_pipe_flow` of `out->struct_size` bytes.
 */
int32_t hg_duct_flow_state(int32_t shape,
                           double a,
                           double b,
                           double length,
                           double roughness,
                           double density,
                           double viscosity,
                           double flow,
                           struct hg_pipe_flow *out);

/**
 * Reynolds number `*re` = ρ·|V|·D/μ of flow `flow` (m³/s, signed) in a round pipe of
 * inside `diameter` (m, > 0), with V = Q/A, for a fluid of `density` (kg/m³, > 0) and
 * `viscosity` (Pa·s, > 0): the core's `Fluid::reynolds`. (The flow state of
 * `hg_duct_flow_state` computes |V|·D/ν and may differ from it in the last bit.)
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Thread-safe.
 *
 * # Safety
 * `re` must be NULL or point to a writable double.
 */
int32_t hg_reynolds(double flow,
                    double diameter,
                    double density,
                    double viscosity,
                    double *re);

/**
 * Head losses and derivatives of one round pipe (as `hg_pipe_head_loss`) at `n` flows:
 * `head_loss[i]`, `dhead_dflow[i]` at `flow[i]`. The results equal the scalar call's bit
 * for bit. Either output may be the `flow` array itself (computed in place); the two
 * outputs must be different arrays.
 *
 * Returns `HG_OK`; the status of the bad pipe or fluid; the status of the first bad
 * flow (message "element <i>: ..."), with the outputs partly written;
 * `HG_ERR_NULL_POINTER`; `HG_ERR_INVALID` for `n` = 0. Thread-safe.
 *
 * # Safety
 * `flow`, `head_loss` and `dhead_dflow` must be NULL or valid for `n` doubles.
 */
int32_t hg_pipe_head_loss_batch(double diameter,
                                double length,
                                double roughness,
                                double density,
                                double viscosity,
                                const double *flow,
                                size_t n,
                                double *head_loss,
                                double *dhead_dflow);

/**
 * Makes an empty line with the default options and stores it in `*out`; free it with
 * `hg_line_free`.
 *
 * Returns `HG_OK` or `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `out` must be NULL or point to a writable `hg_line *`.
 */
int32_t hg_line_new(struct hg_line **out);

/**
 * Releases a line. NULL is accepted and ignored.
 *
 * # Safety
 * `line` must be NULL or a live handle from `hg_line_new`, used by no other thread and
 * not used afterwards.
 */
void hg_line_free(struct hg_line *line);

/**
 * Appends a round pipe: inside `diameter` (m, > 0), `length` (m, > 0), absolute wall
 * `roughness` (m, ≥ 0, at most half the diameter).
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_add_pipe(struct hg_line *line,
                         double diameter,
                         double length,
                         double roughness);

/**
 * Appends a straight duct of section `shape` (`HG_SECTION_*`, dimensions `a`, `b` as
 * for `hg_section_properties`), `length` (m, > 0) and `roughness` (m, ≥ 0). Fittings
 * beside it refer to its hydraulic diameter.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_INVALID` for
 * b ≠ 0 on a one-dimension shape; `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_add_duct(struct hg_line *line,
                         int32_t shape,
                         double a,
                         double b,
                         double length,
                         double roughness);

/**
 * Appends a straight duct of section `shape` (`HG_SECTION_*`, dimensions `a`, `b` as
 * for `hg_section_properties`) and `length` (m, > 0) whose wall is the catalogue
 * `material` (see `hg_roughness`): its roughness is the material's typical value, and
 * the material's range feeds the roughness uncertainty of the bands (as
 * `hg_line_add_pipe_material` for a round pipe).
 *
 * Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`;
 * `HG_ERR_INVALID` for b ≠ 0 on a one-dimension shape or a name not UTF-8;
 * `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread; `material` NULL or a
 * NUL-terminated string.
 */
int32_t hg_line_add_duct_material(struct hg_line *line,
                                  int32_t shape,
                                  double a,
                                  double b,
                                  double length,
                                  const char *material);

/**
 * Appends the catalogue fitting `name` (see `hg_fitting_catalogue_name`). Its K refers
 * to the velocity in `diameter` (m, > 0), or, when `diameter` is 0, in the bore of the
 * pipe before it (after it when it stands first); a line with no pipe to take it from
 * fails when evaluated (`HG_ERR_INVALID`).
 *
 * Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`
 * for a negative diameter; `HG_ERR_INVALID` (a name not UTF-8, or a diameter given to a
 * fitting whose bore its geometry fixes); `HG_ERR_NULL_POINTER`. Needs exclusive use of
 * `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread; `name` NULL or a
 * NUL-terminated string.
 */
int32_t hg_line_add_fitting(struct hg_line *line,
                            const char *name,
                            double diameter);

/**
 * Appends a fitting of fixed resistance coefficient `k` (≥ 0) on the velocity in
 * `diameter` (m, > 0), or in the adjoining pipe's bore when `diameter` is 0.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_add_fitting_k(struct hg_line *line,
                              double k,
                              double diameter);

/**
 * Appends an elevation change `height` (m; positive up in the flow direction, negative
 * for a drop).
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_NULL_POINTER`. Needs exclusive use of
 * `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_add_rise(struct hg_line *line,
                         double height);

/**
 * Appends rated equipment labelled `name` with a pressure drop `drop` (Pa, > 0) at the
 * rating flow `at_flow` (m³/s, > 0), scaled with Q·|Q| at other flows (fixed K).
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_INVALID` for a
 * label not UTF-8; `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread; `name` NULL or a
 * NUL-terminated string.
 */
int32_t hg_line_add_equipment(struct hg_line *line,
                              const char *name,
                              double drop,
                              double at_flow);

/**
 * Sets the friction options of every pipe of the line (correlation, regime limits and
 * transition; the laminar constant is each section's own). See `hg_darcy_factor_opts`.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_INVALID` for a
 * `struct_size` too small; `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread; `opts` NULL or a
 * readable `hg_friction_options`.
 */
int32_t hg_line_set_friction_options(struct hg_line *line,
                                     const struct hg_friction_options *opts);

/**
 * Sets the static pressure at the line's inlet (Pa absolute, > 0), which enables the
 * outlet pressures and the cavitation and gas checks. 0 clears it.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_set_inlet_pressure(struct hg_line *line,
                                   double pressure);

/**
 * The number of elements of the line in `*count`.
 *
 * Returns `HG_OK` or `HG_ERR_NULL_POINTER`. Thread-safe for concurrent readers.
 *
 * # Safety
 * `line` must be NULL or a live handle; `count` NULL or writable.
 */
int32_t hg_line_count(const struct hg_line *line,
                      size_t *count);

/**
 * Appends a round pipe of the catalogue wall `material` (see `hg_roughness`): inside
 * `diameter` (m, > 0), `length` (m, > 0); its roughness is the material's typical
 * value, and the material's range feeds the roughness uncertainty of the bands.
 *
 * Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`;
 * `HG_ERR_INVALID` for a name not UTF-8; `HG_ERR_NULL_POINTER`. Needs exclusive use
 * of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread; `material` NULL or a
 * NUL-terminated string.
 */
int32_t hg_line_add_pipe_material(struct hg_line *line,
                                  double diameter,
                                  double length,
                                  const char *material);

/**
 * Appends a duct of any shape given by its `area` (m², positive), wetted `perimeter`
 * (m, at least the circle's of that area) and `laminar_constant` (f·Re on the
 * hydraulic diameter, positive), with `length` (m, positive) and `roughness` (m, ≥ 0).
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_add_custom_duct(struct hg_line *line,
                                double area,
                                double perimeter,
                                double laminar_constant,
                                double length,
                                double roughness);

/**
 * Appends a sudden expansion from bore `d_in` to bore `d_out` (m, 0 < d_in ≤ d_out):
 * Borda–Carnot, K on the inlet velocity.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_add_expansion(struct hg_line *line,
                              double d_in,
                              double d_out);

/**
 * Appends a sudden contraction from bore `d_in` to bore `d_out` (m, 0 < d_out ≤ d_in),
 * K on the outlet velocity.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_add_contraction(struct hg_line *line,
                                double d_in,
                                double d_out);

/**
 * Appends a 2-K fitting (Hooper 1981): K = k1/Re + k_inf·(1 + 1/D_in), D_in the bore in
 * inches; `k1`, `k_inf` ≥ 0; K on `diameter` (m) or the adjoining pipe's bore when 0.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_add_two_k(struct hg_line *line,
                          double k1,
                          double k_inf,
                          double diameter);

/**
 * Appends a 3-K fitting (Darby 1999): K = k1/Re + k_inf·(1 + k_d/D_in^0.3), D_in the
 * bore in inches; constants ≥ 0; K on `diameter` (m) or the adjoining pipe's bore
 * when 0.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_add_three_k(struct hg_line *line,
                            double k1,
                            double k_inf,
                            double k_d,
                            double diameter);

/**
 * Appends a valve of flow coefficient `cv` (US gpm at 1 psi, > 0), whose K refers to
 * `diameter` (m) or the adjoining pipe's bore when 0.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_add_cv(struct hg_line *line,
                       double cv,
                       double diameter);

/**
 * Appends a valve of flow coefficient `kv` (m³/h at 1 bar, > 0), whose K refers to
 * `diameter` (m) or the adjoining pipe's bore when 0.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_add_kv(struct hg_line *line,
                       double kv,
                       double diameter);

/**
 * Appends a fitting given as an equivalent length `l_over_d` (L/D, ≥ 0): K = f_T·L/D
 * with the fully rough factor of the adjoining pipe; on `diameter` (m) or the
 * adjoining pipe's bore when 0.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_add_equivalent_length(struct hg_line *line,
                                      double l_over_d,
                                      double diameter);

/**
 * Appends a smooth bend of `angle_deg` degrees (0…180) and centreline radius `r_over_d`
 * times the bore (≥ 0.5), Rennels & Hudson (2012); on `diameter` (m) or the adjoining
 * pipe's bore when 0.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_add_bend(struct hg_line *line,
                         double angle_deg,
                         double r_over_d,
                         double diameter);

/**
 * Appends an inlet from a tank through a pipe end with edge `edge` (`HG_EDGE_*`):
 * square (sharp-edged entrance, K = 0.5), rounded (K from `r_over_d`, the rounding radius
 * over the bore, ≥ 0) or re-entrant (K = 0.78). `r_over_d` must be 0 unless the edge is
 * rounded. A line that starts with one starts at the tank's surface; reverse flow turns
 * it into an outlet into the tank.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a bad edge or radius;
 * `HG_ERR_INVALID` for a radius with another edge; `HG_ERR_NULL_POINTER`. Needs
 * exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_add_from_tank(struct hg_line *line,
                              int32_t edge,
                              double r_over_d);

/**
 * Appends an outlet into a large tank (K = 1 on the pipe's velocity); reverse flow turns
 * it into a square-edged inlet from the tank.
 *
 * Returns `HG_OK` or `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_add_into_tank(struct hg_line *line);

/**
 * Sets the relative half-width `spread` (0…1, e.g. 0.3 for ±30 %) of the K of the
 * fitting at `index` (0-based), read by the bands as a rectangular distribution.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a bad spread or an
 * index that is not a fitting; `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_set_k_spread(struct hg_line *line,
                             size_t index,
                             double spread);

/**
 * States the likely range `low`…`high` (m, 0 ≤ low ≤ high) of the roughness of the pipe
 * at `index` (0-based), for the roughness uncertainty of the bands (log-uniform between
 * the two). Checked at once: an index that is not a pipe gives `HG_ERR_OUT_OF_RANGE`.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
 * Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_set_roughness_range(struct hg_line *line,
                                    size_t index,
                                    double low,
                                    double high);

/**
 * Chooses the diameter turbulent flow in non-circular ducts uses (`HG_TURBULENT_DIAMETER_*`).
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an unknown mode; `HG_ERR_NULL_POINTER`.
 * Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_set_turbulent_diameter(struct hg_line *line,
                                       int32_t mode);

/**
 * Sets the label of element `index` (0-based) to `label` (UTF-8, 1 to 120 characters,
 * one line), shown in its result row (`hg_line_result_label`); NULL gives back the
 * default label: kind and index, such as "pipe 3", "fitting 4", "rise 5", a fitting's
 * catalogue or method name and index, or an equipment's name. A count above 1 shows as
 * "6 × …" before either.
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an index that is not an element;
 * `HG_ERR_INVALID` for a label empty, too long, with a control character or not UTF-8;
 * `HG_ERR_NULL_POINTER` for `line`. Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread; `label` NULL or a
 * NUL-terminated string.
 */
int32_t hg_line_set_label(struct hg_line *line,
                          size_t index,
                          const char *label);

/**
 * Makes the fitting at `index` (0-based) stand for `count` identical fittings (1 to
 * 10000): one result row with `count` times the fitting's K, so `count`·K·V²/(2g) of
 * head loss, and one shared K error (its band is `count` times one fitting's).
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for a count out of range or an index that is
 * not an element; `HG_ERR_INVALID` for a count above 1 on an element that is not a
 * fitting; `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_set_count(struct hg_line *line,
                          size_t index,
                          uint32_t count);

/**
 * Makes a new line, stored in `*out`, of the elements `start` to `end - 1` of `line`
 * (0-based, `start < end ≤` the element count) with their labels, counts and roughness
 * ranges and `line`'s options; default labels follow the new indices. Free it with
 * `hg_line_free`; `line` is unchanged.
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for `end` past the last element or `start`
 * after `end`; `HG_ERR_INVALID` when `start == end` (a line needs an element) or the
 * slice cannot be built (a fitting left with no bore to take); `HG_ERR_NULL_POINTER`.
 * Thread-safe (`line` is only read).
 *
 * # Safety
 * `line` must be NULL or a live handle; `out` NULL or a writable `hg_line *`.
 */
int32_t hg_line_slice(const struct hg_line *line,
                      size_t start,
                      size_t end,
                      struct hg_line **out);

/**
 * Appends every element of `other` to `line`, with their labels, counts and roughness
 * ranges; `line` keeps its options, and `other`'s must be the same except its inlet
 * pressure. `other` must be complete (it is built to be read); it is unchanged.
 *
 * Returns `HG_OK`; `HG_ERR_INVALID` when the options differ or `other` cannot be built;
 * `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`; `other` may be `line` itself
 * (the route is then doubled).
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread; `other` NULL or a live
 * handle.
 */
int32_t hg_line_append_line(struct hg_line *line,
                            const struct hg_line *other);

/**
 * The flow `*flow` (m³/s, signed: negative when `head` is below the static head) at
 * which the line's required head equals `head` (m of the flowing fluid), with the ends
 * `*flow_low`, `*flow_high` of its uncertainty band (k = 2).
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_INVALID` for a line without any loss or
 * that cannot be built; `HG_ERR_NO_SOLUTION` when no flow meets the head (e.g. reverse
 * flow through a check valve); `HG_ERR_NULL_POINTER`. Thread-safe (the line is only
 * read).
 *
 * # Safety
 * `line` and `fluid` must be NULL or live handles; the outputs NULL or writable.
 */
int32_t hg_line_flow_for_head(const struct hg_line *line,
                              const struct hg_fluid *fluid,
                              double head,
                              double *flow,
                              double *flow_low,
                              double *flow_high);

/**
 * The system curve: `heads[i]` = the required head (m) of the line at `flows[i]` (m³/s),
 * for `n` flows; uses all cores above 4096 points, with the same results.
 * `heads` may be the `flows` array itself.
 *
 * Returns `HG_OK`; the status of the first failing flow (message "element <i>: ..."),
 * with `heads` unchanged; `HG_ERR_INVALID` for `n` = 0 or a line that cannot be built;
 * `HG_ERR_NULL_POINTER`. Thread-safe (the line is only read).
 *
 * # Safety
 * `line` and `fluid` must be NULL or live handles; `flows` and `heads` NULL or valid for
 * `n` doubles.
 */
int32_t hg_line_system_curve(const struct hg_line *line,
                             const struct hg_fluid *fluid,
                             const double *flows,
                             size_t n,
                             double *heads);

/**
 * The flow `*flow` (m³/s) and head `*head` (m) where the pump curve given by `n` points
 * (`pump_flows` increasing, m³/s; `pump_heads`, m) meets the line's system curve, with
 * the ends of their uncertainty bands. The pump curve is interpolated smoothly between
 * its points and not extrapolated.
 *
 * Returns `HG_OK`; `HG_ERR_NO_SOLUTION` when the curves do not cross inside the pump
 * curve's range; `HG_ERR_NOT_FINITE`, `HG_ERR_OUT_OF_RANGE`, `HG_ERR_INVALID` for a bad
 * pump curve (too few points, flows not increasing) or line; `HG_ERR_NULL_POINTER`.
 * Thread-safe (the line is only read).
 *
 * # Safety
 * `line` and `fluid` must be NULL or live handles; the arrays NULL or valid for `n`
 * doubles; the outputs NULL or writable doubles.
 */
int32_t hg_line_operating_point(const struct hg_line *line,
                                const struct hg_fluid *fluid,
                                const double *pump_flows,
                                const double *pump_heads,
                                size_t n,
                                double *flow,
                                double *head,
                                double *flow_low,
                                double *flow_high,
                                double *head_low,
                                double *head_high);

/**
 * Required head `*head` (m of the flowing fluid) of `line` for `fluid` at signed flow
 * `flow` (m³/s) and its derivative `*dhead_dflow` (s/m²): the call a simulator's
 * Newton loop makes for a whole route. Continuous, with a continuous derivative,
 * through zero flow and the laminar–turbulent transition.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_INVALID` for a line that cannot be
 * built; `HG_ERR_NO_SOLUTION` (refused transition, a gas losing over 40 % of its
 * pressure); `HG_ERR_NULL_POINTER`. Thread-safe (the line is only read).
 *
 * # Safety
 * `line` and `fluid` must be NULL or live handles; the outputs NULL or writable.
 */
int32_t hg_line_required_head(const struct hg_line *line,
                              const struct hg_fluid *fluid,
                              double flow,
                              double *head,
                              double *dhead_dflow);

/**
 * Head `*head` (m) and slope `*dhead_dflow` (s/m²) of the pump curve through `n` points
 * (`flows` ≥ 0 strictly increasing, m³/s; `heads` not increasing, m) at `flow` (m³/s,
 * inside the curve's range), interpolated without overshoot as `hg_line_operating_point`
 * does.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a flow outside the
 * curve; `HG_ERR_INVALID` or `HG_ERR_OUT_OF_RANGE` for a bad curve (fewer than 3
 * points…); `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `flows` and `heads` must be NULL or valid for `n` doubles; the outputs NULL or
 * writable.
 */
int32_t hg_pump_curve_head(const double *flows,
                           const double *heads,
                           size_t n,
                           double flow,
                           double *head,
                           double *dhead_dflow);

/**
 * Makes a new line, stored in `*out`, equal to `line` with every round pipe set to
 * inside `diameter` (m, > 0), by the rule of `hg_line_with_diameter_in` over the whole
 * line: fittings take the new bore, contractions and expansions left between equal
 * bores are removed. Free it with `hg_line_free`; `line` is unchanged.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_INVALID` for a
 * line without a round pipe, with equipment of a fixed bore (the message names it) or
 * that cannot be built; `HG_ERR_NULL_POINTER`. Thread-safe (`line` is only read).
 *
 * # Safety
 * `line` must be NULL or a live handle; `out` NULL or a writable `hg_line *`.
 */
int32_t hg_line_with_uniform_diameter(const struct hg_line *line,
                                      double diameter,
                                      struct hg_line **out);

/**
 * The least-squares polynomial of `degree` (2 or 3) through `n` pump points (`flows`
 * ≥ 0 strictly increasing, m³/s; `heads`, m, which may wiggle): H(Q) = Σ c_k Q^k with
 * `coefficients[0..4]` = c₀ … c₃ in SI units (ascending powers; c₃ = 0 for a quadratic),
 * `*rms_residual` and `*max_residual` (m) the root mean square and largest |H(Q_i) −
 * H_i| at the points. At least `degree + 1` points.
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for a degree other than 2 or 3, a flow or head
 * out of range or flows not increasing; `HG_ERR_NOT_FINITE`; `HG_ERR_INVALID` for too
 * few points or flows too close together; `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `flows` and `heads` must be NULL or valid for `n` doubles; `coefficients` NULL or
 * valid for writing 4 doubles; the other outputs NULL or writable.
 */
int32_t hg_pump_curve_fit(const double *flows,
                          const double *heads,
                          size_t n,
                          int32_t degree,
                          double *coefficients,
                          double *rms_residual,
                          double *max_residual);

/**
 * Head `*head` (m) and slope `*dhead_dflow` (s/m²) at `flow` (m³/s, inside the points'
 * range) of the pump curve through `n` points: `degree` 0 the monotone cubic of
 * `hg_pump_curve_head`, 2 or 3 the least-squares fit of `hg_pump_curve_fit`.
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for a flow outside the curve or a bad degree;
 * the errors of `hg_pump_curve_head` and `hg_pump_curve_fit` for bad points;
 * `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * As `hg_pump_curve_head`.
 */
int32_t hg_pump_curve_fit_head(const double *flows,
                               const double *heads,
                               size_t n,
                               int32_t degree,
                               double flow,
                               double *head,
                               double *dhead_dflow);

/**
 * As `hg_line_operating_point`, with the pump curve of `degree`: 0 the monotone cubic
 * through the points (exactly `hg_line_operating_point`), 2 or 3 the least-squares fit
 * of `hg_pump_curve_fit`.
 *
 * Returns the codes of `hg_line_operating_point`, and `HG_ERR_OUT_OF_RANGE` for a bad
 * degree. Thread-safe (the line is only read).
 *
 * # Safety
 * As `hg_line_operating_point`.
 */
int32_t hg_line_operating_point_fit(const struct hg_line *line,
                                    const struct hg_fluid *fluid,
                                    const double *pump_flows,
                                    const double *pump_heads,
                                    size_t n,
                                    int32_t degree,
                                    double *flow,
                                    double *head,
                                    double *flow_low,
                                    double *flow_high,
                                    double *head_low,
                                    double *head_high);

/**
 * Appends a pump to `line`: its curve through `n` points (`flows` ≥ 0 strictly
 * increasing, m³/s; `heads`, m), `degree` 0 the monotone cubic through the points (heads
 * must not rise with flow), 2 or 3 the least-squares fit of `hg_pump_curve_fit`. In
 * every evaluation the pump is the negative loss −H(Q) (its row's head loss, kind
 * `HG_ELEMENT_PUMP`) with slope −dH/dQ, inside the curve's flow range only: a flow
 * outside it (no extrapolation) or reverse through it (a pump run backwards is not
 * modelled) is `HG_ERR_OUT_OF_RANGE` naming the pump and its range.
 *
 * Returns `HG_OK`; `HG_ERR_INVALID` for too few points (a pump needs a curve);
 * `HG_ERR_OUT_OF_RANGE` for a bad degree, flows not increasing or heads rising (degree
 * 0); `HG_ERR_NOT_FINITE`; `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread; `flows` and `heads` NULL
 * or valid for `n` doubles.
 */
int32_t hg_line_add_pump(struct hg_line *line,
                         const double *flows,
                         const double *heads,
                         size_t n,
                         int32_t degree);

/**
 * Where a line with its own pumps runs by itself: the flow `*flow` (m³/s) at which its
 * required head (static head + losses + end pressure head − the pumps' head) is zero,
 * solved in a kept bracket over the flow range the pumps' curves share; `*pump_head`
 * (m) the pumps' head there. `*npsh_available` (m) is the NPSH available at the first
 * pump's suction (the boundary just upstream of it) and `*has_npsh` 1, or 0 and 0 when
 * the line has no inlet pressure or the fluid no vapour pressure. When `result` is not
 * NULL, `*result` receives the line evaluated at the flow (free it with
 * `hg_line_result_free`).
 *
 * Returns `HG_OK`; `HG_ERR_INVALID` for a line without a pump or one that cannot be
 * built; `HG_ERR_NO_SOLUTION` when the pumps' curves share no flow or the required head
 * does not change sign over their range (the curves are not extrapolated);
 * `HG_ERR_NULL_POINTER`. Nothing is written on error. Thread-safe (the line is only read).
 *
 * # Safety
 * `line` and `fluid` must be NULL or live handles; the outputs NULL or writable
 * (`result` may be NULL).
 */
int32_t hg_line_pumped_flow(const struct hg_line *line,
                            const struct hg_fluid *fluid,
                            double *flow,
                            double *pump_head,
                            double *npsh_available,
                            int32_t *has_npsh,
                            struct hg_line_result **result);

/**
 * Sizes the round pipes of `line` (all set to one inside diameter) for `fluid` at flow
 * `flow` (m³/s, ≠ 0) under the limit `limit` (`HG_LIMIT_*`) of value `limit_value`
 * (Pa or m/s, > 0); with `table` and `schedule` (as `hg_pipe_size`; both NULL for none)
 * it also picks the smallest standard size that meets the limit, at the nominal values
 * and at the band's unfavourable end. The result goes to `*out`. Every trial resizes as
 * `hg_line_with_uniform_diameter` does (reducers between equal bores removed, fittings
 * with a stated bore following, equipment with a fixed bore refused).
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a zero flow, a limit
 * ≤ 0 or an unknown `limit`; `HG_ERR_UNKNOWN_NAME` for a table or schedule;
 * `HG_ERR_INVALID` for a line without round pipes, equipment with a fixed bore or a
 * `struct_size` too small; `HG_ERR_NO_SOLUTION` when no bore up to 20 m or no standard
 * size meets the limit; `HG_ERR_NULL_POINTER`. Thread-safe (the line is only read).
 *
 * # Safety
 * `line` and `fluid` must be NULL or live handles; `table` and `schedule` NULL or
 * NUL-terminated; `out` NULL or a writable `hg_sizing` of `out->struct_size` bytes.
 */
int32_t hg_line_size(const struct hg_line *line,
                     const struct hg_fluid *fluid,
                     double flow,
                     int32_t limit,
                     double limit_value,
                     const char *table,
                     const char *schedule,
                     struct hg_sizing *out);

/**
 * As `hg_line_size`, resizing only the elements `start` … `end − 1` of `line` (indices as
 * `hg_line_count` counts them, `end` excluded); with `material` (a catalogue name as
 * `hg_line_add_pipe_material`, or NULL to keep each pipe's own roughness) the resized
 * pipes are of that material, with its roughness. The limit applies to the whole line.
 * Transitions at the section's borders are rebuilt from the bores that meet there (see
 * `hg_line_with_diameter_in`).
 *
 * Returns as `hg_line_size`; also `HG_ERR_OUT_OF_RANGE` for a section past the line's
 * end or empty, `HG_ERR_INVALID` for a section without a round pipe,
 * `HG_ERR_UNKNOWN_NAME` for `material`. Thread-safe (the line is only read).
 *
 * # Safety
 * As `hg_line_size`; `material` NULL or NUL-terminated.
 */
int32_t hg_line_size_in(const struct hg_line *line,
                        const struct hg_fluid *fluid,
                        double flow,
                        int32_t limit,
                        double limit_value,
                        const char *table,
                        const char *schedule,
                        size_t start,
                        size_t end,
                        const char *material,
                        struct hg_sizing *out);

/**
 * Makes a new line, stored in `*out`, equal to `line` with the round pipes of elements
 * `start` … `end − 1` set to inside `diameter` (m, > 0), of `material` when not NULL (a
 * catalogue name; NULL keeps each pipe's roughness). Fittings in the section with a
 * stated bore take the new bore; a contraction or expansion next to a resized pipe is
 * rebuilt from the bores that now meet there and removed when they are equal (the new
 * line then has fewer elements); a section border where the new bore meets another with
 * no transition element is counted as an abrupt change with its warning. Equipment with
 * a fixed bore in the section refuses, the message naming its index and label. Free the
 * line with `hg_line_free`; `line` is unchanged.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for `diameter` ≤ 0 or a
 * section past the end or empty; `HG_ERR_INVALID` for a section without a round pipe or
 * with fixed-bore equipment; `HG_ERR_UNKNOWN_NAME` for `material`;
 * `HG_ERR_NULL_POINTER`. Thread-safe (`line` is only read).
 *
 * # Safety
 * `line` must be NULL or a live handle; `material` NULL or NUL-terminated; `out` NULL or
 * a writable `hg_line *`.
 */
int32_t hg_line_with_diameter_in(const struct hg_line *line,
                                 double diameter,
                                 size_t start,
                                 size_t end,
                                 const char *material,
                                 struct hg_line **out);

/**
 * Splits a total flow `total` (m³/s) between `n` lines in parallel so that all need the
 * same head: `flows[i]` is the flow in `branches[i]` (m³/s) and `*head` the common
 * required head (m).
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_INVALID` for `n` = 0, a branch without
 * any loss or that cannot be built; `HG_ERR_NO_SOLUTION`; `HG_ERR_NULL_POINTER` (also
 * for a NULL branch). Thread-safe (the lines are only read).
 *
 * # Safety
 * `branches` must be NULL or valid for `n` pointers, each NULL or a live handle;
 * `fluid` NULL or live; `flows` NULL or valid for `n` doubles; `head` NULL or writable.
 */
int32_t hg_line_split_flow(const struct hg_line *const *branches,
                           size_t n,
                           const struct hg_fluid *fluid,
                           double total,
                           double *flows,
                           double *head);

/**
 * The bands (k = 2) of `hg_line_split_flow`: for each branch `i`, `flows_low[i]` …
 * `flows_high[i]` (m³/s), and the common head's band `*head_low` … `*head_high` (m).
 * Line-wide sources (friction model, roughness, diameter, fluid) act on all branches
 * together, each fitting's K on its own branch.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_INVALID` for `n` = 0, a branch without
 * any loss or that cannot be built; `HG_ERR_NO_SOLUTION`; `HG_ERR_NULL_POINTER` (also
 * for a NULL branch). Thread-safe (the lines are only read).
 *
 * # Safety
 * `branches` must be NULL or valid for `n` pointers, each NULL or a live handle;
 * `fluid` NULL or live; `flows_low` and `flows_high` NULL or valid for `n` doubles;
 * `head_low` and `head_high` NULL or writable.
 */
int32_t hg_line_split_flow_bands(const struct hg_line *const *branches,
                                 size_t n,
                                 const struct hg_fluid *fluid,
                                 double total,
                                 double *flows_low,
                                 double *flows_high,
                                 double *head_low,
                                 double *head_high);

/**
 * Evaluates `line` for `fluid` at signed volumetric flow `flow` (m³/s; at inlet
 * conditions for a gas) and stores the result in `*out`: a new handle to read with
 * `hg_line_result_totals`, `hg_line_result_element`, `hg_line_result_label` and the
 * band-source accessors, then free with `hg_line_result_free`. The line is evaluated
 * once; reading the result computes nothing.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE` for the flow; `HG_ERR_INVALID` for a line that
 * cannot be built (no elements, a fitting with no bore to refer to);
 * `HG_ERR_NO_SOLUTION` for transitional flow with `HG_TRANSITION_REFUSE`;
 * `HG_ERR_OUT_OF_RANGE` for a gas losing more than 40 % of its inlet pressure;
 * `HG_ERR_NULL_POINTER`. On failure `*out` is left untouched. Thread-safe (the line is
 * only read).
 *
 * # Safety
 * `line` and `fluid` must be NULL or live handles; `out` NULL or a writable
 * `hg_line_result *`.
 */
int32_t hg_line_evaluate(const struct hg_line *line,
                         const struct hg_fluid *fluid,
                         double flow,
                         struct hg_line_result **out);

/**
 * Evaluates `line` as `hg_line_evaluate`, but with the static pressure at the inlet
 * given for this call: `inlet_pressure` in Pa absolute (> 0), or 0 for none (a gas then
 * starts at its own pressure). The line's own setting (`hg_line_set_inlet_pressure`) is
 * not used and not changed, so threads may evaluate one line at different pressures.
 *
 * Returns the codes of `hg_line_evaluate`, and `HG_ERR_NOT_FINITE` or
 * `HG_ERR_OUT_OF_RANGE` for a bad `inlet_pressure`. On failure `*out` is left
 * untouched. Thread-safe (the line is only read).
 *
 * # Safety
 * As `hg_line_evaluate`.
 */
int32_t hg_line_evaluate_at(const struct hg_line *line,
                            const struct hg_fluid *fluid,
                            double flow,
                            double inlet_pressure,
                            struct hg_line_result **out);

/**
 * Releases a result. NULL is accepted and ignored.
 *
 * # Safety
 * `result` must be NULL or a live handle from `hg_line_evaluate*`, not used afterwards.
 */
void hg_line_result_free(struct hg_line_result *result);

/**
 * The totals of `result` into `*out` (set `out->struct_size` first): flow, losses,
 * heads with their derivative and bands, pressures, warnings and the counts of elements
 * and band sources.
 *
 * Returns `HG_OK`; `HG_ERR_INVALID` for a `struct_size` too small;
 * `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `result` must be NULL or a live handle; `out` NULL or a writable `hg_line_totals` of
 * `out->struct_size` bytes.
 */
int32_t hg_line_result_totals(const struct hg_line_result *result,
                              struct hg_line_totals *out);

/**
 * The row of element `index` (0-based, route order) of `result` into `*out` (set
 * `out->struct_size` first).
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` when `index` is not less than the number of
 * elements; `HG_ERR_INVALID` for a `struct_size` too small; `HG_ERR_NULL_POINTER`.
 * Thread-safe.
 *
 * # Safety
 * `result` must be NULL or a live handle; `out` NULL or a writable `hg_element_result`
 * of `out->struct_size` bytes.
 */
int32_t hg_line_result_element(const struct hg_line_result *result,
                               size_t index,
                               struct hg_element_result *out);

/**
 * Copies the label of element `index` of `result` (the user's, see `hg_line_set_label`,
 * or the default: "pipe 3", "fitting 4", "rise 5", …; "6 × …" for counted fittings) into `buf` (at most `len - 1` bytes and a NUL; `buf` may be NULL
 * when `len` is 0) and stores its full length in `*needed`.
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` when `index` is not an element;
 * `HG_ERR_BUFFER_TOO_SMALL` when the label did not fit (`*needed` and the cut copy are
 * still written); `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `result` must be NULL or a live handle; `buf` NULL or valid for `len` bytes; `needed`
 * NULL or writable.
 */
int32_t hg_line_result_label(const struct hg_line_result *result,
                             size_t index,
                             char *buf,
                             size_t len,
                             size_t *needed);

/**
 * Source number `source` (0-based, largest share first; fewer than
 * `hg_line_totals.band_source_count`) of the head-loss band of the whole line in
 * `result`: its name copied into `buf` (e.g. "friction model", "roughness",
 * "K of gate_valve (element 2)"; at most `len - 1` bytes and a NUL; full length in
 * `*needed`) and its share of the variance (0…1) in `*share`. Source 0 is the input
 * that dominates the band.
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` when `source` is past the last source (a band
 * of zero width, as at zero flow, has none); `HG_ERR_BUFFER_TOO_SMALL` when the name did
 * not fit (`*needed` and the cut copy are written, `*share` is not);
 * `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `result` must be NULL or a live handle; `buf` NULL or valid for `len` bytes; `needed`
 * and `share` NULL or writable.
 */
int32_t hg_line_result_band_source(const struct hg_line_result *result,
                                   size_t source,
                                   char *buf,
                                   size_t len,
                                   size_t *needed,
                                   double *share);

/**
 * Source number `source` (0-based, largest share first; fewer than
 * `hg_element_result.band_source_count`) of the head-loss band of element `index`
 * (0-based, route order) of `result`, as `hg_line_result_band_source` gives them for
 * the whole line.
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` when `index` is not an element or `source` is
 * past the last source (a rise, and any band of zero width, has none);
 * `HG_ERR_BUFFER_TOO_SMALL` when the name did not fit (`*needed` and the cut copy are
 * written, `*share` is not); `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * As `hg_line_result_band_source`.
 */
int32_t hg_line_result_element_band_source(const struct hg_line_result *result,
                                           size_t index,
                                           size_t source,
                                           char *buf,
                                           size_t len,
                                           size_t *needed,
                                           double *share);

/**
 * Fills `opts` with the library's default uncertainty sources and sets its
 * `struct_size`.
 *
 * Returns `HG_OK` or `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `opts` must be NULL or point to a writable `hg_uncertainty_options`.
 */
int32_t hg_uncertainty_options_default(struct hg_uncertainty_options *opts);

/**
 * Sets the uncertainty sources of the bands of `line` (see `hg_uncertainty_options`).
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a negative size or a
 * flag other than 0 or 1; `HG_ERR_INVALID` for a `struct_size` too small;
 * `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread; `opts` NULL or a
 * readable `hg_uncertainty_options`.
 */
int32_t hg_line_set_uncertainty(struct hg_line *line,
                                const struct hg_uncertainty_options *opts);

/**
 * Propagates the uncertainty sources of `line` (see `hg_line_set_uncertainty`) to its
 * required head at `flow` (m³/s) by sampling (JCGM 101:2008), `samples` times (100 to
 * `HG_MONTE_CARLO_MAX_SAMPLES`) from the generator seed `seed`, into `*out`: the check
 * of the first-order band of `hg_line_evaluate`. The same seed gives the same numbers.
 * Friction model, diameter, density and viscosity are drawn normal; roughness, fitting K
 * and equipment ratings rectangular. Time grows with `samples` × elements.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE` for the flow; `HG_ERR_OUT_OF_RANGE` for a sample
 * count outside the range; the codes of `hg_line_evaluate` for the line;
 * `HG_ERR_INVALID` for a `struct_size` too small; `HG_ERR_NULL_POINTER`. Thread-safe
 * (the line is only read).
 *
 * # Safety
 * `line` and `fluid` must be NULL or live handles; `out` NULL or a writable
 * `hg_monte_carlo` of `out->struct_size` bytes.
 */
int32_t hg_line_monte_carlo(const struct hg_line *line,
                            const struct hg_fluid *fluid,
                            double flow,
                            size_t samples,
                            uint64_t seed,
                            struct hg_monte_carlo *out);

/**
 * Sets the air around `line` to `surroundings` (a gas handle, copied), or back to the
 * default dry air at 20 °C and 101 325 Pa when `surroundings` is NULL. A rise in a gas
 * line then adds (ρ − ρ_surroundings)·g·Δz of pressure (the stack effect); a liquid line
 * neglects the air column unless `hg_line_set_air_column_for_liquids` turns it on.
 *
 * Returns `HG_OK`; `HG_ERR_INVALID` when `surroundings` is a liquid;
 * `HG_ERR_NULL_POINTER` for `line`. Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread; `surroundings` NULL or a
 * live fluid handle.
 */
int32_t hg_line_set_surroundings(struct hg_line *line,
                                 const struct hg_fluid *surroundings);

/**
 * Counts the surrounding air column for a liquid line too (`on` = 1) or neglects it (0,
 * the default: for water it changes a rise's head by about 0.12 %).
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for `on` other than 0 or 1;
 * `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_set_air_column_for_liquids(struct hg_line *line,
                                           int32_t on);

/**
 * Writes 1 to `*blocks` when some element of `line` stops reverse flow (a check or foot
 * valve), else 0. Every call that takes a flow refuses a reverse flow through such a
 * line with `HG_ERR_NO_SOLUTION` and a message naming the valve.
 *
 * Returns `HG_OK`; `HG_ERR_INVALID` for a line that cannot be built;
 * `HG_ERR_NULL_POINTER`. Thread-safe (the line is only read).
 *
 * # Safety
 * `line` must be NULL or a live handle; `blocks` NULL or writable.
 */
int32_t hg_line_blocks_reverse_flow(const struct hg_line *line,
                                    int32_t *blocks);

/**
 * Writes the NPSH available (m) at the outlet of row `index` (0-based, route order) of
 * `result` to `*npsh`: the total pressure there over the vapour pressure in metres of
 * the liquid, NPSHa = (p + ½ρV² − p_v)/(ρ g) (definition, e.g. ISO 9906).
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` when `index` is not a row of the result;
 * `HG_ERR_INVALID` when the line was evaluated without an inlet pressure or the fluid
 * has no vapour pressure (a gas, or a liquid stated without one); `HG_ERR_NULL_POINTER`.
 * Thread-safe.
 *
 * # Safety
 * `result` must be NULL or a live handle; `npsh` NULL or writable.
 */
int32_t hg_line_result_npsh_available(const struct hg_line_result *result,
                                      size_t index,
                                      double *npsh);

/**
 * Checks the NPSH available at the outlet of row `index` of `result` against
 * `required` (m, ≥ 0, the pump maker's NPSH required) plus `margin` (m, ≥ 0): writes the
 * NPSH available (m) to `*available` and 1 to `*sufficient` when available ≥ required +
 * margin, else 0.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE` or `HG_ERR_OUT_OF_RANGE` for a bad `required` or
 * `margin`; otherwise as `hg_line_result_npsh_available`. Nothing is written on error.
 * Thread-safe.
 *
 * # Safety
 * `result` must be NULL or a live handle; `available` and `sufficient` NULL or writable.
 */
int32_t hg_line_result_npsh_check(const struct hg_line_result *result,
                                  size_t index,
                                  double required,
                                  double margin,
                                  double *available,
                                  int32_t *sufficient);

/**
 * Writes the number of messages of `result` to `*count`: each says in words what a
 * warning found (the element, the values, and for a likely unit slip the value in the
 * unit probably meant).
 *
 * Returns `HG_OK` or `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `result` must be NULL or a live handle; `count` NULL or writable.
 */
int32_t hg_line_result_message_count(const struct hg_line_result *result,
                                     size_t *count);

/**
 * Copies message `index` (0-based, see `hg_line_result_message_count`) of `result` into
 * `buf` (at most `len - 1` bytes and a NUL, UTF-8; `buf` may be NULL when `len` is 0) and
 * stores its full length in `*needed`.
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` when `index` is not a message;
 * `HG_ERR_BUFFER_TOO_SMALL` when the message did not fit (`*needed` and the cut copy are
 * still written); `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `result` must be NULL or a live handle; `buf` NULL or valid for `len` bytes; `needed`
 * NULL or writable.
 */
int32_t hg_line_result_message(const struct hg_line_result *result,
                               size_t index,
                               char *buf,
                               size_t len,
                               size_t *needed);

/**
 * Appends rated equipment labelled `name` with a pressure drop `drop` (Pa, > 0) at the
 * rating flow `at_flow` (m³/s, > 0) of a fluid of density `rating_density` (kg/m³, > 0):
 * in the line's fluid of density ρ the drop is drop · (ρ/ρ_rating) · Q|Q|/Q_rating².
 * `hg_line_add_equipment` rates with water at 20 °C.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_INVALID` for a
 * label not UTF-8; `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread; `name` NULL or a
 * NUL-terminated string.
 */
int32_t hg_line_add_equipment_rated(struct hg_line *line,
                                    const char *name,
                                    double drop,
                                    double at_flow,
                                    double rating_density);

/**
 * Sets the pressure the line must deliver at its end, Pa above the pressure at its start
 * (a spray header, a burner, a process inlet), counted in the required head as
 * p_end/(ρ g); 0 asks for none (the default).
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_NULL_POINTER`. Needs exclusive use of
 * `line`.
 *
 * # Safety
 * `line` must be NULL or a live handle used by no other thread.
 */
int32_t hg_line_set_end_pressure(struct hg_line *line,
                                 double pressure);

/**
 * Makes an empty network and stores it in `*out`; free it with `hg_network_free`.
 *
 * Returns `HG_OK`; `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `out` must be NULL or point to a writable `hg_network *`.
 */
int32_t hg_network_new(struct hg_network **out);

/**
 * Releases a network. NULL is accepted and ignored.
 *
 * # Safety
 * `network` must be NULL or a live handle from `hg_network_new`, not used afterwards.
 */
void hg_network_free(struct hg_network *network);

/**
 * Adds a junction `name` at `elevation` (m, within ±10,000) where `outflow` (m³/s)
 * leaves the system (negative for an inflow).
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_INVALID` for an
 * empty or repeated name or text that is not UTF-8; `HG_ERR_NULL_POINTER`. Not
 * thread-safe for one network.
 *
 * # Safety
 * `network` NULL or a live handle used by no other thread; `name` NULL or a
 * NUL-terminated string.
 */
int32_t hg_network_add_node(struct hg_network *network,
                            const char *name,
                            double elevation,
                            double outflow);

/**
 * Adds a node `name` held at `head` (m): a tank level or a main at a known pressure.
 * `elevation` points to the elevation (m) where its pressure is read, or is NULL for a
 * free surface at the head.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_INVALID` for an
 * empty or repeated name; `HG_ERR_NULL_POINTER`. Not thread-safe for one network.
 *
 * # Safety
 * `network` NULL or a live handle used by no other thread; `name` NULL or a
 * NUL-terminated string; `elevation` NULL or readable.
 */
int32_t hg_network_add_fixed_head(struct hg_network *network,
                                  const char *name,
                                  double head,
                                  const double *elevation);

/**
 * Adds a link `name` carrying a copy of `line` from node `upstream` to node
 * `downstream` (positive flow runs that way). Nodes must be added first.
 *
 * Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` for a node not in the network;
 * `HG_ERR_INVALID` for an empty or repeated name, a link from a node to itself, rises
 * that disagree with the nodes' elevations or a line that cannot be built;
 * `HG_ERR_NULL_POINTER`. Not thread-safe for one network.
 *
 * # Safety
 * `network` NULL or a live handle used by no other thread; the strings NULL or
 * NUL-terminated; `line` NULL or a live handle.
 */
int32_t hg_network_add_link(struct hg_network *network,
                            const char *name,
                            const char *upstream,
                            const char *downstream,
                            const struct hg_line *line);

/**
 * Places node `name` at plan position (`x`, `y`) (m, or any plan unit used
 * consistently; within ±1e8), for drawing the network; the hydraulics do not use it.
 *
 * Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` for a node not in the network;
 * `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`. Not thread-safe for
 * one network.
 *
 * # Safety
 * `network` NULL or a live handle used by no other thread; `name` NULL or a
 * NUL-terminated string.
 */
int32_t hg_network_place_node(struct hg_network *network,
                              const char *name,
                              double x,
                              double y);

/**
 * The plan position of node `index` (in the order added): `x`, `y` and `*has_position`
 * (1 when placed by `hg_network_place_node`; 0 with `x` = `y` = 0 otherwise).
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an index past the last node;
 * `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `network` NULL or a live handle; the outputs NULL or writable.
 */
int32_t hg_network_node_position(const struct hg_network *network,
                                 size_t index,
                                 double *x,
                                 double *y,
                                 int32_t *has_position);

/**
 * The flow available at junction `node` at a minimum residual pressure: the largest
 * extra outflow (m³/s, on top of the node's own demand) with which the static gauge
 * pressure stays at or above `min_pressure` (Pa, −101,325…1e8) at the node
 * (`every_junction` = 0) or at every junction (≠ 0). Stores the flow, the node's
 * pressure at that flow (Pa), the index of the junction where the minimum binds and,
 * when `solution` is not NULL, the network solved with that flow drawn (a new
 * `hg_network_solution`; free it with `hg_network_solution_free`). Each trial is a full
 * solve (bracket, then Illinois regula falsi to 1e-10 of the flow); a draw the network
 * cannot be solved at counts as beyond the available flow.
 *
 * Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` for a node not in the network;
 * `HG_ERR_INVALID` for a fixed-head node and the errors of `hg_network_solve` at the
 * given demands; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NO_SOLUTION` when
 * the pressure is below the minimum already at the given demands (the message names
 * the junction); `HG_ERR_NULL_POINTER`. On failure the outputs are left untouched.
 * Thread-safe (the network is only read).
 *
 * # Safety
 * `network` and `fluid` NULL or live handles; `node` NULL or NUL-terminated; `flow`,
 * `pressure` and `critical` NULL or writable; `solution` NULL or a writable
 * `hg_network_solution *`.
 */
int32_t hg_network_available_flow(const struct hg_network *network,
                                  const struct hg_fluid *fluid,
                                  const char *node,
                                  double min_pressure,
                                  int32_t every_junction,
                                  double *flow,
                                  double *pressure,
                                  size_t *critical,
                                  struct hg_network_solution **solution);

/**
 * The number of nodes and links in the network.
 *
 * Returns `HG_OK`; `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `network` NULL or a live handle; `nodes` and `links` NULL or writable.
 */
int32_t hg_network_counts(const struct hg_network *network,
                          size_t *nodes,
                          size_t *links);

/**
 * The index (in the order added) of node `name` (`is_link` = 0) or link `name`
 * (`is_link` ≠ 0), for the `hg_network_solution_*` accessors.
 *
 * Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME`; `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `network` NULL or a live handle; `name` NULL or NUL-terminated; `index` NULL or
 * writable.
 */
int32_t hg_network_index(const struct hg_network *network,
                         const char *name,
                         int32_t is_link,
                         size_t *index);

/**
 * Solves `network` for `fluid` (global gradient method, Todini and Pilati 1988) and
 * stores the solution in `*out`; free it with `hg_network_solution_free`.
 *
 * Returns `HG_OK`; `HG_ERR_INVALID` for no links, no fixed-head node, a part with no
 * fixed head or a link with no loss (the message names the node or link);
 * `HG_ERR_NO_SOLUTION` when the iteration does not converge (naming the worst link) or
 * a node is cut off by closed check valves; `HG_ERR_NULL_POINTER`. On failure `*out`
 * is left untouched. Thread-safe (the network is only read).
 *
 * # Safety
 * `network` and `fluid` NULL or live handles; `out` NULL or a writable
 * `hg_network_solution *`.
 */
int32_t hg_network_solve(const struct hg_network *network,
                         const struct hg_fluid *fluid,
                         struct hg_network_solution **out);

/**
 * Releases a solution. NULL is accepted and ignored.
 *
 * # Safety
 * `solution` must be NULL or a live handle from `hg_network_solve`, not used
 * afterwards.
 */
void hg_network_solution_free(struct hg_network_solution *solution);

/**
 * Newton iterations used, the largest flow change of the last one (m³/s), the largest
 * energy imbalance of a link at the solution (m) and the number of warnings.
 *
 * Returns `HG_OK`; `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `solution` NULL or a live handle; the outputs NULL or writable.
 */
int32_t hg_network_solution_summary(const struct hg_network_solution *solution,
                                    size_t *iterations,
                                    double *flow_change,
                                    double *head_imbalance,
                                    size_t *warnings);

/**
 * Node `index` (in the order added) of a solution: piezometric `head` (m), `elevation`
 * (m), static gauge `pressure` ρg(head − elevation) (Pa) and `outflow` (m³/s leaving
 * the system; at a fixed-head node negative when it feeds the network).
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an index past the last node;
 * `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `solution` NULL or a live handle; the outputs NULL or writable.
 */
int32_t hg_network_solution_node(const struct hg_network_solution *solution,
                                 size_t index,
                                 double *head,
                                 double *elevation,
                                 double *pressure,
                                 double *outflow);

/**
 * Link `index` (in the order added) of a solution: `flow` (m³/s, positive from
 * upstream to downstream), `velocity` (m/s, the largest along the line; 0 with
 * `*has_velocity` = 0 for a line with no bore), `head_drop` (m, upstream head minus
 * downstream head), `closed` (1 when a check valve holds it shut) and `warnings` (the
 * line's own `HG_WARN_*` bits at the solved flow).
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an index past the last link;
 * `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `solution` NULL or a live handle; the outputs NULL or writable.
 */
int32_t hg_network_solution_link(const struct hg_network_solution *solution,
                                 size_t index,
                                 double *flow,
                                 double *velocity,
                                 int32_t *has_velocity,
                                 double *head_drop,
                                 int32_t *closed,
                                 uint32_t *warnings);

/**
 * Warning `index` of a solution: its `kind` (`HG_NETWORK_WARNING_*`) and its message
 * (naming the node or link and the values) copied into `buf` like `snprintf`, with the
 * full length in `*needed`.
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an index past the last warning;
 * `HG_ERR_BUFFER_TOO_SMALL` (the kind, the needed length and a cut copy are stored);
 * `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `solution` NULL or a live handle; `kind` and `needed` NULL or writable; `buf` NULL or
 * valid for `len` bytes.
 */
int32_t hg_network_solution_warning(const struct hg_network_solution *solution,
                                    size_t index,
                                    int32_t *kind,
                                    char *buf,
                                    size_t len,
                                    size_t *needed);

/**
 * The per-element breakdown of link `index`: its line evaluated for `fluid` at the flow
 * of `solution`, stored in `*out` as a new `hg_line_result` (free it with
 * `hg_line_result_free`).
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an index past the last link; the errors
 * of `hg_line_evaluate`; `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `network`, `solution` and `fluid` NULL or live handles; `out` NULL or a writable
 * `hg_line_result *`.
 */
int32_t hg_network_link_result(const struct hg_network *network,
                               const struct hg_network_solution *solution,
                               const struct hg_fluid *fluid,
                               size_t index,
                               struct hg_line_result **out);

/**
 * Reads a network from a JSON document of hydrograde's own schema (version 1: a
 * `"hydrograde_network": 1` field, `"nodes"`, `"links"` with each link's line, optional
 * `"options"`) and stores it in `*out`; free it with `hg_network_free`. The document goes
 * through the same checks as building in code.
 *
 * Returns `HG_OK`; `HG_ERR_INVALID` for text that is not such a document, another
 * version, or any bad node, link or option (the message names it);
 * `HG_ERR_NULL_POINTER`. On failure `*out` is left untouched. Thread-safe.
 *
 * # Safety
 * `text` NULL or a NUL-terminated UTF-8 string; `out` NULL or a writable `hg_network *`.
 */
int32_t hg_network_from_json(const char *text,
                             struct hg_network **out);

/**
 * Computes the 95 % bands of every node head and pressure and every link flow of
 * `solution` (a solve of `network` with `fluid`): first order from the converged
 * system, one solve per uncertainty source. Stores them in `*out`; free with
 * `hg_network_bands_free`.
 *
 * Returns `HG_OK`; `HG_ERR_INVALID` for a solution of another network or a network
 * whose bands would exceed the work limit (the message gives the counts);
 * `HG_ERR_NULL_POINTER`. On failure `*out` is left untouched. Thread-safe.
 *
 * # Safety
 * `network`, `fluid` and `solution` NULL or live handles; `out` NULL or a writable
 * `hg_network_bands *`.
 */
int32_t hg_network_bands_new(const struct hg_network *network,
                             const struct hg_fluid *fluid,
                             const struct hg_network_solution *solution,
                             struct hg_network_bands **out);

/**
 * Releases network bands. NULL is accepted and ignored.
 *
 * # Safety
 * `bands` must be NULL or a live handle from `hg_network_bands_new`, not used
 * afterwards.
 */
void hg_network_bands_free(struct hg_network_bands *bands);

/**
 * The band of node `index`'s head (m) and of its static gauge pressure (Pa): the
 * 95 % interval `low` … `high` around the `nominal` value, for head and pressure.
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an index beyond the nodes;
 * `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `bands` NULL or a live handle; the outputs NULL or writable.
 */
int32_t hg_network_bands_node(const struct hg_network_bands *bands,
                              size_t index,
                              double *head_low,
                              double *head,
                              double *head_high,
                              double *pressure_low,
                              double *pressure,
                              double *pressure_high);

/**
 * The band of link `index`'s flow (m³/s): the 95 % interval `low` … `high` around the
 * `nominal` flow.
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an index beyond the links;
 * `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `bands` NULL or a live handle; the outputs NULL or writable.
 */
int32_t hg_network_bands_flow(const struct hg_network_bands *bands,
                              size_t index,
                              double *low,
                              double *nominal,
                              double *high);

/**
 * The system curve with its 95 % band: at each of the `n` flows `flows[i]` (m³/s),
 * `nominal[i]` = the required head (m, the same value as `hg_line_system_curve`) and
 * `low[i]`, `high[i]` = the ends of its band (the band of `hg_line_evaluate`'s required
 * head at that flow). One pass over the elements per flow; uses all cores above 64
 * flows, with the same results.
 *
 * Returns `HG_OK`; the status of the first failing flow (message "element <i>: ..."),
 * with the outputs unchanged; `HG_ERR_INVALID` for `n` = 0 or a line that cannot be
 * built; `HG_ERR_NULL_POINTER`. Thread-safe (the line is only read).
 *
 * # Safety
 * `line` and `fluid` must be NULL or live handles; `flows`, `low`, `nominal` and `high`
 * NULL or valid for `n` doubles (the outputs may not overlap `flows` or each other).
 */
int32_t hg_line_system_curve_band(const struct hg_line *line,
                                  const struct hg_fluid *fluid,
                                  const double *flows,
                                  size_t n,
                                  double *low,
                                  double *nominal,
                                  double *high);

/**
 * The Monte Carlo interval offered with a band that flags itself non-linear: evaluates
 * `line` at `flow` (m³/s) and, when its required-head band is flagged
 * (`hg_line_totals.band_non_linear`: a band wider than ±20 % of its value, or
 * a pipe whose Reynolds number reaches into the laminar–turbulent transition), sets
 * `*offered` = 1 and writes into `*out` the `hg_line_monte_carlo` run with 20,000
 * samples from seed 101 (the same bits in every binding), whose `low` and `high` are the
 * 95 % interval to use; otherwise sets `*offered` = 0 and writes zeros (`samples` 0)
 * into `*out`, which then holds no interval.
 * Costs one evaluation when not flagged, 20,000 when flagged.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE` for the flow; the codes of `hg_line_evaluate` for
 * the line; `HG_ERR_INVALID` for a `struct_size` too small; `HG_ERR_NULL_POINTER`.
 * Thread-safe (the line is only read).
 *
 * # Safety
 * `line` and `fluid` must be NULL or live handles; `offered` NULL or writable; `out` NULL
 * or a writable `hg_monte_carlo` of `out->struct_size` bytes.
 */
int32_t hg_line_band_monte_carlo(const struct hg_line *line,
                                 const struct hg_fluid *fluid,
                                 double flow,
                                 int32_t *offered,
                                 struct hg_monte_carlo *out);

/**
 * Treats the pipes of catalogue material `material` as independent in the bands (each
 * pipe its own roughness error, as for pipes from different supplies) when `independent`
 * is 1, or as sharing one error (the default) when 0.
 *
 * Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` for a name not in the material catalogue;
 * `HG_ERR_OUT_OF_RANGE` for `independent` other than 0 or 1; `HG_ERR_NULL_POINTER`.
 * Not thread-safe for the same line (it changes the line).
 *
 * # Safety
 * `line` must be NULL or a live handle; `material` NULL or a NUL-terminated string.
 */
int32_t hg_line_set_material_independent(struct hg_line *line,
                                         const char *material,
                                         int32_t independent);

/**
 * Converts `value` from unit `from` to unit `to` into `*out`, with the exact factors of
 * NIST SP 811. Unit names are those of the core's table, e.g. "m", "mm", "in", "ft",
 * "m3/s", "L/s", "m3/h", "gpm", "Pa", "kPa", "bar", "psi", "Pa.s", "cP", "K", "degC",
 * "degF" (see `hg_unit_name` for the full list). Heads of liquid need a density: use
 * `hg_convert_head`.
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE` for a NaN or infinite value;
 * `HG_ERR_UNKNOWN_NAME` for an unknown unit (the message lists the known ones);
 * `HG_ERR_INVALID` when the two units measure different things;
 * `HG_ERR_OUT_OF_RANGE` for a temperature below absolute zero; `HG_ERR_NULL_POINTER`.
 * Thread-safe.
 *
 * # Safety
 * `from` and `to` must be NULL or NUL-terminated strings; `out` NULL or writable.
 */
int32_t hg_convert(double value,
                   const char *from,
                   const char *to,
                   double *out);

/**
 * Converts between pressures and heads of a liquid of `density` (kg/m³, > 0):
 * p = ρ·g₀·h with standard gravity g₀. `from` and `to` are each a pressure unit ("Pa",
 * "kPa", "MPa", "bar", "psi", "atm") or a head unit ("m_head", "ft_head").
 *
 * Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a density ≤ 0;
 * `HG_ERR_UNKNOWN_NAME`; `HG_ERR_INVALID` for a unit that is neither a pressure nor a
 * head; `HG_ERR_NULL_POINTER`. Thread-safe.
 *
 * # Safety
 * `from` and `to` must be NULL or NUL-terminated strings; `out` NULL or writable.
 */
int32_t hg_convert_head(double value,
                        const char *from,
                        const char *to,
                        double density,
                        double *out);

/**
 * Copies the name of unit number `index` (0-based, in the core's table order) into
 * `buf` like `hg_last_error` (at most `len - 1` bytes and a NUL) and stores its full
 * length in `*needed`.
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` when `index` is past the end (use it to count
 * the units); `HG_ERR_NULL_POINTER` for a NULL `needed`, or a NULL `buf` with `len` > 0;
 * `HG_ERR_BUFFER_TOO_SMALL` when the name did not fit (the cut copy is still written).
 * Thread-safe.
 *
 * # Safety
 * `buf` must be NULL or valid for writing `len` bytes; `needed` NULL or writable.
 */
int32_t hg_unit_name(size_t index,
                     char *buf,
                     size_t len,
                     size_t *needed);

/**
 * The name of one warning bit (`HG_WARN_*`) as a static string, e.g.
 * "transitional_flow"; NULL when `bit` is not exactly one known warning bit.
 * Thread-safe.
 */
const char *hg_warning_name(uint32_t bit);

/**
 * The library version as a static string, e.g. "0.1.0" (never freed; never NULL).
 * Thread-safe.
 */
const char *hg_version(void);

/**
 * The ABI version of the loaded library; compare with `HG_ABI_VERSION`. Thread-safe.
 */
uint32_t hg_abi_version(void);

/**
 * Sets the number of threads the batch calls (`hg_darcy_factor_batch`,
 * `hg_line_system_curve`) may use, 1 to `HG_MAX_THREADS`. With 1 the library never
 * starts a thread: every call runs on the caller's thread (the setting for an embedding
 * program that runs its own threads, and for valgrind). The default is read once, at the
 * first batch, from the environment variable `HYDROGRADE_THREADS` (a whole number ≥ 1),
 * else it is the number of cores. The threads belong to the library's own pool; results
 * are the same bit for bit whatever the setting.
 *
 * Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for 0 or more than `HG_MAX_THREADS` (the
 * setting is then unchanged). Thread-safe: a batch running when the setting changes
 * finishes with the threads it started with.
 */
int32_t hg_set_threads(size_t n);

/**
 * The number of threads the batch calls may use (≥ 1); see `hg_set_threads`.
 * Thread-safe.
 */
size_t hg_threads(void);

#ifdef __cplusplus
}  // extern "C"
#endif  // __cplusplus

#endif  /* HYDROGRADE_H */

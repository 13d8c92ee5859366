"""Writes engineer_units.ipynb (no outputs) beside this script: README's first Python
scenario worked in L/s, kPa and mm with pint quantities, every view and two plots.
Run it after editing the cells below; tests/python/test_notebook_run.py executes the
notebook with nbclient."""

from pathlib import Path

import nbformat

CELLS = [
    ("markdown", "# A water line in the units engineers type\n\n"
     "README's first scenario (12 °C water, 77.9 mm bore, 260 m of smooth pipe, a gate "
     "valve, 12 m up, 6 L/s) typed with pint quantities and shown in L/s, kPa and mm. "
     "Engineering estimates with stated uncertainty: designs are checked by a competent "
     "engineer — licensed or registered where the law requires it — against the codes and "
     "standards that apply where they are built."),
    ("code", "import numpy as np\nimport pint\nimport hydrograde as hg\n\n"
     "u = pint.UnitRegistry()\nQ = u.Quantity\n"
     "hg.display(flow='L/s', pressure='kPa', length='mm', head='m')"),
    ("code", "water = hg.Fluid.water(Q(12, 'degC'))\n"
     "line = hg.Line([\n"
     "    hg.Fitting.from_tank(),\n"
     "    hg.Pipe(77.9 * u.mm, 260 * u.m, 0.0015 * u.mm),\n"
     "    hg.Fitting.named('gate_valve'),\n"
     "    hg.Rise(12 * u.m),\n"
     "    hg.Fitting.into_tank(),\n"
     "], inlet_pressure=Q(300, 'kPa'))\n"
     "r = line.evaluate(water, 6 * u.L / u.s)\n"
     "# README's SI call gives the same numbers (77.9 mm is 77.9/1000 m, rounded once).\n"
     "si = hg.Line([hg.Fitting.from_tank(), hg.Pipe(0.0779, 260.0, 1.5e-6),\n"
     "              hg.Fitting.named('gate_valve'), hg.Rise(12.0), hg.Fitting.into_tank()],\n"
     "             inlet_pressure=3e5).evaluate(water, 0.006)\n"
     "assert r.flow == 0.006 and abs(r.required_head / si.required_head - 1) < 1e-13\n"
     "r"),
    ("code", "q = hg.quantities(r, u)\n"
     "print(q['pressure_loss'], q['required_head'])\n"
     "assert abs(q['pressure_loss'].to('Pa').magnitude - r.pressure_loss) < 1e-9 * r.pressure_loss\n"
     "line"),
    ("code", "r.elements[1]"),
    ("code", "r.required_head_band"),
    ("code", "water"),
    ("code", "line.elements[1]"),
    ("code", "line.elements[2]"),
    ("code", "pump = hg.PumpCurve(np.array([0, 3, 6, 9, 12]) * u.L / u.s,\n"
     "                     np.array([42, 40.5, 36, 28.5, 18]) * u.m)\npump"),
    ("code", "line.operating_point(water, pump)"),
    ("code", "line.flow_for_head(water, 25 * u.m)"),
    ("code", "branch = hg.Line([hg.Pipe(52.5 * u.mm, 120 * u.m, 0.045 * u.mm), hg.Rise(12 * u.m)])\n"
     "hg.split_flow([line, branch], water, 9 * u.L / u.s)"),
    ("code", "line.size(water, 6 * u.L / u.s, max_velocity=1.5 * u.m / u.s, table='steel', schedule='40')"),
    ("code", "try:\n    line.evaluate(water, 6 * u.kPa)\nexcept hg.HydrogradeError as e:\n"
     "    print(type(e).__name__, e)"),
    ("code", "ax = line.plot_system(water, np.linspace(0, 12, 49) * u.L / u.s, pump=pump)"),
    ("code", "ax = r.plot()\nax.figure"),
    ("code", "with hg.display(flow='m3/h', pressure='bar'):\n    df = r.to_dataframe()\n"
     "df[['label', 'velocity', 'reynolds', 'head_loss', 'pressure_out']]"),
]


def main() -> None:
    nb = nbformat.v4.new_notebook()
    nb.metadata["kernelspec"] = {"name": "python3", "display_name": "Python 3", "language": "python"}
    for kind, src in CELLS:
        cell = nbformat.v4.new_markdown_cell(src) if kind == "markdown" else nbformat.v4.new_code_cell(src)
        nb.cells.append(cell)
    for i, cell in enumerate(nb.cells):
        cell["id"] = f"cell-{i}"
    nbformat.write(nb, Path(__file__).with_name("engineer_units.ipynb"))


if __name__ == "__main__":
    main()

"""Writes Touchstone files with scikit-rf (Debian python3-scikit-rf 0.15.4) so our reader can be checked against
another program's writer. Builds a small lossy network of its own (a line, a series resistor, a shunt capacitor,
an ideal junction for 3 ports), writes it as FILE in the given form, and prints its S-matrix and z0 as JSON:
{"f": [Hz], "z0": [ohm], "s": [freq][i][j] = [re, im]}.
Run: PATH="$(getconf PATH)" python3 scripts/reference/skrf_write.py OUT_DIR NAME NPORTS FORM(ri|ma|db)
"""
import contextlib
import io
import json
import os
import sys
import warnings

warnings.filterwarnings("ignore")
import numpy as np  # noqa: E402

if not hasattr(np, "complex"):  # scikit-rf 0.15.4 still uses this alias, removed in numpy 1.24
    np.complex = complex
with contextlib.redirect_stdout(io.StringIO()):  # it prints a note about matplotlib on import
    import skrf as rf  # noqa: E402

out_dir, name, nports, form = sys.argv[1], sys.argv[2], int(sys.argv[3]), sys.argv[4]
f = rf.Frequency(1, 3, 5, "ghz")
m = rf.media.DefinedGammaZ0(frequency=f, z0=50.0, Z0=50.0, gamma=0.3 + 1j * f.w * 1.7 / 299792458.0)
m2 = rf.media.DefinedGammaZ0(frequency=f, z0=50.0, Z0=50.0, gamma=0.1 + 1j * f.w * 1.6 / 299792458.0)
two = m.line(0.03, "m") ** m.resistor(12.0) ** m.shunt_capacitor(0.8e-12) ** m2.line(0.011, "m")
if nports == 1:
    ntw = two ** m.short()
elif nports == 2:
    ntw = two
else:
    ntw = rf.connect(m.splitter(3), 1, two, 0)
ntw.name = name
with contextlib.redirect_stdout(io.StringIO()):
    ntw.write_touchstone(filename=name, dir=out_dir, form=form)
json.dump({
    "f": [float(x) for x in ntw.f],
    "z0": [float(z.real) for z in ntw.z0[0]],
    "s": [[[[float(v.real), float(v.imag)] for v in row] for row in mm] for mm in ntw.s],
    "file": os.path.join(out_dir, name + ".s%dp" % ntw.nports),
}, sys.stdout)

"""Reads a Touchstone file with scikit-rf (Debian python3-scikit-rf 0.15.4) and prints what it understood as JSON:
{"nports", "f": [Hz], "z0": [ohm per port at the first frequency], "s": [freq][i][j] = [re, im]}.
Run: PATH="$(getconf PATH)" python3 scripts/reference/skrf_read.py FILE.sNp
"""
import json
import sys
import warnings

warnings.filterwarnings("ignore")
import contextlib  # noqa: E402
import io  # noqa: E402
with contextlib.redirect_stdout(io.StringIO()):  # it prints a note about matplotlib on import
    import skrf as rf  # noqa: E402

ntw = rf.Network(sys.argv[1])
json.dump({
    "nports": int(ntw.nports),
    "f": [float(x) for x in ntw.f],
    "z0": [float(z.real) for z in ntw.z0[0]],
    "s": [[[[float(v.real), float(v.imag)] for v in row] for row in m] for m in ntw.s],
}, sys.stdout)

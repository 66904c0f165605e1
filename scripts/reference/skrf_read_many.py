"""Reads several Touchstone files with scikit-rf (Debian python3-scikit-rf 0.15.4) in one process and prints one JSON
list, one entry per file in the order given: {"file", "nports", "f": [Hz], "z0": [ohm per port at the first
frequency], "s": [freq][i][j] = [re, im]} or {"file", "error": "..."} when scikit-rf cannot read it.
Run: PATH="$(getconf PATH)" python3 scripts/reference/skrf_read_many.py A.s1p B.s2p ...
"""
import json
import sys
import warnings

warnings.filterwarnings("ignore")
import contextlib  # noqa: E402
import io  # noqa: E402
with contextlib.redirect_stdout(io.StringIO()):  # it prints a note about matplotlib on import
    import skrf as rf  # noqa: E402

out = []
for path in sys.argv[1:]:
    try:
        with contextlib.redirect_stdout(io.StringIO()):
            ntw = rf.Network(path)
        out.append({
            "file": path,
            "nports": int(ntw.nports),
            "f": [float(x) for x in ntw.f],
            "z0": [float(z.real) for z in ntw.z0[0]],
            "s": [[[[float(v.real), float(v.imag)] for v in row] for row in m] for m in ntw.s],
        })
    except Exception as e:  # noqa: BLE001 - the test reports what the library refused
        out.append({"file": path, "error": f"{type(e).__name__}: {e}"})
json.dump(out, sys.stdout)

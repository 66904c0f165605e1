"""Oracle for the coupled pair's four-port: each mode (even, odd) as a line of scikit-rf (Debian python3-scikit-rf
0.15.4, media.DefinedGammaZ0 with the mode's real Z0 and gamma), renormalised to the ports' reference impedance, then
combined into the symmetric four-port by the even/odd decomposition (Reed and Wheeler 1956):
  S11 = (S11e + S11o)/2, S13 = (S11e - S11o)/2, S12 = (S21e + S21o)/2, S14 = (S21e - S21o)/2
with ports [1 = strip 1 near end, 2 = strip 1 far end, 3 = strip 2 near end, 4 = strip 2 far end].

Input (JSON on stdin): {"freqs": [Hz...], "length": m, "zref": ohm,
  "even": {"z0": ohm, "gamma": [[re, im] per freq]}, "odd": {...}}
Output: {"s": [[[[re, im] ...]]] (freq, i, j)}.
Run: PATH="$(getconf PATH)" python3 scripts/reference/skrf_coupled.py < in.json
"""
import json
import sys
import warnings

warnings.filterwarnings("ignore")
import contextlib  # noqa: E402
import io  # noqa: E402
import numpy as np  # noqa: E402

# scikit-rf 0.15.4 still uses the alias np.complex, removed in numpy 1.24: restore it (it was the builtin complex).
if not hasattr(np, "complex"):
    np.complex = complex
with contextlib.redirect_stdout(io.StringIO()):  # it prints a note about matplotlib on import
    import skrf as rf  # noqa: E402


def mode_line(f, spec, length, zref):
    gamma = np.array([complex(g[0], g[1]) for g in spec["gamma"]])
    media = rf.media.DefinedGammaZ0(frequency=f, gamma=gamma, z0=spec["z0"])
    line = media.line(length, "m")
    line.renormalize(zref)
    return line.s


def main():
    spec = json.load(sys.stdin)
    f = rf.Frequency.from_f(np.array(spec["freqs"]), unit="hz")
    se = mode_line(f, spec["even"], spec["length"], spec["zref"])
    so = mode_line(f, spec["odd"], spec["length"], spec["zref"])
    n = len(spec["freqs"])
    s = np.zeros((n, 4, 4), dtype=complex)
    self_ = (se[:, 0, 0] + so[:, 0, 0]) / 2
    side = (se[:, 0, 0] - so[:, 0, 0]) / 2
    thru = (se[:, 1, 0] + so[:, 1, 0]) / 2
    cross = (se[:, 1, 0] - so[:, 1, 0]) / 2
    kind = [[0, 1, 2, 3], [1, 0, 3, 2], [2, 3, 0, 1], [3, 2, 1, 0]]
    parts = [self_, thru, side, cross]
    for i in range(4):
        for j in range(4):
            s[:, i, j] = parts[kind[i][j]]
    out = [[[[float(s[k, i, j].real), float(s[k, i, j].imag)] for j in range(4)] for i in range(4)] for k in range(n)]
    json.dump({"s": out}, sys.stdout)


main()

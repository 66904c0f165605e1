#!/usr/bin/env python3
"""Rebuild a sized block from `stripwright build --json` with Debian's scikit-rf (python3-scikit-rf 0.15.4) and print
its S-matrix as JSON. Independent of our line model: every line piece is a scikit-rf microstrip (MLine, Hammerstad-
Jensen static model with Kirschning-Jansen dispersion of eps_eff, t = 0) of the piece's width and network length,
taken lossless (the phase constant only) unless "lossy" is set (then the library's own conductor loss, from "rho",
and dielectric loss, from "tand", with no roughness, in the complex propagation constant); junctions are ideal (the design is sized with junctions "ideal"); lumped
resistors are the library's own. The static Z0 is used: 0.15.4's Z0(f) misplaces a bracket (see skrf_line.py).

Input (stdin): {"freqs": [Hz], "er": float, "h": m, ["lossy": bool, "tand": float, "rho": ohm m,] "pieces": [{"id", "a", "b", "width_m", "length_m"}],
                "resistors": [{"id", "a", "b", "value"}], "ports": [{"name", "node", "zRef"}]}
Output: {"s": [[[[re, im] ...]]]} per frequency.
"""
import json
import os
import sys
import warnings

warnings.filterwarnings("ignore")
sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import contextlib  # noqa: E402
import io  # noqa: E402
import numpy as np  # noqa: E402

if not hasattr(np, "complex"):
    np.complex = complex
with contextlib.redirect_stdout(io.StringIO()):
    import skrf as rf  # noqa: E402
    from skrf.media import MLine  # noqa: E402
from skrf_network import build  # noqa: E402  (the graph connection of pieces at ideal junctions)


def main():
    spec = json.load(sys.stdin)
    f = rf.Frequency.from_f(np.array(spec["freqs"], dtype=float), unit="hz")
    lines = []
    lossy = bool(spec.get("lossy", False))
    for p in spec["pieces"]:
        m = MLine(frequency=f, w=p["width_m"], h=spec["h"], t=0.0, ep_r=spec["er"], mu_r=1, diel="frequencyinvariant",
                  rho=spec.get("rho", 1.72e-8), tand=spec.get("tand", 0.0) if lossy else 0.0, rough=0.0, disp="kirschningjansen")
        z0 = np.real(m.Z0) * np.ones(len(spec["freqs"]))
        gamma = m.gamma * np.ones(len(spec["freqs"]))
        alpha = np.real(gamma) if lossy else np.zeros(len(spec["freqs"]))
        lines.append({"id": p["id"], "a": p["a"], "b": p["b"], "length": p["length_m"], "z0": list(z0),
                      "gamma": [[float(a), float(b)] for a, b in zip(alpha, np.imag(gamma))]})
    net = build({"freqs": spec["freqs"], "lines": lines, "resistors": spec.get("resistors", []), "ports": spec["ports"],
                 "mode": "graph"})
    print(json.dumps({"s": [[[[float(np.real(x)), float(np.imag(x))] for x in row] for row in m] for m in net.s]}))


if __name__ == "__main__":
    main()

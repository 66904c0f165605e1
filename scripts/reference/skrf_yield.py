"""Oracle for the yield estimate: rebuilds every made board of a Monte Carlo run from its raw draws, independently of
Stripwright's board maker and line models, and prints each board's S-matrix as JSON.

Input (JSON on stdin):
  {"freqs": [Hz...], "ports": [{"name", "node", "zRef"}],
   "substrate": {"er", "h", "tanDelta", "sigma"}, "process": {"kind", ...},
   "lines": [{"id", "a", "b", "length": m, "width": m (nominal), "piece": index}],
   "resistors": [{"id", "a", "b", "value": ohm, "piece": index}],
   "tolerances": [{"quantity", "scope"}], "boards": [{"draws": [[...] per tolerance]}]}
Per board the draws are applied here (er + d, h + d, widths + the process rule of each quantity, R * (1 + d)):
  etch-bias dW = -2 d, tool-width dW = -d, mill-depth (V-bit) dW = -2 d tan(angle/2), width dW = +d.
Each line: scikit-rf 0.15.4 MLine (t = 0, no roughness, frequency-invariant dielectric, Kirschning-Jansen dispersion)
gives the static Z0 and eps_eff (Hammerstad-Jensen 1980) and eps_eff(f) (Kirschning-Jansen 1982). Its Z0(f) is not
used: 0.15.4 misplaces a bracket in R8, so Z0(f) is written here from the published equations (R. H. Jansen and
M. Kirschning, "Arguments and an accurate model for the power-current formulation of microstrip characteristic
impedance", AEU 37, 1983, pp. 108-112). Losses: conductor Rs*Ki/(Z0(f)*W) with Ki = exp(-1.2 (Z0/eta0)^0.7) (the
current-distribution form MLine uses), dielectric by the filling factor (MLine.alpha_dielectric). Line constants by
the telegrapher's relations from R', L', G', C' (D. M. Pozar, Microwave Engineering, 4th ed., section 2.1), joined
into the network by scripts/reference/skrf_network.py ("graph" mode: ideal junctions + innerconnect).
Output: {"s": [board][freq][i][j] as [re, im]}.
Run: PATH="$(getconf PATH)" python3 scripts/reference/skrf_yield.py < in.json
"""
import json
import math
import os
import sys

sys.path.insert(0, os.path.dirname(__file__))
import skrf_network  # noqa: E402  (restores np.complex and silences the import note)
import numpy as np  # noqa: E402
from skrf_network import rf  # noqa: E402
from skrf.media import MLine  # noqa: E402

C = 299792458.0
MU0 = 4e-7 * math.pi
ETA0 = MU0 * C


def jk_z0_f(z0s, ees, eef, er, u, fn):
    """Jansen & Kirschning 1983, Z0(f) = Z0(0) (R13/R14)^R17, fn = f*h in GHz*mm."""
    R1 = 0.03891 * er ** 1.4
    R2 = 0.267 * u ** 7
    R3 = 4.766 * np.exp(-3.228 * u ** 0.641)
    R4 = 0.016 + (0.0514 * er) ** 4.524
    R5 = (fn / 28.843) ** 12
    R6 = 22.2 * u ** 1.92
    R7 = 1.206 - 0.3144 * np.exp(-R1) * (1 - np.exp(-R2))
    R8 = 1 + 1.275 * (1 - np.exp(-0.004625 * R3 * er ** 1.674 * (fn / 18.365) ** 2.745))
    R9 = 5.086 * R4 * R5 / (0.3838 + 0.386 * R4) * np.exp(-R6) / (1 + 1.2992 * R5) * (er - 1) ** 6 / (1 + 10 * (er - 1) ** 6)
    R10 = 0.00044 * er ** 2.136 + 0.0184
    R11 = (fn / 19.47) ** 6 / (1 + 0.0962 * (fn / 19.47) ** 6)
    R12 = 1 / (1 + 0.00245 * u ** 2)
    R13 = 0.9408 * eef ** R8 - 0.9603
    R14 = (0.9408 - R9) * ees ** R8 - 0.9603
    R15 = 0.707 * R10 * (fn / 12.3) ** 1.097
    R16 = 1 + 0.0503 * er ** 2 * R11 * (1 - np.exp(-(u / 15) ** 6))
    R17 = R7 * (1 - 1.1241 * R12 / R16 * np.exp(-0.026 * fn ** 1.15656 - R15))
    return z0s * (R13 / R14) ** R17


def line_constants(freqs, w, h, er, tand, sigma):
    f = rf.Frequency.from_f(freqs, unit="hz")
    m = MLine(frequency=f, w=w, h=h, t=0.0, ep_r=er, mu_r=1, diel="frequencyinvariant",
                       rho=1 / sigma, tand=tand, rough=0.0, disp="kirschningjansen")
    z0s = np.real(m.Z0) * np.ones(len(freqs))
    ees = np.real(m.ep_reff) * np.ones(len(freqs))
    eef = np.real(m.ep_reff_f) * np.ones(len(freqs))
    z0f = jk_z0_f(z0s, ees, eef, er, w / h, freqs * h * 1e-6)
    rs = np.sqrt(math.pi * freqs * MU0 / sigma)
    ac = rs * np.exp(-1.2 * (z0f / ETA0) ** 0.7) / (z0f * w)
    ad = np.real(m.alpha_dielectric) * np.ones(len(freqs))
    sq = np.sqrt(eef)
    L = z0f * sq / C
    Cp = sq / (z0f * C)
    R = 2 * z0f * ac
    G = 2 * ad / z0f
    om = 2 * math.pi * freqs
    Z = R + 1j * om * L
    Y = G + 1j * om * Cp
    return np.sqrt(Z / Y), np.sqrt(Z * Y)


def width_gain(q, proc):
    if q == "width":
        return 1.0
    if q == "etch-bias":
        return -2.0
    if q == "tool-width":
        return -1.0
    if q == "mill-depth":
        return -2 * math.tan(math.radians(proc["angleDeg"]) / 2)
    return 0.0


def board_spec(spec, draws):
    sub = spec["substrate"]
    er, h = sub["er"], sub["h"]
    tols = spec["tolerances"]
    npieces = 1 + max([ln["piece"] for ln in spec["lines"]] + [r["piece"] for r in spec["resistors"]])
    dw = np.zeros(npieces)
    rfac = np.ones(npieces)

    def at(k, i):
        d = draws[k]
        return d[0] if len(d) == 1 else d[i]

    for k, t in enumerate(tols):
        q = t["quantity"]
        if q == "er":
            er += at(k, 0)
        elif q == "h":
            h += at(k, 0)
        elif q == "resistor":
            for i in range(npieces):
                rfac[i] *= 1 + at(k, i)
        else:
            for i in range(npieces):
                dw[i] += width_gain(q, spec["process"]) * at(k, i)
    freqs = np.array(spec["freqs"], dtype=float)
    lines = []
    for ln in spec["lines"]:
        zc, gamma = line_constants(freqs, ln["width"] + dw[ln["piece"]], h, er, sub["tanDelta"], sub["sigma"])
        lines.append({"id": ln["id"], "a": ln["a"], "b": ln["b"], "length": ln["length"],
                      "z0": [float(np.real(z)) for z in zc], "gamma": [[float(g.real), float(g.imag)] for g in gamma]})
    res = [{"id": r["id"], "a": r["a"], "b": r["b"], "value": r["value"] * rfac[r["piece"]]} for r in spec["resistors"]]
    return {"freqs": spec["freqs"], "lines": lines, "resistors": res, "ports": spec["ports"], "mode": "graph"}


def main():
    spec = json.load(sys.stdin)
    out = []
    for b in spec["boards"]:
        net = skrf_network.build(board_spec(spec, b["draws"]))
        out.append([[[[float(x.real), float(x.imag)] for x in row] for row in sk] for sk in net.s])
    print(json.dumps({"s": out}))


if __name__ == "__main__":
    main()

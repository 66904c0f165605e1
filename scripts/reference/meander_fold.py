"""Transmission phase of a folded coupled pair (a meander's U), from the even/odd-mode equations directly.

Input (stdin, JSON): {"cases": [{"even": {"zc": [re, im], "gamma": [re, im]}, "odd": {...}, "join": {...},
"leg": m, "joinLength": m, "zref": ohm}]}. For each case: each mode is a uniform line with the Z-matrix
z11 = Zc coth(gl), z12 = Zc csch(gl) (D. M. Pozar, Microwave Engineering, 4th ed., 2012, sec. 4.2/4.4 and 7.6);
strip terminals follow from the even/odd split (V1 = Ve + Vo, V2 = Ve - Vo; Ie = (I1 + I2)/2, Io = (I1 - I2)/2).
Terminals: 0 = strip 1 near, 1 = strip 1 far, 2 = strip 2 near, 3 = strip 2 far. The far ends are joined by a line;
the near ends are the ports. Output: {"phase": [rad, ...]} (angle of S21). numpy only; shares no code with core/.
"""
import json
import sys

import numpy as np


def cplx(p):
    return complex(p[0], p[1])


def mode_z(m, length):
    zc, g = cplx(m["zc"]), cplx(m["gamma"])
    gl = g * length
    return np.array([[zc / np.tanh(gl), zc / np.sinh(gl)], [zc / np.sinh(gl), zc / np.tanh(gl)]])


def pair_z(even, odd, length):
    ze, zo = mode_z(even, length), mode_z(odd, length)
    z = np.zeros((4, 4), dtype=complex)
    # terminal (strip s, end a) -> index 2*s + a; sign of strip in the odd mode: +1 strip 1, -1 strip 2
    for s in range(2):
        for a in range(2):
            for t in range(2):
                for b in range(2):
                    sign = (1 if s == 0 else -1) * (1 if t == 0 else -1)
                    z[2 * s + a, 2 * t + b] = (ze[a, b] + sign * zo[a, b]) / 2
    return z


def fold_phase(case):
    y = np.linalg.inv(pair_z(case["even"], case["odd"], case["leg"]))
    yj = np.linalg.inv(mode_z(case["join"], case["joinLength"]))
    far = [1, 3]
    for i in range(2):
        for j in range(2):
            y[far[i], far[j]] += yj[i, j]
    near = [0, 2]
    ynn = y[np.ix_(near, near)]
    ynf = y[np.ix_(near, far)]
    yfn = y[np.ix_(far, near)]
    yff = y[np.ix_(far, far)]
    yport = ynn - ynf @ np.linalg.inv(yff) @ yfn
    z0 = case["zref"]
    eye = np.eye(2)
    s = (eye - z0 * yport) @ np.linalg.inv(eye + z0 * yport)
    return float(np.angle(s[1, 0]))


def main():
    data = json.load(sys.stdin)
    print(json.dumps({"phase": [fold_phase(c) for c in data["cases"]]}))


if __name__ == "__main__":
    main()

#!/usr/bin/env python3
"""Rebuild an edge-coupled band-pass filter (a chain of coupled sections) with numpy and Debian's scikit-rf
(python3-scikit-rf 0.15.4), from the figures `stripwright build --json` reports, and print |S21| and |S11| in dB.

Independent of the project's network code:
- each coupled section is the four-port of its open-circuit impedance matrix, written from the even/odd-mode
  decomposition (E. M. T. Jones and J. T. Bolljahn, IRE Trans. MTT-4, 1956; G. I. Zysman and A. K. Johnson, "Coupled
  transmission line networks in an inhomogeneous dielectric medium", IEEE Trans. MTT-17(10), 753-759, 1969; the
  same form as D. M. Pozar, Microwave Engineering, 4th ed., 2012, section 8.7), with the terminals
  [1 = strip 1 near end, 2 = strip 1 far end, 3 = strip 2 near end, 4 = strip 2 far end]:
      Z11 = (Zce coth(ge l) + Zco coth(go l)) / 2          (same terminal)
      Z12 = (Zce csch(ge l) + Zco csch(go l)) / 2          (same strip, other end)
      Z13 = (Zce coth(ge l) - Zco coth(go l)) / 2          (other strip, same end)
      Z14 = (Zce csch(ge l) - Zco csch(go l)) / 2          (other strip, other end)
  each mode a line of its own Z0, phase constant 2 pi f sqrt(eps_eff)/c0 and, with losses, its conductor loss as a
  series resistance and its dielectric loss as a shunt conductance (Pozar section 2.7); the mode figures are given at
  a few frequencies and interpolated (quadratic in f);
- turned into S by the library (z2s), the open strip ends loaded with their end capacitance to ground, the strips' plain
  runs and the port lines as the library's own microstrip (MLine, t = 0, static Z0, Kirschning-Jansen dispersion; its
  own conductor and dielectric loss when "lossy", each kept in its place as for the modes), every piece in S at the
  ports' impedance and cascaded with the library's Network algebra (connect, **).

Input (stdin): {"freqs": [Hz], "er", "h", "rho", "tand", "lossy": bool, "zref",
  "chain": [{"kind": "line", "width_m", "length_m"} |
            {"kind": "pair", "width_m", "overlap_m", "alone_m": {"a","b","c","d"}, "cap_b_f", "cap_c_f",
             "modes": [{"f_hz", "even": {"z0_ohm","eps_eff","alpha_c_np_m","alpha_d_np_m"}, "odd": {...}}]}]}
  (a pair enters at strip 1's near end and leaves at strip 2's far end; strip 1's far end and strip 2's near end open).
Output: {"s21_db": [...], "s11_db": [...]}.
Run: PATH="$(getconf PATH)" python3 scripts/reference/skrf_bandpass.py < in.json
"""
import contextlib
import io
import json
import sys
import warnings

warnings.filterwarnings("ignore")
import numpy as np  # noqa: E402

if not hasattr(np, "complex"):  # 0.15.4 still uses the alias removed in numpy 1.24
    np.complex = complex
with contextlib.redirect_stdout(io.StringIO()):
    import skrf as rf  # noqa: E402
    from skrf.media import MLine  # noqa: E402

C0 = 299792458.0


def mode_values(modes, name, key, freqs):
    """A mode figure at every frequency, interpolated through the given points (quadratic, or fewer points' degree)."""
    fs = np.array([m["f_hz"] for m in modes], dtype=float)
    vs = np.array([m[name][key] for m in modes], dtype=float)
    deg = min(2, len(fs) - 1)
    if deg == 0:
        return np.full(len(freqs), vs[0])
    scale = fs.mean()
    return np.polyval(np.polyfit(fs / scale, vs, deg), freqs / scale)


def rlgc(z0, beta, ac, ad):
    """Zc and gamma of a line from its lossless Z0 and beta and its conductor and dielectric attenuation: series
    R = 2 Z0 ac beside L, shunt G = 2 ad / Z0 beside C (D. M. Pozar, Microwave Engineering, 4th ed., section 2.7).
    The loss stays where it is made (conductor loss in series, dielectric loss in shunt), which matters in a resonator:
    at a current maximum only the series part dissipates."""
    zs = z0 * (2 * ac + 1j * beta)
    ys = (2 * ad + 1j * beta) / z0
    return np.sqrt(zs / ys), np.sqrt(zs * ys)


def pair_z(seg, freqs, lossy):
    """Open-circuit impedance matrix (n, 4, 4) of the coupled section over its overlap."""
    length = seg["overlap_m"]
    n = len(freqs)
    z = np.zeros((n, 4, 4), dtype=complex)
    parts = {}
    for name in ("even", "odd"):
        v = lambda key: mode_values(seg["modes"], name, key, freqs)  # noqa: E731
        beta = 2 * np.pi * freqs * np.sqrt(v("eps_eff")) / C0
        zc, gamma = rlgc(v("z0_ohm"), beta, v("alpha_c_np_m") if lossy else 0.0, v("alpha_d_np_m") if lossy else 0.0)
        gl = gamma * length
        parts[name] = (zc / np.tanh(gl), zc / np.sinh(gl))
    (ce, se), (co, so) = parts["even"], parts["odd"]
    same, along, beside, across = (ce + co) / 2, (se + so) / 2, (ce - co) / 2, (se - so) / 2
    table = [[same, along, beside, across], [along, same, across, beside], [beside, across, same, along], [across, beside, along, same]]
    for i in range(4):
        for j in range(4):
            z[:, i, j] = table[i][j]
    return z


def mline(f, spec, width, rho, tand):
    return MLine(frequency=f, w=width, h=spec["h"], t=0.0, ep_r=spec["er"], mu_r=1, diel="frequencyinvariant",
                 rho=rho, tand=tand, rough=0.0, disp="kirschningjansen")


def microstrip(f, spec, width, length, zref):
    """A plain run as the library's microstrip: its static Z0 (0.15.4's Z0(f) misplaces a bracket, see skrf_line.py),
    its phase constant, and with losses its conductor attenuation (copper resistivity, no dielectric loss) and the rest
    of its total attenuation as dielectric; as a two-port from its ABCD matrix, in S at zref."""
    n = len(f.f)
    rho = spec.get("rho", 1.72e-8)
    plain = mline(f, spec, width, rho, 0.0)
    z0 = np.real(plain.Z0) * np.ones(n)
    beta = np.imag(plain.gamma) * np.ones(n)
    if spec["lossy"]:
        ac = np.real(plain.gamma) * np.ones(n)
        ad = np.real(mline(f, spec, width, rho, spec.get("tand", 0.0)).gamma) * np.ones(n) - ac
    else:
        ac = ad = 0.0
    zc, gamma = rlgc(z0, beta, ac, ad)
    ch, sh = np.cosh(gamma * length), np.sinh(gamma * length)
    a, b, c, d = ch, zc * sh, sh / zc, ch
    den = a + b / zref + c * zref + d
    s = np.zeros((n, 2, 2), dtype=complex)
    s[:, 0, 0] = (a + b / zref - c * zref - d) / den
    s[:, 0, 1] = 2 * (a * d - b * c) / den
    s[:, 1, 0] = 2 / den
    s[:, 1, 1] = (-a + b / zref - c * zref + d) / den
    return rf.Network(frequency=f, s=s, z0=zref)


def open_end(f, cap, zref):
    """One-port: the end capacitance to ground."""
    w = 2 * np.pi * f.f
    zl = 1.0 / (1j * w * cap) if cap > 0 else np.full(len(f.f), 1e18 + 0j)
    g = (zl - zref) / (zl + zref)
    return rf.Network(frequency=f, s=g.reshape(-1, 1, 1), z0=zref)


def section(f, spec, seg, zref):
    """The coupled section as a two-port from strip 1's near end to strip 2's far end."""
    freqs = f.f
    four = rf.Network(frequency=f, s=rf.z2s(pair_z(seg, freqs, bool(spec["lossy"])), zref), z0=zref)
    alone = seg["alone_m"]

    def load(run, cap):
        end = open_end(f, cap, zref)
        return microstrip(f, spec, seg["width_m"], run, zref) ** end if run > 1e-12 else end

    three = rf.connect(four, 1, load(alone["b"], seg["cap_b_f"]), 0)  # ports: a, c, d
    two = rf.connect(three, 1, load(alone["c"], seg["cap_c_f"]), 0)  # ports: a, d
    if alone["a"] > 1e-12:
        two = microstrip(f, spec, seg["width_m"], alone["a"], zref) ** two
    if alone["d"] > 1e-12:
        two = two ** microstrip(f, spec, seg["width_m"], alone["d"], zref)
    return two


def main():
    spec = json.load(sys.stdin)
    zref = float(spec["zref"])
    f = rf.Frequency.from_f(np.array(spec["freqs"], dtype=float), unit="hz")
    net = None
    for piece in spec["chain"]:
        two = microstrip(f, spec, piece["width_m"], piece["length_m"], zref) if piece["kind"] == "line" else section(f, spec, piece, zref)
        net = two if net is None else net ** two
    db = lambda x: [float(v) for v in 20 * np.log10(np.abs(x))]  # noqa: E731
    json.dump({"s21_db": db(net.s[:, 1, 0]), "s11_db": db(net.s[:, 0, 0])}, sys.stdout)


main()

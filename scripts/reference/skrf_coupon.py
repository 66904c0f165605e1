#!/usr/bin/env python3
"""Synthetic laminate coupons made with Debian's scikit-rf (python3-scikit-rf, 0.15.4 here), for the outside check
of Stripwright's coupon extraction, and scikit-rf's own multiline TRL (NISTMultilineTRL) on the same files.

Run with the system Python:
    PATH="$(getconf PATH)" python3 scripts/reference/skrf_coupon.py OUT_DIR < spec.json > result.json

spec.json (SI units): {"er": 4.3, "tand": 0.018, "h": 1.52e-3, "w": 2.9e-3, "rho": 1.72e-8,
  "lengths": [0.025, 0.045], "f_start": 0.5e9, "f_stop": 6e9, "n": 111, "seed": 1,
  "return_loss_db": 15, "noise": 1e-3}

Each line: t = 0 microstrip of width w on (er, tand, h), from the published equations as scikit-rf implements them
for t = 0 -- MLine's Kirschning-Jansen eps_eff(f) for beta, its dielectric loss (filling-factor form with the
static eps_eff), and the conductor loss in the current-distribution form Rs*exp(-1.2*(Z0/eta0)**0.7)/(Z0*w) with
the static Z0 (MLine's own conductor loss uses its Z0(f), which 0.15.4 gets wrong; see skrf_line.py), frequency-
invariant dielectric, no roughness. The line's S-parameters in 50 ohm follow from gamma and the static Z0 (the
usual line formulas). Both ends get the same random reciprocal connector boxes (one per side; |S11|, |S22| between
half the limit and the limit set by return_loss_db, transmission 0.8-0.97 with a random delay), cascaded with
scikit-rf's ** operator; complex Gaussian noise of rms `noise` is added to every S-parameter (seeded numpy RNG).
Files are written with scikit-rf's own Network.write_touchstone (RI) as OUT_DIR/line<i>.s2p.

The multiline TRL needs a reflect: a short behind each connector box (two_port_reflect), not written as a file.
Printed JSON: freqs, the true gamma, and scikit-rf's NISTMultilineTRL gamma (shortest line as the thru).
"""
import sys
import os
import json
import warnings

warnings.filterwarnings("ignore")

import contextlib  # noqa: E402
import numpy as np  # noqa: E402

for _alias, _type in (("complex", complex), ("float", float), ("int", int)):
    if not hasattr(np, _alias):
        setattr(np, _alias, _type)  # numpy >= 1.24 removed aliases that scikit-rf 0.15.4 still uses

with contextlib.redirect_stdout(sys.stderr):  # the library prints a note about plotting on import
    import skrf  # noqa: E402
    from skrf.media import MLine  # noqa: E402
    from skrf.calibration import NISTMultilineTRL  # noqa: E402
    from skrf.network import two_port_reflect  # noqa: E402

ETA0 = 376.730313668


def line_s(z0, gamma, l, r=50.0):
    e1 = np.exp(-gamma * l)
    g = (z0 - r) / (z0 + r)
    den = 1 - g * g * e1 * e1
    s11 = g * (1 - e1 * e1) / den
    s21 = (1 - g * g) * e1 / den
    s = np.zeros((len(gamma), 2, 2), dtype=complex)
    s[:, 0, 0] = s11
    s[:, 1, 1] = s11
    s[:, 0, 1] = s21
    s[:, 1, 0] = s21
    return s


def box(freq, rng, gmax):
    f = freq.f
    g1, g2 = gmax * (0.5 + 0.5 * rng.random(2))
    p1, p2 = 2 * np.pi * rng.random(2)
    t = 0.8 + 0.17 * rng.random()
    delay = 20e-12 + 60e-12 * rng.random()
    ph = -2 * np.pi * f * delay
    s = np.zeros((len(f), 2, 2), dtype=complex)
    s[:, 0, 0] = g1 * np.exp(1j * (p1 + ph))
    s[:, 1, 1] = g2 * np.exp(1j * (p2 + 1.3 * ph))
    s[:, 1, 0] = t * np.exp(1j * ph)
    s[:, 0, 1] = s[:, 1, 0]
    return skrf.Network(frequency=freq, s=s, z0=50)


def main():
    out = sys.argv[1]
    spec = json.load(sys.stdin)
    rng = np.random.default_rng(spec.get("seed", 1))
    freq = skrf.Frequency(spec["f_start"], spec["f_stop"], spec["n"], unit="hz")
    f = freq.f
    m = MLine(frequency=freq, w=spec["w"], h=spec["h"], t=0.0, ep_r=spec["er"], mu_r=1, diel="frequencyinvariant",
              rho=spec["rho"], tand=spec["tand"], rough=0.0, disp="kirschningjansen")
    z0 = float(np.real(np.atleast_1d(m.Z0))[0])
    beta = 2 * np.pi * f / 299792458.0 * np.sqrt(np.real(m.ep_reff_f))
    alpha_d = np.real(m.alpha_dielectric)
    rs = np.sqrt(np.pi * f * 4e-7 * np.pi * spec["rho"])
    alpha_c = rs * np.exp(-1.2 * (z0 / ETA0) ** 0.7) / (z0 * spec["w"])
    gamma = alpha_d + alpha_c + 1j * beta
    gmax = 10 ** (-spec.get("return_loss_db", 15) / 20)
    a = box(freq, rng, gmax)
    b = box(freq, rng, gmax)
    b_flipped = b.flipped()
    noise = spec.get("noise", 0.0)
    measured = []
    os.makedirs(out, exist_ok=True)
    for i, l in enumerate(spec["lengths"]):
        line = skrf.Network(frequency=freq, s=line_s(z0, gamma, l), z0=50)
        meas = a ** line ** b_flipped
        if noise > 0:
            shape = meas.s.shape
            meas.s = meas.s + noise / np.sqrt(2) * (rng.standard_normal(shape) + 1j * rng.standard_normal(shape))
        meas.name = "line%d" % i
        meas.write_touchstone(filename="line%d" % i, dir=out, form="ri")
        measured.append(meas)
    result = {"skrf": skrf.__version__, "z0": z0, "freqs": f.tolist(), "gamma_true": [gamma.real.tolist(), gamma.imag.tolist()]}
    if len(spec["lengths"]) < 2:  # a single line: files only
        print(json.dumps(result))
        return
    # Multiline TRL: shortest line as the thru, a short behind each box as the reflect.
    order = sorted(range(len(spec["lengths"])), key=lambda k: spec["lengths"][k])
    short = skrf.Network(frequency=freq, s=-np.ones((len(f), 1, 1), dtype=complex), z0=50)
    refl = two_port_reflect(a ** short, b ** short)
    lens = [spec["lengths"][k] for k in order]
    with contextlib.redirect_stdout(sys.stderr):
        cal = NISTMultilineTRL(measured=[measured[order[0]], refl] + [measured[k] for k in order[1:]], Grefls=[-1],
                               l=lens, er_est=spec["er"], refl_offset=[-lens[0] / 2])
        cal.run()
    g = np.asarray(cal.gamma)
    result["gamma_mtrl"] = [g.real.tolist(), g.imag.tolist()]
    print(json.dumps(result))


if __name__ == "__main__":
    main()

#!/usr/bin/env python3
"""Regenerate microstrip reference values with Debian's scikit-rf (python3-scikit-rf, 0.15.4 here).

Run with the system Python, not a virtual environment:
    PATH="$(getconf PATH)" python3 scripts/reference/skrf_line.py > /tmp/skrf-line.csv
    PATH="$(getconf PATH)" python3 scripts/reference/skrf_line.py --bench 100000   (timing only, prints JSON)

Grid: er {2.2, 3.0, 3.66, 4.4, 6.15, 9.8, 10.2} x W/h {0.1, 0.3, 1, 2, 5, 10} x h {0.254, 0.508, 0.79, 1.52} mm
x f {0.1, 1, 5, 10, 24} GHz, t = 0, tand 0.002, rho 1.72e-8, roughness 0, frequency-invariant dielectric,
Kirschning-Jansen dispersion.

Only t = 0 is used, and only the static Z0 and eps_eff, eps_eff(f) and the dielectric loss are written: the 0.15.4
release evaluates the Hammerstad-Jensen thickness term with t in metres instead of t/h, divides by the
thickness-corrected eps_eff in Z0, and misplaces a bracket in the Z0-dispersion term R8, so its Z0(f), conductor
loss and every thickness-dependent value differ from the published equations. Its dielectric loss uses the static
eps_eff (the published form).

Output columns (SI): er,h_m,w_m,f_hz,tand,z0_static,eps_eff_static,eps_eff_f,alpha_d_np_per_m
"""
import sys
import time
import json
import warnings

warnings.filterwarnings("ignore")

import contextlib  # noqa: E402
import numpy as np  # noqa: E402

with contextlib.redirect_stdout(sys.stderr):  # the library prints a note about plotting on import
    import skrf  # noqa: E402
    from skrf.media import MLine  # noqa: E402

ERS = [2.2, 3.0, 3.66, 4.4, 6.15, 9.8, 10.2]
US = [0.1, 0.3, 1.0, 2.0, 5.0, 10.0]
HS = [0.254e-3, 0.508e-3, 0.79e-3, 1.52e-3]
FS = [0.1e9, 1e9, 5e9, 10e9, 24e9]
TAND = 0.002
RHO = 1.72e-8


def mline(f, w, h, er, tand):
    freq = skrf.Frequency.from_f(np.atleast_1d(np.asarray(f, dtype=float)), unit="hz")
    return MLine(frequency=freq, w=w, h=h, t=0.0, ep_r=er, mu_r=1, diel="frequencyinvariant",
                 rho=RHO, tand=tand, rough=0.0, disp="kirschningjansen")


def grid():
    print(f"# scikit-rf {skrf.__version__}, numpy {np.__version__}; t = 0 (see the script's notes)")
    print("er,h_m,w_m,f_hz,tand,z0_static,eps_eff_static,eps_eff_f,alpha_d_np_per_m")
    for er in ERS:
        for u in US:
            for h in HS:
                w = u * h
                m = mline(FS, w, h, er, TAND)
                z0 = np.real(m.Z0) * np.ones(len(FS))
                ee = np.real(m.ep_reff) * np.ones(len(FS))
                eef = np.real(m.ep_reff_f)
                ad = np.real(m.alpha_dielectric)
                for i, f in enumerate(FS):
                    print(f"{er!r},{h!r},{w!r},{f!r},{TAND!r},{z0[i]!r},{ee[i]!r},{eef[i]!r},{ad[i]!r}")


def bench(n):
    """Time n analyses vectorised by the library (static + dispersion + dielectric loss), one call; CPU time."""
    rng = np.random.default_rng(1)
    h = 0.79e-3
    w = h * 10 ** rng.uniform(-1, 1, n)
    f = 10 ** rng.uniform(8, 10, n)
    best = float("inf")
    for _ in range(3):
        t0 = time.process_time()
        m = mline(f, w, h, 4.4, 0.02)
        _ = (np.real(m.Z0), np.real(m.ep_reff_f), np.real(m.Z0_f), np.real(m.alpha_dielectric))
        best = min(best, time.process_time() - t0)
    print(json.dumps({"n": n, "seconds": best, "per_second": n / best, "skrf": skrf.__version__, "numpy": np.__version__}))


if __name__ == "__main__":
    if len(sys.argv) == 3 and sys.argv[1] == "--bench":
        bench(int(sys.argv[2]))
    elif len(sys.argv) == 1:
        grid()
    else:
        sys.exit("usage: skrf_line.py [--bench N]")

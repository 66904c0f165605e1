"""Γ → Z and VSWR with Debian's scikit-rf 0.15.4, for the Smith-chart readout test.

Reads JSON {"z0": ohms, "gamma": [[re, im], ...]} on stdin; writes {"z": [[re, im], ...], "vswr": [...]}.
Uses skrf.network.s2z on 1-port data and skrf's own Network.s_vswr.
"""
import io, json, sys, contextlib
import numpy as np
if not hasattr(np, 'complex'): np.complex = complex  # 0.15.4 still uses the removed alias
with contextlib.redirect_stdout(io.StringIO()):  # 0.15.4 prints a matplotlib note on import
    import skrf as rf

data = json.load(sys.stdin)
g = np.array([complex(a, b) for a, b in data["gamma"]]).reshape(-1, 1, 1)
z = rf.network.s2z(g, data["z0"]).reshape(-1)
net = rf.Network(frequency=rf.Frequency(1, len(g), len(g), 'ghz'), s=g, z0=data["z0"])
print(json.dumps({"z": [[v.real, v.imag] for v in z], "vswr": [float(v) for v in net.s_vswr.reshape(-1)]}))

"""Oracle for the response solver: builds a network of lines (given Z0 and gamma per frequency), series
resistors and ports with scikit-rf (Debian python3-scikit-rf 0.15.4) and prints its S-matrix as JSON.

Input (JSON on stdin):
  {"freqs": [Hz...],
   "lines": [{"id", "a", "b", "length": m, "z0": [ohm per freq], "gamma": [[re, im] per freq]}],
   "resistors": [{"id", "a", "b", "value": ohm}],
   "transformers": [{"id", "a", "b", "n": [per freq]}]   (optional; ideal, V_b = n V_a),
   "ports": [{"name", "node", "zRef": ohm}],
   "mode": "cascade" | "graph" | "grow", "repeat": N (optional, for timing)}
"cascade": the lines form one chain from ports[0] to ports[1] and are joined with skrf's `**`.
"graph": every node becomes an ideal junction (media.splitter, or media.open for a lone end) and all pieces are
joined with skrf.network.innerconnect ("graph": all side by side first; "grow": one piece at a time with
skrf.network.connect, the usual way for large networks); scikit-rf inserts the impedance steps between pieces whose
port impedances differ.
Output: {"s": [[[[re, im] ...]]] (freq, i, j), "seconds": build+solve time of one run}.
A line may give "lengths" (m, one per frequency) instead of "length": a line whose reference planes move with
frequency (a tee's arms); it is built as a 1 m line of propagation constant gamma(f)*lengths(f), which is the same
two-port. An ideal transformer (V_b = n V_a, I_b = -I_a / n) has, for equal real references, S11 = (1 - n^2)/(1 + n^2),
S22 = -S11, S21 = S12 = 2n/(1 + n^2) (from its ABCD matrix [1/n, 0; 0, n], D. M. Pozar, Microwave Engineering,
4th ed., Table 4.2).
Lines use a real characteristic impedance (scikit-rf 0.15.4 labels a line with its media's port impedance, so
the line's media gets z0 = Z0 = the given real value) and a complex gamma.
Run: PATH="$(getconf PATH)" python3 scripts/reference/skrf_network.py < in.json
"""
import json
import sys
import time
import warnings

warnings.filterwarnings("ignore")
import contextlib  # noqa: E402
import io  # noqa: E402
import numpy as np  # noqa: E402

# scikit-rf 0.15.4 still uses the alias np.complex, removed in numpy 1.24 (Debian ships 1.24): restore the alias
# (it was always the builtin complex) so the library's own resistor and conversions run.
if not hasattr(np, "complex"):
    np.complex = complex
with contextlib.redirect_stdout(io.StringIO()):  # it prints a note about matplotlib on import
    import skrf as rf  # noqa: E402


def build(spec):
    f = rf.Frequency.from_f(np.array(spec["freqs"]), unit="hz")
    nets = []  # (network, [terminal node names])

    def line_net(ln):
        z0 = np.array(ln["z0"], dtype=float)
        gamma = np.array([complex(g[0], g[1]) for g in ln["gamma"]])
        if "lengths" in ln:
            gamma = gamma * np.array(ln["lengths"], dtype=float)
            media = rf.media.DefinedGammaZ0(frequency=f, z0=z0, gamma=gamma, Z0=z0)
            return media.line(1.0, "m", name=ln["id"])
        media = rf.media.DefinedGammaZ0(frequency=f, z0=z0, gamma=gamma, Z0=z0)
        return media.line(ln["length"], "m", name=ln["id"])

    if spec.get("mode") == "cascade":
        p0, p1 = spec["ports"][0], spec["ports"][1]
        m0 = rf.media.DefinedGammaZ0(frequency=f, z0=p0["zRef"], Z0=p0["zRef"])
        m1 = rf.media.DefinedGammaZ0(frequency=f, z0=p1["zRef"], Z0=p1["zRef"])
        ntw = m0.line(0, "m", name="in")
        for ln in spec["lines"]:
            ntw = ntw ** line_net(ln)
        ntw = ntw ** m1.line(0, "m", name="out")
        return ntw

    for ln in spec["lines"]:
        nets.append((line_net(ln), [ln["a"], ln["b"]]))
    for r in spec.get("resistors", []):
        m50 = rf.media.DefinedGammaZ0(frequency=f, z0=50.0, Z0=50.0)
        nets.append((m50.resistor(r["value"], name=r["id"]), [r["a"], r["b"]]))
    for t in spec.get("transformers", []):
        n = np.array(t["n"], dtype=float)
        sx = np.zeros((len(f), 2, 2), dtype=complex)
        sx[:, 0, 0] = (1 - n ** 2) / (1 + n ** 2)
        sx[:, 1, 1] = -(1 - n ** 2) / (1 + n ** 2)
        sx[:, 0, 1] = sx[:, 1, 0] = 2 * n / (1 + n ** 2)
        nets.append((rf.Network(frequency=f, s=sx, z0=50.0, name=t["id"]), [t["a"], t["b"]]))
    # Terminals per node, then one ideal junction per node (plus one terminal for a port there).
    degree = {}
    for _, nodes in nets:
        for n in nodes:
            degree[n] = degree.get(n, 0) + 1
    port_at = {}
    for k, p in enumerate(spec["ports"]):
        port_at.setdefault(p["node"], []).append(k)
    # Edge labels: piece terminal t of piece i is edge ("p", i, t); junction ports are ordered:
    # external ports first, then the pieces' terminals.
    items = []  # (network, [edge label per port])
    piece_edges = []
    for i, (ntw, nodes) in enumerate(nets):
        piece_edges.append([("e", i, t) for t in range(len(nodes))])
    junction_ports = {n: [] for n in degree}
    for k, p in enumerate(spec["ports"]):
        junction_ports[p["node"]].append(("x", k))
    for i, (_, nodes) in enumerate(nets):
        for t, n in enumerate(nodes):
            junction_ports[n].append(("e", i, t))
    for i, (ntw, nodes) in enumerate(nets):
        items.append((ntw, piece_edges[i]))
    for n, labels in junction_ports.items():
        zj = spec["ports"][port_at[n][0]]["zRef"] if n in port_at else 50.0
        mj = rf.media.DefinedGammaZ0(frequency=f, z0=zj, Z0=zj)
        # A lone terminal is an open end (splitter(1) divides by zero in 0.15.4).
        j = mj.open(name="j_" + n) if len(labels) == 1 else mj.splitter(len(labels), name="j_" + n)
        items.append((j, labels))
    if spec.get("mode") == "grow":
        big, labels = grow(items)
    else:
        big, labels = side_by_side(f, items)
    order = [labels.index(("x", k)) for k in range(len(spec["ports"]))]
    s = big.s[:, order][:, :, order]
    out = rf.Network(frequency=f, s=s, z0=np.array([p["zRef"] for p in spec["ports"]], dtype=float))
    return out


def side_by_side(f, items):
    """All pieces side by side as one block-diagonal network, then every shared edge joined with skrf's
    innerconnect (which keeps the other ports in order and inserts the impedance step between unequal ports).
    Exact for any topology; memory grows with the square of all pieces' ports, so only for small networks."""
    nports = sum(ntw.nports for ntw, _ in items)
    s_all = np.zeros((len(f), nports, nports), dtype=complex)
    z_all = np.zeros((len(f), nports), dtype=complex)
    labels = []
    at = 0
    for ntw, lab in items:
        n = ntw.nports
        s_all[:, at:at + n, at:at + n] = ntw.s
        z_all[:, at:at + n] = ntw.z0
        labels += lab
        at += n
    big = rf.Network(frequency=f, s=s_all, z0=z_all)
    return close_loops(big, labels)


def close_loops(big, labels):
    while True:
        dup = [x for x in labels if x[0] == "e" and labels.count(x) == 2]
        if not dup:
            return big, labels
        x = dup[0]
        i1 = labels.index(x)
        i2 = labels.index(x, i1 + 1)
        big = rf.innerconnect(big, i1, i2)
        labels = [y for j, y in enumerate(labels) if j not in (i1, i2)]


def grow(items):
    """The usual way of building a large network with scikit-rf: start from one piece and connect the others one
    by one with skrf.network.connect (loops closed with innerconnect). skrf 0.15.4's connect() moves the
    remaining port of a 2-port `ntwkB` back to position k; a 2-port is therefore always passed as `ntwkA`, where
    the result is simply its other port followed by the big network's remaining ports."""
    big, labels = items[0][0], list(items[0][1])
    rest = list(items[1:])
    while rest:
        for idx, (ntw, lab) in enumerate(rest):
            shared = [e for e in lab if e[0] == "e" and e in labels]
            if shared:
                break
        else:
            raise SystemExit("network is not connected")
        ntw, lab = rest.pop(idx)
        e = shared[0]
        k, l = labels.index(e), lab.index(e)
        if ntw.nports == 2:
            big = rf.connect(ntw, l, big, k)
            labels = [x for j, x in enumerate(lab) if j != l] + [x for j, x in enumerate(labels) if j != k]
        else:
            big = rf.connect(big, k, ntw, l)
            labels = [x for j, x in enumerate(labels) if j != k] + [x for j, x in enumerate(lab) if j != l]
        big, labels = close_loops(big, labels)
    return big, labels


def main():
    spec = json.load(sys.stdin)
    repeat = int(spec.get("repeat", 1))
    t0 = time.perf_counter()
    for _ in range(repeat):
        ntw = build(spec)
    seconds = (time.perf_counter() - t0) / repeat
    s = [[[[float(v.real), float(v.imag)] for v in row] for row in m] for m in ntw.s]
    json.dump({"s": s, "seconds": seconds}, sys.stdout)


if __name__ == "__main__":  # skrf_yield.py imports build() from here
    main()

#!/usr/bin/python3
"""Independent reference solution of swaysheet scenarios with a hook block
and rigging (load.hook), with SciPy.

Run with Debian's /usr/bin/python3 (python3-scipy, python3-numpy):

    /usr/bin/python3 testdata/reference/double.py generate   # writes results_double.json
    /usr/bin/python3 testdata/reference/double.py show FILE.json [--rtol 1e-13]

`make reference` runs the first after reference.py. The Go test
core/sway/reference_double_test.go compares the core with the committed
results_double.json; it needs no Python.

Formulation
-----------
The core integrates the rope direction n1 and the rigging direction n2
(unit vectors and their rates, projected back after every step) and solves
a 2x2 system for the two tensions (core/pendulum/double.go). This script
shares none of that: it integrates the Cartesian positions and velocities
of the hook block P1 (mass m1) and of the load P2 (mass m2) in the ground
frame, 12 numbers, with two distance constraints

    c1 = (r1.r1 - L1(t)^2) / 2 = 0,   r1 = P1 - S(t)   (rope, suspension point to hook)
    c2 = (r2.r2 - L2^2) / 2 = 0,      r2 = P2 - P1     (rigging, hook to the load's centre of mass)

whose Lagrange multipliers l1 = T1/|r1| and l2 = T2/|r2| give the rope
tension T1 and the rigging tension T2. Newton's law for both masses,

    m1 P1'' = m1 a1 - l1 r1 + l2 r2,    m2 P2'' = m2 a2 - l2 r2,

with a1 = g_vec and a2 = g_vec + F/m2 (wind and drag act on the load, as
the core documents), put into the stabilised constraints
c_i'' + 2 w_i c_i' + w_i^2 c_i = 0 (Baumgarte, Comput. Methods Appl. Mech.
Eng. 1, 1972; w_i = sqrt(g_n / L_i)) give two linear equations in l1, l2:

    (r1.r1/m1) l1 - (r1.r2/m1) l2             = r1.(a1 - S'') + q1
    -(r1.r2/m1) l1 + r2.r2 (1/m1 + 1/m2) l2   = r2.(a2 - a1) + q2

    q1 = r1'.r1' - L1'^2 - L1 L1'' + 2 w1 c1' + w1^2 c1,
    q2 = r2'.r2' + 2 w2 c2' + w2^2 c2,

solved here with numpy.linalg.solve. The motions, the suspension point,
the rope length, wind and drag are those of reference.py (imported).
SciPy's solve_ivp(method="DOP853") at rtol = atol = 1e-12, restarted at
every motion breakpoint, as in reference.py.

The sway period the core reports for a double is the slower of the two
small-swing modes; here it comes from the eigenvalues of the linearised
equations K v = w^2 M v with M = [[(m1+m2) L1^2, m2 L1 L2], [m2 L1 L2,
m2 L2^2]] and K = diag((m1+m2) g L1, m2 g L2) (numpy.linalg.eigvals), where
the core uses the closed form.

Figures, each under the name the core's result JSON uses: period_s,
mode_periods_s, run_s, motion_end_s, peak_swing_deg (the line from the
suspension point to the load, from the vertical), peak_excursion_m,
residual_swing_deg and residual_excursion_m (after the last motion),
tension_max_n / tension_min_n (rope), tension_factor = tension_max_n /
((m1 + m2) g), and for the rigging block: peak_rope_swing_deg (the rope
itself), peak_rigging_angle_deg (between rope and rigging),
rigging_tension_max_n, rigging_tension_min_n; sampled states at a few
history sample times.
"""

import glob
import json
import math
import os
import platform
import sys
import time

import numpy as np
import scipy
from scipy.integrate import solve_ivp

HERE = os.path.dirname(os.path.abspath(__file__))
sys.path.insert(0, HERE)
import reference as ref  # noqa: E402  (motions, suspension point, wind: shared on purpose)

G_N = ref.G_N
DEG = ref.DEG
RTOL = ATOL = 1e-12
ROOT = ref.ROOT
RESULTS = os.path.join(HERE, "results_double.json")

# Scenario files with a hook block the reference covers (the planner's moves
# under a hook block, planned-*.json, live in testdata/reference/scenarios/
# beside the single-pendulum ones). Those without anything that moves are
# left out.
SCENARIO_GLOBS = ["testdata/scenarios/*.json", "testdata/reference/double/*.json",
                  "testdata/reference/scenarios/*.json"]


# Small-swing mode periods, slower first, from numpy's eigenvalues of the
# linearised two-mass pendulum (defined in reference.py, which also designs
# a hook-block shaper for the slower one).
linear_periods = ref.linear_periods


class DoubleModel(ref.Model):
    """A scenario with load.hook as the constrained Cartesian equations above."""

    def __init__(self, sc):
        super().__init__(sc)
        hook = sc["load"]["hook"]
        self.m1 = hook["mass_kg"]
        self.m2 = self.m  # the load
        self.l2 = hook["rigging_length_m"]
        st = sc.get("settings") or {}
        settle = st.get("settle_periods", 0) or 3.0
        self.mode_periods = linear_periods(self.m1, self.m2, self.l_end, self.l2)
        self.period = self.mode_periods[0]
        self.t_end = max(self.activity_end + settle * self.period, st.get("duration_s", 0.0))
        self.breaks = [b for b in self.breaks if b < self.t_end - 1e-12]

    def multipliers(self, t, y):
        p1, v1, p2, v2 = y[0:3], y[3:6], y[6:9], y[9:12]
        s, ds, dds = self.suspension(t)
        l1, dl1, ddl1 = self.rope(t)
        l2 = self.l2
        r1, dr1 = p1 - s, v1 - ds
        r2, dr2 = p2 - p1, v2 - v1
        a1 = np.array([0.0, 0.0, -G_N])
        a2 = self.applied(t, v2)  # gravity, wind and drag on the load, per kg of load
        c1, dc1 = 0.5 * (r1 @ r1 - l1 * l1), r1 @ dr1 - l1 * dl1
        c2, dc2 = 0.5 * (r2 @ r2 - l2 * l2), r2 @ dr2
        w1, w2 = math.sqrt(G_N / l1), math.sqrt(G_N / l2)
        q1 = dr1 @ dr1 - dl1 * dl1 - l1 * ddl1 + 2 * w1 * dc1 + w1 * w1 * c1
        q2 = dr2 @ dr2 + 2 * w2 * dc2 + w2 * w2 * c2
        im1, im2 = 1.0 / self.m1, 1.0 / self.m2
        k12 = r1 @ r2
        a = np.array([[(r1 @ r1) * im1, -k12 * im1], [-k12 * im1, (r2 @ r2) * (im1 + im2)]])
        b = np.array([r1 @ (a1 - dds) + q1, r2 @ (a2 - a1) + q2])
        lam = np.linalg.solve(a, b)
        return lam, r1, r2, a1, a2, s

    def rhs(self, t, y):
        (lam1, lam2), r1, r2, a1, a2, _ = self.multipliers(t, y)
        acc1 = a1 + (-lam1 * r1 + lam2 * r2) / self.m1
        acc2 = a2 - lam2 * r2 / self.m2
        return np.concatenate((y[3:6], acc1, y[9:12], acc2))

    def initial(self):
        """Rope and rigging in line at the initial swing angle, swinging
        together so that the load moves horizontally at the given velocity
        relative to the suspension point (as core/pendulum documents for
        DoubleStateFromSwing)."""
        ini = self.sc.get("initial") or {}
        th = ini.get("swing_deg", 0.0) * DEG
        az = ini.get("toward_deg", 0.0) * DEG
        s, ds, _ = self.suspension(0.0)
        l1, dl1, _ = self.rope(0.0)
        big = l1 + self.l2
        n = np.array([math.sin(th) * math.cos(az), math.sin(th) * math.sin(az), -math.cos(th)])
        ux, uy = ini.get("velocity_x_m_per_s", 0.0) / big, ini.get("velocity_y_m_per_s", 0.0) / big
        uz = -(n[0] * ux + n[1] * uy) / n[2]
        u = np.array([ux, uy, uz])
        p1 = s + l1 * n
        v1 = ds + dl1 * n + l1 * u
        return np.concatenate((p1, v1, p1 + self.l2 * n, v1 + self.l2 * u))


def figures(model, t, y):
    """Per point: swing of the line suspension-to-load (rad), excursion (m),
    rope tension (N), rope angle (rad), rope-to-rigging angle (rad),
    rigging tension (N)."""
    (lam1, lam2), r1, r2, _, _, s = model.multipliers(t, y)
    d = y[6:9] - s
    h = math.hypot(d[0], d[1])
    rig = math.atan2(np.linalg.norm(np.cross(r1, r2)), r1 @ r2)
    return (math.atan2(h, -d[2]), h, lam1 * math.sqrt(r1 @ r1),
            math.atan2(math.hypot(r1[0], r1[1]), -r1[2]), rig, lam2 * math.sqrt(r2 @ r2))


NAMES = ["swing", "exc", "ten", "rope", "rig", "rigten"]
# Maxima tracked: each figure and, for tensions, the minimum as a maximum of minus it.
TRACKS = [("swing", 0, 1.0), ("exc", 1, 1.0), ("ten", 2, 1.0), ("neg_ten", 2, -1.0),
          ("rope", 3, 1.0), ("rig", 4, 1.0), ("rigten", 5, 1.0), ("neg_rigten", 5, -1.0)]


def solve(model, rtol=RTOL, atol=ATOL, per_step=8):
    edges = [0.0] + model.breaks + [model.t_end]
    y = model.initial()
    peaks = {k: ref.Peak() for k, _, _ in TRACKS}
    peaks["res_swing"], peaks["res_exc"] = ref.Peak(), ref.Peak()
    sample_times = [round(f * (model.samples - 1)) * (model.t_end / (model.samples - 1))
                    for f in ref.SAMPLE_FRACTIONS]
    sample_times[-1] = model.t_end
    samples = {}
    nfev = steps = 0
    max_err = 0.0
    for a, b in zip(edges[:-1], edges[1:]):
        if b <= a:
            continue
        sol = solve_ivp(model.rhs, (a, b), y, method="DOP853", rtol=rtol, atol=atol, dense_output=True)
        if not sol.success:
            raise RuntimeError("solve_ivp failed on [%g, %g]: %s" % (a, b, sol.message))
        nfev += sol.nfev
        steps += len(sol.t) - 1
        residual = a >= model.motion_end - 1e-12
        ts = sol.t
        for i in range(len(ts) - 1):
            tt = np.linspace(ts[i], ts[i + 1], per_step + 1)
            yy = sol.sol(tt)
            vals = np.array([figures(model, tt[j], yy[:, j]) for j in range(len(tt))])
            for name, col, sgn in TRACKS:
                targets = [peaks[name]]
                if residual and name in ("swing", "exc"):
                    targets.append(peaks["res_" + name])
                v = sgn * vals[:, col]
                j = int(np.argmax(v))
                tm, vm = tt[j], v[j]
                lo, hi = max(j - 1, 0), min(j + 1, per_step)
                if vm >= min(p.v for p in targets) - 1e-2 * abs(vm):
                    def f(t_, col=col, sgn=sgn):
                        return sgn * figures(model, t_, sol.sol(t_))[col]
                    t2, v2 = ref.golden_max(f, tt[lo], tt[hi])
                    if v2 > vm:
                        tm, vm = t2, v2
                for p in targets:
                    p.offer(vm, tm)
        for st in sample_times:
            if a - 1e-12 <= st <= b + 1e-12 and st not in samples:
                ys = sol.sol(st)
                sw, _, ten, _, _, rten = figures(model, st, ys)
                s = model.suspension(st)[0]
                d = ys[6:9] - s
                samples[st] = {
                    "time_s": st, "rel_x_m": d[0], "rel_y_m": d[1], "rel_z_m": d[2],
                    "suspension_x_m": s[0], "suspension_y_m": s[1],
                    "swing_deg": sw / DEG, "tension_n": ten, "rigging_tension_n": rten,
                    "rope_m": model.rope(st)[0],
                }
        y = sol.y[:, -1]
        s = model.suspension(b)[0]
        l1 = model.rope(b)[0]
        max_err = max(max_err, abs(np.linalg.norm(y[0:3] - s) - l1) / l1,
                      abs(np.linalg.norm(y[6:9] - y[0:3]) - model.l2) / model.l2)
    if model.motion_end >= model.t_end:
        raise RuntimeError("no residual window")
    w = (model.m1 + model.m2) * G_N
    return {
        "period_s": model.period,
        "mode_periods_s": model.mode_periods,
        "run_s": model.t_end,
        "motion_end_s": model.motion_end,
        "rope_length_end_m": model.l_end,
        "wind_force_n": model.wind_force,
        "peak_swing_deg": peaks["swing"].v / DEG,
        "peak_swing_time_s": peaks["swing"].t,
        "peak_excursion_m": peaks["exc"].v,
        "residual_swing_deg": peaks["res_swing"].v / DEG,
        "residual_excursion_m": peaks["res_exc"].v,
        "tension_max_n": peaks["ten"].v,
        "tension_min_n": -peaks["neg_ten"].v,
        "tension_factor": peaks["ten"].v / w,
        "rigging": {
            "peak_rope_swing_deg": peaks["rope"].v / DEG,
            "peak_rigging_angle_deg": peaks["rig"].v / DEG,
            "rigging_tension_max_n": peaks["rigten"].v,
            "rigging_tension_min_n": -peaks["neg_rigten"].v,
        },
        "samples": [samples[t] for t in sorted(samples)],
        "solver": {"steps": steps, "nfev": nfev, "length_rel_error": max_err},
    }


def covered(sc):
    """Whether the scenario has a hook block and something that moves (a
    motion profile reference.py does not rebuild stops the run there)."""
    return "hook" in sc.get("load", {}) and ref.moves(sc)


def scenario_paths():
    out = []
    for g in SCENARIO_GLOBS:
        out += sorted(glob.glob(os.path.join(ROOT, g)))
    return [os.path.relpath(p, ROOT) for p in out]


def cmd_generate(args):
    entries = []
    for rel in scenario_paths():
        sc = ref.load(os.path.join(ROOT, rel))
        if not covered(sc):
            continue
        t0 = time.perf_counter()
        res = solve(DoubleModel(sc))
        print("%-52s peak %8.5f deg  residual %8.5f deg  rigging %8.5f deg  %6.2f s" % (
            rel, res["peak_swing_deg"], res["residual_swing_deg"], res["rigging"]["peak_rigging_angle_deg"],
            time.perf_counter() - t0), file=sys.stderr)
        entries.append({"scenario": rel, "result": res})
    doc = {
        "what": "Reference results for swaysheet scenarios with a hook block and rigging, from testdata/reference/double.py",
        "formulation": "Cartesian hook and load positions and velocities; rope and rigging tensions as the Lagrange "
                       "multipliers of two distance constraints; Baumgarte stabilisation with w_i = sqrt(g/L_i)",
        "solver": "scipy.integrate.solve_ivp, method DOP853, rtol %g, atol %g, restarted at every motion "
                  "breakpoint; peaks located on the dense output by golden-section search" % (RTOL, ATOL),
        "scipy": scipy.__version__,
        "numpy": np.__version__,
        "python": platform.python_version(),
        "scenarios": entries,
    }
    with open(RESULTS, "w") as f:
        json.dump(doc, f, indent=1)
        f.write("\n")
    print("wrote %s (%d scenarios)" % (os.path.relpath(RESULTS, ROOT), len(entries)), file=sys.stderr)


def main():
    ref.generate_show_cli(__doc__, "results_double.json", cmd_generate, DoubleModel, solve)


if __name__ == "__main__":
    main()

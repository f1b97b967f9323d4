#!/usr/bin/python3
"""Independent reference solution of swaysheet scenarios with SciPy.

Run with Debian's /usr/bin/python3 (python3-scipy, python3-numpy):

    /usr/bin/python3 testdata/reference/reference.py generate   # writes results.json
    /usr/bin/python3 testdata/reference/reference.py show FILE.json
    /usr/bin/python3 testdata/reference/reference.py time FILE.json --rtol 1e-8 --atol 1e-10
    /usr/bin/python3 testdata/reference/reference.py time FILE.json --target-position-error-m 3e-6

`make reference` runs the first. The Go tests in core/sway compare the core
with the committed results.json; they need no Python.

Why a second solver
-------------------
The core integrates the rope direction unit vector n and dn/dt, projected
back onto |n| = 1 after every step, with its own Dormand-Prince 5(4) code.
This script shares none of that: it integrates the load's Cartesian
position P and velocity V in the ground frame, with the rope as a distance
constraint whose tension is a Lagrange multiplier, using SciPy's
solve_ivp(method="DOP853") (Hairer, Norsett & Wanner's 8(5,3) pair) at
rtol = atol = 1e-12.

Equations. Let S(t) be the suspension point, L(t) the rope length,
r = P - S the rope vector, a(t, P, V) = g_vec + F/m the applied
acceleration (gravity -g_n*z, wind rising as a step or a ramp, quadratic
drag on the load's velocity relative to the air, as core/scenario's Wind
documents it; see Model.__init__ and Model.applied). The constraint is

    c(r, t) = (r.r - L^2) / 2 = 0,
    c'  = r.r' - L L',
    c'' = r.r'' + r'.r' - L'^2 - L L''.

Newton's law for the load is P'' = a - mu r, with mu = T / (m |r|) >= 0 the
multiplier (T the rope tension). Putting r'' = a - S'' - mu r into the
stabilised constraint c'' + 2 w c' + w^2 c = 0 (Baumgarte, Comput. Methods
Appl. Mech. Eng. 1, 1972) gives

    mu = [ r.(a - S'') + r'.r' - L'^2 - L L'' + 2 w c' + w^2 c ] / (r.r)

with w = sqrt(g_n / L(t)). On the exact solution c = c' = 0 and the
stabilising terms vanish; they only stop the drift of the rope length.

Motions are rebuilt from the documentation of the scenario format and the
profiles (core/scenario, DEVELOPERS.md "Motion profiles", the doc comments
of core/motion and core/shaper), not from the core's code: every profile
(trapezoid, s_curve, steps, hard_stop, sine_ramp, series from CSV with
speed or position columns) and any of them through a ZV, ZVD or EI shaper, one- or
two-mode (PROFILES and build_move below); moves on one axis are summed.
Travel on x and y; slew about the vertical axis through the origin at
radius r (which a "radius" move changes); hoist positive up (rope
shortens). The suspension point is the complex number
z = x + i y + r e^{i phi}, whose derivatives follow from differentiating
that product. Where the core builds every profile from spans of constant
jerk, the S-curve here is the moving average of the trapezoid through the
exact antiderivative of its position, the position spline is SciPy's
CubicSpline(bc_type="clamped"), and a shaped move sums the shifted base
move at each call.

Figures reported, each as the result JSON of the core names it:
period_s (2 pi sqrt(L_end/g)), peak_swing_deg and its time, peak_excursion_m
(horizontal distance of load from the point under the suspension point),
residual_swing_deg and residual_excursion_m (largest after the last motion
has ended, to the end of the run), tension_max_n, tension_min_n,
tension_factor = tension_max_n / (m g), run_s, motion_end_s, and sampled
states at a few of the history sample times.

Scenarios solved: every file in testdata/scenarios and
testdata/reference/scenarios without a hook block (double.py takes those)
that has something moving the load (a motion, wind or an initial swing;
the planning examples hold no motions and are skipped).

The planner's moves
-------------------
testdata/reference/planned.py (`make planned`) writes the recommended
option's move and one other shaped option's of each planning example
(testdata/scenarios/plan-*.json) as testdata/reference/scenarios/planned-*.json,
at the nominal rope length and both ends of the range; then run
`make reference`. A new motion profile goes into PROFILES below (a function
of the motion returning an object with at(t) -> (pos, vel, acc),
breakpoints() and end()), derived from that profile's documentation; the
script stops with a clear message on an unknown profile.
"""

import argparse
import bisect
import csv
import glob
import json
import math
import os
import platform
import statistics
import sys
import time

import numpy as np
import scipy
from scipy.integrate import solve_ivp
from scipy.interpolate import CubicSpline

G_N = 9.80665          # standard gravity, m/s^2 (3rd CGPM 1901; ISO 80000-3)
RHO_AIR = 1.25         # default air density, kg/m^3, as core/scenario documents
DEG = math.pi / 180
RTOL = ATOL = 1e-12

HERE = os.path.dirname(os.path.abspath(__file__))
ROOT = os.path.dirname(os.path.dirname(HERE))
RESULTS = os.path.join(HERE, "results.json")

# Scenario files the reference covers, relative to the repository root.
SCENARIO_GLOBS = ["testdata/scenarios/*.json", "testdata/reference/scenarios/*.json"]

# Number of history samples the core takes when settings.samples is unset
# (core/sway), and the sample indices at which states are recorded here.
DEFAULT_SAMPLES = 601
SAMPLE_FRACTIONS = [0.0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0]


# ---------------------------------------------------------------- motions

class TrapezoidMove:
    """Point-to-point move: constant acceleration `acc` from rest to speed
    v_top, cruise, constant deceleration `dec` to rest, covering |distance|
    in the direction of its sign. When the distance is shorter than the two
    ramps at full speed (v^2/2acc + v^2/2dec > d) the move never cruises and
    peaks at v = sqrt(2 d acc dec / (acc + dec))."""

    def __init__(self, start, distance, speed, acc, dec):
        self.t0 = start
        self.sign = -1.0 if distance < 0 else 1.0
        d = abs(distance)
        v = speed
        if v * v / (2 * acc) + v * v / (2 * dec) > d:
            v = math.sqrt(2 * d * acc * dec / (acc + dec))
        self.v, self.acc, self.dec, self.d = v, acc, dec, d
        self.ta = v / acc if v > 0 else 0.0
        self.td = v / dec if v > 0 else 0.0
        self.tc = max(0.0, (d - v * v / (2 * acc) - v * v / (2 * dec)) / v) if v > 0 else 0.0

    def end(self):
        return self.t0 + self.ta + self.tc + self.td

    def breakpoints(self):
        return [self.t0, self.t0 + self.ta, self.t0 + self.ta + self.tc, self.end()]

    def _ramp_up(self, u):
        """Position, speed and acceleration u s into the ramp up."""
        return 0.5 * self.acc * u * u, self.acc * u, self.acc

    def _ramp_down(self, left):
        """Distance still to go, speed and acceleration left s before rest."""
        return 0.5 * self.dec * left * left, self.dec * left, -self.dec

    def at(self, t):
        """Position, speed and acceleration at time t (rest outside the move)."""
        s = t - self.t0
        ta, tc, td = self.ta, self.tc, self.td
        if s <= 0:
            return 0.0, 0.0, 0.0
        if s < ta:
            p, v, a = self._ramp_up(s)
        elif s < ta + tc:
            p, v, a = 0.5 * self.v * ta + self.v * (s - ta), self.v, 0.0
        elif s < ta + tc + td:
            # Distance covered so far = d minus what the deceleration still needs.
            togo, v, a = self._ramp_down(ta + tc + td - s)
            p = self.d - togo
        else:
            p, v, a = self.d, 0.0, 0.0
        return self.sign * p, self.sign * v, self.sign * a


def trapezoid(m):
    if m["axis"] == "slew":
        acc = m["accel_deg_per_s2"]
        return TrapezoidMove(m.get("start_s", 0.0), m["angle_deg"] * DEG, m["rate_deg_per_s"] * DEG,
                             acc * DEG, m.get("decel_deg_per_s2", acc) * DEG)
    acc = m["accel_m_per_s2"]
    return TrapezoidMove(m.get("start_s", 0.0), m["distance_m"], m["speed_m_per_s"], acc,
                         m.get("decel_m_per_s2", acc))


class SineRampMove(TrapezoidMove):
    """Point-to-point move with half-cosine speed ramps, as motion.SineRamp
    documents it: over a ramp of duration T to speed v the acceleration is
    A sin(pi u / T) with A = pi v / (2 T), the speed v (1 - cos(pi u / T)) / 2
    and the position (v / 2) (u - (T / pi) sin(pi u / T)); accel and decel
    are the peaks A and D, so T = pi v / (2 A). A ramp covers v T / 2; when
    the distance is shorter than both ramps at the top speed the move peaks
    at v = sqrt(4 d A D / (pi (A + D))). The ramp down mirrors the ramp up."""

    def __init__(self, start, distance, speed, acc, dec):
        self.t0 = start
        self.sign = -1.0 if distance < 0 else 1.0
        d = abs(distance)
        v = speed
        if math.pi * v * v / 4 * (1 / acc + 1 / dec) > d:
            v = math.sqrt(4 * d * acc * dec / (math.pi * (acc + dec)))
        self.v, self.d = v, d
        self.ta = math.pi * v / (2 * acc) if v > 0 else 0.0
        self.td = math.pi * v / (2 * dec) if v > 0 else 0.0
        self.tc = max(0.0, (d - v * self.ta / 2 - v * self.td / 2) / v) if v > 0 else 0.0

    # end(), breakpoints() and at() are the trapezoid's: the same phases,
    # with these ramps.

    def _ramp(self, u, T):
        w = math.pi / T
        return (0.5 * self.v * (u - math.sin(w * u) / w), 0.5 * self.v * (1 - math.cos(w * u)),
                0.5 * self.v * w * math.sin(w * u))

    def _ramp_up(self, u):
        return self._ramp(u, self.ta)

    def _ramp_down(self, left):
        p, v, a = self._ramp(left, self.td)
        return p, v, -a


def sine_ramp(m):
    acc, dec = _acc_dec(m)
    if m["axis"] == "slew":
        return SineRampMove(m.get("start_s", 0.0), m["angle_deg"] * DEG, m["rate_deg_per_s"] * DEG, acc, dec)
    return SineRampMove(m.get("start_s", 0.0), m["distance_m"], m["speed_m_per_s"], acc, dec)


def _acc_dec(m):
    """accel and decel of a move in SI (rad for slew); decel defaults to accel."""
    if m["axis"] == "slew":
        a = m["accel_deg_per_s2"]
        return a * DEG, m.get("decel_deg_per_s2", a) * DEG
    a = m["accel_m_per_s2"]
    return a, m.get("decel_m_per_s2", a)


def _scale(m):
    """Axis unit to SI: degrees to radians on the slew axis, else 1."""
    return DEG if m["axis"] == "slew" else 1.0


class SCurveMove:
    """Jerk-limited move, as DEVELOPERS.md and motion.SCurve document it: the
    trapezoid of the same distance, speed, acceleration and deceleration
    averaged over a sliding window of the rounding time w,

        x_s(t) = (1/w) * integral from t-w to t of x_trap(s) ds,

    so v_s(t) = (x(t) - x(t-w))/w and a_s(t) = (v(t) - v(t-w))/w. Here the
    position comes from the exact antiderivative X of the trapezoid's
    position (piecewise cubic), x_s = (X(t) - X(t-w))/w, rather than from
    spans of constant jerk as in the core."""

    def __init__(self, base, w):
        self.base, self.w = base, w

    def _X(self, t):
        """Integral of the trapezoid's unsigned position from its start to t."""
        b = self.base
        s = t - b.t0
        if s <= 0:
            return 0.0
        ta, tc, td = b.ta, b.tc, b.td
        u = min(s, ta)
        x = b.acc * u ** 3 / 6
        if s > ta:
            u = min(s, ta + tc) - ta
            x += 0.5 * b.v * ta * u + 0.5 * b.v * u * u
        if s > ta + tc:
            tt = ta + tc + td
            s2 = ta + tc
            u = min(s, tt)
            x += b.d * (u - s2) - 0.5 * b.dec * ((tt - s2) ** 3 - (tt - u) ** 3) / 3
        if s > ta + tc + td:
            x += b.d * (s - (ta + tc + td))
        return x

    def end(self):
        return self.base.end() + self.w

    def breakpoints(self):
        bp = self.base.breakpoints()
        return sorted(set(bp + [t + self.w for t in bp]))

    def at(self, t):
        if self.w <= 0:
            return self.base.at(t)
        w, b = self.w, self.base
        p = b.sign * (self._X(t) - self._X(t - w)) / w
        now, then = b.at(t), b.at(t - w)
        # speed: (x(t) - x(t-w))/w; acceleration: (v(t) - v(t-w))/w
        return p, (now[0] - then[0]) / w, (now[1] - then[1]) / w


def s_curve(m):
    base = trapezoid(m)
    if "rounding_s" in m:
        w = m["rounding_s"]
    elif "jerk_m_per_s3" in m:
        w = m["accel_m_per_s2"] / m["jerk_m_per_s3"]
    else:
        w = m["accel_deg_per_s2"] / m["jerk_deg_per_s3"]
    return SCurveMove(base, w)


class ConstAccel:
    """A motion made of intervals of constant acceleration, given by the
    start time, position and speed of each; before the first the axis moves
    steadily at the first speed, after the last it keeps the last interval's
    acceleration (zero for one that ends at rest)."""

    def __init__(self, knots, end):
        self.knots = knots  # [(t, p, v, a)]
        self.times = [k[0] for k in knots]
        self._end = end

    @staticmethod
    def build(t0, p0, v0, pieces):
        """pieces: [(duration, acc)]; returns knots and the end time."""
        knots, t, p, v = [], t0, p0, v0
        for d, a in pieces:
            if d <= 0:
                continue
            knots.append((t, p, v, a))
            p += v * d + 0.5 * a * d * d
            v += a * d
            t += d
        return knots, t, p, v

    def end(self):
        return self._end

    def breakpoints(self):
        return list(self.times)

    def at(self, t):
        i = bisect.bisect_right(self.times, t) - 1
        if i < 0:
            t0, p0, v0, _ = self.knots[0]
            return p0 + v0 * (t - t0), v0, 0.0
        t0, p0, v0, a = self.knots[i]
        u = t - t0
        return p0 + v0 * u + 0.5 * a * u * u, v0 + a * u, a


def steps(m):
    """Step-speed move (DEVELOPERS.md, motion.Steps): at start_s + at_s of each
    step the drive heads for the step's speed, accelerating at accel while
    the speed grows in size, decelerating at decel while it shrinks (so a
    reversal first brakes to zero at decel, then accelerates at accel), and
    holds the speed once reached; a step that comes early starts from the
    speed reached so far. The last step is to 0. At rest before the first."""
    acc, dec = _acc_dec(m)
    sc = _scale(m)
    key = "rate_deg_per_s" if m["axis"] == "slew" else "speed_m_per_s"
    t0 = m.get("start_s", 0.0)
    sts = [(t0 + s["at_s"], s[key] * sc) for s in m["steps"]]
    pieces = []
    v, t = 0.0, sts[0][0]
    for k, (tk, target) in enumerate(sts):
        t_next = sts[k + 1][0] if k + 1 < len(sts) else math.inf
        while t < t_next and v != target:
            if v * target < 0:          # reversing: brake to zero first
                stop, a = 0.0, -math.copysign(dec, v)
            elif abs(target) > abs(v):  # speed grows in size
                stop, a = target, math.copysign(acc, target - v)
            else:                       # speed shrinks in size
                stop, a = target, math.copysign(dec, target - v)
            full = (stop - v) / a
            d = min(full, t_next - t)
            pieces.append((d, a))
            t += d
            v = stop if d == full else v + a * d
        if t < t_next and t_next < math.inf:
            pieces.append((t_next - t, 0.0))
            t = t_next
    knots, t_end, p, _ = ConstAccel.build(sts[0][0], 0.0, 0.0, pieces)
    knots.append((t_end, p, 0.0, 0.0))
    return ConstAccel(knots, t_end)


def hard_stop(m):
    """Hard stop (DEVELOPERS.md, motion.HardStop): moving at the given speed
    from t = 0 (and before: the load hangs still relative to the crane at
    t = 0), braking at decel from brake_at_s to rest. Position 0 at t = 0."""
    sc = _scale(m)
    if m["axis"] == "slew":
        v, dec = m["rate_deg_per_s"] * sc, m["decel_deg_per_s2"] * sc
    else:
        v, dec = m["speed_m_per_s"], m["decel_m_per_s2"]
    tb = m["brake_at_s"]
    knots, t_end, p, _ = ConstAccel.build(0.0, 0.0, v, [(tb, 0.0), (v / dec, -dec)])
    knots.append((t_end, p, 0.0, 0.0))
    return ConstAccel(knots, t_end)


def parse_csv(text):
    """A CSV record as DEVELOPERS.md documents it: header time_s,<col>,...;
    lines starting with # are comments, blank lines skipped, cells trimmed.
    Returns times and {column: values}. Errors are the core's business (the
    reference only reads scenarios the core accepts)."""
    rows = []
    for line in text.splitlines():
        s = line.strip()
        if not s or s.startswith("#"):
            continue
        rows.append([c.strip() for c in next(csv.reader([s]))])
    head = rows[0]
    if head[0] != "time_s":
        sys.exit("reference.py: a CSV record must start with time_s, not %r" % head[0])
    data = np.array([[float(c) for c in r] for r in rows[1:]])
    return data[:, 0], {n: data[:, j + 1] for j, n in enumerate(head[1:])}


class SpeedRecord:
    """Speeds linear in time between samples (constant acceleration on each
    interval), position their exact integral, zero at the first sample;
    steady at the first speed before it; the last speed is 0."""

    def __init__(self, t, v):
        pieces = [(t[i + 1] - t[i], (v[i + 1] - v[i]) / (t[i + 1] - t[i])) for i in range(len(t) - 1)]
        knots, t_end, p, _ = ConstAccel.build(t[0], 0.0, v[0], pieces)
        knots.append((t_end, p, 0.0, 0.0))
        self.ca = ConstAccel(knots, t_end)

    def at(self, t):
        return self.ca.at(t)

    def breakpoints(self):
        return self.ca.breakpoints()

    def end(self):
        return self.ca.end()


class PositionRecord:
    """Positions through a clamped cubic spline with zero speed at the first
    and last sample (scipy.interpolate.CubicSpline, bc_type "clamped"),
    relative to the first sample; at rest before and after the record."""

    def __init__(self, t, x):
        self.t0, self.t1 = t[0], t[-1]
        self.x_end = x[-1] - x[0]
        self.cs = CubicSpline(t, x - x[0], bc_type="clamped")
        self.times = list(t)

    def at(self, t):
        if t <= self.t0:
            return 0.0, 0.0, 0.0
        if t >= self.t1:
            return self.x_end, 0.0, 0.0
        return float(self.cs(t)), float(self.cs(t, 1)), float(self.cs(t, 2))

    def breakpoints(self):
        return list(self.times)

    def end(self):
        return self.t1


def series(m):
    """Recorded or planned time series from the motion's csv: the column
    named in `column`, else <axis>_m_per_s if the record has it, else
    <axis>_m (slew_deg_per_s / slew_deg on the slew axis, in degrees). A
    column ending in _per_s holds speeds, any other positions. Shifted by
    start_s."""
    t, cols = parse_csv(m["csv"])
    unit = "_deg" if m["axis"] == "slew" else "_m"
    col = m.get("column") or (m["axis"] + unit + "_per_s" if m["axis"] + unit + "_per_s" in cols
                              else m["axis"] + unit)
    vals = cols[col] * _scale(m)
    t = t + m.get("start_s", 0.0)
    return SpeedRecord(t, vals) if col.endswith("_per_s") else PositionRecord(t, vals)


# ------------------------------------------------------------ input shapers

def linear_periods(m1, m2, l1, l2):
    """Small-swing periods of the two modes of hook block (m1 on rope l1) and
    load (m2 on rigging l2), slower first, from the eigenvalues of M^-1 K of
    the linearised two-mass pendulum (angles of rope and rigging):
    M = [[(m1+m2) l1^2, m2 l1 l2], [m2 l1 l2, m2 l2^2]], K = diag((m1+m2) g l1, m2 g l2)."""
    m = m1 + m2
    mm = np.array([[m * l1 * l1, m2 * l1 * l2], [m2 * l1 * l2, m2 * l2 * l2]])
    kk = np.diag([m * G_N * l1, m2 * G_N * l2])
    w2 = np.sort(np.real(np.linalg.eigvals(np.linalg.solve(mm, kk))))
    return [2 * math.pi / math.sqrt(w2[0]), 2 * math.pi / math.sqrt(w2[1])]


def shaper_impulses(kind, period, zeta, v):
    """Impulses [(A, t)] of one shaper, from the published formulas (Singer &
    Seering 1990: ZV, ZVD; Singhose, Seering & Singer 1994: EI), as the
    core/shaper package comment states them:
    K = exp(-zeta pi / sqrt(1 - zeta^2)), Td = T / sqrt(1 - zeta^2)."""
    k = math.exp(-zeta * math.pi / math.sqrt(1 - zeta * zeta))
    td = period / math.sqrt(1 - zeta * zeta)
    if kind == "zv":
        return [(1 / (1 + k), 0.0), (k / (1 + k), td / 2)]
    if kind == "zvd":
        n = (1 + k) ** 2
        return [(1 / n, 0.0), (2 * k / n, td / 2), (k * k / n, td)]
    if kind == "ei":
        return [((1 + v) / 4, 0.0), ((1 - v) / 2, period / 2), ((1 + v) / 4, period)]
    sys.exit("reference.py: shaper kind %r is not implemented here" % kind)


def shaper_of(spec, sc):
    """The impulses of a motion's shaper: designed for period_s, or for the
    small-swing period at rope_length_m (default the load's rope length):
    2 pi sqrt(L/g), or with a hook block the slower mode's period at that
    rope length to the hook. With second_period_s, the convolution with a
    shaper of the same kind for that period (impulse A_i B_j at t_i + s_j)."""
    load = sc["load"]
    if "period_s" in spec:
        period = spec["period_s"]
    else:
        l = spec.get("rope_length_m", load["rope_length_m"])
        if "hook" in load:
            period = linear_periods(load["hook"]["mass_kg"], load["mass_kg"], l,
                                    load["hook"]["rigging_length_m"])[0]
        else:
            period = 2 * math.pi * math.sqrt(l / G_N)
    zeta = spec.get("damping_ratio", 0.0)
    v = spec.get("tolerance_pct", 0.0) / 100 or 0.05  # EI: 5 % when not given
    imps = shaper_impulses(spec["kind"], period, zeta, v)
    if "second_period_s" in spec:
        second = shaper_impulses(spec["kind"], spec["second_period_s"], zeta, v)
        imps = [(a * b, s + u) for a, s in imps for b, u in second]
    return imps


class ShapedMove:
    """A move convolved with a shaper's impulses: x(t) = sum_i A_i x_base(t - t_i),
    and the same sum for speed and acceleration."""

    def __init__(self, base, impulses):
        self.base, self.imps = base, impulses

    def at(self, t):
        p = v = a = 0.0
        for amp, ti in self.imps:
            q = self.base.at(t - ti)
            p += amp * q[0]
            v += amp * q[1]
            a += amp * q[2]
        return p, v, a

    def breakpoints(self):
        return sorted(set(b + ti for _, ti in self.imps for b in self.base.breakpoints()))

    def end(self):
        return self.base.end() + max(ti for _, ti in self.imps)


# Motion profiles by the scenario's "profile" name.
PROFILES = {"trapezoid": trapezoid, "s_curve": s_curve, "steps": steps, "hard_stop": hard_stop,
            "series": series, "sine_ramp": sine_ramp}


def build_move(m, sc):
    """The move of one scenario motion, with its shaper if it has one."""
    prof = m.get("profile", "trapezoid") or "trapezoid"
    if prof not in PROFILES:
        sys.exit("reference.py: motion profile %r is not implemented here; add it to PROFILES" % prof)
    mv = PROFILES[prof](m)
    if m.get("shaper"):
        mv = ShapedMove(mv, shaper_of(m["shaper"], sc))
    return mv


class Axis:
    """Sum of the moves of one axis."""

    def __init__(self):
        self.moves = []

    def at(self, t):
        p = v = a = 0.0
        for mv in self.moves:
            q = mv.at(t)
            p += q[0]
            v += q[1]
            a += q[2]
        return p, v, a


# --------------------------------------------------------------- scenario

class Model:
    """One scenario turned into the constrained Cartesian equations above."""

    def __init__(self, sc):
        self.sc = sc
        load = sc["load"]
        self.m = load["mass_kg"]
        self.l0 = load["rope_length_m"]
        crane = sc.get("crane", {})
        self.r0 = crane.get("radius_m", 0.0)
        self.phi0 = crane.get("slew_deg", 0.0) * DEG
        self.axes = {k: Axis() for k in ("travel_x", "travel_y", "slew", "radius", "hoist")}
        breaks = []
        self.motion_end = 0.0
        for m in sc.get("motions", []):
            mv = build_move(m, sc)
            self.axes[m["axis"]].moves.append(mv)
            breaks += mv.breakpoints()
            self.motion_end = max(self.motion_end, mv.end())
        self.activity_end = self.motion_end

        # Wind and drag as core/scenario's Wind documents them. The wind
        # speed's fraction of full s(t) (0 to 1) rises linearly over ramp_s
        # from start_s and, with duration_s, falls linearly over ramp_s from
        # start_s + duration_s (steps when ramp_s is 0). The force on the
        # load at rest is s^2 F_w toward `toward_deg` (F_w = force_n, or
        # 0.5 rho v^2 A c from speed_m_per_s and shape_factor). With drag
        # (k = 0.5 rho c_d A) the air moves at w = s V e, V the typed speed
        # or, for a typed force, sqrt(F_w / k); the drag acts on the load's
        # velocity relative to the air, less the drag on the load at rest:
        #     F = s^2 F_w e - k (|v - w| (v - w) + s^2 V^2 e).
        w = sc.get("wind")
        rho = RHO_AIR
        if w is not None and w.get("air_density_kg_per_m3", 0) > 0:
            rho = w["air_density_kg_per_m3"]
        # Quadratic drag factor k (0 without drag).
        self.drag = 0.5 * rho * load.get("drag_coefficient", 0.0) * load.get("area_m2", 0.0)
        self.wind_force = 0.0
        self.e = np.zeros(3)
        self.air_speed = 0.0
        self.wind_start = math.inf
        self.wind_dur = self.wind_ramp = 0.0
        if w is not None:
            if "force_n" in w:
                f = w["force_n"]
                self.air_speed = math.sqrt(f / self.drag) if self.drag > 0 else 0.0
            else:
                f = 0.5 * rho * w["speed_m_per_s"] ** 2 * load.get("area_m2", 0.0) * w["shape_factor"]
                self.air_speed = w["speed_m_per_s"]
            self.wind_force = f
            th = w.get("toward_deg", 0.0) * DEG
            self.e = np.array([math.cos(th), math.sin(th), 0.0])
            self.wind_start = w.get("start_s", 0.0)
            self.wind_dur = w.get("duration_s", 0.0)
            self.wind_ramp = w.get("ramp_s", 0.0)
            corners = [self.wind_start, self.wind_start + self.wind_ramp]
            if self.wind_dur > 0:
                corners += [self.wind_start + self.wind_dur, self.wind_start + self.wind_dur + self.wind_ramp]
            breaks += corners
            self.activity_end = max([self.activity_end] + corners)

        self.l_end = self.rope(self.motion_end + 1.0)[0]
        st = sc.get("settings") or {}
        settle = st.get("settle_periods", 0) or 3.0
        self.period = 2 * math.pi * math.sqrt(self.l_end / G_N)
        self.t_end = max(self.activity_end + settle * self.period, st.get("duration_s", 0.0))
        self.samples = st.get("samples", 0) or DEFAULT_SAMPLES
        self.breaks = sorted(set(b for b in breaks if 1e-12 < b < self.t_end - 1e-12))

    def rope(self, t):
        h = self.axes["hoist"].at(t)
        return self.l0 - h[0], -h[1], -h[2]

    def suspension(self, t):
        """Suspension point position, velocity, acceleration (3-vectors, z = 0)."""
        x, y = self.axes["travel_x"].at(t), self.axes["travel_y"].at(t)
        p, q = self.axes["slew"].at(t), self.axes["radius"].at(t)
        phi, dphi, ddphi = self.phi0 + p[0], p[1], p[2]
        r, dr, ddr = self.r0 + q[0], q[1], q[2]
        e = complex(math.cos(phi), math.sin(phi))
        z = complex(x[0], y[0]) + r * e
        dz = complex(x[1], y[1]) + complex(dr, r * dphi) * e
        ddz = complex(x[2], y[2]) + complex(ddr - r * dphi * dphi, r * ddphi + 2 * dr * dphi) * e
        return (np.array([z.real, z.imag, 0.0]), np.array([dz.real, dz.imag, 0.0]),
                np.array([ddz.real, ddz.imag, 0.0]))

    def strength(self, t):
        """The wind speed's fraction of full s(t), 0 to 1: a ramp up from
        start_s and, with duration_s, a ramp down from start_s + duration_s."""
        def ramp(s):
            if s < 0:
                return 0.0
            if s >= self.wind_ramp:
                return 1.0
            return s / self.wind_ramp
        r = ramp(t - self.wind_start)
        if self.wind_dur > 0:
            r -= ramp(t - self.wind_start - self.wind_dur)
        return r

    def applied(self, t, vel):
        """Gravity plus the air's force per kg of load (see __init__)."""
        s = self.strength(t)
        f = s * s * self.wind_force * self.e
        if self.drag > 0:
            rel = vel - s * self.air_speed * self.e
            f = f - self.drag * (np.linalg.norm(rel) * rel + s * s * self.air_speed ** 2 * self.e)
        return np.array([0.0, 0.0, -G_N]) + f / self.m

    def multiplier(self, t, y):
        """mu = T/(m|r|) and the pieces used by rhs and by the outputs."""
        pos, vel = y[:3], y[3:]
        s, ds, dds = self.suspension(t)
        l, dl, ddl = self.rope(t)
        r, dr = pos - s, vel - ds
        a = self.applied(t, vel)
        c = 0.5 * (r @ r - l * l)
        dc = r @ dr - l * dl
        w = math.sqrt(G_N / l)
        mu = (r @ (a - dds) + dr @ dr - dl * dl - l * ddl + 2 * w * dc + w * w * c) / (r @ r)
        return mu, r, a, l

    def rhs(self, t, y):
        mu, r, a, _ = self.multiplier(t, y)
        return np.concatenate((y[3:], a - mu * r))

    def initial(self):
        """Load at the initial swing angle toward its azimuth; horizontal
        velocity relative to the suspension point as given, vertical part
        from the rope constraint r.r' = L L' (L' = 0 at t = 0: every move
        starts from rest)."""
        ini = self.sc.get("initial") or {}
        th = ini.get("swing_deg", 0.0) * DEG
        az = ini.get("toward_deg", 0.0) * DEG
        s, ds, _ = self.suspension(0.0)
        l, dl, _ = self.rope(0.0)
        r = l * np.array([math.sin(th) * math.cos(az), math.sin(th) * math.sin(az), -math.cos(th)])
        vx, vy = ini.get("velocity_x_m_per_s", 0.0), ini.get("velocity_y_m_per_s", 0.0)
        vz = (l * dl - r[0] * vx - r[1] * vy) / r[2]
        return np.concatenate((s + r, ds + np.array([vx, vy, vz])))


# ---------------------------------------------------------------- figures

def figures(model, t, y):
    """Swing (rad), horizontal excursion (m), tension (N) at the points given
    (t shape (k,), y shape (6, k))."""
    k = len(t)
    swing, exc, ten = np.empty(k), np.empty(k), np.empty(k)
    for j in range(k):
        mu, r, _, _ = model.multiplier(t[j], y[:, j])
        h = math.hypot(r[0], r[1])
        swing[j] = math.atan2(h, -r[2])
        exc[j] = h
        ten[j] = model.m * mu * math.sqrt(r @ r)
    return swing, exc, ten


class Peak:
    def __init__(self):
        self.v, self.t = -math.inf, 0.0

    def offer(self, v, t):
        if v > self.v:
            self.v, self.t = v, t


def golden_max(f, a, b, tol=1e-11):
    """Maximum of a unimodal f on [a, b] by golden-section search."""
    inv = (math.sqrt(5) - 1) / 2
    c, d = b - inv * (b - a), a + inv * (b - a)
    fc, fd = f(c), f(d)
    while b - a > tol * (1 + abs(b)):
        if fc > fd:
            b, d, fd = d, c, fc
            c = b - inv * (b - a)
            fc = f(c)
        else:
            a, c, fc = c, d, fd
            d = a + inv * (b - a)
            fd = f(d)
    return (c, fc) if fc > fd else (d, fd)


def solve(model, rtol=RTOL, atol=ATOL, per_step=8):
    """Integrate the whole run piece by piece between breakpoints, scanning
    every step of the dense output for maxima. Returns the figures."""
    edges = [0.0] + model.breaks + [model.t_end]
    y = model.initial()
    peaks = {k: Peak() for k in ("swing", "exc", "res_swing", "res_exc", "ten", "neg_ten")}
    sample_times = [round(f * (model.samples - 1)) * (model.t_end / (model.samples - 1))
                    for f in SAMPLE_FRACTIONS]
    sample_times[-1] = model.t_end
    samples = {}
    nfev = steps = 0
    max_rope_err = 0.0
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
            sw, ex, te = figures(model, tt, yy)
            for name, vals in (("swing", sw), ("exc", ex), ("ten", te), ("neg_ten", -te)):
                targets = [peaks[name]]
                if residual and name in ("swing", "exc"):
                    targets.append(peaks["res_" + name])
                # The largest sample of the step, then the exact maximum
                # around it: between its neighbours, or between the end
                # sample and the one inside the step (the maximum may lie
                # just inside a step whose end sample is the largest).
                j = int(np.argmax(vals))
                tm, vm = tt[j], vals[j]
                lo, hi = max(j - 1, 0), min(j + 1, per_step)
                if vm >= min(p.v for p in targets) - 1e-2 * abs(vm):
                    col = {"swing": 0, "exc": 1, "ten": 2, "neg_ten": 2}[name]
                    sgn = -1.0 if name == "neg_ten" else 1.0

                    def f(t_, col=col, sgn=sgn):
                        return sgn * figures(model, [t_], sol.sol(t_).reshape(6, 1))[col][0]
                    t2, v2 = golden_max(f, tt[lo], tt[hi])
                    if v2 > vm:
                        tm, vm = t2, v2
                for p in targets:
                    p.offer(vm, tm)
        for st in sample_times:
            if a - 1e-12 <= st <= b + 1e-12 and st not in samples:
                ys = sol.sol(st)
                mu, r, _, l = model.multiplier(st, ys)
                s = model.suspension(st)[0]
                samples[st] = {
                    "time_s": st,
                    "rel_x_m": r[0], "rel_y_m": r[1], "rel_z_m": r[2],
                    "suspension_x_m": s[0], "suspension_y_m": s[1],
                    "swing_deg": math.atan2(math.hypot(r[0], r[1]), -r[2]) / DEG,
                    "tension_n": model.m * mu * math.sqrt(r @ r),
                    "rope_m": l,
                }
        y = sol.y[:, -1]
        rr = y[:3] - model.suspension(b)[0]
        max_rope_err = max(max_rope_err, abs(math.sqrt(rr @ rr) - model.rope(b)[0]) / model.rope(b)[0])
    if model.motion_end >= model.t_end:
        raise RuntimeError("no residual window")
    mg = model.m * G_N
    return {
        "period_s": model.period,
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
        "tension_factor": peaks["ten"].v / mg,
        "samples": [samples[t] for t in sorted(samples)],
        "solver": {"steps": steps, "nfev": nfev, "rope_length_rel_error": max_rope_err},
    }


# ---------------------------------------------------------------- commands

def load(path):
    with open(path) as f:
        return json.load(f)


def moves(sc):
    """Whether anything moves the load: a motion, wind or an initial swing."""
    return bool(sc.get("motions") or sc.get("wind") or sc.get("initial"))


def scenario_paths(globs=SCENARIO_GLOBS):
    out = []
    for g in globs:
        out += sorted(glob.glob(os.path.join(ROOT, g)))
    return [os.path.relpath(p, ROOT) for p in out]


def cmd_generate(args):
    entries = []
    for rel in scenario_paths():
        sc = load(os.path.join(ROOT, rel))
        if "hook" in sc.get("load", {}):
            continue  # hook block and rigging: double.py, results_double.json
        if "body" in sc.get("load", {}):
            continue  # a rigid load: rigid.py, results_rigid.json
        if not moves(sc):
            continue  # a planning request without motions: nothing to solve
        t0 = time.perf_counter()
        res = solve(Model(sc))
        print("%-52s peak %8.5f deg  residual %8.5f deg  %6.2f s" % (
            rel, res["peak_swing_deg"], res["residual_swing_deg"], time.perf_counter() - t0), file=sys.stderr)
        entries.append({"scenario": rel, "result": res})
    write_results(RESULTS, "Reference results for swaysheet scenarios, from testdata/reference/reference.py",
                  "Cartesian load position and velocity; rope tension as a Lagrange multiplier; "
                  "Baumgarte stabilisation with w = sqrt(g/L)", "golden-section search", entries)


def write_results(path, what, formulation, peak_search, entries):
    """Write a results file: the entries with the formulation, the solver
    and the library versions that produced them."""
    doc = {
        "what": what,
        "formulation": formulation,
        "solver": "scipy.integrate.solve_ivp, method DOP853, rtol %g, atol %g, restarted at every motion "
                  "breakpoint; peaks located on the dense output by %s" % (RTOL, ATOL, peak_search),
        "scipy": scipy.__version__,
        "numpy": np.__version__,
        "python": platform.python_version(),
        "scenarios": entries,
    }
    with open(path, "w") as f:
        json.dump(doc, f, indent=1)
        f.write("\n")
    print("wrote %s (%d scenarios)" % (os.path.relpath(path, ROOT), len(entries)), file=sys.stderr)


def generate_show_cli(doc, results_name, cmd_generate, model_class, solve_fn):
    """The command line of a reference script for one kind of scenario:
    `generate` (writes results_name) and `show FILE... [--rtol R]`."""
    ap = argparse.ArgumentParser(description=doc.split("\n")[0])
    sub = ap.add_subparsers(dest="cmd", required=True)
    sub.add_parser("generate", help="solve every scenario it covers and write " + results_name)
    s = sub.add_parser("show", help="print the reference result of scenario files")
    s.add_argument("files", nargs="+")
    s.add_argument("--rtol", type=float, default=RTOL, help="rtol = atol of the solution (default 1e-12)")
    args = ap.parse_args()
    if args.cmd == "generate":
        cmd_generate(args)
        return
    for p in args.files:
        json.dump(solve_fn(model_class(load(p)), rtol=args.rtol, atol=args.rtol), sys.stdout, indent=1)
        print()


def cmd_show(args):
    for p in args.files:
        res = solve(Model(load(p)))
        json.dump(res, sys.stdout, indent=1)
        print()


def integrate_only(model, rtol, atol):
    """The same integration as solve(), restarted at the same breakpoints,
    without dense output or peak search: the cost of SciPy itself."""
    edges = [0.0] + model.breaks + [model.t_end]
    y = model.initial()
    nfev = 0
    for a, b in zip(edges[:-1], edges[1:]):
        if b <= a:
            continue
        sol = solve_ivp(model.rhs, (a, b), y, method="DOP853", rtol=rtol, atol=atol)
        nfev += sol.nfev
        y = sol.y[:, -1]
    return nfev


def time_one(path, model, ref, rtol, atol, repeat):
    full, bare = [], []
    for _ in range(repeat):
        t0 = time.perf_counter()
        res = solve(model, rtol=rtol, atol=atol)
        full.append(time.perf_counter() - t0)
        t0 = time.perf_counter()
        integrate_only(model, rtol, atol)
        bare.append(time.perf_counter() - t0)
    pos_err = max(math.dist((a["rel_x_m"], a["rel_y_m"], a["rel_z_m"]),
                            (b["rel_x_m"], b["rel_y_m"], b["rel_z_m"]))
                  for a, b in zip(res["samples"], ref["samples"]))
    return {
        "scenario": path, "rtol": rtol, "atol": atol, "repeats": repeat,
        # Integration alone (SciPy's own cost), and the whole evaluation
        # with this script's pure-Python peak search.
        "wall_s_solve_median": statistics.median(bare),
        "wall_s_full_median": statistics.median(full),
        "steps": res["solver"]["steps"], "nfev": res["solver"]["nfev"],
        "sample_position_error_m": pos_err,
        "peak_swing_error_deg": abs(res["peak_swing_deg"] - ref["peak_swing_deg"]),
        "residual_swing_error_deg": abs(res["residual_swing_deg"] - ref["residual_swing_deg"]),
        "scipy": scipy.__version__,
    }


def cmd_time(args):
    """Wall time at the given tolerances (median of --repeat runs) and the
    accuracy reached against the rtol = atol = 1e-12 solution: largest
    error of the sampled rope vector (m), error of the peak and residual
    swing (deg). With --target-position-error-m, tries tolerances from 1e-3
    down by half decades and prints the loosest that reaches the target
    (for putting SciPy beside the core at equal accuracy)."""
    for p in args.files:
        model = Model(load(p))
        ref = solve(model)
        if args.target_position_error_m is not None:
            hit = None
            for k in range(6, 25):
                rtol = 10 ** (-k / 2)
                atol = rtol * 1e-2 if args.atol is None else args.atol
                row = time_one(p, model, ref, rtol, atol, 1)
                if row["sample_position_error_m"] <= args.target_position_error_m:
                    hit = time_one(p, model, ref, rtol, atol, args.repeat)
                    break
            if hit is None:
                sys.exit("reference.py: no tolerance down to 1e-12 reaches %g m" % args.target_position_error_m)
            hit["target_position_error_m"] = args.target_position_error_m
            print(json.dumps(hit))
            continue
        for rtol in args.rtol:
            atol = args.atol if args.atol is not None else rtol * 1e-2
            print(json.dumps(time_one(p, model, ref, rtol, atol, args.repeat)))


def main():
    ap = argparse.ArgumentParser(description=__doc__.split("\n")[0])
    sub = ap.add_subparsers(dest="cmd", required=True)
    sub.add_parser("generate", help="solve every scenario and write results.json")
    s = sub.add_parser("show", help="print the reference result of scenario files")
    s.add_argument("files", nargs="+")
    t = sub.add_parser("time", help="wall time and accuracy at given tolerances")
    t.add_argument("files", nargs="+")
    t.add_argument("--rtol", type=float, nargs="+", default=[1e-8])
    t.add_argument("--atol", type=float, default=None, help="default: rtol/100, as the core")
    t.add_argument("--repeat", type=int, default=3)
    t.add_argument("--target-position-error-m", type=float, default=None,
                   help="find the loosest rtol whose sampled rope vector error is at most this")
    args = ap.parse_args()
    {"generate": cmd_generate, "show": cmd_show, "time": cmd_time}[args.cmd](args)


if __name__ == "__main__":
    main()

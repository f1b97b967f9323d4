#!/usr/bin/python3
"""Independent reference solution of swaysheet scenarios with a rigid load
(load.body), with SciPy.

Run with Debian's /usr/bin/python3 (python3-scipy, python3-numpy):

    /usr/bin/python3 testdata/reference/rigid.py generate   # writes results_rigid.json
    /usr/bin/python3 testdata/reference/rigid.py show FILE.json [--rtol 1e-12]

`make reference` runs it after double.py. The Go test
core/sway/reference_rigid_test.go compares the core with the committed
results_rigid.json; it needs no Python.

Formulation
-----------
The core (core/pendulum/rigid.go) integrates the load as one rigid body:
centre of mass, unit quaternion and angular velocity, Newton-Euler
equations with the hook block merged into the body (four legs) or as a
point of its own (two legs), constraint multipliers from a Schur
complement, and a modal analysis by numerical differentiation. This script
shares none of that. The load is four point masses m/4 at the corners of a
tetrahedron p_k = c + R A v_k (v_k the unit vertices of a regular
tetrahedron, sum v_k v_k^T = 4/3 I; A = diag(sqrt(3 J_i / m)), J_i the
load's second moments about its own axes, J_x = m (k_y^2 + k_z^2 - k_x^2)/2
and so on), which has the load's mass, centre of mass and inertia exactly,
held rigid by the six distances between them. Every other point of the
load (attach points, corners, the hook of a four-leg sling) is the affine
combination of the four with fixed weights. The hook block is a fifth
point mass m_h: with two legs joined to the two attach points by the two
leg lengths; with four legs (a rigid frame) held by its distances to three
of the vertices (none when m_h = 0: the rope then pulls on the load's hook
point). The rope is a distance L(t) from the suspension point to the hook;
a spreader's two parallel legs are distances L(t) from the points
S(t) +/- a e(t) (e the load's heading turned with the slew) to the attach
points; two hook ropes (load.body.tandem) are distances L(t) + (l_i - L0)
from the points S(t) +/- (spacing/2) e(t) to their own attach points. Every constraint is c_j = (d_j.d_j - l_j^2)/2 with d_j linear in the
point positions; Newton's law M q'' = F + G^T lambda and the Baumgarte
stabilised constraints c'' + 2 w c' + w^2 c = 0 (Baumgarte, Comput.
Methods Appl. Mech. Eng. 1, 1972; w = sqrt(g_n / L)) give the multipliers
from (G M^-1 G^T) lambda = -G M^-1 F - kappa - 2 w c' - w^2 c, solved with
numpy.linalg.solve. A rope or leg tension is -lambda |d|. Wind and drag act
on the load's centre of mass (a quarter on each vertex). Four legs share
the force Fs they carry (Fs = m_h (a_H - g) - rope pull on the hook) by
the stiffness model the core documents: T_i = k_i e_i.K^-1 Fs, k_i = 1/l_i,
K = sum k_i e_i e_i^T, e_i the unit vector hook to attach point.

The hanging-still state is built here from the same rule (the hook over
the load's centre of mass; two legs in the plane through the attach line
and the centre of mass), the hook point by scipy.optimize.least_squares.
With two hook ropes it is the solution of the static equilibrium itself,
by scipy.optimize.least_squares from the load hanging level below the
suspension points: unknowns the centre of mass, a rotation vector and the
two rope tensions; equations the two rope lengths, the sum of forces and
the sum of moments about the centre of mass (where the core minimises the
height of the centre of mass over a planar four-bar linkage). The swing
and excursion are measured from the point above where the load hangs
still (turned with the slew), as the core does for two ropes.
The initial swing follows the convention core/pendulum documents for
Rigid.Initial. Mode periods come from the exact linearisation of this
constrained system: with N an orthonormal basis of the null space of G
(scipy.linalg.null_space) and the static multipliers from G^T lambda = -F,
K_r = -N^T (sum lambda_j D_j^T D_j) N, M_r = N^T M N, omega^2 the
eigenvalues of K_r v = omega^2 M_r v (scipy.linalg.eigh). period_s is the
slowest mode with omega^2 above 1e-7 1/s^2 (the core's rule).

SciPy's solve_ivp(method="DOP853") at rtol = atol = 1e-12, restarted at
every motion breakpoint; maxima located on the dense output by
Brent's bounded method (scipy.optimize.minimize_scalar).
"""

import json
import math
import os
import sys
import time

import numpy as np
import scipy
import scipy.linalg
from scipy.integrate import solve_ivp
from scipy.optimize import least_squares, minimize_scalar

HERE = os.path.dirname(os.path.abspath(__file__))
sys.path.insert(0, HERE)
import reference as ref  # noqa: E402  (motions, suspension point, wind: shared on purpose)

G_N = ref.G_N
DEG = ref.DEG
RTOL = ATOL = 1e-12
ROOT = ref.ROOT
RESULTS = os.path.join(HERE, "results_rigid.json")
SCENARIO_GLOBS = ["testdata/scenarios/*.json", "testdata/reference/rigid/*.json"]
FREE_OMEGA2 = 1e-7
TETRA = np.array([[1, 1, 1], [1, -1, -1], [-1, 1, -1], [-1, -1, 1]]) / math.sqrt(3.0)


def rot_axis(axis, angle):
    """Rotation matrix by angle about a unit axis (Rodrigues)."""
    axis = np.asarray(axis, float)
    k = np.array([[0, -axis[2], axis[1]], [axis[2], 0, -axis[0]], [-axis[1], axis[0], 0]])
    return np.eye(3) + math.sin(angle) * k + (1 - math.cos(angle)) * (k @ k)


def rot_to(a, b):
    """Smallest rotation taking unit vector a to unit vector b."""
    ax = np.cross(a, b)
    s = np.linalg.norm(ax)
    if s < 1e-15:
        return np.eye(3)
    return rot_axis(ax / s, math.atan2(s, a @ b))


class RigidModel(ref.Model):
    def __init__(self, sc):
        super().__init__(sc)
        b = sc["load"]["body"]
        self.size = np.array([b["length_m"], b["width_m"], b["height_m"]])
        a, w, h = self.size
        k = np.array([b.get("gyration_length_m", math.sqrt((w * w + h * h) / 12)),
                      b.get("gyration_width_m", math.sqrt((a * a + h * h) / 12)),
                      b.get("gyration_height_m", math.sqrt((a * a + w * w) / 12))])
        self.k = k
        m = self.m
        jj = m * np.array([k[1] ** 2 + k[2] ** 2 - k[0] ** 2, k[0] ** 2 + k[2] ** 2 - k[1] ** 2,
                           k[0] ** 2 + k[1] ** 2 - k[2] ** 2]) / 2
        self.amat = np.diag(np.sqrt(3 * jj / m))
        self.verts = TETRA @ self.amat  # body frame, rows
        self.heading = b.get("heading_deg", 0.0) * DEG
        self.mh = b.get("hook_mass_kg", 0.0)
        self.spreader = b.get("spreader")
        self.tandem = b.get("tandem")
        self.legs = b.get("legs", [])
        self.extra = [0.0, 0.0]
        self.rest_memo = {}
        if self.spreader:
            sa = self.spreader["spacing_m"] / 2
            za = self.spreader.get("attach_z_m", h / 2)
            self.attach = [np.array([sa, 0, za]), np.array([-sa, 0, za])]
            self.half = sa
            self.tops = [sa, -sa]
            self.kind = "spreader"
        elif self.tandem:
            ropes = self.tandem["ropes"]
            self.attach = [np.array([r["attach_x_m"], r.get("attach_y_m", 0.0), r.get("attach_z_m", h / 2)])
                           for r in ropes]
            l0 = sc["load"]["rope_length_m"]
            self.extra = [r.get("length_m", l0) - l0 for r in ropes]
            sp = self.tandem.get("spacing_m", self.attach[0][0] - self.attach[1][0])
            self.tops = [sp / 2, -sp / 2]
            self.kind = "two ropes"
        else:
            self.attach = [np.array([l.get("attach_x_m", 0.0), l.get("attach_y_m", 0.0), l["attach_z_m"]])
                           for l in self.legs]
            self.lens = [l["length_m"] for l in self.legs]
            self.kind = "two legs" if len(self.legs) == 2 else "four legs"
            self.hook_b = self.hook_point()
        self.hook_pt = self.kind == "two legs" or (self.kind == "four legs" and self.mh > 0)
        self.npts = 5 if self.hook_pt else 4
        self.masses = np.array([m / 4] * 4 + ([self.mh] if self.hook_pt else []))
        self.rest_R = self.rest_rotation()
        self.build_constraints()
        st = sc.get("settings") or {}
        settle = st.get("settle_periods", 0) or 3.0
        self.mode_periods = self.modes(self.l_end)
        self.period = self.mode_periods[0]
        self.t_end = max(self.activity_end + settle * self.period, st.get("duration_s", 0.0))
        self.breaks = [x for x in self.breaks if x < self.t_end - 1e-12]
        y0 = self.rest_state(0.0, self.rope(0.0)[0])
        s0 = self.suspension(0.0)[0]
        self.rest_corner = [(self.body_pos(y0, self.bary(c)) - s0)[:2] for c in self.corners_b()]

    # -- geometry of the load
    def bary(self, b):
        """Weights of the vertices giving body point b (sum 1)."""
        a = np.vstack([self.verts.T, np.ones(4)])
        return np.linalg.solve(a, np.append(b, 1.0))

    def corners_b(self):
        out = []
        for i in range(8):
            c = self.size / 2 * np.array([-1 if i & 1 else 1, -1 if i & 2 else 1, -1 if i & 4 else 1])
            out.append(c)
        return out

    def hook_point(self):
        """Hook position in the load's frame, hanging still."""
        att, lens = self.attach, self.lens
        if len(att) == 4:
            c = sum(att) / 4
            sol = least_squares(lambda h: [np.linalg.norm(h - a) - l for a, l in zip(att, lens)],
                                c + np.array([0, 0, max(lens)]), xtol=1e-15, ftol=1e-15, gtol=1e-15)
            return sol.x
        # Two legs: in the plane of the attach line and the centre of
        # mass, on the far side of the line from it.
        u = (att[1] - att[0]) / np.linalg.norm(att[1] - att[0])
        q0 = att[0] - (att[0] @ u) * u
        wv = q0 / np.linalg.norm(q0)

        def res(p):
            h = p[0] * u + p[1] * wv
            return [np.linalg.norm(h - att[0]) - lens[0], np.linalg.norm(h - att[1]) - lens[1]]
        sol = least_squares(res, [0.5 * (att[0] + att[1]) @ u, np.linalg.norm(q0) + max(lens)],
                            xtol=1e-15, ftol=1e-15, gtol=1e-15)
        return sol.x[0] * u + sol.x[1] * wv

    def rest_rotation(self):
        r0 = rot_axis([0, 0, 1], self.heading)
        if self.kind == "spreader":
            return r0
        if self.kind == "two ropes":
            return self.tandem_rest(self.rope(0.0)[0])[0]
        d = r0 @ (-self.hook_b)
        return rot_to(d / np.linalg.norm(d), np.array([0, 0, -1.0])) @ r0

    def tandem_rest(self, l):
        """Two hook ropes hanging still under a still suspension point at
        the origin, rope length l: (rotation, centre of mass)."""
        if l in self.rest_memo:
            return self.rest_memo[l]
        r0 = rot_axis([0, 0, 1], self.heading)
        e = r0 @ np.array([1.0, 0, 0])
        tops = [t * e for t in self.tops]
        lens = [l + x for x in self.extra]
        w = self.m * G_N

        def rot(v):
            a = np.linalg.norm(v)
            return r0 if a == 0 else rot_axis(v / a, a) @ r0

        def res(p):
            c, R, lam = p[:3], rot(p[3:6]), p[6:8]
            out, force, moment = [], np.array([0, 0, -w]), np.zeros(3)
            for a, t, ln, tn in zip(self.attach, tops, lens, lam):
                arm = R @ a
                d = t - (c + arm)
                n = np.linalg.norm(d)
                out.append((n - ln) / ln)
                force = force + tn * d / n
                moment = moment + np.cross(arm, tn * d / n)
            return out + list(force / w) + list(moment / (w * l))
        zc = -(np.mean(lens) + np.mean([a[2] for a in self.attach]))
        sol = least_squares(res, np.concatenate(([0, 0, zc], [0, 0, 0], [w / 2, w / 2])),
                            xtol=1e-15, ftol=1e-15, gtol=1e-15)
        if max(abs(x) for x in sol.fun) > 1e-12:
            raise RuntimeError("two ropes: no rest found (residual %g)" % max(abs(x) for x in sol.fun))
        self.rest_memo[l] = (rot(sol.x[3:6]), sol.x[:3])
        return self.rest_memo[l]

    def plumb(self, t):
        """Two hook ropes: where the load hangs still from the suspension
        point, horizontally, turned with the slew, at the rope length at t."""
        if self.kind != "two ropes":
            return np.zeros(3)
        c = self.tandem_rest(self.rope(t)[0])[1]
        psi = self.axes["slew"].at(t)[0]
        cs, sn = math.cos(psi), math.sin(psi)
        return np.array([cs * c[0] - sn * c[1], sn * c[0] + cs * c[1], 0.0])

    # -- points and constraints
    def body_pos(self, y, wts):
        p = y[:3 * self.npts].reshape(self.npts, 3)
        return wts @ p[:4]

    def top_offset(self, t, i):
        """Offset of top point i (spreader, two ropes) from S: position, velocity, acceleration."""
        psi, dpsi, ddpsi = self.axes["slew"].at(t)
        h = self.heading + psi
        e = np.array([math.cos(h), math.sin(h), 0.0])
        et = np.array([-math.sin(h), math.cos(h), 0.0])
        a = self.tops[i]
        return a * e, a * dpsi * et, a * ddpsi * et - a * dpsi * dpsi * e

    def build_constraints(self):
        """Each constraint: (weights over the points, kind of offset, length)."""
        n = self.npts
        cons = []
        for i in range(4):
            for j in range(i + 1, 4):
                w = np.zeros(n)
                w[i], w[j] = 1, -1
                cons.append((w, None, np.linalg.norm(self.verts[i] - self.verts[j])))
        self.n_rigid = len(cons)

        def on_body(b):
            w = np.zeros(n)
            w[:4] = self.bary(b)
            return w
        if self.kind in ("spreader", "two ropes"):
            for i in range(2):
                cons.append((on_body(self.attach[i]), ("top", i), "rope"))
        else:
            if self.hook_pt:
                wh = np.zeros(n)
                wh[4] = 1
            else:
                wh = on_body(self.hook_b)
            cons.append((wh, ("top", 0), "rope"))
            if self.kind == "two legs":
                for a, l in zip(self.attach, self.lens):
                    cons.append((wh - on_body(a), None, l))
            elif self.hook_pt:
                # Held rigid by three vertices: those whose plane is farthest from the hook.
                best = max(range(4), key=lambda drop: self.plane_dist(drop))
                for k in range(4):
                    if k != best:
                        w = wh.copy()
                        w[k] -= 1
                        cons.append((w, None, np.linalg.norm(self.hook_b - self.verts[k])))
        self.cons = cons

    def plane_dist(self, drop):
        v = [self.verts[k] for k in range(4) if k != drop]
        nrm = np.cross(v[1] - v[0], v[2] - v[0])
        return abs((self.hook_b - v[0]) @ nrm) / np.linalg.norm(nrm)

    def offset(self, t, spec):
        if spec is None:
            z = np.zeros(3)
            return z, z, z
        s, ds, dds = self.suspension(t)
        if self.kind in ("spreader", "two ropes"):
            o, do, ddo = self.top_offset(t, spec[1])
            return -(s + o), -(ds + do), -(dds + ddo)
        return -s, -ds, -dds

    def rope_extra(self, spec):
        """A rope's length less L(t): two hook ropes' own lengths."""
        return self.extra[spec[1]] if self.kind == "two ropes" else 0.0

    def length(self, t, l):
        if l == "rope":
            return self.rope(t)
        return l, 0.0, 0.0

    def multipliers(self, t, y, baumgarte=True):
        n = self.npts
        p = y[:3 * n].reshape(n, 3)
        v = y[3 * n:].reshape(n, 3)
        if not hasattr(self, "wmat"):
            self.wmat = np.array([c[0] for c in self.cons])
            self.fixed_len = np.array([0.0 if c[2] == "rope" else c[2] for c in self.cons])
            self.rope_rows = [i for i, c in enumerate(self.cons) if c[2] == "rope"]
            self.minv = np.repeat(1.0 / self.masses, 3)
        forces = self.masses[:, None] * np.array([0, 0, -G_N])
        vc = v[:4].mean(axis=0)
        fl = self.m * (self.applied(t, vc) - np.array([0, 0, -G_N]))  # wind and drag on the load
        forces[:4] += fl / 4
        wm = self.wmat
        nc = len(wm)
        d = wm @ p
        dd = wm @ v
        dda = np.zeros((nc, 3))
        l = self.fixed_len.copy()
        dl = np.zeros(nc)
        ddl = np.zeros(nc)
        lr, dlr, ddlr = self.rope(t)
        for i in self.rope_rows:
            o, do, ddo = self.offset(t, self.cons[i][1])
            d[i] += o
            dd[i] += do
            dda[i] = ddo
            l[i], dl[i], ddl[i] = lr + self.rope_extra(self.cons[i][1]), dlr, ddlr
        gm = (wm[:, :, None] * d[:, None, :]).reshape(nc, 3 * n)
        kappa = np.einsum("ij,ij->i", d, dda) + np.einsum("ij,ij->i", dd, dd) - dl * dl - l * ddl
        if baumgarte:
            wb = math.sqrt(G_N / lr)
            c = 0.5 * (np.einsum("ij,ij->i", d, d) - l * l)
            dc = np.einsum("ij,ij->i", d, dd) - l * dl
            kappa += 2 * wb * dc + wb * wb * c
        f = forces.reshape(-1)
        gmi = gm * self.minv
        lam = np.linalg.solve(gmi @ gm.T, -kappa - gmi @ f)
        acc = self.minv * (f + gm.T @ lam)
        info = list(zip(d, l))
        return lam, acc, info

    def rhs(self, t, y):
        _, acc, _ = self.multipliers(t, y)
        return np.concatenate((y[3 * self.npts:], acc))

    # -- states
    def rest_state(self, t, l):
        s = self.suspension(t)[0]
        R = self.rest_R
        if self.kind == "two ropes":
            R, c0 = self.tandem_rest(l)
            c = s + c0
        elif self.kind == "spreader":
            c = s - np.array([0, 0, l + self.attach[0][2]])
        else:
            hook = s - np.array([0, 0, l])
            c = hook - R @ self.hook_b
        pts = [c + R @ vk for vk in self.verts]
        if self.hook_pt:
            pts.append(c + R @ self.hook_b)
        return np.concatenate((np.concatenate(pts), np.zeros(3 * self.npts)))

    def initial(self):
        ini = self.sc.get("initial") or {}
        th = ini.get("swing_deg", 0.0) * DEG
        az = ini.get("toward_deg", 0.0) * DEG
        vx, vy = ini.get("velocity_x_m_per_s", 0.0), ini.get("velocity_y_m_per_s", 0.0)
        s, ds, _ = self.suspension(0.0)
        l = self.rope(0.0)[0]
        y = self.rest_state(0.0, l)
        n = self.npts
        p = y[:3 * n].reshape(n, 3)
        q = rot_axis([math.sin(az), -math.cos(az), 0.0], th)
        if self.kind in ("spreader", "two ropes"):
            l += np.mean(self.extra)
            p = p + (q @ np.array([0, 0, -l]) - np.array([0, 0, -l]))
            nd = q @ np.array([0, 0, -1.0])
            w = np.array([vx, vy, -(nd[0] * vx + nd[1] * vy) / nd[2]])
            v = np.tile(ds + w, (n, 1))
        else:
            p = s + (p - s) @ q.T
            rl = p[:4].mean(axis=0) - s
            w = np.array([vx, vy, -(rl[0] * vx + rl[1] * vy) / rl[2]])
            om = np.cross(rl, w) / (rl @ rl)
            v = ds + np.cross(om, p - s)
        return np.concatenate((p.reshape(-1), v.reshape(-1)))

    # -- modes
    def modes(self, l):
        """Exact linearisation about hanging still at rope length l."""
        save = self.suspension, self.rope, self.applied
        self.suspension = lambda t: (np.zeros(3), np.zeros(3), np.zeros(3))
        self.rope = lambda t: (l, 0.0, 0.0)
        self.applied = lambda t, v: np.array([0, 0, -G_N])
        try:
            y = self.rest_state(0.0, l)
            p = y[:3 * self.npts].reshape(self.npts, 3)
            gm = []
            dtd = []
            for w, spec, lspec in self.cons:
                o, _, _ = self.offset(0.0, spec)
                d = w @ p + o
                gm.append(np.kron(w, d))
                dtd.append(np.kron(np.outer(w, w), np.eye(3)))
            gm = np.array(gm)
            f = (self.masses[:, None] * np.array([0, 0, -G_N])).reshape(-1)
            lam = np.linalg.lstsq(gm.T, -f, rcond=None)[0]
            nb = scipy.linalg.null_space(gm, rcond=1e-10)
            kr = -nb.T @ sum(lj * dj for lj, dj in zip(lam, dtd)) @ nb
            mr = nb.T @ np.diag(np.repeat(self.masses, 3)) @ nb
            w2 = scipy.linalg.eigh(0.5 * (kr + kr.T), mr, eigvals_only=True)
        finally:
            self.suspension, self.rope, self.applied = save
        return sorted((2 * math.pi / math.sqrt(x) for x in w2 if x > FREE_OMEGA2), reverse=True)


def orientation(model, p):
    c = p[:4].mean(axis=0)
    m = sum(np.outer(p[k] - c, TETRA[k]) for k in range(4)) * 0.75
    return c, m @ np.linalg.inv(model.amat)


def figures(model, t, y):
    """swing, excursion, rope tension, tilt, |twist|, corner swing^2, legs..."""
    lam, acc, info = model.multipliers(t, y)
    n = model.npts
    p = y[:3 * n].reshape(n, 3)
    s = model.suspension(t)[0]
    c, R = orientation(model, p)
    d = c - s - model.plumb(t)
    h = math.hypot(d[0], d[1])
    k0 = model.n_rigid
    if model.kind in ("spreader", "two ropes"):
        legs = [-lam[k0 + i] * info[k0 + i][1] for i in range(2)]
        ten = sum(legs)
    else:
        (dr, lr) = info[k0]
        ten = -lam[k0] * lr
        if model.kind == "two legs":
            legs = [-lam[k0 + 1 + i] * info[k0 + 1 + i][1] for i in range(2)]
        else:
            hook = p[4] if model.hook_pt else model.body_pos(y, model.bary(model.hook_b))
            ah = acc[12:15] if model.hook_pt else model.bary(model.hook_b) @ acc[:12].reshape(4, 3)
            rope = lam[k0] * dr
            fs = model.mh * (ah - np.array([0, 0, -G_N])) - rope
            es = []
            for a in model.attach:
                e = model.body_pos(y, model.bary(a)) - hook
                es.append(e / np.linalg.norm(e))
            kk = sum(np.outer(e, e) / l for e, l in zip(es, model.lens))
            x = np.linalg.solve(kk, fs)
            legs = [(e @ x) / l for e, l in zip(es, model.lens)]
    ez, ex = R[:, 2], R[:, 0]
    tilt = math.atan2(math.hypot(ez[0], ez[1]), ez[2])
    psi = model.axes["slew"].at(t)[0] if model.kind in ("spreader", "two ropes") else 0.0
    rx = model.rest_R[:, 0]
    rest_corner = model.rest_corner
    if model.kind == "two ropes":
        # Hanging still at the present rope length.
        rr, c0 = model.tandem_rest(model.rope(t)[0])
        rx = rr[:, 0]
        rest_corner = [(c0 + rr @ cb)[:2] for cb in model.corners_b()]
    tw = math.remainder(math.atan2(ex[1], ex[0]) - math.atan2(rx[1], rx[0]) - psi, 2 * math.pi)
    cs, sn = math.cos(psi), math.sin(psi)
    corner = 0.0
    for cb, rc in zip(model.corners_b(), rest_corner):
        pc = c + R @ cb - s
        dx = pc[0] - (cs * rc[0] - sn * rc[1])
        dy = pc[1] - (sn * rc[0] + cs * rc[1])
        corner = max(corner, dx * dx + dy * dy)
    return [math.atan2(h, -d[2]), h, ten, tilt, abs(tw), corner] + legs, d, s


def brent_max(f, a, b):
    """Maximum of f on [a, b] by Brent's bounded method (SciPy's
    minimize_scalar), to 1e-10 s."""
    r = minimize_scalar(lambda x: -f(x), bounds=(a, b), method="bounded",
                        options={"xatol": 1e-10 * (1 + abs(b))})
    return r.x, -r.fun


def solve(model, rtol=RTOL, atol=ATOL, per_step=6):
    nl = 2 if model.kind != "four legs" else 4
    tracks = [("swing", 0, 1.0), ("exc", 1, 1.0), ("ten", 2, 1.0), ("neg_ten", 2, -1.0),
              ("tilt", 3, 1.0), ("twist", 4, 1.0), ("corner", 5, 1.0)]
    for i in range(nl):
        tracks += [("leg%d" % i, 6 + i, 1.0), ("neg_leg%d" % i, 6 + i, -1.0)]
    edges = [0.0] + model.breaks + [model.t_end]
    y = model.initial()
    peaks = {k: ref.Peak() for k, _, _ in tracks}
    peaks["res_swing"], peaks["res_exc"] = ref.Peak(), ref.Peak()
    sample_times = [round(f * (model.samples - 1)) * (model.t_end / (model.samples - 1))
                    for f in ref.SAMPLE_FRACTIONS]
    sample_times[-1] = model.t_end
    samples = {}
    nfev = steps = 0
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
            vals = np.array([figures(model, tt[j], yy[:, j])[0] for j in range(len(tt))])
            for name, col, sgn in tracks:
                targets = [peaks[name]]
                if residual and name in ("swing", "exc"):
                    targets.append(peaks["res_" + name])
                v = sgn * vals[:, col]
                j = int(np.argmax(v))
                tm, vm = tt[j], v[j]
                lo, hi = max(j - 1, 0), min(j + 1, per_step)
                # Refine only a sample that may beat the best so far once
                # refined: the top lies above the samples by less than
                # their largest difference within the step.
                slack = np.max(np.abs(np.diff(v))) + 1e-12 * abs(vm)
                if vm + slack >= min(p.v for p in targets):
                    def f(t_, col=col, sgn=sgn):
                        return sgn * figures(model, t_, sol.sol(t_))[0][col]
                    t2, v2 = brent_max(f, tt[lo], tt[hi])
                    if v2 > vm:
                        tm, vm = t2, v2
                for p in targets:
                    p.offer(vm, tm)
        for st in sample_times:
            if a - 1e-12 <= st <= b + 1e-12 and st not in samples:
                vals, d, s = figures(model, st, sol.sol(st))
                samples[st] = {
                    "time_s": st, "rel_x_m": d[0], "rel_y_m": d[1], "rel_z_m": d[2],
                    "suspension_x_m": s[0], "suspension_y_m": s[1],
                    "swing_deg": vals[0] / DEG, "tension_n": vals[2], "rope_m": model.rope(st)[0],
                    "tilt_deg": vals[3] / DEG, "leg_tension_n": vals[6:],
                }
        y = sol.y[:, -1]
    if model.motion_end >= model.t_end:
        raise RuntimeError("no residual window")
    w = (model.m + model.mh) * G_N
    saved = model.suspension, model.rope
    model.suspension = lambda t: (np.zeros(3), np.zeros(3), np.zeros(3))
    model.rope = lambda t: (model.l_end, 0.0, 0.0)
    try:
        rest = model.rest_state(0.0, model.l_end)
        rest_vals = figures(model, 0.0, rest)[0]
    finally:
        model.suspension, model.rope = saved
    out = {
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
        "tension_factor": peaks["ten"].v / w,
        "body": {
            "suspension": model.kind,
            "mode_periods_s": model.mode_periods,
            "rest_tilt_deg": rest_vals[3] / DEG,
            "peak_tilt_deg": peaks["tilt"].v / DEG,
            "peak_twist_deg": peaks["twist"].v / DEG,
            "peak_corner_swing_m": math.sqrt(peaks["corner"].v),
            "legs": [{"static_n": rest_vals[6 + i], "tension_max_n": peaks["leg%d" % i].v,
                      "tension_min_n": -peaks["neg_leg%d" % i].v} for i in range(nl)],
        },
        "samples": [samples[t] for t in sorted(samples)],
        "solver": {"steps": steps, "nfev": nfev},
    }
    if model.kind == "spreader":
        out["body"]["bifilar_twist_period_s"] = 2 * math.pi * (model.k[2] / model.half) * math.sqrt(model.l_end / G_N)
    if model.kind == "two ropes":
        # The bifilar formula with a half the attach points' horizontal
        # distance and h the ropes' mean length (exact for parallel equal ropes).
        da = model.attach[0] - model.attach[1]
        a = math.hypot(da[0], da[1]) / 2
        out["body"]["bifilar_twist_period_s"] = 2 * math.pi * (model.k[2] / a) * math.sqrt((model.l_end + np.mean(model.extra)) / G_N)
    return out


def covered(sc):
    return "body" in sc.get("load", {}) and ref.moves(sc)


def cmd_generate(args):
    entries = []
    for rel in ref.scenario_paths(SCENARIO_GLOBS):
        sc = ref.load(os.path.join(ROOT, rel))
        if not covered(sc):
            continue
        t0 = time.perf_counter()
        res = solve(RigidModel(sc))
        print("%-52s peak %8.5f deg  tilt %8.5f deg  twist %8.5f deg  %6.1f s" % (
            rel, res["peak_swing_deg"], res["body"]["peak_tilt_deg"], res["body"]["peak_twist_deg"],
            time.perf_counter() - t0), file=sys.stderr)
        entries.append({"scenario": rel, "result": res})
    ref.write_results(RESULTS, "Reference results for swaysheet scenarios with a rigid load, from testdata/reference/rigid.py",
                      "the load as four point masses on a rigid tetrahedron with its mass and inertia; hook block "
                      "as a fifth point; rope, legs and rigidity as distance constraints with Lagrange multipliers; "
                      "Baumgarte stabilisation with w = sqrt(g/L); modes from the exact linearisation",
                      "Brent's bounded method", entries)


def main():
    ref.generate_show_cli(__doc__, "results_rigid.json", cmd_generate, RigidModel, solve)


if __name__ == "__main__":
    main()

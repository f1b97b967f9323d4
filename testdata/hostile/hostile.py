#!/usr/bin/env python3
"""Hostile scenario files (invented, for testing only): files built to make
the core work as long as it can, or to break its decoder. `make hostile`
writes them to out/hostile/ and times the command line on each (wall and
CPU); the README's "Bad input" section records the last run. None may take
more than 10 s."""
import json, math, os, resource, subprocess, sys, time

OUT = sys.argv[1] if len(sys.argv) > 1 else "out/hostile"
CLI = sys.argv[2] if len(sys.argv) > 2 else "out/hostile/swaysheet"


def base(name, rope=5.0):
    return {"format": "swaysheet-scenario", "version": 1, "name": name, "example": True,
            "description": "Invented hostile input for testing the work bounds.",
            "load": {"mass_kg": 1000, "rope_length_m": rope}, "motions": []}


EI2 = {"kind": "ei", "period_s": 4.5, "second_period_s": 1.3}


def files():
    s = base("100 recorded moves, two-mode EI, rel_tol 1e-13")
    csv = "time_s,travel_x_m_per_s\n" + "".join(
        "%g,%g\n" % (i * 0.5, 0.5 if 0 < i < 10 else 0) for i in range(12))
    s["motions"] = [{"axis": "travel_x", "profile": "series", "start_s": k * 30, "csv": csv, "shaper": EI2}
                    for k in range(100)]
    s["settings"] = {"rel_tol": 1e-13}
    yield "recorded-100-ei2", s, []

    s = base("100 long moves at once, two-mode EI, rel_tol 1e-13")
    s["motions"] = [{"axis": ["travel_x", "travel_y"][k % 2], "start_s": k * 0.01, "distance_m": 900,
                     "speed_m_per_s": 1, "accel_m_per_s2": 0.3, "shaper": EI2} for k in range(100)]
    s["settings"] = {"rel_tol": 1e-13}
    yield "overlap-100-ei2-long", s, []

    s = base("0.3 m rope for 3600 s at rel_tol 1e-13", rope=0.3)
    s["motions"] = [{"axis": "travel_x", "distance_m": 2000, "speed_m_per_s": 1, "accel_m_per_s2": 5}]
    s["settings"] = {"rel_tol": 1e-13, "duration_s": 3600}
    yield "short-rope-3600s", s, []

    s = base("stiff hook block for 3600 s at rel_tol 1e-13", rope=0.3)
    s["load"]["hook"] = {"mass_kg": 0.1, "rigging_length_m": 0.1}
    s["motions"] = [{"axis": "travel_x", "distance_m": 2000, "speed_m_per_s": 1, "accel_m_per_s2": 5}]
    s["settings"] = {"rel_tol": 1e-13, "duration_s": 3600}
    yield "hook-short-3600s", s, []

    # A record as large as a file may be: about 45,000 speed samples.
    s = base("largest recorded move, two-mode EI, rel_tol 1e-13")
    n = 45000
    rows = ["%.2f,%.4f" % (i * 0.02, 0.8 * math.sin(math.pi * i / (n - 1)) ** 2) for i in range(n)]
    s["motions"] = [{"axis": "travel_x", "profile": "series", "csv": "time_s,travel_x_m_per_s\n" + "\n".join(rows) + "\n",
                     "shaper": EI2}]
    s["settings"] = {"rel_tol": 1e-13}
    yield "csv-largest", s, []

    s = base("100 step-speed moves of 50 steps at once, rel_tol 1e-13")
    steps = [{"at_s": i * 2.0, "speed_m_per_s": (0.5 if i % 2 else -0.5) if i < 49 else 0} for i in range(50)]
    s["motions"] = [{"axis": "travel_x", "profile": "steps", "start_s": k * 0.5, "accel_m_per_s2": 0.3, "steps": steps,
                     "shaper": EI2} for k in range(100)]
    s["settings"] = {"rel_tol": 1e-13}
    yield "steps-100x50", s, []

    for k, (rope, hook, rig, dist, v, a) in enumerate([(0.3, 0.1, 0.1, 2000, 10, 5), (5, 0.1, 0.1, 10, 1, 1)]):
        s = base("plan with a stiff hook block over rope lengths 0.3 to 500 m", rope=rope)
        s["load"]["hook"] = {"mass_kg": hook, "rigging_length_m": rig}
        s["limits"] = {"peak_swing_deg": 5, "residual_swing_deg": 0.5}
        s["plan"] = {"axis": "travel_x", "distance_m": dist, "top_speed_m_per_s": v, "max_accel_m_per_s2": a,
                     "rope_length_min_m": 0.3, "rope_length_max_m": 500}
        yield "plan-hook-range-%d" % (k + 1), s, ["-plan"]

    yield "deep-lists", "[" * 1_000_000, []
    yield "many-keys", "{" + ",".join('"k%d":%d' % (i, i) for i in range(60000)) + "}", []


def main():
    os.makedirs(OUT, exist_ok=True)
    worst = 0.0
    for name, s, flags in files():
        path = os.path.join(OUT, name + ".json")
        with open(path, "w") as f:
            f.write(s if isinstance(s, str) else json.dumps(s))
        before = resource.getrusage(resource.RUSAGE_CHILDREN)
        t0 = time.perf_counter()
        p = subprocess.run([CLI, "-summary"] + flags + [path], capture_output=True, text=True)
        wall = time.perf_counter() - t0
        after = resource.getrusage(resource.RUSAGE_CHILDREN)
        cpu = (after.ru_utime - before.ru_utime) + (after.ru_stime - before.ru_stime)
        worst = max(worst, wall)
        what = (p.stderr.strip().splitlines() or ["a result"])[0]
        print("| %s | %.2f s | %.2f s | exit %d: %s |" % (name, wall, cpu, p.returncode, what[len(path) + 2:][:160] if p.returncode else what))
    print("worst wall time: %.2f s" % worst)
    return 0 if worst <= 10 else 1


if __name__ == "__main__":
    sys.exit(main())

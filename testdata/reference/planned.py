#!/usr/bin/python3
"""Write the planner's moves as reference scenarios.

    /usr/bin/python3 testdata/reference/planned.py     # or: make planned

For every planning example testdata/scenarios/plan-*.json this runs
`go run ./core/cmd/swaysheet -plan -json FILE` and writes, for the
recommended option and one other shaped option (the best ranked shaped
option of another drive kind, else of the same kind), the option's move
(its `motion`, as the planner hands it out) as an ordinary scenario at each
rope length the planner verified it at: the nominal one and both ends of
the range, with the planner's two periods of settling. The files are testdata/reference/scenarios/planned-<plan>-<option>-<L>m.json;
`make reference` then solves them (reference.py, or double.py for those
with a hook block). Re-run after a planner change, then `make reference`.

The recommended option is the plan's own ("recommended", the index the
planner ranks first; checked on 2026-12-02 for every planning example).
The other shaped option may be one the planner screened and did not
simulate (its "not_simulated" says why; in plan-precast-hook, ZV2):
TestPlannerAgainstReference then runs that move itself, at the planner's
tolerance, before comparing.
Only the Python standard library is used.
"""

import glob
import json
import os
import subprocess
import sys

HERE = os.path.dirname(os.path.abspath(__file__))
ROOT = os.path.dirname(os.path.dirname(HERE))
OUT = os.path.join(HERE, "scenarios")


def plan(path):
    out = subprocess.run(["go", "run", "./core/cmd/swaysheet", "-plan", "-json", path],
                         cwd=ROOT, check=True, capture_output=True, text=True).stdout
    return json.loads(out)


def chosen(p):
    """The recommended option and one other shaped option, or only the first
    when the plan offers no other shaped one."""
    opts = p["options"]
    if p["recommended"] >= 0:
        rec = opts[p["recommended"]]
    else:
        # Nothing recommended (a pendant the crew cannot time well enough):
        # the crew's own option, else the first.
        rec = next((o for o in opts if o.get("presses")), opts[0])
    shaped = [o for o in opts if o is not rec and o.get("shaper") and o.get("motion")]
    other = [o for o in shaped if o["drive"] != rec["drive"]] or shaped
    return [("recommended", rec)] + ([("shaped", other[0])] if other else [])


def length_name(x):
    return ("%g" % x).replace(".", "p") + "m"


def main():
    for old in glob.glob(os.path.join(OUT, "planned-*.json")):
        os.remove(old)
    n = 0
    for path in sorted(glob.glob(os.path.join(ROOT, "testdata/scenarios/plan-*.json"))):
        rel = os.path.relpath(path, ROOT)
        with open(path) as f:
            sc = json.load(f)
        p = plan(rel)
        stem = os.path.basename(path)[len("plan-"):-len(".json")]
        for why, o in chosen(p):
            for l in p["rope_lengths_m"]:
                out = {"format": sc["format"], "version": sc["version"]}
                out["name"] = "Planned move: %s, rope %g m" % (o["label"], l)
                out["description"] = (
                    "Written by testdata/reference/planned.py from `swaysheet -plan -json %s`: the %s option "
                    "(%s, rank %d of %d) as the planner hands out its move, at a rope length of %g m "
                    "(nominal %g m, range %g to %g m)." % (
                        rel, why, o["key"], o["rank"], len(p["options"]), l, p["rope_length_m"],
                        min(p["rope_lengths_m"]), max(p["rope_lengths_m"])))
                out["example"] = sc.get("example", False)
                out["load"] = dict(sc["load"], rope_length_m=l)
                for k in ("crane", "wind", "initial"):
                    if k in sc:
                        out[k] = sc[k]
                out["motions"] = [o["motion"]]
                out["limits"] = sc["limits"]
                # The planner verifies each option over two periods of settling
                # (core/plan); the same here, so that its figures can be checked
                # against the reference (TestPlannerAgainstReference).
                out["settings"] = {"settle_periods": 2}
                name = "planned-%s-%s-%s.json" % (stem, o["key"].replace("_", "-"), length_name(l))
                with open(os.path.join(OUT, name), "w") as f:
                    json.dump(out, f, indent=2)
                    f.write("\n")
                print("wrote testdata/reference/scenarios/" + name, file=sys.stderr)
                n += 1
    print("%d planned scenarios" % n, file=sys.stderr)


if __name__ == "__main__":
    main()

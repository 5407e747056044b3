#!/usr/bin/env python3
"""The turn pressures of a team file, computed with CoolProp alone: the yardstick for
timing `turnsheet plan` (BENCHMARKS.md, "The command line against a CoolProp script").

It does what the plan needs and nothing more: each diver's gas content at the start
(real gas, HEOS reference equations, and by tank factor), the allowance of the rule, and
each turn pressure by the inverse. The inverse is direct, as in Turnsheet: the density
wanted is rho(1 atm) x (1 + content / W), and CoolProp gives the pressure at that density
in one call. Stages are matched the same way among the divers who carry one. The matching
and the water capacities are the ones of make_mixed_teams.py (common practice: volume
matching, the higher of the two exact turns, rounded up to the gauge step).

Usage, from the repository root (CoolProp 8.0.0: `pip install coolprop==8.0.0`):

    python3 tests/reference/plan_with_coolprop.py examples/hollowmere-team.json

Prints one line per diver: name, turn (and stage drop) on the diver's gauge.
"""
import math
import os
import sys

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))

import CoolProp.CoolProp as CP  # noqa: E402

from make_mixed_teams import ATM, composition, fluid, from_bar, lpl, team_supplies, water  # noqa: E402


def turn_real(w, comp, content_left, t_k):
    """Gauge bar at which `w` litres of water hold `content_left` free litres (direct)."""
    if content_left <= 0:
        return 0.0
    f = fluid(comp)
    d0 = CP.PropsSI("Dmolar", "P", ATM, "T", t_k, f)
    p = CP.PropsSI("P", "Dmolar", d0 * (1.0 + content_left / w), "T", t_k, f)
    return (p - ATM) / 1e5


def match(supplies, fraction, t_k):
    for s in supplies:
        s["comp"] = composition(s["mix"])
        s["w_real"] = water(s["cyl"], "real")
        s["w_hand"] = water(s["cyl"], "hand")
        s["c_real"] = s["w_real"] * lpl(s["comp"], s["start_bar"], t_k)
        s["c_hand"] = s["w_hand"] * s["start_bar"]
    a_real = min(s["c_real"] for s in supplies) * fraction
    a_hand = min(s["c_hand"] for s in supplies) * fraction
    shown = []
    for s in supplies:
        real = turn_real(s["w_real"], s["comp"], s["c_real"] - a_real, t_k)
        hand = (s["c_hand"] - a_hand) / s["w_hand"]
        u = s["unit"]
        higher = max(from_bar(real, u), from_bar(hand, u))
        start = from_bar(s["start_bar"], u)
        shown.append(min(math.ceil(higher / s["step"] - 1e-9) * s["step"], start))
    return shown


def main(path):
    import json

    with open(path) as f:
        team = json.load(f)
    t_k, fraction, mains, stages, stage_of = team_supplies(team)
    turns = match(mains, fraction, t_k)
    drops = dict(zip(stage_of, match(stages, fraction, t_k))) if stages else {}
    for i, d in enumerate(team["divers"]):
        line = f"{d['name']}: turn {turns[i]:g} {mains[i]['unit']}"
        if i in drops:
            line += f", stage drop {drops[i]:g} {mains[i]['unit']}"
        print(line)


if __name__ == "__main__":
    main(sys.argv[1] if len(sys.argv) > 1 else "examples/hollowmere-team.json")

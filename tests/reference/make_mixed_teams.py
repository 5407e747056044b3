#!/usr/bin/env python3
"""Expected turn pressures for invented teams whose divers read different gauges
(bar and psi, different graduations), some with stages, computed independently of
Turnsheet with CoolProp's HEOS reference equations.

The method is the volume matching of common practice:
  content   real gas: W x (rho(p + 1 atm) - rho(1 atm)) / rho(1 atm) at water temperature;
            tank factor: water litres x gauge bar, or rated cu ft x gauge psi / rated psi
  allowance the smallest content x the rule's fraction (each model on its own)
  turn      the pressure where the content is down by the allowance; shown: the higher of the
            two exact turns, in the diver's gauge unit, rounded UP to the diver's graduation,
            never above the start. Stages are matched the same way among the divers who carry one.
An imperial rating (cu ft at psi) gives the real-gas water capacity from AIR at the rated
pressure and 70 F (the rating is free air).

Install: `pip install coolprop==8.0.0`. Run from the repository root:
`python3 tests/reference/make_mixed_teams.py`. Writes tests/reference/mixed_teams.json with
the CoolProp version in its "source" field. The divers and teams are invented.
"""
import json
import math
import os

import CoolProp
import CoolProp.CoolProp as CP

ATM = 101325.0  # Pa
BAR_PER_PSI = 0.0689475729
L_PER_CUFT = 28.316846592
HERE = os.path.dirname(os.path.abspath(__file__))
AIR = {"Nitrogen": 0.7812, "Oxygen": 0.2096, "Argon": 0.0092}


def composition(mix):
    o2 = mix.get("o2", 0.21)
    he = mix.get("he", 0.0)
    if abs(o2 - 0.21) < 1e-12 and he == 0.0:
        return AIR
    comp = {"Oxygen": o2}
    if he > 0:
        comp["Helium"] = he
    if 1.0 - o2 - he > 1e-12:
        comp["Nitrogen"] = 1.0 - o2 - he
    return comp


def fluid(comp):
    return "HEOS::" + "&".join(f"{k}[{v}]" for k, v in comp.items())


def lpl(comp, p_bar_gauge, t_k):
    """Free litres at 1 atm per litre of water, real gas."""
    if p_bar_gauge <= 0:
        return 0.0
    f = fluid(comp)
    d0 = CP.PropsSI("Dmolar", "P", ATM, "T", t_k, f)
    d = CP.PropsSI("Dmolar", "P", p_bar_gauge * 1e5 + ATM, "T", t_k, f)
    return d / d0 - 1.0


def to_bar(value, unit):
    return value if unit == "bar" else value * BAR_PER_PSI


def from_bar(bar, unit):
    return bar if unit == "bar" else bar / BAR_PER_PSI


def water(cyl, kind):
    n = cyl.get("count", 1)
    if "water_l" in cyl:
        return n * cyl["water_l"]
    rating_l = cyl["rated_cuft"] * L_PER_CUFT
    rated_bar = cyl["rated_psi"] * BAR_PER_PSI
    if kind == "hand":
        return n * rating_l / rated_bar
    t70 = (70.0 - 32.0) * 5.0 / 9.0 + 273.15
    return n * rating_l / lpl(AIR, rated_bar, t70)


def solve(f, target, lo=0.0, hi=400.0):
    """Pressure (bar) where the increasing f reaches target, by bisection."""
    if target <= f(lo):
        return lo
    for _ in range(80):
        mid = 0.5 * (lo + hi)
        if f(mid) < target:
            lo = mid
        else:
            hi = mid
    return 0.5 * (lo + hi)


def match(supplies, fraction, t_k):
    """supplies: list of dicts with cyl, mix, start_bar, unit, step."""
    for s in supplies:
        comp = composition(s["mix"])
        s["w_real"] = water(s["cyl"], "real")
        s["w_hand"] = water(s["cyl"], "hand")
        s["c_real"] = s["w_real"] * lpl(comp, s["start_bar"], t_k)
        s["c_hand"] = s["w_hand"] * s["start_bar"]
        s["comp"] = comp
    a_real = min(s["c_real"] for s in supplies) * fraction
    a_hand = min(s["c_hand"] for s in supplies) * fraction
    out = []
    for s in supplies:
        target = s["c_real"] - a_real
        turn_real = solve(lambda p: s["w_real"] * lpl(s["comp"], p, t_k), target)
        turn_hand = (s["c_hand"] - a_hand) / s["w_hand"]
        u = s["unit"]
        higher = max(from_bar(turn_real, u), from_bar(turn_hand, u))
        start = from_bar(s["start_bar"], u)
        shown = min(math.ceil(higher / s["step"] - 1e-9) * s["step"], start)
        out.append({
            "turn_real": round(from_bar(turn_real, u), 4),
            "turn_hand": round(from_bar(turn_hand, u), 4),
            "turn": shown,
        })
    return out


FRACTIONS = {"halves": 1 / 2, "thirds": 1 / 3, "quarters": 1 / 4, "fifths": 1 / 5, "sixths": 1 / 6}


def team_supplies(team):
    """The team file read for matching: water temperature (K), the rule's fraction, each
    diver's main supply, the stages and whose each stage is (index into the divers)."""
    units = team["units"]
    team_unit = "bar" if units == "metric" else "psi"
    team_step = team.get("gauge_step", 10 if units == "metric" else 100)
    wt = team.get("water_temp", 20 if units == "metric" else 68)
    t_c = wt if units == "metric" else (wt - 32.0) * 5.0 / 9.0
    t_k = t_c + 273.15
    fraction = FRACTIONS[team["rule"]]
    mains, stages, stage_of = [], [], []
    for i, d in enumerate(team["divers"]):
        g = d.get("gauge")
        unit = g["unit"] if g else team_unit
        step = (g.get("step") if g else None) or (team_step if unit == team_unit else (10 if unit == "bar" else 100))
        mains.append({"cyl": d["cylinders"], "mix": d.get("mix", {}), "start_bar": to_bar(d["start"], unit),
                      "unit": unit, "step": step})
        if "stage" in d:
            st = d["stage"]
            stages.append({"cyl": st["cylinders"], "mix": st.get("mix", {}), "start_bar": to_bar(st["start"], unit),
                           "unit": unit, "step": step})
            stage_of.append(i)
    return t_k, fraction, mains, stages, stage_of


def plan(team):
    t_k, fraction, mains, stages, stage_of = team_supplies(team)
    main = match(mains, fraction, t_k)
    result = []
    for i, d in enumerate(team["divers"]):
        r = {"name": d["name"], "unit": mains[i]["unit"], "step": mains[i]["step"], **main[i]}
        result.append(r)
    if stages:
        for k, m in enumerate(match(stages, fraction, t_k)):
            r = result[stage_of[k]]
            r["stage_drop"] = m["turn"]
            r["stage_drop_real"] = m["turn_real"]
            r["stage_drop_hand"] = m["turn_hand"]
    return result


# Invented teams: divers, cylinders and fills of our own.
TEAMS = [
    {
        "units": "metric", "rule": "thirds", "gauge_step": 10, "water_temp": 14,
        "divers": [
            {"name": "Anouk", "cylinders": {"count": 2, "water_l": 12, "working_bar": 232}, "start": 225},
            {"name": "Bram", "cylinders": {"count": 2, "rated_cuft": 77.4, "rated_psi": 3000},
             "start": 3100, "gauge": {"unit": "psi", "step": 100}},
            {"name": "Chiara", "cylinders": {"count": 2, "water_l": 8.5, "working_bar": 300},
             "mix": {"o2": 0.21, "he": 0.35}, "start": 285, "gauge": {"unit": "bar", "step": 5}},
        ],
    },
    {
        "units": "imperial", "rule": "quarters", "gauge_step": 50, "water_temp": 58,
        "divers": [
            {"name": "Dai", "cylinders": {"count": 2, "rated_cuft": 104, "rated_psi": 2640}, "start": 2850,
             "stage": {"cylinders": {"rated_cuft": 40, "rated_psi": 3000}, "mix": {"o2": 0.5}, "start": 2950}},
            {"name": "Eero", "cylinders": {"count": 2, "water_l": 12, "working_bar": 232}, "start": 218,
             "gauge": {"unit": "bar"},
             "stage": {"cylinders": {"water_l": 7, "working_bar": 232}, "mix": {"o2": 0.5}, "start": 205}},
            {"name": "Femke", "cylinders": {"count": 2, "rated_cuft": 100, "rated_psi": 3442}, "start": 3300,
             "gauge": {"unit": "psi", "step": 100}},
        ],
    },
    {
        "units": "metric", "rule": "thirds", "gauge_step": 5, "water_temp": 22,
        "divers": [
            {"name": "Goran", "cylinders": {"count": 1, "rated_cuft": 77.4, "rated_psi": 3000}, "start": 2900,
             "gauge": {"unit": "psi", "step": 50}},
            {"name": "Hedda", "cylinders": {"count": 2, "water_l": 11.1, "working_bar": 207}, "start": 200},
        ],
    },
]


def main():
    out = {
        "source": f"CoolProp {CoolProp.__version__}, HEOS reference equations; tests/reference/make_mixed_teams.py",
        "teams": [{"team": t, "expected": plan(t)} for t in TEAMS],
    }
    with open(os.path.join(HERE, "mixed_teams.json"), "w") as f:
        json.dump(out, f, indent=1)
        f.write("\n")


if __name__ == "__main__":
    main()

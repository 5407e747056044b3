#!/usr/bin/env python3
"""Reference gas contents and temperature changes for Turnsheet's tests.

Computed with CoolProp's HEOS reference equations of state (mixtures with
CoolProp's own mixing rules). Install: `pip install coolprop==8.0.0`.
Run from the repository root: `python3 tests/reference/make_reference.py`.
The CoolProp version is written into each file's first line.
"""
import os

import CoolProp
import CoolProp.CoolProp as CP

ATM = 101325.0  # Pa
HERE = os.path.dirname(os.path.abspath(__file__))

# Mole fractions; air with argon (N2 0.7812 / O2 0.2096 / Ar 0.0092).
MIXES = {
    "air": {"Nitrogen": 0.7812, "Oxygen": 0.2096, "Argon": 0.0092},
    "ean32": {"Nitrogen": 0.68, "Oxygen": 0.32},
    "tx21_35": {"Nitrogen": 0.44, "Oxygen": 0.21, "Helium": 0.35},
    "tx18_45": {"Nitrogen": 0.37, "Oxygen": 0.18, "Helium": 0.45},
    "heliox21_79": {"Oxygen": 0.21, "Helium": 0.79},
}
O2_HE = {
    "air": (0.21, 0.0),
    "ean32": (0.32, 0.0),
    "tx21_35": (0.21, 0.35),
    "tx18_45": (0.18, 0.45),
    "heliox21_79": (0.21, 0.79),
}
PRESSURES_BAR = [10, 50, 100, 150, 200, 232, 250, 300]
TEMPS_C = [0, 10, 20, 30, 40]
# (mix, fill bar gauge, fill °C, water °C)
COOLING = [
    ("air", 232, 35, 12),
    ("air", 200, 30, 4),
    ("air", 300, 40, 15),
    ("ean32", 232, 35, 20),
    ("tx21_35", 232, 35, 12),
    ("air", 180, 5, 25),
]


def fluid(name):
    parts = [f"{k}[{v}]" for k, v in MIXES[name].items()]
    return "HEOS::" + "&".join(parts)


def density(name, p_abs_pa, t_k):
    return CP.PropsSI("Dmolar", "P", p_abs_pa, "T", t_k, fluid(name))


def main():
    version = CoolProp.__version__
    with open(os.path.join(HERE, "gas_content.csv"), "w") as f:
        f.write(f"# CoolProp {version}, HEOS; free litres at 1 atm and T delivered per litre of water capacity from p gauge to 0 gauge\n")
        f.write("mix,o2,he,pressure_bar,temp_c,litres_per_litre\n")
        for name in MIXES:
            o2, he = O2_HE[name]
            for t_c in TEMPS_C:
                t = t_c + 273.15
                d0 = density(name, ATM, t)
                for p in PRESSURES_BAR:
                    d = density(name, p * 1e5 + ATM, t)
                    f.write(f"{name},{o2},{he},{p},{t_c},{d / d0 - 1.0:.6f}\n")
    with open(os.path.join(HERE, "temperature_change.csv"), "w") as f:
        f.write(f"# CoolProp {version}, HEOS; sealed cylinder at constant density, gauge pressures in bar\n")
        f.write("mix,o2,he,fill_bar,fill_c,water_c,pressure_after_bar\n")
        for name, p1, t1, t2 in COOLING:
            o2, he = O2_HE[name]
            d = density(name, p1 * 1e5 + ATM, t1 + 273.15)
            p2 = CP.PropsSI("P", "Dmolar", d, "T", t2 + 273.15, fluid(name))
            f.write(f"{name},{o2},{he},{p1},{t1},{t2},{(p2 - ATM) / 1e5:.4f}\n")


if __name__ == "__main__":
    main()

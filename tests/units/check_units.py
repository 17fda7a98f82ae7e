#!/usr/bin/python3
"""Reference check of the CLI's unit conversions against scipy.constants and pint.

    /usr/bin/python3 tests/units/check_units.py build/native/fuelwright

Each conversion is run through `fuelwright convert VALUE FROM TO` and compared
with the value built from scipy.constants (the attribute is named in the line)
and, where pint has the unit, with pint. Prints one line per check and a final
"N passed, N failed"; exits 1 on any failure.

Tolerances:
- scipy.constants holds the exact defining values (NIST SP 811 / CODATA), so
  the only difference is floating-point rounding: relative 1e-12.
- pint's exactly defined units (Btu_it, international_calorie, gallon, ...) are
  also compared at 1e-12. pint's plain `Btu` is the ISO 31-4 rounded
  1055.056 J, 1.4e-7 relative above Btu_IT = 1055.05585262 J, and pint's
  `therm` (= EC_therm) is 1e5 of that rounded Btu: comparisons with those two
  use a relative tolerance of 2e-7.

Unit conventions of the project checked here:
- Btu = Btu_IT = 1055.05585262 J;  therm = 100 000 Btu_IT = 105.505585262 MJ.
  That is pint's EC_therm within pint's Btu rounding, NOT pint's US_therm
  (105.4804 MJ): the project's therm is 0.0239 % larger, asserted below.
- cal = cal_IT = 4.1868 J, kcal = 1000 cal_IT; cal_th = 4.184 J, kcal_th = 4184 J.
  (pint's `cal`/`kcal` are thermochemical: the project's cal is pint's cal_it.)
- gal = US liquid gallon = 231 in3; imp_gal = 4.54609 L.
- ccf = 100 ft3, Mcf = 1000 ft3; short_ton = 2000 lb; tonne = 1000 kg.
- cord = 128 ft3: no library defines it. Definition: 128 ft3 stacked
  (USDA Forest Service), checked against 128 * scipy.constants.foot**3.
"""
import json
import math
import subprocess
import sys

import pint
import scipy.constants as sc

RTOL_EXACT = 1e-12
# pint's Btu is 1055.056 J (rounded); Btu_IT is 1055.05585262 J: relative 1.4e-7 apart.
RTOL_PINT_ROUNDED_BTU = 2e-7

ureg = pint.UnitRegistry()
Q = ureg.Quantity

kWh = sc.kilo * sc.hour  # J; 1 W * 3600 s * 1000
therm = 1e5 * sc.Btu_IT  # J

# (value, from, to, expected from scipy, how the expectation was built,
#  pint expression or None, pint tolerance)
CASES = [
    (1, "therm", "kWh", therm / kWh, "1e5*Btu_IT/(kilo*hour)", ("therm", "kWh"), RTOL_PINT_ROUNDED_BTU),
    (100, "kWh", "therm", 100 * kWh / therm, "100*kilo*hour/(1e5*Btu_IT)", None, None),
    (1, "therm", "MJ", therm / sc.mega, "1e5*Btu_IT/mega", ("therm", "MJ"), RTOL_PINT_ROUNDED_BTU),
    (1000, "MJ", "therm", 1000 * sc.mega / therm, "1000*mega/(1e5*Btu_IT)", None, None),
    (1, "Btu", "J", sc.Btu_IT, "Btu_IT", ("Btu_it", "J"), RTOL_EXACT),
    (1, "Btu", "J", sc.Btu_IT, "Btu_IT (pint's rounded ISO Btu)", ("Btu", "J"), RTOL_PINT_ROUNDED_BTU),
    (1e6, "J", "Btu", 1e6 / sc.Btu_IT, "1e6/Btu_IT", ("J", "Btu_it"), RTOL_EXACT),
    (1, "MMBtu", "GJ", 1e6 * sc.Btu_IT / sc.giga, "1e6*Btu_IT/giga", None, None),
    (1, "GJ", "MMBtu", sc.giga / (1e6 * sc.Btu_IT), "giga/(1e6*Btu_IT)", None, None),
    (1, "kcal", "kJ", sc.calorie_IT, "calorie_IT (kJ per kcal)", ("kilocal_it", "kJ"), RTOL_EXACT),
    (1, "kcal_th", "kJ", sc.calorie_th, "calorie_th (kJ per kcal_th)", ("kilocalorie", "kJ"), RTOL_EXACT),
    (1, "cal", "J", sc.calorie_IT, "calorie_IT", ("cal_it", "J"), RTOL_EXACT),
    (1, "cal_th", "J", sc.calorie_th, "calorie_th", ("cal_th", "J"), RTOL_EXACT),
    (1, "gal", "L", sc.gallon / sc.liter, "gallon/liter", ("gallon", "L"), RTOL_EXACT),
    (10, "L", "gal", 10 * sc.liter / sc.gallon, "10*liter/gallon", None, None),
    (1, "imp_gal", "L", sc.gallon_imp / sc.liter, "gallon_imp/liter", ("imperial_gallon", "L"), RTOL_EXACT),
    (1, "ft3", "m3", sc.foot ** 3, "foot**3", ("ft**3", "m**3"), RTOL_EXACT),
    (1, "ccf", "m3", 100 * sc.foot ** 3, "100*foot**3", None, None),
    (1, "Mcf", "ft3", 1000.0, "1000 (definition)", None, None),
    (1, "lb", "kg", sc.pound, "pound", ("lb", "kg"), RTOL_EXACT),
    (1, "short_ton", "kg", sc.short_ton, "short_ton", ("short_ton", "kg"), RTOL_EXACT),
    (1, "tonne", "kg", sc.metric_ton, "metric_ton", ("tonne", "kg"), RTOL_EXACT),
    (1, "Btu/h", "W", sc.Btu_IT / sc.hour, "Btu_IT/hour", ("Btu_it/hour", "W"), RTOL_EXACT),
    (1, "kW", "Btu/h", sc.kilo * sc.hour / sc.Btu_IT, "kilo*hour/Btu_IT", ("kW", "Btu_it/hour"), RTOL_EXACT),
    (212, "degF", "degC", sc.convert_temperature(212, "Fahrenheit", "Celsius"),
     "convert_temperature(212, F, C)", ("degF", "degC"), RTOL_EXACT),
    (-40, "degC", "degF", sc.convert_temperature(-40, "Celsius", "Fahrenheit"),
     "convert_temperature(-40, C, F)", ("degC", "degF"), RTOL_EXACT),
    (300, "K", "degC", 300 - sc.zero_Celsius, "300 - zero_Celsius", ("K", "degC"), RTOL_EXACT),
    (1, "cord", "ft3", 128.0, "definition: 128 ft3 stacked (USDA Forest Service)", None, None),
    (1, "cord", "m3", 128 * sc.foot ** 3,
     "128*foot**3; definition: 128 ft3 stacked (USDA Forest Service)", None, None),
]

# Conversions that must be refused (exit status 2): unknown or wrongly cased units.
REFUSED = [("1", "therm", "furlong"), ("1", "KWH", "J"), ("1", "btu", "J"), ("x", "kWh", "J")]

passed = 0
failed = 0


def report(ok, text):
    global passed, failed
    if ok:
        passed += 1
    else:
        failed += 1
    print(f"{'PASS' if ok else 'FAIL'}  {text}")


def close(actual, expected, rtol):
    return math.isclose(actual, expected, rel_tol=rtol, abs_tol=1e-300 if expected else 1e-12)


def run_cli(cli, *args):
    return subprocess.run([cli, "convert", *args], capture_output=True, text=True, timeout=30)


def main():
    if len(sys.argv) != 2:
        print("usage: check_units.py PATH/TO/fuelwright", file=sys.stderr)
        return 2
    cli = sys.argv[1]

    for value, src, dst, expected, how, pint_units, pint_rtol in CASES:
        label = f"{value:g} {src} -> {dst}"
        proc = run_cli(cli, repr(value) if isinstance(value, float) else str(value), src, dst)
        try:
            out = json.loads(proc.stdout)
            actual = float(out["value"])
            unit = out["unit"]
        except (ValueError, KeyError, TypeError):
            report(False, f"{label}: exit {proc.returncode}, no result: {proc.stdout.strip()} {proc.stderr.strip()}")
            continue
        if proc.returncode != 0 or unit != dst:
            report(False, f"{label}: exit {proc.returncode}, unit {unit!r}")
            continue
        report(close(actual, expected, RTOL_EXACT),
               f"{label} = {actual!r}  scipy.constants {how} = {expected!r} (rtol {RTOL_EXACT:g})")
        if pint_units:
            p_from, p_to = pint_units
            reference = Q(value, p_from).to(p_to).magnitude
            report(close(actual, reference, pint_rtol),
                   f"{label} = {actual!r}  pint {p_from} -> {p_to} = {reference!r} (rtol {pint_rtol:g})")

    # The project's therm is not pint's US_therm (105.4804 MJ): 0.0239 % more.
    proc = run_cli(cli, "1", "therm", "MJ")
    try:
        project_therm = float(json.loads(proc.stdout)["value"])
        us_therm = Q(1, "US_therm").to("MJ").magnitude
        excess = project_therm / us_therm - 1
        report(2.38e-4 < excess < 2.40e-4,
               f"therm = {project_therm!r} MJ is {excess * 100:.4f} % above pint US_therm {us_therm!r} MJ "
               "(expected 0.0239 %: therm = 1e5 Btu_IT, not US_therm)")
    except (ValueError, KeyError, TypeError):
        report(False, f"1 therm -> MJ: no result: {proc.stdout.strip()}")

    for args in REFUSED:
        proc = run_cli(cli, *args)
        report(proc.returncode == 2, f"convert {' '.join(args)}: exit {proc.returncode} (expected 2: refused)")

    print(f"{passed} passed, {failed} failed")
    return 1 if failed else 0


if __name__ == "__main__":
    sys.exit(main())

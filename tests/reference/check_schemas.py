#!/usr/bin/python3
"""JSON Schemas in data/schema/ against the files they describe (python3-jsonschema, draft 2020-12).

Checks, one line each:
  - every schema is itself a valid 2020-12 schema, and every property in it has a description;
  - every data/examples/*.json is a valid scenario, with a title and a description that says it
    is an invented example;
  - each catalog data/<name>.json is valid against data/schema/<name>.schema.json;
  - the scenario schema's lists of catalog fuels, systems, wood species and per-fuel price units
    are exactly those of data/fuels.json and data/systems.json (so the two cannot drift apart);
  - deliberately bad scenarios built below are rejected, and a few unusual but valid ones are
    accepted, so the schema can neither accept everything nor reject the contract.
Prints 'N passed, N failed' last; exits 1 on any failure.
"""
import copy
import json
import sys
from pathlib import Path

from jsonschema import Draft202012Validator

ROOT = Path(__file__).resolve().parents[2]
DATA = ROOT / "data"
SCHEMAS = DATA / "schema"
CATALOGS = ["fuels", "systems", "species", "elements"]

passed = 0
failed = 0


def check(ok, label, detail=""):
    global passed, failed
    if ok:
        passed += 1
        print(f"ok    {label}")
    else:
        failed += 1
        print(f"FAIL  {label}" + (f"\n      {detail}" if detail else ""))


def load(path):
    with open(path, encoding="utf-8") as f:
        return json.load(f)


def errors_of(validator, document):
    """Validation errors as 'pointer: message' lines, most specific first."""
    errors = sorted(validator.iter_errors(document), key=lambda e: -len(e.absolute_path))
    return ["/" + "/".join(str(p) for p in e.absolute_path) + ": " + e.message for e in errors]


def undescribed_properties(schema):
    """Pointers of declared properties without a description, directly or on the $defs entry they
    $ref. Conditions (if/then/else, dependentSchemas, not) only narrow properties declared elsewhere."""
    defs = schema.get("$defs", {})

    def described(node):
        if "description" in node:
            return True
        ref = node.get("$ref", "")
        return ref.startswith("#/$defs/") and "description" in defs.get(ref[len("#/$defs/"):], {})

    missing = []

    def walk(node, pointer):
        if isinstance(node, dict):
            for name, sub in node.get("properties", {}).items():
                if isinstance(sub, dict) and not described(sub):
                    missing.append(f"{pointer}/properties/{name}")
            for key, sub in node.items():
                if key not in ("if", "then", "else", "dependentSchemas", "not"):
                    walk(sub, f"{pointer}/{key}")
        elif isinstance(node, list):
            for i, sub in enumerate(node):
                walk(sub, f"{pointer}/{i}")

    walk(schema, "")
    return missing


# ---------------------------------------------------------------------------
# The schemas themselves
validators = {}
for name in ["scenario"] + CATALOGS:
    path = SCHEMAS / f"{name}.schema.json"
    label = f"schema  data/schema/{path.name}"
    try:
        schema = load(path)
        Draft202012Validator.check_schema(schema)
    except Exception as error:  # noqa: BLE001 - reported as a failed check
        check(False, label + " is a valid 2020-12 schema", str(error).splitlines()[0])
        continue
    check(schema.get("$schema") == "https://json-schema.org/draft/2020-12/schema"
          and all(schema.get(k) for k in ("$id", "title", "description")),
          label + " is a valid 2020-12 schema with $id, title and description")
    missing = undescribed_properties(schema)
    check(not missing, label + " describes every property", ", ".join(missing))
    validators[name] = Draft202012Validator(schema)

if "scenario" not in validators:
    print(f"{passed} passed, {failed + 1} failed")
    sys.exit(1)
scenario = validators["scenario"]

# ---------------------------------------------------------------------------
# Examples
PRICE_FILES = {"supplier-prices.json", "supplier-prices-time-of-use.json"}  # supplier price files, checked against their own schema below
examples = sorted(p for p in (DATA / "examples").glob("*.json") if p.name not in PRICE_FILES)
check(len(examples) >= 5, f"examples  at least five scenarios in data/examples/ (found {len(examples)})")
for path in examples:
    label = f"example data/examples/{path.name}"
    try:
        document = load(path)
    except ValueError as error:
        check(False, label, f"not JSON: {error}")
        continue
    errors = errors_of(scenario, document)
    check(not errors, label + " is a valid scenario", "\n      ".join(errors[:8]))
    text = (str(document.get("title", "")) + " " + str(document.get("description", ""))).lower()
    check(bool(document.get("title")) and bool(document.get("description")) and "invented" in text,
          label + " has a title and a description saying it is invented")

# ---------------------------------------------------------------------------
# Supplier price files: the sample is valid; every bad fixture the schema can judge is rejected.
Draft202012Validator.check_schema(load(DATA / "schema" / "supplier-prices.schema.json"))
# The price file's climate refers to the scenario schema's (scenario.schema.json#/$defs/climate), found by its $id.
scenario_document = load(DATA / "schema" / "scenario.schema.json")
prices_document = load(DATA / "schema" / "supplier-prices.schema.json")
try:  # jsonschema 4.18 and later
    from referencing import Registry
    from referencing.jsonschema import DRAFT202012
    registry = Registry().with_resource(scenario_document["$id"], DRAFT202012.create_resource(scenario_document))
    prices_schema = Draft202012Validator(prices_document, registry=registry)
except ImportError:  # Debian 12's jsonschema 4.10
    from jsonschema import RefResolver
    resolver = RefResolver.from_schema(prices_document, store={scenario_document["$id"]: scenario_document})
    prices_schema = Draft202012Validator(prices_document, resolver=resolver)
with_climate = copy.deepcopy(load(DATA / "examples" / "supplier-prices.json"))
with_climate["climate"] = {"monthly_mean": [22, 25, 34, 46, 57, 66, 71, 69, 61, 49, 38, 27], "unit": "degF"}
errors = errors_of(prices_schema, with_climate)
check(not errors, "prices  a price file with the climate of its area is valid", "\n      ".join(errors[:4]))
with_climate["climate"]["colour"] = "blue"
check(bool(errors_of(prices_schema, with_climate)), "prices  the price file's climate is checked as a scenario's (unknown field rejected)")
for name in sorted(PRICE_FILES):
    errors = errors_of(prices_schema, load(DATA / "examples" / name))
    check(not errors, f"prices  data/examples/{name} is a valid price file", "\n      ".join(errors[:8]))
FIXTURES = DATA.parent / "tests" / "fixtures" / "prices"
expected = load(FIXTURES / "expected.json")
for case in expected["cases"]:
    if case["schema_rejects"] is None:
        continue
    errors = errors_of(prices_schema, load(FIXTURES / case["file"]))
    if case["schema_rejects"]:
        check(bool(errors), f"prices  schema rejects {case['file']}")
    else:
        # Beyond a JSON Schema (tier order, units per fuel, dates): the schema accepts it, check-prices does not.
        check(not errors, f"prices  schema accepts domain-rule case {case['file']}", "\n      ".join(errors[:4]))

# ---------------------------------------------------------------------------
# Catalogs
catalogs = {}
for name in CATALOGS:
    label = f"catalog data/{name}.json"
    try:
        catalogs[name] = load(DATA / f"{name}.json")
    except (OSError, ValueError) as error:
        check(False, label, f"cannot be read: {error}")
        catalogs[name] = {}
        continue
    if name not in validators:
        check(False, label, "its schema did not load")
        continue
    errors = errors_of(validators[name], catalogs[name])
    check(not errors, label + f" is valid against {name}.schema.json", "\n      ".join(errors[:8]))

# The scenario schema's enumerations follow the catalogs.
defs = load(SCHEMAS / "scenario.schema.json")["$defs"]
fuels = {fuel["id"]: fuel for fuel in catalogs["fuels"].get("fuels", [])}
check(sorted(defs["catalogFuel"]["enum"]) == sorted(fuels),
      "sync    scenario catalogFuel = ids of data/fuels.json",
      f"schema {sorted(defs['catalogFuel']['enum'])} vs data {sorted(fuels)}")
systems = catalogs["systems"].get("systems", [])
system_ids = [system["id"] for system in systems]
check(sorted(defs["catalogSystem"]["enum"]) == sorted(system_ids),
      "sync    scenario catalogSystem = ids of data/systems.json",
      f"schema {sorted(defs['catalogSystem']['enum'])} vs data {sorted(system_ids)}")
species_groups = [group["id"] for group in fuels.get("cordwood", {}).get("species_groups", [])]
wood_enum = defs["option"]["properties"]["wood_species"]["enum"]
check(sorted(wood_enum) == sorted(species_groups),
      "sync    scenario wood_species = cordwood species_groups of data/fuels.json",
      f"schema {sorted(wood_enum)} vs data {sorted(species_groups)}")
per_fuel = {}
for rule in defs["perFuelUnits"]["allOf"]:
    fuel_test = rule["if"]["properties"]["fuel"]
    units = rule["then"]["properties"]["price"]["properties"]["per"].get("enum")
    for fuel_id in fuel_test.get("enum", [fuel_test["const"]] if "const" in fuel_test else []):
        per_fuel[fuel_id] = units
for fuel_id, fuel in fuels.items():
    check(sorted(per_fuel.get(fuel_id) or []) == sorted(fuel["sale_units"]),
          f"sync    scenario price units of {fuel_id} = its sale_units in data/fuels.json",
          f"schema {per_fuel.get(fuel_id)} vs data {fuel['sale_units']}")
system_sources = catalogs["systems"].get("sources", {})
for system in systems:
    unknown = [f for f in system["fuels"] if f not in fuels]
    check(not unknown, f"sync    fuels of system {system['id']} are in data/fuels.json", str(unknown))
    cited = [system[k]["source"] for k in ("typical", "minimum", "auxiliary_electricity", "service_life") if k in system]
    missing = [c for c in cited if c not in system_sources]
    check(not missing, f"sources of system {system['id']} are keys of the file's sources", str(missing))

# ---------------------------------------------------------------------------
# Documents the scenario schema must reject, and unusual ones it must accept.
BASE = {
    "schema": "fuelwright.scenario/1",
    "demand": {"method": "direct", "annual_useful_heat": {"value": 60, "unit": "MMBtu"}},
    "options": [{
        "id": "gas",
        "fuel": "natural-gas",
        "price": {"amount": 1.4, "per": "therm"},
        "system": {"kind": "furnace", "efficiency": {"value": 95, "rating": "AFUE"}},
    }],
}
check(not errors_of(scenario, BASE), "accept  the minimal scenario the bad cases start from",
      "\n      ".join(errors_of(scenario, BASE)))


def variant(change):
    document = copy.deepcopy(BASE)
    change(document)
    return document


def option(document):
    return document["options"][0]


BAD = {
    "missing options": lambda d: d.pop("options"),
    "empty options": lambda d: d.update(options=[]),
    "31 options": lambda d: d.update(options=[dict(option(d), id=f"o{i}") for i in range(31)]),
    "missing demand": lambda d: d.pop("demand"),
    "discount rate below -100 %": lambda d: d.update(economics={"discount_rate": -1.5}),
    "too few Monte Carlo draws": lambda d: d.update(uncertainty={"draws": 10}),
    "heat-loss demand without UA or design load": lambda d: d.update(demand={"method": "heat-loss"}),
    "bills demand without bills": lambda d: d.update(demand={"method": "bills", "option": "gas"}),
    "climate with 11 monthly means": lambda d: d.update(climate={"monthly_mean": [0] * 11, "unit": "degC"}),
    "climate in kelvin": lambda d: d.update(climate={"monthly_mean": [270] * 12, "unit": "K"}),
    "heat-pump point with COP below 1": lambda d: option(d)["system"].update(
        ratings=[{"outdoor": {"value": 47, "unit": "degF"}, "capacity": {"value": 1, "unit": "kW"}, "cop": 0.8},
                 {"outdoor": {"value": 17, "unit": "degF"}, "capacity": {"value": 1, "unit": "kW"}, "cop": 2}]),
    "wrong schema version": lambda d: d.update(schema="fuelwright.scenario/2"),
    "unknown top-level key": lambda d: d.update(optoins=[]),
    "direct demand without annual_useful_heat": lambda d: d["demand"].pop("annual_useful_heat"),
    "unknown demand method": lambda d: d["demand"].update(method="guess"),
    "zero annual heat": lambda d: d["demand"]["annual_useful_heat"].update(value=0),
    "non-energy demand unit": lambda d: d["demand"]["annual_useful_heat"].update(unit="gal"),
    "negative price amount": lambda d: option(d)["price"].update(amount=-0.5),
    "price without per": lambda d: option(d)["price"].pop("per"),
    "price per a unit natural gas is not sold in": lambda d: option(d)["price"].update(per="gal"),
    "electricity priced per therm": lambda d: option(d).update(fuel="electricity"),
    "unknown rating": lambda d: option(d)["system"]["efficiency"].update(rating="EER"),
    "zero efficiency": lambda d: option(d)["system"]["efficiency"].update(value=0),
    "no efficiency and no catalog": lambda d: option(d)["system"].pop("efficiency"),
    "unknown system kind": lambda d: option(d)["system"].update(kind="fireplace"),
    "unknown catalog system": lambda d: option(d)["system"].update(catalog="gas-furnace-magic"),
    "distribution_loss of 1": lambda d: option(d)["system"].update(distribution_loss=1),
    "typo in a system key": lambda d: option(d)["system"].update(efficency={"value": 95, "rating": "AFUE"}),
    "bad units value": lambda d: d.update(settings={"units": "imperial"}),
    "lower-case currency": lambda d: d.update(settings={"currency": "usd"}),
    "unknown GWP set": lambda d: d.update(settings={"gwp": "AR3"}),
    "negative electricity factor": lambda d: d.update(settings={"electricity_co2e_kg_per_kwh": -0.1}),
    "unknown catalog fuel": lambda d: option(d).update(fuel="unobtainium"),
    "option id with a space": lambda d: option(d).update(id="gas furnace"),
    "typo in an option key": lambda d: option(d).update(lable="Gas"),
    "wood species on natural gas": lambda d: option(d).update(wood_species="red-oak"),
    "face_cord_fraction above 1": lambda d: option(d).update(face_cord_fraction=1.5),
    "fixed charge with neither amount": lambda d: option(d).update(fixed_charges=[{"label": "customer charge"}]),
    "fixed charge with both amounts": lambda d: option(d).update(
        fixed_charges=[{"amount_per_month": 15, "amount_per_year": 180}]),
    "heating value unit without a sale unit": lambda d: option(d).update(heating_value={"value": 1036, "unit": "Btu"}),
    "heating value basis GCV": lambda d: option(d).update(
        heating_value={"value": 1036, "unit": "Btu/ft3", "basis": "GCV"}),
    "custom fuel with formula and mixture": lambda d: option(d).update(
        fuel={"id": "x", "formula": "CH4", "mixture": "CH4:1", "sale_unit": "m3"}, price={"amount": 1, "per": "m3"}),
    "custom fuel without a description": lambda d: option(d).update(
        fuel={"id": "x", "sale_unit": "m3"}, price={"amount": 1, "per": "m3"}),
    "custom fuel without sale_unit": lambda d: option(d).update(
        fuel={"id": "x", "formula": "CH4"}, price={"amount": 1, "per": "m3"}),
    "custom fuel sold per therm": lambda d: option(d).update(
        fuel={"id": "x", "formula": "CH4", "sale_unit": "therm"}, price={"amount": 1, "per": "therm"}),
    "custom fuel moisture without ultimate": lambda d: option(d).update(
        fuel={"id": "x", "formula": "CH4", "moisture": 10, "sale_unit": "kg"}, price={"amount": 1, "per": "kg"}),
    "custom fuel moisture of 100": lambda d: option(d).update(
        fuel={"id": "x", "ultimate": "C:50,H:6,O:44", "moisture": 100, "sale_unit": "kg"},
        price={"amount": 1, "per": "kg"}),
    "custom mixture with a space after a comma": lambda d: option(d).update(
        fuel={"id": "x", "mixture": "CH4:0.6, CO2:0.4", "sale_unit": "m3"}, price={"amount": 1, "per": "m3"}),
    "custom ultimate analysis with an unknown item": lambda d: option(d).update(
        fuel={"id": "x", "ultimate": "C:50,H:6,O:43,Ash:1", "sale_unit": "kg"}, price={"amount": 1, "per": "kg"}),
    "quote date not YYYY-MM-DD": lambda d: d.update(quote={"date": "16/11/2026"}),
}
for name, change in BAD.items():
    check(bool(errors_of(scenario, variant(change))), f"reject  {name}")

GOOD = {
    "efficiency left to the catalog": lambda d: option(d)["system"].update(
        catalog="gas-furnace-condensing") or option(d)["system"].pop("efficiency"),
    "heat-loss demand by UA with a climate": lambda d: d.update(
        demand={"method": "heat-loss", "ua": {"value": 300, "unit": "W/K"},
                "balance_point": {"value": 16, "unit": "degC"}},
        climate={"monthly_mean": [-5, -3, 2, 8, 14, 19, 22, 21, 16, 10, 4, -2], "unit": "degC"}),
    "bills demand naming an option": lambda d: d.update(
        demand={"method": "bills", "option": "a",
                "bills": [{"start": "2025-01-01", "end": "2025-01-31", "quantity": 98.5, "unit": "therm"}]},
        climate={"annual_hdd": 5000, "unit": "degF", "design_temperature": {"value": 5, "unit": "degF"}}),
    "economics and uncertainty": lambda d: d.update(
        economics={"analysis_years": 15, "discount_rate": 0.05, "escalation": {"default": 0.02, "propane": 0.03},
                   "basis": "real"},
        uncertainty={"draws": 10000, "seed": 1, "spread": {"natural-gas": 0.25}}),
    "heat pump with data-sheet points": lambda d: option(d).update(
        fuel="electricity", price={"amount": 0.16, "per": "kWh"},
        system={"kind": "air-source-heat-pump", "backup": "electric-resistance", "cd": 0.25,
                "ratings": [{"outdoor": {"value": 47, "unit": "degF"}, "capacity": {"value": 36000, "unit": "Btu/h"}, "cop": 3.8},
                            {"outdoor": {"value": 17, "unit": "degF"}, "capacity": {"value": 24000, "unit": "Btu/h"}, "cop": 2.5}]}),
    "custom fuel by mixture sold per m3": lambda d: option(d).update(
        fuel={"id": "bio", "mixture": "CH4:0.6,CO2:0.4", "sale_unit": "m3", "reference": "0C"},
        price={"amount": 0.3, "per": "m3"}),
    "heating value in Btu/therm": lambda d: option(d).update(heating_value={"value": 100000, "unit": "Btu/therm"}),
    "fixed charge per year": lambda d: option(d).update(fixed_charges=[{"label": "meter", "amount_per_year": 60}]),
    "price of zero": lambda d: option(d)["price"].update(amount=0),
}
for name, change in GOOD.items():
    document = variant(change)
    errors = errors_of(scenario, document)
    check(not errors, f"accept  {name}", "\n      ".join(errors[:4]))

print(f"{passed} passed, {failed} failed")
sys.exit(1 if failed else 0)

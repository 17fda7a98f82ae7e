#!/usr/bin/python3
"""Atomic weights and molar masses in data/ against python3-periodictable.

periodictable 1.6.0 carries NIST atomic weights (Coursey et al., NIST Physical Reference Data,
"Atomic Weights and Isotopic Compositions"); data/elements.json carries the IUPAC CIAAW 2021
abridged values. The two editions differ in the last digits (H 1.00794 vs 1.0080, C 12.0107 vs
12.011, S 32.065 vs 32.06), so:
  - each atomic weight must agree within 5e-4 relative (the abridged table rounds to five
    significant figures; a typing error would be larger), and
  - each species molar mass must agree within sum(n_i x |w_i(IUPAC) - w_i(NIST)|) + 1e-5 g/mol,
    the difference the two editions alone can make, plus the rounding of the stored value.
Prints one line per check and 'N passed, N failed'; exits 1 on any failure.
"""
import json
import re
import sys
from pathlib import Path

import periodictable

DATA = Path(__file__).resolve().parents[2] / "data"


def atoms_of(formula):
    """Element counts of a formula with optional parenthesised groups, e.g. (CH3)2CO."""
    def parse(text, pos):
        counts = {}
        while pos < len(text) and text[pos] != ")":
            if text[pos] == "(":
                inner, pos = parse(text, pos + 1)
                pos += 1  # ')'
                m = re.match(r"\d*", text[pos:])
                n = int(m.group() or 1)
                pos += len(m.group())
                for k, v in inner.items():
                    counts[k] = counts.get(k, 0) + v * n
            else:
                m = re.match(r"([A-Z][a-z]?)(\d*)", text[pos:])
                counts[m.group(1)] = counts.get(m.group(1), 0) + int(m.group(2) or 1)
                pos += len(m.group())
        return counts, pos
    return parse(formula, 0)[0]


def main():
    passed = failed = 0
    elements = json.loads((DATA / "elements.json").read_text())["elements"]
    ours = {e["symbol"]: e["atomic_weight"] for e in elements}
    for symbol, weight in ours.items():
        nist = getattr(periodictable, symbol).mass
        ok = abs(weight / nist - 1) <= 5e-4
        print(f"{'ok  ' if ok else 'FAIL'} atomic weight {symbol}: IUPAC 2021 {weight} vs NIST {nist}")
        passed, failed = passed + ok, failed + (not ok)
    species = json.loads((DATA / "species.json").read_text())["species"]
    for record in species:
        atoms = atoms_of(record["formula"])
        nist_mass = periodictable.formula(record["formula"]).mass
        allowed = sum(n * abs(ours[s] - getattr(periodictable, s).mass) for s, n in atoms.items()) + 1e-5
        diff = abs(record["molar_mass_g_per_mol"] - nist_mass)
        ok = diff <= allowed
        print(f"{'ok  ' if ok else 'FAIL'} molar mass {record['id']} ({record['phase']}): "
              f"{record['molar_mass_g_per_mol']} vs periodictable {nist_mass:.5f} (|d| {diff:.6f} <= {allowed:.6f})")
        passed, failed = passed + ok, failed + (not ok)
    print(f"{passed} passed, {failed} failed")
    return 0 if failed == 0 else 1


if __name__ == "__main__":
    sys.exit(main())

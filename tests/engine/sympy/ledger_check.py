"""Check that the ledger's equations are the system: solve the KCL and branch equations that
Portfold wrote into its steps (plain infix, "lhs = rhs") with sympy, and compare the port
voltage with Portfold's Vth.

stdin: [{"id", "equations": [...], "unknowns": [...], "target": "V_out - V_ref", "vth": "..."}]
stdout: [{"id", "verdict"}]
"""

import json
import re
import sys

import sympy as sp

IDENT = re.compile(r"[A-Za-z_][A-Za-z0-9_]*")


def parse(text, names):
    for n in IDENT.findall(text):
        names.setdefault(n, sp.Symbol(n))
    return sp.sympify(text.replace("^", "**"), locals=dict(names))


def main():
    out = []
    for case in json.load(sys.stdin):
        names = {}
        unknowns = [parse(u, names) for u in case["unknowns"]]
        eqs = []
        for e in case["equations"]:
            lhs, rhs = e.split("=")
            eqs.append(parse(lhs, names) - parse(rhs, names))
        sol = sp.solve(eqs, unknowns, dict=True)
        if len(sol) != 1:
            out.append({"id": case["id"], "verdict": f"{len(sol)} solutions"})
            continue
        got = sp.cancel(parse(case["target"], names).subs(sol[0]))
        diff = sp.cancel(got - parse(case["vth"], names))
        out.append({"id": case["id"], "verdict": "ok" if diff == 0 else f"differs by {diff}"})
    json.dump(out, sys.stdout)


if __name__ == "__main__":
    main()

// Cross-checks against sympy (Debian python3-sympy, run with /usr/bin/python3). One Python
// process per batch of questions; each answer is computed and compared on the Python side.

import { execFileSync } from "node:child_process";

export type SympyQuestion =
  | { kind: "equal"; a: string; b: string } // a - b cancels to 0
  | { kind: "limit"; expr: string; symbol: string; to: "inf" | "zero"; ours: string } // ours: expression, "oo" or "-oo"
  | { kind: "gcd"; a: string; b: string; ours: string } // ours equals sympy's gcd up to a constant factor
  | { kind: "det"; rows: string[][]; ours: string }
  | { kind: "sensitivity"; expr: string; symbol: string; ours: string } // ours = (x/F) dF/dx
  | { kind: "value"; expr: string }; // sympy's exact value as "p/q" (for constant expressions)

const PROGRAM = String.raw`
import json, re, sys
import sympy
from sympy.parsing.sympy_parser import parse_expr

def parse(text):
    names = set(re.findall(r"[A-Za-z_][A-Za-z0-9_]*", text))
    local = {n: sympy.Symbol(n) for n in names}
    return parse_expr(text.replace("^", "**"), local_dict=local, evaluate=True)

def answer(q):
    k = q["kind"]
    if k == "equal":
        return sympy.cancel(parse(q["a"]) - parse(q["b"])) == 0
    if k == "limit":
        x = sympy.Symbol(q["symbol"])
        target = sympy.oo if q["to"] == "inf" else 0
        got = sympy.limit(parse(q["expr"]), x, target, "+" if q["to"] == "zero" else "-")
        ours = q["ours"]
        if ours in ("oo", "-oo"):
            return got == (sympy.oo if ours == "oo" else -sympy.oo)
        return sympy.cancel(got - parse(ours)) == 0
    if k == "gcd":
        g = sympy.gcd(parse(q["a"]), parse(q["b"]))
        ratio = sympy.cancel(g / parse(q["ours"]))
        return ratio.is_number and ratio != 0
    if k == "det":
        m = sympy.Matrix([[parse(e) for e in row] for row in q["rows"]])
        return sympy.expand(m.det(method="berkowitz") - parse(q["ours"])) == 0
    if k == "sensitivity":
        x = sympy.Symbol(q["symbol"])
        f = parse(q["expr"])
        return sympy.cancel(x / f * sympy.diff(f, x) - parse(q["ours"])) == 0
    if k == "value":
        v = sympy.Rational(parse(q["expr"]))
        return f"{v.p}/{v.q}"
    raise ValueError(k)

questions = json.load(sys.stdin)
print(json.dumps([answer(q) for q in questions]))
`;

export function askSympy(questions: SympyQuestion[]): Array<boolean | string> {
  const out = execFileSync("/usr/bin/python3", ["-c", PROGRAM], {
    input: JSON.stringify(questions),
    encoding: "utf8",
    maxBuffer: 64 * 1024 * 1024,
    timeout: 120_000,
  });
  return JSON.parse(out);
}

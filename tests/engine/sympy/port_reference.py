"""Independent reference for Portfold's port results, written with sympy.

Reads a JSON list of cases from stdin: [{"id", "network", "ours": {"vth", "isc", "rth"}}],
where "network" is the interchange format and the "ours" entries are plain infix strings
(^ as power) or null. For each network it writes the nodal equations itself, from the
element semantics of the interchange format (not from Portfold's matrix):

  * unknowns: node voltages, plus one current per voltage source and op-amp output;
  * a source value's controls are substituted as expressions: across(a, b) as Va - Vb,
    through(x) as x's current written as an expression (Y*(Va - Vb) for a passive, the
    value for a current source, ...), not a new unknown;
  * Vth: the open port; Rth: sources zeroed and 1 A driven into plus, out of minus;
  * Isc: a 0 V source across the port (not the node merge Portfold uses).

It solves each system by Cramer's rule with sympy's DomainMatrix determinants over the
polynomial ring (fraction-free elimination; each equation's denominators cleared first),
brings the quotient to lowest terms with the ring's own gcd, and checks that
cancel(ours - theirs) == 0. Prints a JSON list of {"id", "checks": {name: verdict}, "theirs"}.
"""

import json
import re
import sys

import sympy as sp
from sympy.polys.matrices import DomainMatrix

SI = {"T": 12, "G": 9, "M": 6, "k": 3, "m": -3, "u": -6, "\u00b5": -6, "n": -9, "p": -12, "f": -15}
TOKEN = re.compile(
    r"\s*(?:(?P<num>(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)(?P<prefix>[TGMkmu\u00b5npf](?![A-Za-z0-9_]))?"
    r"|(?P<ident>[A-Za-z_][A-Za-z0-9_]*)|(?P<op>[-+*/^()]))"
)

S = sp.Symbol("s")


def symbol(name):
    return S if name == "s" else sp.Symbol(name)


CONTROL = re.compile(r"(across|through)\s*\(([^)]*)\)")


def parse(text, control=None):
    """Parse a value or result string into sympy, every identifier a Symbol, numbers exact.

    control(word, args) gives the expression a control call across(...) / through(...) stands for.
    """
    calls = []

    def hole(m):
        calls.append((m.group(1), [a.strip() for a in m.group(2).split(",")]))
        return f"__control{len(calls) - 1}"

    text = CONTROL.sub(hole, text)
    if calls and control is None:
        raise ValueError(f"a control in {text!r} where none is expected")
    pos = 0
    out = []
    names = {}
    text = text.strip()
    while pos < len(text):
        m = TOKEN.match(text, pos)
        if not m or m.end() == pos:
            raise ValueError(f"cannot read {text!r} at {pos}")
        pos = m.end()
        if m.group("num"):
            mant = m.group("num")
            e = 0
            if "e" in mant.lower():
                mant, ex = re.split("[eE]", mant)
                e = int(ex)
            if m.group("prefix"):
                e += SI[m.group("prefix")]
            out.append(f"(Rational('{mant}')*Rational(10)**({e}))")
        elif m.group("ident"):
            name = m.group("ident")
            if name.startswith("__control"):
                j = int(name[len("__control"):])
                out.append(f"({name})")
                names.setdefault(name, (name, control(*calls[j])))
                continue
            key = f"__v{len(names)}" if name not in names else names[name][0]
            names.setdefault(name, (key, symbol(name)))
            out.append(names[name][0])
        else:
            out.append("**" if m.group("op") == "^" else m.group("op"))
    local = {key: sym for key, sym in names.values()}
    local["Rational"] = sp.Rational
    return sp.sympify("".join(out), locals=local) if out else sp.Integer(0)


def solve_port(network, mode):
    """mode: 'open' (Vth), 'test' (Rth) or 'short' (Isc). Returns the port quantity or None if singular."""
    ground = network.get("ground", "0")
    plus, minus = network["port"]["plus"], network["port"]["minus"]
    elements = network["elements"]
    by_name = {e["name"]: e for e in elements}

    nodes = []
    for e in elements:
        for n in (e["inputs"] + [e["output"]]) if e["kind"] == "opamp" else e["nodes"]:
            if n != ground and n not in nodes:
                nodes.append(n)
    volt = {n: sp.Symbol(f"V__{i}") for i, n in enumerate(nodes)}
    V = lambda n: sp.Integer(0) if n == ground else volt[n]

    branch = {}
    for e in elements:
        if e["kind"] in ("voltage", "opamp"):
            branch[e["name"]] = sp.Symbol(f"I__{len(branch)}")
    short = sp.Symbol("I__short")

    zeroed = mode == "test"

    def value(e, seen=()):
        """A source's value with its controls substituted; its independent part removed for the test source."""
        full = parse(str(e["value"]), lambda word, args: control(word, args, seen + (e["name"],)))
        if not zeroed:
            return full
        return full - parse(str(e["value"]), lambda word, args: sp.Integer(0))

    def control(word, args, seen):
        if word == "across":
            return V(args[0]) - V(args[1])
        return current(args[0], seen)

    def admittance(e):
        v = parse(str(e["value"]))
        return {"resistor": 1 / v, "conductance": v, "capacitor": S * v, "inductor": 1 / (S * v)}[e["kind"]]

    def current(name, seen=()):
        """Reference current of an element, first node -> second, as an expression."""
        if name in seen:
            raise ValueError("current-control cycle")
        e = by_name[name]
        k = e["kind"]
        if k in ("resistor", "conductance", "capacitor", "inductor"):
            a, b = e["nodes"]
            return admittance(e) * (V(a) - V(b))
        if e["name"] in branch:
            return branch[e["name"]]
        if k == "current":
            return value(e, seen)
        raise ValueError(f"no current for {k}")

    kcl = {n: sp.Integer(0) for n in nodes}

    def leave(n, i):
        if n != ground:
            kcl[n] += i

    constraints = []
    for e in elements:
        k = e["kind"]
        if k == "opamp":
            leave(e["output"], -branch[e["name"]])
            p, q = e["inputs"]
            constraints.append(V(p) - V(q))
            continue
        a, b = e["nodes"]
        i = current(e["name"])
        leave(a, i)
        leave(b, -i)
        if k == "voltage":
            constraints.append(V(a) - V(b) - value(e))

    unknowns = [volt[n] for n in nodes] + list(branch.values())
    if mode == "test":
        leave(plus, sp.Integer(-1))  # 1 A driven into plus: sum leaving = 1
        leave(minus, sp.Integer(1))
    if mode == "short":
        leave(plus, short)
        leave(minus, -short)
        constraints.append(V(plus) - V(minus))
        unknowns.append(short)
    eqs = list(kcl.values()) + constraints
    # Clear each equation's denominators (a row scaling), then Cramer's rule over the polynomial ring.
    eqs = [sp.fraction(sp.together(sp.expand(x)))[0] for x in eqs]
    A, rhs = sp.linear_eq_to_matrix([sp.expand(x) for x in eqs], unknowns)
    gens = sorted(A.free_symbols | rhs.free_symbols, key=str)
    domain = sp.ZZ[tuple(gens)] if gens else sp.ZZ
    dA = DomainMatrix.from_Matrix(A).convert_to(domain)
    det = dA.det()
    if det == domain.zero:
        return None
    target = {short: 1} if mode == "short" else {}
    if mode != "short":
        if plus != ground:
            target[volt[plus]] = 1
        if minus != ground:
            target[volt[minus]] = -1
    db = DomainMatrix.from_Matrix(rhs).convert_to(domain)
    num = domain.zero
    for u, sign in target.items():
        j = unknowns.index(u)
        cols = [db if k == j else dA.extract(list(range(len(unknowns))), [k]) for k in range(len(unknowns))]
        replaced = cols[0].hstack(*cols[1:])
        num += sign * replaced.det()
    # Lowest terms inside the polynomial ring (its own gcd), not on expression trees.
    if gens:
        num, det = num.cancel(det)
        return domain.to_sympy(num) / domain.to_sympy(det)
    return sp.Rational(domain.to_sympy(num), domain.to_sympy(det))


def main():
    cases = json.load(sys.stdin)
    report = []
    for case in cases:
        net = case["network"]
        checks, theirs = {}, {}
        for name, mode in (("vth", "open"), ("rth", "test"), ("isc", "short")):
            try:
                ref = solve_port(net, mode)
            except Exception as exc:  # a reference that cannot be formed is reported, not hidden
                checks[name] = f"error: {exc}"
                continue
            theirs[name] = None if ref is None else str(ref)
            ours = case["ours"].get(name)
            if ref is None or ours is None:
                checks[name] = "ok" if ref is None and ours is None else "existence differs"
                continue
            diff = sp.cancel(sp.together(parse(ours) - ref))
            checks[name] = "ok" if diff == 0 else f"differs by {diff}"
        report.append({"id": case["id"], "checks": checks, "theirs": theirs})
    json.dump(report, sys.stdout)


if __name__ == "__main__":
    main()

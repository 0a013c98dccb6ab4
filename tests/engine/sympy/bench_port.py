"""Solve one network's port with sympy, for scripts/bench-engine.ts: reads the network JSON on
stdin, solves Vth, Rth and Isc with the reference formulation of port_reference.py (Cramer's rule
on DomainMatrix determinants over the polynomial ring, then cancel), and prints the time taken
and the results as JSON."""

import json
import os
import sys
import time

sys.dont_write_bytecode = True  # keep the repository free of __pycache__
sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from port_reference import solve_port  # noqa: E402


def main():
    network = json.load(sys.stdin)
    start = time.perf_counter()
    results = {name: solve_port(network, mode) for name, mode in (("vth", "open"), ("rth", "test"), ("isc", "short"))}
    seconds = time.perf_counter() - start
    json.dump({"seconds": seconds, **{k: None if v is None else str(v) for k, v in results.items()}}, sys.stdout)


if __name__ == "__main__":
    main()

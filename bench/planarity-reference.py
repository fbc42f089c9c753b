"""Reference timings for bench/planarity.ts: networkx check_planarity on the same graphs.

Reads a JSON list of {"n", "edges", "reps", "counterexample"} on stdin; for each graph builds an
nx.Graph once, then times check_planarity(G, counterexample=...) reps times in CPU time (graph
construction not timed) and prints a JSON list of {"planar", "seconds"} with the median time.
"""
import json
import statistics
import sys
import time

import networkx as nx


def main() -> None:
    out = []
    for case in json.load(sys.stdin):
        g = nx.Graph()
        g.add_nodes_from(range(case["n"]))
        g.add_edges_from(case["edges"])
        times = []
        planar = None
        for _ in range(case["reps"]):
            t0 = time.process_time()
            planar, _cert = nx.check_planarity(g, counterexample=case["counterexample"])
            times.append(time.process_time() - t0)
        out.append({"planar": planar, "seconds": statistics.median(times)})
    json.dump(out, sys.stdout)


main()

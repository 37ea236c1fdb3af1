"""Immediate dominators by networkx, to cross-check the engine's own.

stdin: "n root" then one "u v" pair per edge (whitespace separated integers).
stdout: JSON {"idom": [...], "ms": <time of immediate_dominators alone>, "networkx": version};
idom[root] and idom of unreachable nodes are -1 (networkx's own root entry
differs between versions, so it is dropped here).
With --probe: prints the networkx version and exits.
"""
import json
import sys
import time

import networkx as nx


def main() -> None:
    if "--probe" in sys.argv:
        print(nx.__version__)
        return
    data = sys.stdin.buffer.read().split()
    n, root = int(data[0]), int(data[1])
    g = nx.DiGraph()
    g.add_nodes_from(range(n))
    ends = iter(map(int, data[2:]))
    g.add_edges_from(zip(ends, ends))
    started = time.perf_counter()
    dominators = nx.immediate_dominators(g, root)
    ms = (time.perf_counter() - started) * 1000
    idom = [-1] * n
    for v, p in dominators.items():
        if v != root and p is not None:
            idom[v] = p
    json.dump({"idom": idom, "ms": ms, "networkx": nx.__version__}, sys.stdout)


if __name__ == "__main__":
    main()

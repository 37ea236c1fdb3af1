"""Immediate dominators by networkx, to cross-check the engine's own.

stdin (whitespace-separated integers): the number of graphs, then for each
graph "n root m" followed by m "u v" edge pairs.
stdout: JSON list, one {"idom": [...], "ms": <time of immediate_dominators
alone>} per graph; idom[root] and idom of unreachable nodes are -1
(networkx's own root entry differs between versions, so it is dropped).
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
    pos = 1
    answers = []
    for _ in range(int(data[0])):
        n, root, m = int(data[pos]), int(data[pos + 1]), int(data[pos + 2])
        pos += 3
        g = nx.DiGraph()
        g.add_nodes_from(range(n))
        ends = iter(map(int, data[pos : pos + 2 * m]))
        pos += 2 * m
        g.add_edges_from(zip(ends, ends))
        started = time.perf_counter()
        dominators = nx.immediate_dominators(g, root)
        ms = (time.perf_counter() - started) * 1000
        idom = [-1] * n
        for v, p in dominators.items():
            if v != root and p is not None:
                idom[v] = p
        answers.append({"idom": idom, "ms": ms})
    json.dump(answers, sys.stdout)


if __name__ == "__main__":
    main()

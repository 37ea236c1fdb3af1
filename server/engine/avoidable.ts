/**
 * Rule 9 (revised): which single points of failure another feed could avoid.
 *
 * A single point of failure x of carriage c is avoidable when some origin
 * carriage of c's service still has programme under {x}. An origin carriage's
 * node has the root as a predecessor, so it loses programme under {x} exactly
 * when x owns that node (its site, or a group its site belongs to): a feed
 * never reaches an origin carriage "only" through something. So x is
 * unavoidable for service s iff x owns the carriage node of every origin of s,
 * which is the intersection of the owner lists of the origin nodes: a handful
 * of ids per service, computed once.
 */
import type { EngineCore } from './core';

/** Per service: element ids that hold every origin of the service (ascending). Empty for a service without origins. */
export function unavoidableByService(core: EngineCore): Int32Array[] {
  const { services, full } = core;
  return services.map((svc) => {
    const { out } = full[svc.service];
    let common: number[] | null = null;
    // Origin carriages are exactly the root's successors (graphs.ts).
    for (let e = out.offsets[0]; e < out.offsets[1]; e++) {
      const u = out.targets[e];
      const owners = Array.from(svc.owners.subarray(svc.ownerOffsets[u], svc.ownerOffsets[u + 1]));
      common = common === null ? owners : common.filter((x) => owners.includes(x));
      if (common.length === 0) break;
    }
    return Int32Array.from((common ?? []).sort((a, b) => a - b));
  });
}

/** The avoidable part of a sorted list of single points of failure of a carriage of service s. */
export function avoidableOf(unavoidable: Int32Array[], service: number, spof: ArrayLike<number>): number[] {
  const hold = unavoidable[service];
  const out: number[] = [];
  for (let i = 0; i < spof.length; i++) if (!hold.includes(spof[i])) out.push(spof[i]);
  return out;
}

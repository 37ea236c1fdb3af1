/**
 * The in-memory network a server process answers from: the document as
 * loaded from PostgreSQL, look-ups by code, and the analysis engine's graphs.
 * Built from scratch after an import (and as the fallback), updated after a
 * single edit (`updateServedNetwork`); either way a new object per network
 * version, swapped in whole (networkStore.ts), so caches keyed on it (WeakMaps
 * in server/operations/reach.ts, server/routes/checks.ts, the planner's on the
 * engine, the export cache) never see a version change under them.
 */
import type { NetworkDocument, Site, Carriage, Feed, Service, Group, EntityKind } from '@/shared/schemas/network';
import { NetworkEngine } from '../engine/engine';
import type { CodesByKind, EntitiesByKind } from './networkLoader';
import { patchDocument } from './documentPatch';

export interface ServedNetwork {
  networkVersion: number;
  document: NetworkDocument;
  sites: Map<string, Site>;
  services: Map<string, Service>;
  groups: Map<string, Group>;
  carriages: Map<string, Carriage>;
  feeds: Map<string, Feed>;
  engine: NetworkEngine;
  builtAt: Date;
}

const byCode = <T extends { code: string }>(items: T[]) => new Map(items.map((i) => [i.code, i]));

export function buildServedNetwork(document: NetworkDocument, networkVersion: number): ServedNetwork {
  return {
    networkVersion,
    document,
    sites: byCode(document.sites),
    services: byCode(document.services),
    groups: byCode(document.groups),
    carriages: byCode(document.carriages),
    feeds: byCode(document.feeds),
    engine: NetworkEngine.build(document, networkVersion),
    builtAt: new Date(),
  };
}

/**
 * The network after an edit that changed the `codes` (created, updated or
 * deleted; `entities` holds their current rows): the document patched, the
 * look-ups of the kinds that changed copied and patched, and the engine
 * updated service by service (server/engine/update.ts).
 */
export function updateServedNetwork(prev: ServedNetwork, codes: CodesByKind, entities: EntitiesByKind, networkVersion: number): ServedNetwork {
  const document = patchDocument(prev.document, codes, entities);
  const patched = <K extends EntityKind>(kind: K): ServedNetwork[K] => {
    const old = prev[kind] as Map<string, { code: string }>;
    if (!codes[kind] || codes[kind].length === 0) return prev[kind];
    const next = new Map(old);
    for (const code of codes[kind]) next.delete(code);
    for (const e of (entities[kind] ?? []) as { code: string }[]) next.set(e.code, e);
    return next as ServedNetwork[K];
  };
  return {
    networkVersion,
    document,
    sites: patched('sites'),
    services: patched('services'),
    groups: patched('groups'),
    carriages: patched('carriages'),
    feeds: patched('feeds'),
    engine: NetworkEngine.update(prev.engine, document, networkVersion, codes),
    builtAt: new Date(),
  };
}

/**
 * The in-memory network a server process answers from: the document as
 * loaded from PostgreSQL, look-ups by code, and the analysis engine's graphs.
 * Built from scratch on every change and swapped in whole (networkStore.ts).
 */
import type { NetworkDocument, Site, Carriage, Feed, Service, Group } from '@/shared/schemas/network';
import { NetworkEngine } from '../engine/engine';

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

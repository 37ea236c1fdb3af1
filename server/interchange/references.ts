/**
 * Cross-entity import rules (docs/format.md, "Import
 * rules"): duplicate codes, unknown references, a feed between carriages of
 * different services, a feed from a carriage to itself, a via-site that is
 * one end of its feed, two carriages of one service at one site.
 * Only the document's entities are reported; the stored network (if any)
 * only answers references.
 */
import { ENTITY_KINDS, type EntityKind } from '@/shared/schemas/network';
import { KIND_NOUN, type IssueSink } from './issues';
import { forEachRef, refAt, type Entry, type NetworkView } from './view';

export function checkReferences(view: NetworkView, sink: IssueSink): void {
  checkDuplicateCodes(view, sink);
  for (const entry of view.doc.sites) checkGroupList(view, sink, 'sites', entry);
  checkCarriages(view, sink);
  for (const entry of view.doc.feeds) checkFeed(view, sink, entry);
}

function checkDuplicateCodes(view: NetworkView, sink: IssueSink): void {
  for (const kind of ENTITY_KINDS) {
    for (const entry of view.doc[kind]) {
      const code = refAt(entry.raw, 'code');
      if (code === undefined) continue;
      const first = view.byCode[kind].get(code);
      if (first && first !== entry && first.index >= 0) {
        sink.error(kind, entry.index, code, 'code', 'duplicate-code',
          `code ${code} is used twice: the ${KIND_NOUN[kind]} ${sink.where(kind, first.index)} has it too; codes are unique within a kind`);
      }
    }
  }
}

/** Reports a reference to an entity that is neither in the document nor stored; returns the entry it names. */
function resolve(view: NetworkView, sink: IssueSink, kind: EntityKind, entry: Entry, field: string, target: EntityKind, code: string, label: string): Entry | undefined {
  const found = view.byCode[target].get(code);
  if (found || view.unreadable.has(target)) return found;
  sink.error(kind, entry.index, refAt(entry.raw, 'code'), field, 'unknown-reference', `${label} ${code} does not exist`);
  return undefined;
}

function checkGroupList(view: NetworkView, sink: IssueSink, kind: 'sites' | 'feeds', entry: Entry): void {
  forEachRef(entry.raw, 'groups', (i, code) => {
    resolve(view, sink, kind, entry, `groups[${i}]`, 'groups', code, 'group');
  });
}

function checkCarriages(view: NetworkView, sink: IssueSink): void {
  for (const entry of view.doc.carriages) {
    const site = refAt(entry.raw, 'site');
    const service = refAt(entry.raw, 'service');
    if (site !== undefined) resolve(view, sink, 'carriages', entry, 'site', 'sites', site, 'site');
    if (service !== undefined) resolve(view, sink, 'carriages', entry, 'service', 'services', service, 'service');
  }
  // Stored carriages come first in the map, so a clash with a stored carriage is reported on the document's one.
  // service -> site -> first carriage: a few services, so no string keys are built per carriage.
  const atSite = new Map<string, Map<string, Entry>>();
  for (const entry of view.byCode.carriages.values()) markSiteService(atSite, entry, sink);
  for (const entry of view.doc.carriages) {
    const code = refAt(entry.raw, 'code');
    if (code === undefined || view.byCode.carriages.get(code) !== entry) markSiteService(atSite, entry, sink);
  }
}

function markSiteService(atSite: Map<string, Map<string, Entry>>, entry: Entry, sink: IssueSink): void {
  const site = refAt(entry.raw, 'site');
  const service = refAt(entry.raw, 'service');
  if (site === undefined || service === undefined) return;
  let sites = atSite.get(service);
  if (!sites) atSite.set(service, (sites = new Map()));
  const first = sites.get(site);
  if (!first) {
    sites.set(site, entry);
    return;
  }
  if (entry.index < 0) return;
  const code = refAt(entry.raw, 'code');
  // A duplicate code is already reported as such; the second copy is not also a second carriage.
  if (code !== undefined && code === refAt(first.raw, 'code')) return;
  const firstName = refAt(first.raw, 'code') ?? `the carriage ${sink.where('carriages', first.index)}`;
  sink.error('carriages', entry.index, code, 'service', 'duplicate-carriage',
    `site ${site} already has carriage ${firstName} for service ${service}; a site radiates each service once`);
}

function checkFeed(view: NetworkView, sink: IssueSink, entry: Entry): void {
  const code = refAt(entry.raw, 'code');
  const from = refAt(entry.raw, 'from');
  const to = refAt(entry.raw, 'to');
  const source = from === undefined ? undefined : resolve(view, sink, 'feeds', entry, 'from', 'carriages', from, 'source carriage');
  const target = to === undefined ? undefined : resolve(view, sink, 'feeds', entry, 'to', 'carriages', to, 'receiving carriage');
  if (from !== undefined && from === to) {
    sink.error('feeds', entry.index, code, 'to', 'self-feed', `source and target are the same carriage ${from}; a feed joins two different carriages`);
  }
  if (source && target && source !== target) {
    const sourceService = refAt(source.raw, 'service');
    const targetService = refAt(target.raw, 'service');
    // An unknown service is reported on its carriage; a mismatch with it would say nothing new.
    if (knownService(view, sourceService) && knownService(view, targetService) && sourceService !== targetService) {
      sink.error('feeds', entry.index, code, 'to', 'service-mismatch',
        `source carriage ${from} carries service ${sourceService} but receiving carriage ${to} carries ${targetService}; both ends of a feed carry the same service`);
    }
  }
  const sourceSite = source ? refAt(source.raw, 'site') : undefined;
  const targetSite = target ? refAt(target.raw, 'site') : undefined;
  forEachRef(entry.raw, 'via', (i, site) => {
    resolve(view, sink, 'feeds', entry, `via[${i}]`, 'sites', site, 'via-site');
    const end = site === sourceSite ? `the source site (of carriage ${from})` : site === targetSite ? `the target site (of carriage ${to})` : undefined;
    if (end) {
      sink.error('feeds', entry.index, code, `via[${i}]`, 'via-endpoint', `via-site ${site} is ${end}; a via-site is a hop between the two ends`);
    }
  });
  checkGroupList(view, sink, 'feeds', entry);
}

function knownService(view: NetworkView, service: string | undefined): boolean {
  return service !== undefined && (view.byCode.services.has(service) || view.unreadable.has('services'));
}

/**
 * Cross-entity import rules (docs/format.md, "Import
 * rules") over a document and the stored network; the rules themselves and
 * their words are in crossRules.ts, shared with single edits: duplicate codes, unknown references, a feed between carriages of
 * different services, a feed from a carriage to itself, a via-site that is
 * one end of its feed, two carriages of one service at one site.
 * Only the document's entities are reported; the stored network (if any)
 * only answers references.
 */
import { ENTITY_KINDS, type EntityKind } from '@/shared/schemas/network';
import { duplicateCarriage, feedRules, REFERENCE_LABEL, unknownReference, type CarriageEnd } from './crossRules';
import { KIND_NOUN, type IssueSink } from './issues';
import type { Turns } from './turns';
import { forEachRef, refAt, type Entry, type NetworkView } from './view';

/** A generator so the caller may pause when a turn is due (validate.ts, turns.ts); yields `progress` unchanged. */
export function* checkReferences(view: NetworkView, sink: IssueSink, turns: Turns, progress = 0): Generator<number, void> {
  yield* checkDuplicateCodes(view, sink, turns, progress);
  for (const entry of view.doc.sites) {
    checkGroupList(view, sink, 'sites', entry);
    if (turns.due()) yield progress;
  }
  yield* checkCarriages(view, sink, turns, progress);
  for (const entry of view.doc.feeds) {
    checkFeed(view, sink, entry);
    if (turns.due()) yield progress;
  }
}

function* checkDuplicateCodes(view: NetworkView, sink: IssueSink, turns: Turns, progress: number): Generator<number, void> {
  for (const kind of ENTITY_KINDS) {
    for (const entry of view.doc[kind]) {
      if (turns.due()) yield progress;
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
  const issue = unknownReference(field, label, code);
  sink.error(kind, entry.index, refAt(entry.raw, 'code'), issue.field, issue.rule, issue.detail);
  return undefined;
}

function checkGroupList(view: NetworkView, sink: IssueSink, kind: 'sites' | 'feeds', entry: Entry): void {
  forEachRef(entry.raw, 'groups', (i, code) => {
    resolve(view, sink, kind, entry, `groups[${i}]`, 'groups', code, REFERENCE_LABEL.groups);
  });
}

function* checkCarriages(view: NetworkView, sink: IssueSink, turns: Turns, progress: number): Generator<number, void> {
  for (const entry of view.doc.carriages) {
    if (turns.due()) yield progress;
    const site = refAt(entry.raw, 'site');
    const service = refAt(entry.raw, 'service');
    if (site !== undefined) resolve(view, sink, 'carriages', entry, 'site', 'sites', site, REFERENCE_LABEL.site);
    if (service !== undefined) resolve(view, sink, 'carriages', entry, 'service', 'services', service, REFERENCE_LABEL.service);
  }
  // Stored carriages come first in the map, so a clash with a stored carriage is reported on the document's one.
  // service -> site -> first carriage: a few services, so no string keys are built per carriage.
  const atSite = new Map<string, Map<string, Entry>>();
  for (const entry of view.byCode.carriages.values()) {
    markSiteService(atSite, entry, sink);
    if (turns.due()) yield progress;
  }
  for (const entry of view.doc.carriages) {
    if (turns.due()) yield progress;
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
  const issue = duplicateCarriage(site, service, firstName);
  sink.error('carriages', entry.index, code, issue.field, issue.rule, issue.detail);
}

function checkFeed(view: NetworkView, sink: IssueSink, entry: Entry): void {
  const code = refAt(entry.raw, 'code');
  const from = refAt(entry.raw, 'from');
  const to = refAt(entry.raw, 'to');
  const source = from === undefined ? undefined : resolve(view, sink, 'feeds', entry, 'from', 'carriages', from, REFERENCE_LABEL.from);
  const target = to === undefined ? undefined : resolve(view, sink, 'feeds', entry, 'to', 'carriages', to, REFERENCE_LABEL.to);
  forEachRef(entry.raw, 'via', (i, site) => {
    resolve(view, sink, 'feeds', entry, `via[${i}]`, 'sites', site, REFERENCE_LABEL.via);
  });
  const via = Array.isArray(entry.raw.via) ? (entry.raw.via as unknown[]) : [];
  for (const issue of feedRules({ from, to, via }, endOf(view, source), endOf(view, target))) {
    sink.error('feeds', entry.index, code, issue.field, issue.rule, issue.detail);
  }
  checkGroupList(view, sink, 'feeds', entry);
}

/** A carriage's place; an unknown service is reported on its carriage, so it is left out rather than compared. */
function endOf(view: NetworkView, carriage: Entry | undefined): CarriageEnd | undefined {
  if (!carriage) return undefined;
  const service = refAt(carriage.raw, 'service');
  return { site: refAt(carriage.raw, 'site'), service: knownService(view, service) ? service : undefined };
}

function knownService(view: NetworkView, service: string | undefined): boolean {
  return service !== undefined && (view.byCode.services.has(service) || view.unreadable.has('services'));
}

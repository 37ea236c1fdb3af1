/**
 * An upsert (no `replace`) keeps the stored feeds the document leaves out.
 * The validator checks the document's own feeds; this checks the kept ones
 * against the carriages the document moves: a kept feed whose two carriages
 * would carry different services, or whose via-site would become one of its
 * ends, breaks the same import rules (docs/format.md), so
 * the carriage that causes it is reported, with the same rules and words as
 * a single edit that moves it (server/interchange/crossRules.ts).
 */
import type { NetworkDocument } from '@/shared/schemas/network';
import { IssueSink, type RowsOf } from '@/server/interchange/issues';
import type { ImportIssue } from '@/shared/schemas/import';
import { movedCarriageRules } from '@/server/interchange/crossRules';

export function checkKeptFeeds(stored: NetworkDocument, document: NetworkDocument, rowsOf?: RowsOf): ImportIssue[] {
  const moved = new Map<string, { index: number; site: string; service: string }>();
  const storedCarriage = new Map(stored.carriages.map((c) => [c.code, c]));
  document.carriages.forEach((c, index) => {
    const old = storedCarriage.get(c.code);
    if (old && (old.site !== c.site || old.service !== c.service)) moved.set(c.code, { index, site: c.site, service: c.service });
  });
  if (moved.size === 0) return [];

  const inDocument = new Set(document.feeds.map((f) => f.code));
  const now = (code: string) => moved.get(code) ?? storedCarriage.get(code);
  const sink = new IssueSink(rowsOf);
  for (const feed of stored.feeds) {
    if (inDocument.has(feed.code) || (!moved.has(feed.from) && !moved.has(feed.to))) continue;
    const culprit = moved.has(feed.to) ? feed.to : feed.from;
    const otherCode = culprit === feed.to ? feed.from : feed.to;
    const at = moved.get(culprit)!;
    const other = now(otherCode);
    if (!other) continue;
    for (const issue of movedCarriageRules({ code: culprit, site: at.site, service: at.service }, feed, { code: otherCode, site: other.site, service: other.service })) {
      sink.error('carriages', at.index, culprit, issue.field, issue.rule, issue.detail);
    }
  }
  return sink.sorted().errors;
}

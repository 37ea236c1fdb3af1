/**
 * An upsert (no `replace`) keeps the stored feeds the document leaves out.
 * The validator checks the document's own feeds; this checks the kept ones
 * against the carriages the document moves: a kept feed whose two carriages
 * would carry different services, or whose via-site would become one of its
 * ends, breaks the same import rules (docs/format.md), so
 * the carriage that causes it is reported.
 */
import type { NetworkDocument } from '@/shared/schemas/network';
import { IssueSink, type RowsOf } from '@/server/interchange/issues';
import type { ImportIssue } from '@/shared/schemas/import';

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
    const source = now(feed.from);
    const target = now(feed.to);
    if (!source || !target) continue;
    const culprit = moved.has(feed.to) ? feed.to : feed.from;
    const at = moved.get(culprit)!;
    const keep = `feed ${feed.code} is stored and not in this document`;
    if (source.service !== target.service) {
      sink.error('carriages', at.index, culprit, 'service', 'service-mismatch',
        `${keep}; after this import its source carriage ${feed.from} would carry ${source.service} and its receiving carriage ${feed.to} ${target.service}; put ${feed.code} in the document too, or keep the service`);
    }
    const via = feed.via ?? [];
    const end = via.find((site) => site === source.site || site === target.site);
    if (end !== undefined) {
      sink.error('carriages', at.index, culprit, 'site', 'via-endpoint',
        `${keep}; it passes via site ${end}, which this import makes one of its ends; put ${feed.code} in the document too, or keep the site`);
    }
  }
  return sink.sorted().errors;
}

/**
 * The rules between entities (docs/format.md, "Import rules"), written once:
 * the import's validator (references.ts, over the document and the stored
 * network), the single edits (server/services/inventory/rules.ts, over the
 * stored network) and the dry run (the validator again) all ask these, so
 * one bad feed gets one message whichever way it comes in. Each answers
 * the field, the rule name and the sentence after "feed F12: ".
 * Resolving codes is the caller's part (a map over a document, or a query).
 */
export interface CrossIssue {
  field: string;
  rule: string;
  detail: string;
}

/** A carriage's place, as far as it is known. */
export interface CarriageEnd {
  site?: string;
  service?: string;
}

/** "source carriage C99 does not exist" */
export const unknownReference = (field: string, label: string, code: string): CrossIssue => ({ field, rule: 'unknown-reference', detail: `${label} ${code} does not exist` });

/** What each reference of an entity names, for unknownReference's label. */
export const REFERENCE_LABEL = {
  site: 'site',
  service: 'service',
  from: 'source carriage',
  to: 'receiving carriage',
  via: 'via-site',
  groups: 'group',
} as const;

export const duplicateCarriage = (site: string, service: string, holder: string): CrossIssue => ({
  field: 'service',
  rule: 'duplicate-carriage',
  detail: `site ${site} already has carriage ${holder} for service ${service}; a site radiates each service once`,
});

/**
 * A feed's ends and via-sites: two different carriages, one service, no
 * via-site at either end. `source`/`target` are the ends when they resolve
 * (a service left out is not compared: its own reference is reported).
 */
export function feedRules(feed: { from?: string; to?: string; via?: readonly unknown[] }, source?: CarriageEnd, target?: CarriageEnd): CrossIssue[] {
  const out: CrossIssue[] = [];
  const { from, to } = feed;
  if (from !== undefined && from === to) {
    out.push({ field: 'to', rule: 'self-feed', detail: `source and receiving carriage are the same carriage ${from}; a feed joins two different carriages` });
  }
  if (source && target && from !== to && source.service !== undefined && target.service !== undefined && source.service !== target.service) {
    out.push({ field: 'to', rule: 'service-mismatch',
      detail: `source carriage ${from} carries service ${source.service} but receiving carriage ${to} carries ${target.service}; both ends of a feed carry the same service` });
  }
  (feed.via ?? []).forEach((site, i) => {
    if (typeof site !== 'string') return;
    const end = site === source?.site ? `the source site (of carriage ${from})` : site === target?.site ? `the receiving site (of carriage ${to})` : undefined;
    if (end) out.push({ field: `via[${i}]`, rule: 'via-endpoint', detail: `via-site ${site} is ${end}; a via-site is a hop between the two ends` });
  });
  return out;
}

/**
 * A stored feed of a carriage that moves to another site or service: its
 * other end must carry the same service, and none of its via-sites may
 * become one of its ends. `other` is the feed's other carriage as it will be.
 */
export function movedCarriageRules(
  carriage: { code: string; site: string; service: string },
  feed: { code: string; via?: readonly string[] },
  other: { code: string; service: string; site: string },
): CrossIssue[] {
  const out: CrossIssue[] = [];
  if (other.service !== carriage.service) {
    out.push({ field: 'service', rule: 'service-mismatch',
      detail: `feed ${feed.code} joins it to carriage ${other.code}, which carries ${other.service}, not ${carriage.service}; change or delete the feed first, or import it too` });
  }
  const end = (feed.via ?? []).find((site) => site === carriage.site || site === other.site);
  if (end !== undefined) {
    out.push({ field: 'site', rule: 'via-endpoint',
      detail: `feed ${feed.code} into or out of it passes via site ${end}, which would become one of its ends; change the feed first, or import it too` });
  }
  return out;
}

/**
 * The import report (shared/schemas/import.ts) as the import screen shows
 * it: one table of issues, errors before warnings, each group in document
 * order (kind in the document's order, then file, then row or index), and a
 * line of counts per kind.
 */
import { countOf, formatCount } from '@/shared/format';
import { ENTITY_KINDS, type EntityKind } from '@/shared/schemas/network';
import type { ImportIssue, ImportReport, KindCounts } from '@/shared/schemas/import';

export type Severity = 'error' | 'warning';

export interface IssueRow extends ImportIssue {
  severity: Severity;
  /** "row 12 of sites.csv", "item 4", or "" */
  where: string;
  /** a key unique within one report */
  key: string;
}

/** The document's order of kinds; 'document' (the file as a whole) comes first. */
const KIND_ORDER: Record<string, number> = Object.fromEntries([['document', -1], ...ENTITY_KINDS.map((k, i) => [k, i])]);

export function whereOf(issue: ImportIssue): string {
  if (issue.row !== undefined) return issue.file ? `row ${issue.row} of ${issue.file}` : `row ${issue.row}`;
  // The server counts JSON items from 0; people count from 1.
  if (issue.index !== undefined) return `item ${issue.index + 1}`;
  return '';
}

function compareIssues(a: ImportIssue, b: ImportIssue): number {
  const ka = KIND_ORDER[a.kind] ?? 99;
  const kb = KIND_ORDER[b.kind] ?? 99;
  if (ka !== kb) return ka - kb;
  const fa = a.file ?? '';
  const fb = b.file ?? '';
  if (fa !== fb) return fa < fb ? -1 : 1;
  const pa = a.row ?? a.index ?? -1;
  const pb = b.row ?? b.index ?? -1;
  return pa - pb;
}

/** Errors first, then warnings; each sorted stably by kind, file and position. */
export function issueRows(report: Pick<ImportReport, 'errors' | 'warnings'>): IssueRow[] {
  const tag = (issues: ImportIssue[], severity: Severity) =>
    issues
      .map((issue, i) => ({ issue, i }))
      .sort((x, y) => compareIssues(x.issue, y.issue) || x.i - y.i)
      .map(({ issue, i }) => ({ ...issue, severity, where: whereOf(issue), key: `${severity}-${i}` }));
  return [...tag(report.errors, 'error'), ...tag(report.warnings, 'warning')];
}

export interface CountRow extends KindCounts {
  kind: EntityKind;
}

/** Counts per kind in the document's order, kinds the file did not touch left out. */
export function countRows(report: Pick<ImportReport, 'counts'>): CountRow[] {
  return ENTITY_KINDS.map((kind) => ({ kind, ...report.counts[kind] })).filter(
    (c) => c.received + c.created + c.updated + c.unchanged + c.deleted > 0,
  );
}

/** Totals over every kind. */
export function totals(report: Pick<ImportReport, 'counts'>): KindCounts {
  const sum: KindCounts = { received: 0, created: 0, updated: 0, unchanged: 0, deleted: 0 };
  for (const kind of ENTITY_KINDS) {
    const c = report.counts[kind];
    sum.received += c.received;
    sum.created += c.created;
    sum.updated += c.updated;
    sum.unchanged += c.unchanged;
    sum.deleted += c.deleted;
  }
  return sum;
}

/** Every error and warning found, the listed ones and those counted beyond the report's limit. */
export function issueTotals(report: Pick<ImportReport, 'errors' | 'warnings' | 'moreErrors' | 'moreWarnings'>): { errors: number; warnings: number; unlisted: number } {
  const unlisted = (report.moreErrors ?? 0) + (report.moreWarnings ?? 0);
  return { errors: report.errors.length + (report.moreErrors ?? 0), warnings: report.warnings.length + (report.moreWarnings ?? 0), unlisted };
}

/** One sentence over the report, for the top of the region and for screen readers. */
export function reportHeadline(report: ImportReport): string {
  const { errors: e, warnings: w } = issueTotals(report);
  const t = totals(report);
  const plural = (n: number, word: string) => countOf(n, word);
  if (e > 0) {
    return `${plural(e, 'error')}${w ? ` and ${plural(w, 'warning')}` : ''}: nothing can be imported until the errors are fixed in the file.`;
  }
  const changes = `${formatCount(t.created)} to create, ${formatCount(t.updated)} to update, ${formatCount(t.deleted)} to delete, ${formatCount(t.unchanged)} unchanged`;
  if (report.dryRun) return `Check passed${w ? ` with ${plural(w, 'warning')}` : ''}: ${changes}.`;
  return `Imported${w ? ` with ${plural(w, 'warning')}` : ''}: ${changes.replace(/to create/, 'created').replace(/to update/, 'updated').replace(/to delete/, 'deleted')}.`;
}

export interface Confirmations {
  /** a stale base: the person agreed to undo the changes since */
  undo?: boolean;
  /** a replace that deletes records: the person agreed to the deletions named */
  deletes?: boolean;
}

const KIND_NOUN: Record<EntityKind, string> = { sites: 'site', services: 'service', groups: 'group', carriages: 'carriage', feeds: 'feed' };

/** What a checked replace deletes, per kind: "1 site, 1 carriage and 3 feeds" (empty when nothing). */
export function deletionsText(report: Pick<ImportReport, 'counts'>): string {
  const parts = ENTITY_KINDS.filter((k) => report.counts[k].deleted > 0).map((k) => countOf(report.counts[k].deleted, KIND_NOUN[k]));
  if (parts.length <= 1) return parts.join('');
  return `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
}

/** Whether a checked replace deletes anything, so the person must confirm the deletions it names. */
export function needsDeleteConfirmation(report: ImportReport | null | undefined): boolean {
  return !!report && report.dryRun && report.replace && report.errors.length === 0 && totals(report).deleted > 0;
}

/** Whether a checked report may be committed: a dry run with no errors; a stale base and deletions only once confirmed. */
export function canCommit(report: ImportReport | null | undefined, confirmed: Confirmations = {}): boolean {
  if (!report || !report.dryRun || report.errors.length > 0) return false;
  if (report.stale && !confirmed.undo) return false;
  return !needsDeleteConfirmation(report) || confirmed.deletes === true;
}

/** The sentence about a file made from an older network version (report.stale). */
export function staleText(stale: NonNullable<ImportReport['stale']>): string {
  const n = stale.changesSince;
  const changes = countOf(n, 'change');
  return `This file was made from network version ${formatCount(stale.baseVersion)}; the network is now at version ${formatCount(stale.currentVersion)}, with ${changes} since. Replacing the network with this file undoes ${n === 1 ? 'it' : 'them'}.`;
}

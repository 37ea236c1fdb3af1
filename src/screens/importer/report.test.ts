import { describe, expect, it } from 'vitest';
import type { ImportReport, KindCounts } from '@/shared/schemas/import';
import { canCommit, countRows, deletionsText, issueRows, needsDeleteConfirmation, reportHeadline, staleText, totals, whereOf } from './report';

const zero: KindCounts = { received: 0, created: 0, updated: 0, unchanged: 0, deleted: 0 };
const counts = { sites: { ...zero }, services: { ...zero }, groups: { ...zero }, carriages: { ...zero }, feeds: { ...zero } };

function report(partial: Partial<ImportReport>): ImportReport {
  return { ok: true, dryRun: true, replace: false, counts, errors: [], warnings: [], ...partial };
}

describe('issueRows', () => {
  it('puts errors before warnings, each in document order (kind, file, position)', () => {
    const rows = issueRows({
      warnings: [
        { kind: 'sites', rule: 'no-reserve', message: 'w-site', index: 3, code: 'S3' },
        { kind: 'carriages', rule: 'no-feed', message: 'w-carriage', index: 0 },
      ],
      errors: [
        { kind: 'feeds', rule: 'unknown-reference', message: 'e-feed-2', index: 2, field: 'from' },
        { kind: 'sites', rule: 'out-of-range', message: 'e-site-9', index: 9, field: 'lat' },
        { kind: 'feeds', rule: 'unknown-reference', message: 'e-feed-0', index: 0 },
        { kind: 'document', rule: 'unknown-key', message: 'e-doc' },
      ],
    });
    expect(rows.map((r) => `${r.severity}:${r.message}`)).toEqual([
      'error:e-doc',
      'error:e-site-9',
      'error:e-feed-0',
      'error:e-feed-2',
      'warning:w-site',
      'warning:w-carriage',
    ]);
    expect(new Set(rows.map((r) => r.key)).size).toBe(rows.length);
  });

  it('orders CSV rows by file then row number, not as text', () => {
    const rows = issueRows({
      errors: [
        { kind: 'sites', rule: 'r', message: 'b10', file: 'sites.csv', row: 10 },
        { kind: 'sites', rule: 'r', message: 'b2', file: 'sites.csv', row: 2 },
        { kind: 'sites', rule: 'r', message: 'a5', file: 'a-sites.csv', row: 5 },
      ],
      warnings: [],
    });
    expect(rows.map((r) => r.message)).toEqual(['a5', 'b2', 'b10']);
  });
});

describe('whereOf', () => {
  it('says CSV rows as rows and JSON indexes counted from 1', () => {
    expect(whereOf({ kind: 'sites', rule: 'r', message: 'm', file: 'sites.csv', row: 4 })).toBe('row 4 of sites.csv');
    expect(whereOf({ kind: 'sites', rule: 'r', message: 'm', row: 4 })).toBe('row 4');
    expect(whereOf({ kind: 'feeds', rule: 'r', message: 'm', index: 0 })).toBe('item 1');
    expect(whereOf({ kind: 'document', rule: 'r', message: 'm' })).toBe('');
  });
});

describe('counts', () => {
  const r = report({
    counts: { ...counts, sites: { received: 3, created: 1, updated: 1, unchanged: 1, deleted: 2 }, feeds: { received: 4, created: 4, updated: 0, unchanged: 0, deleted: 0 } },
  });

  it('lists the kinds the import touches in document order', () => {
    expect(countRows(r).map((c) => c.kind)).toEqual(['sites', 'feeds']);
  });

  it('adds up every kind', () => {
    expect(totals(r)).toEqual({ received: 7, created: 5, updated: 1, unchanged: 1, deleted: 2 });
  });

  it('words the outcome of a check and of a commit', () => {
    expect(reportHeadline(r)).toBe('Check passed: 5 to create, 1 to update, 2 to delete, 1 unchanged.');
    expect(reportHeadline({ ...r, dryRun: false, warnings: [{ kind: 'sites', rule: 'x', message: 'm' }] })).toBe('Imported with 1 warning: 5 created, 1 updated, 2 deleted, 1 unchanged.');
    expect(reportHeadline({ ...r, ok: false, errors: [{ kind: 'sites', rule: 'x', message: 'm' }, { kind: 'sites', rule: 'x', message: 'n' }] })).toMatch(/^2 errors: nothing can be imported/);
  });
});

describe('canCommit', () => {
  it('allows a commit only after a dry run without errors', () => {
    expect(canCommit(report({}))).toBe(true);
    expect(canCommit(report({ warnings: [{ kind: 'sites', rule: 'x', message: 'm' }] }))).toBe(true);
    expect(canCommit(report({ ok: false, errors: [{ kind: 'sites', rule: 'x', message: 'm' }] }))).toBe(false);
    expect(canCommit(report({ dryRun: false }))).toBe(false);
    expect(canCommit(null)).toBe(false);
  });
});

describe('a file older than the network', () => {
  const stale = { baseVersion: 12, currentVersion: 15, changesSince: 4512 };
  const base = report({ replace: true });

  it('may be committed only once the undo is confirmed', () => {
    expect(canCommit({ ...base, stale })).toBe(false);
    expect(canCommit({ ...base, stale }, { undo: true })).toBe(true);
    expect(canCommit(base)).toBe(true);
  });

  it('says how many changes would be undone', () => {
    expect(staleText(stale)).toBe('This file was made from network version 12; the network is now at version 15, with 4,512 changes since. Replacing the network with this file undoes them.');
  });
});

describe('a replace that deletes records', () => {
  const deleting = report({ replace: true });
  deleting.counts = { ...deleting.counts, sites: { ...deleting.counts.sites, deleted: 1 }, feeds: { ...deleting.counts.feeds, deleted: 1204 } };

  it('names the deletions per kind with thousands separators', () => {
    expect(deletionsText(deleting)).toBe('1 site and 1,204 feeds');
    expect(deletionsText(report({}))).toBe('');
  });

  it('may be committed only once the deletions are confirmed', () => {
    expect(needsDeleteConfirmation(deleting)).toBe(true);
    expect(canCommit(deleting)).toBe(false);
    expect(canCommit(deleting, { deletes: true })).toBe(true);
    expect(needsDeleteConfirmation(report({ replace: true }))).toBe(false);
    expect(needsDeleteConfirmation({ ...deleting, replace: false })).toBe(false);
  });
});

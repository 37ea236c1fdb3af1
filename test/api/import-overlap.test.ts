/**
 * The importer starts its write once every entity has passed its own check,
 * while the rules between entities are still checked
 * (server/services/import/overlap.ts). A document those later rules refuse
 * is answered with their errors and leaves the database as it was; progress
 * still comes stage after stage.
 */
import { describe, expect, it } from 'vitest';
import type { ImportProgress } from '@/shared/schemas/import';
import { generateNetwork } from '@/scripts/generator';
import { importNetwork } from '@/server/services/importer';
import { useTestApp } from '../helpers/testApp';

const app = useTestApp();

const TABLES = ['sites', 'services', 'risk_groups', 'carriages', 'feeds', 'feed_via_sites', 'feed_groups', 'site_groups', 'audit_log'];

async function rowCounts(): Promise<Record<string, number>> {
  const out: Record<string, number> = {};
  for (const table of TABLES) {
    const [rows] = await app().db.sequelize.query(`SELECT count(*)::int AS n FROM ${table}`);
    out[table] = (rows as { n: number }[])[0].n;
  }
  return out;
}

const networkVersion = async () => {
  const [rows] = await app().db.sequelize.query('SELECT version FROM network_state WHERE id = 1');
  return Number((rows as { version: number }[])[0].version);
};

/** The stages heard, each once, in the order they came. */
const stagesOf = (heard: ImportProgress[]) => heard.map((p) => p.stage).filter((s, i, all) => i === 0 || all[i - 1] !== s);

describe('an import written while its rules between entities are checked', () => {
  // large enough that the rules between entities take several turns while the write runs
  const network = () => generateNetwork({ sites: 1500, seed: 5 });

  it('answers the errors of those rules, not of the write, and leaves nothing', async () => {
    const doc = network();
    const last = doc.feeds.length - 1;
    doc.feeds[last] = { ...doc.feeds[last], to: 'NO.SUCH.CARRIAGE' };
    const before = await rowCounts();
    const v0 = await networkVersion();
    const heard: ImportProgress[] = [];
    const report = await importNetwork(app().db, doc, { actor: { email: 'test' }, onProgress: (p) => heard.push(p) });
    expect(report.ok).toBe(false);
    expect(report.errors.map((e) => `${e.kind}/${e.code}/${e.field}/${e.rule}`)).toEqual([`feeds/${doc.feeds[last].code}/to/unknown-reference`]);
    expect(stagesOf(heard)).toEqual(['validating']);
    expect(await rowCounts()).toEqual(before);
    expect(await networkVersion()).toBe(v0);
  });

  it('writes a valid document whole, reporting validating and then writing, never back', async () => {
    const doc = network();
    const heard: ImportProgress[] = [];
    const report = await importNetwork(app().db, doc, { actor: { email: 'test' }, onProgress: (p) => heard.push(p) });
    expect(report.errors).toEqual([]);
    expect(stagesOf(heard)).toEqual(['validating', 'writing']);
    const writing = heard.filter((p) => p.stage === 'writing');
    expect(writing.at(-1)!.done).toBe(writing.at(-1)!.total);
    const counts = await rowCounts();
    expect([counts.sites, counts.carriages, counts.feeds]).toEqual([doc.sites.length, doc.carriages.length, doc.feeds.length]);
    expect(counts.feed_groups).toBe(doc.feeds.reduce((n, f) => n + new Set(f.groups ?? []).size, 0));
    await app().ctx.network.refresh(await networkVersion());
  });
});

/**
 * POST /api/network/import with a JSON document (docs/api.md
 * section 1, "Import rules"): all or nothing, dry run, upsert by code,
 * replace, every error listed, and the network version.
 */
import request from 'supertest';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type { NetworkDocument } from '@/shared/schemas/network';
import { generateNetwork } from '@/scripts/generator';
import { smallNetwork } from '../fixtures/small-network';
import { makeTestApp, type TestApp } from '../helpers/testApp';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => t?.close());
beforeEach(async () => t.reset());

const TABLES = ['sites', 'services', 'risk_groups', 'carriages', 'feeds', 'feed_via_sites', 'feed_groups', 'site_groups', 'audit_log'];

async function rowCounts(): Promise<Record<string, number>> {
  const out: Record<string, number> = {};
  for (const table of TABLES) {
    const [rows] = await t.db.sequelize.query(`SELECT count(*)::int AS n FROM ${table}`);
    out[table] = (rows as { n: number }[])[0].n;
  }
  return out;
}

async function networkVersion(): Promise<number> {
  const [rows] = await t.db.sequelize.query('SELECT version FROM network_state WHERE id = 1');
  return Number((rows as { version: number }[])[0].version);
}

async function rowVersions(table: string): Promise<Record<string, number>> {
  const [rows] = await t.db.sequelize.query(`SELECT code, version FROM ${table}`);
  return Object.fromEntries((rows as { code: string; version: number }[]).map((r) => [r.code, r.version]));
}

const importDoc = (doc: unknown, query = '') =>
  request(t.app).post(`/api/network/import${query}`).set(t.auth('engineer')).send(doc as object);

/** A replace as a person makes it: the dry run, then the commit with the dry run's confirmation. */
async function confirmedReplace(doc: unknown) {
  const dry = await importDoc(doc, '?replace=true&dryRun=true');
  expect(dry.status).toBe(200);
  expect(dry.body.confirmReplace).toMatch(/^[0-9a-f]{16}$/);
  return importDoc(doc, `?replace=true&confirmReplace=${dry.body.confirmReplace}`);
}

const exportDoc = async (): Promise<NetworkDocument> => {
  const r = await request(t.app).get('/api/network/export').set(t.auth('viewer'));
  expect(r.status).toBe(200);
  return r.body;
};

describe('import', () => {
  it('dry run answers the counts and writes nothing', async () => {
    const before = await rowCounts();
    const v0 = await networkVersion();
    const r = await importDoc(smallNetwork(), '?dryRun=true');
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ ok: true, dryRun: true, replace: false, errors: [] });
    expect(r.body.counts.sites).toEqual({ received: 5, created: 5, updated: 0, unchanged: 0, deleted: 0 });
    expect(r.body.counts.feeds.created).toBe(smallNetwork().feeds.length);
    expect(await rowCounts()).toEqual(before);
    expect(await networkVersion()).toBe(v0);
  });

  it('imports, then the same document again changes nothing and keeps the version', async () => {
    const doc = smallNetwork();
    const first = await importDoc(doc);
    expect(first.status).toBe(200);
    expect(first.body.ok).toBe(true);
    expect(first.body.counts.carriages).toMatchObject({ created: doc.carriages.length, updated: 0, unchanged: 0 });
    const v1 = await networkVersion();
    expect(first.body.networkVersion).toBe(v1);
    const counts1 = await rowCounts();
    expect(counts1).toMatchObject({ sites: 5, services: 2, risk_groups: 3, carriages: doc.carriages.length, feeds: doc.feeds.length, feed_via_sites: 1, site_groups: 1 });
    const versions = await rowVersions('feeds');

    const second = await importDoc(doc);
    expect(second.status).toBe(200);
    for (const kind of ['sites', 'services', 'groups', 'carriages', 'feeds'] as const) {
      expect(second.body.counts[kind]).toEqual({ received: doc[kind].length, created: 0, updated: 0, unchanged: doc[kind].length, deleted: 0 });
    }
    expect(await networkVersion()).toBe(v1);
    expect(second.body.networkVersion).toBe(v1);
    expect(await rowVersions('feeds')).toEqual(versions);
    // the second import is recorded, but moved nothing
    expect((await rowCounts()).audit_log).toBe(counts1.audit_log + 1);
  });

  it('updates only what changed, including a change to a list, and moves the version once', async () => {
    await importDoc(smallNetwork());
    const v1 = await networkVersion();
    const sitesBefore = await rowVersions('sites');
    const doc = smallNetwork();
    doc.sites.find((s) => s.code === 'R1')!.name = 'Relay One (renamed)';
    doc.sites.find((s) => s.code === 'M1')!.groups = ['G-PWR', 'G-TEL'];
    // the same groups in another order is not a change
    doc.feeds.find((f) => f.code === 'R2.TV1.R')!.groups = ['G-TEL'];
    const r = await importDoc(doc);
    expect(r.status).toBe(200);
    expect(r.body.counts.sites).toMatchObject({ updated: 2, unchanged: 3, created: 0 });
    expect(r.body.counts.feeds).toMatchObject({ updated: 0, unchanged: doc.feeds.length });
    expect(await networkVersion()).toBe(v1 + 1);
    const sitesAfter = await rowVersions('sites');
    expect(sitesAfter.R1).toBe(sitesBefore.R1 + 1);
    expect(sitesAfter.M1).toBe(sitesBefore.M1 + 1);
    expect(sitesAfter.O1).toBe(sitesBefore.O1);
    const exported = await exportDoc();
    expect(exported.sites.find((s) => s.code === 'M1')!.groups).toEqual(['G-PWR', 'G-TEL']);
  });

  it('without replace keeps what the document leaves out; with replace removes it', async () => {
    await importDoc(smallNetwork());
    const doc = smallNetwork();
    // drop relay R2 with its carriage and every feed that touches it
    doc.sites = doc.sites.filter((s) => s.code !== 'R2');
    doc.carriages = doc.carriages.filter((c) => c.site !== 'R2');
    doc.feeds = doc.feeds.filter((f) => !f.from.startsWith('R2.') && !f.to.startsWith('R2.'));
    doc.groups = doc.groups.filter((g) => g.code !== 'G-SAT');
    doc.feeds = doc.feeds.filter((f) => !(f.groups ?? []).includes('G-SAT'));

    const upsert = await importDoc(doc);
    expect(upsert.body.counts.sites).toMatchObject({ deleted: 0, unchanged: 4 });
    expect((await exportDoc()).sites.map((s) => s.code)).toContain('R2');

    const replaced = await confirmedReplace(doc);
    expect(replaced.status).toBe(200);
    expect(replaced.body.counts.sites).toMatchObject({ deleted: 1, unchanged: 4 });
    expect(replaced.body.counts.carriages.deleted).toBe(1);
    expect(replaced.body.counts.feeds.deleted).toBe(smallNetwork().feeds.length - doc.feeds.length);
    expect(replaced.body.counts.groups.deleted).toBe(1);
    const after = await exportDoc();
    expect(after.sites.map((s) => s.code).sort()).toEqual(doc.sites.map((s) => s.code).sort());
    expect(after.feeds.map((f) => f.code).sort()).toEqual(doc.feeds.map((f) => f.code).sort());
    expect(after.groups.map((g) => g.code)).not.toContain('G-SAT');
  });

  it('lets an upsert refer to stored entities', async () => {
    await importDoc(smallNetwork());
    const r = await importDoc({
      format: 'network/1',
      sites: [{ code: 'R3', name: 'Relay Three', role: 'relay', lat: -38.0, lon: -29.2 }],
      carriages: [{ code: 'R3.TV1', site: 'R3', service: 'TV1' }],
      feeds: [{ code: 'R3.TV1.M', from: 'M1.TV1', to: 'R3.TV1', medium: 'off-air', role: 'main' }],
    });
    expect(r.status).toBe(200);
    expect(r.body.counts.feeds).toMatchObject({ created: 1, received: 1 });
    expect(r.body.counts.services).toMatchObject({ received: 0, unchanged: 0 });
  });

  it('moves carriages between places, even when two swap sites, and a replace reuses a freed place', async () => {
    await importDoc(smallNetwork());
    const doc = smallNetwork();
    const r1 = doc.carriages.find((c) => c.code === 'R1.TV1')!;
    const r2 = doc.carriages.find((c) => c.code === 'R2.TV1')!;
    [r1.site, r2.site] = [r2.site, r1.site];
    const swapped = await importDoc(doc);
    expect(swapped.status).toBe(200);
    expect(swapped.body.counts.carriages.updated).toBe(2);
    const carriages = (await exportDoc()).carriages;
    expect(carriages.find((c) => c.code === 'R1.TV1')!.site).toBe('R2');
    expect(carriages.find((c) => c.code === 'R2.TV1')!.site).toBe('R1');
    expect((await exportDoc()).services.map((s) => s.code).sort()).toEqual(['FM1', 'TV1']);

    // a new carriage code takes the place of one the replace deletes
    const renamed = smallNetwork();
    renamed.carriages.find((c) => c.code === 'R1.TV1')!.code = 'R1.TV1.new';
    for (const f of renamed.feeds) if (f.to === 'R1.TV1') f.to = 'R1.TV1.new';
    const replaced = await confirmedReplace(renamed);
    expect(replaced.status).toBe(200);
    expect(replaced.body.counts.carriages).toMatchObject({ created: 1, deleted: 1 });
  });

  it('refuses an upsert that would break a stored feed it leaves out', async () => {
    await importDoc(smallNetwork());
    const before = await rowCounts();
    const r = await importDoc({ format: 'network/1', carriages: [{ code: 'R1.TV1', site: 'R1', service: 'FM1' }] });
    expect(r.status).toBe(422);
    expect(r.body.errors.map((e: { rule: string }) => e.rule)).toContain('service-mismatch');
    expect(r.body.errors[0]).toMatchObject({ kind: 'carriages', index: 0, code: 'R1.TV1' });
    expect(await rowCounts()).toEqual(before);
  });
});

describe('a generated network', () => {
  it('imports a few thousand rows (past the statistics refresh), then again with nothing changed', async () => {
    const doc = generateNetwork({ sites: 600, seed: 3 });
    const first = await importDoc(doc);
    expect(first.status).toBe(200);
    expect(first.body.counts.carriages.created).toBe(doc.carriages.length);
    expect(doc.carriages.length + doc.feeds.length).toBeGreaterThan(4000);
    const counts = await rowCounts();
    expect(counts.feed_via_sites).toBe(doc.feeds.reduce((n, f) => n + (f.via?.length ?? 0), 0));
    expect(counts.feed_groups).toBe(doc.feeds.reduce((n, f) => n + new Set(f.groups ?? []).size, 0));
    const v1 = await networkVersion();
    const again = await importDoc(doc);
    expect(again.body.counts.feeds).toMatchObject({ unchanged: doc.feeds.length, updated: 0, created: 0 });
    expect(await networkVersion()).toBe(v1);
  });
});

describe('import errors', () => {
  it('lists every planted error with kind, index, code and field, and writes nothing', async () => {
    const doc = smallNetwork() as unknown as { sites: Record<string, unknown>[]; carriages: Record<string, unknown>[]; feeds: Record<string, unknown>[] };
    doc.sites[2].lat = 95;
    doc.sites[3].households = -5;
    doc.sites.push({ ...doc.sites[0] });
    doc.carriages.push({ code: 'R1.FM1', site: 'R1', service: 'NOPE' });
    doc.feeds.push({ code: 'BAD.MIX', from: 'O1.FM1', to: 'R1.TV1', medium: 'off-air', role: 'main' });
    doc.feeds.push({ code: 'BAD.SELF', from: 'R1.TV1', to: 'R1.TV1', medium: 'line', role: 'main' });
    doc.feeds.push({ code: 'BAD.MEDIUM', from: 'O1.TV1', to: 'R1.TV1', medium: 'pigeon', role: 'main' });
    const before = await rowCounts();
    const r = await importDoc(doc);
    expect(r.status).toBe(422);
    expect(r.body.ok).toBe(false);
    const found = r.body.errors.map((e: { kind: string; code?: string; field?: string; rule: string }) => `${e.kind}/${e.code}/${e.field}/${e.rule}`);
    expect(found).toEqual(
      expect.arrayContaining([
        'sites/R1/lat/out-of-range',
        'sites/R2/households/negative-value',
        'sites/O1/code/duplicate-code',
        'carriages/R1.FM1/service/unknown-reference',
        'feeds/BAD.MIX/to/service-mismatch',
        'feeds/BAD.SELF/to/self-feed',
        'feeds/BAD.MEDIUM/medium/unknown-enum',
      ]),
    );
    expect(r.body.errors.length).toBeGreaterThanOrEqual(7);
    for (const e of r.body.errors) expect(typeof e.message).toBe('string');
    expect(r.body.errors.find((e: { code?: string }) => e.code === 'R1.FM1').message).toMatch(/service NOPE does not exist/);
    expect(await rowCounts()).toEqual(before);
  });

  it('answers malformed JSON with 400', async () => {
    const r = await request(t.app).post('/api/network/import').set(t.auth('engineer')).set('Content-Type', 'application/json').send('{"format": "network/1", "sites": [');
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('malformed-json');
  });

  it('answers an unknown top-level key with 422 naming it', async () => {
    const r = await importDoc({ ...smallNetwork(), stations: [] });
    expect(r.status).toBe(422);
    expect(r.body.errors).toEqual([expect.objectContaining({ kind: 'document', rule: 'unknown-key', field: 'stations' })]);
    expect((await rowCounts()).sites).toBe(0);
  });

  it('answers a body that is not a document, and bad flags, with a 4xx', async () => {
    expect((await importDoc([1, 2, 3])).status).toBe(422);
    expect((await importDoc({})).status).toBe(422);
    const flag = await importDoc(smallNetwork(), '?dryRun=yes');
    expect(flag.status).toBe(400);
    expect(flag.body.error.message).toMatch(/dryRun/);
    const text = await request(t.app).post('/api/network/import').set(t.auth('engineer')).set('Content-Type', 'text/plain').send('hello');
    expect(text.status).toBe(415);
  });

  it('reports a value the database cannot hold as an import error, not a server fault', async () => {
    const doc = smallNetwork();
    doc.sites[1].households = 3_000_000_000;
    const r = await importDoc(doc);
    expect(r.status).toBe(422);
    expect(r.body.ok).toBe(false);
    expect((await rowCounts()).sites).toBe(0);
  });

  it('forbids a viewer and an operator (403)', async () => {
    for (const role of ['viewer', 'operator'] as const) {
      const r = await request(t.app).post('/api/network/import').set(t.auth(role)).send(smallNetwork());
      expect(r.status).toBe(403);
    }
    expect((await rowCounts()).sites).toBe(0);
  });

  it('refuses a replace without the confirmation of its dry run, naming what it would delete', async () => {
    await importDoc(smallNetwork());
    const doc = smallNetwork();
    doc.sites = doc.sites.filter((s) => s.code !== 'R2');
    doc.carriages = doc.carriages.filter((c) => c.site !== 'R2');
    doc.feeds = doc.feeds.filter((f) => !f.from.startsWith('R2.') && !f.to.startsWith('R2.'));
    const droppedFeeds = smallNetwork().feeds.length - doc.feeds.length;
    const before = await rowCounts();
    const v0 = await networkVersion();

    const bare = await importDoc(doc, '?replace=true');
    expect(bare.status).toBe(428);
    expect(bare.body.error.code).toBe('replace-not-confirmed');
    expect(bare.body.error.message).toContain(`deletes 1 site, 1 carriage and ${droppedFeeds} feed${droppedFeeds === 1 ? '' : 's'}`);
    expect(bare.body.error.message).toContain('confirmReplace');
    expect(bare.body.error.details.deletions).toEqual({ sites: 1, services: 0, groups: 0, carriages: 1, feeds: droppedFeeds });
    expect(await rowCounts()).toEqual(before);
    expect(await networkVersion()).toBe(v0);

    const dry = await importDoc(doc, '?replace=true&dryRun=true');
    expect(dry.body.counts.sites.deleted).toBe(1);
    const wrong = await importDoc(doc, '?replace=true&confirmReplace=0000000000000000');
    expect(wrong.status).toBe(409);
    expect(wrong.body.error.code).toBe('replace-confirmation-outdated');
    expect(await rowCounts()).toEqual(before);

    // the network changes between the check and the commit: the confirmation no longer holds
    expect((await importDoc({ format: 'network/1', groups: [{ code: 'G-NEW', name: 'New group' }] })).status).toBe(200);
    const late = await importDoc(doc, `?replace=true&confirmReplace=${dry.body.confirmReplace}`);
    expect(late.status).toBe(409);
    expect(late.body.error.message).toContain('1 group');
    const stored = await exportDoc();
    expect(stored.sites.map((s) => s.code)).toContain('R2');
    expect(stored.groups.map((g) => g.code)).toContain('G-NEW');
  });
});

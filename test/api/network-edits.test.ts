/**
 * Edits reach every process's model as updates, not rebuilds: random edits
 * through the inventory API (creates, updates, deletes with cascade) are
 * applied by the writing process and, through the change notification and a
 * read of the named rows, by a second store on the same database. At the end
 * both models equal a full rebuild from PostgreSQL: the document, single
 * points of failure, exposure and reach. And an edit whose notification is
 * lost is caught by the periodic check with its default interval, within 30 s.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { NetworkStore } from '@/server/services/networkStore';
import { buildServedNetwork, updateServedNetwork, type ServedNetwork } from '@/server/services/servedNetwork';
import { loadNetworkDocument } from '@/server/services/networkLoader';
import { smallRandomNetwork, prng } from '@/test/helpers/random-network';
import { RandomEditor } from '@/test/helpers/random-edits';
import type { Element } from '@/shared/schemas/analysis';
import { makeTestApp, type TestApp } from '../helpers/testApp';
import { waitFor } from '../helpers/cluster';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
  await t.reset();
});
afterAll(async () => t?.close());

function sameAsRebuild(model: ServedNetwork, rebuilt: ServedNetwork) {
  expect(model.networkVersion).toBe(rebuilt.networkVersion);
  expect(model.document).toEqual(rebuilt.document);
  expect([...model.sites.keys()].sort()).toEqual([...rebuilt.sites.keys()].sort());
  expect([...model.feeds.keys()].sort()).toEqual([...rebuilt.feeds.keys()].sort());
  expect(model.engine.spof()).toEqual(rebuilt.engine.spof());
  expect(model.engine.exposure()).toEqual(rebuilt.engine.exposure());
  expect(model.engine.unfed()).toEqual(rebuilt.engine.unfed());
  for (const e of rebuilt.engine.elements() as Element[]) expect(model.engine.reach([e])).toEqual(rebuilt.engine.reach([e]));
}

describe('edits update the model in this process and in another', () => {
  it('150 random edits (each changing something) through the API: both processes update (no rebuild) and end equal to a full rebuild', async () => {
    const doc = smallRandomNetwork({ seed: 42, sites: 14, services: 3, groups: 3, feeds: 40, originChance: 0.2, carriageChance: 0.7 });
    const imported = await request(t.app).post('/api/network/import').set(t.auth('engineer')).send(doc);
    expect(imported.status).toBe(200);
    const other = new NetworkStore(t.db.sequelize, t.db.url, buildServedNetwork, { update: updateServedNetwork, checkEveryMs: 600_000 });
    await other.start();
    try {
      const here = t.ctx.network;
      const start = { here: here.status(), other: other.status() };
      const editor = new RandomEditor(prng(9));
      let version = here.model!.networkVersion;
      for (let done = 0; done < 150; ) {
        const edit = editor.next(here.model!.document);
        if (!edit) continue;
        const path = `/api/${edit.kind}/${encodeURIComponent(edit.code)}`;
        let r;
        // Random feeds may make a second main feed into a carriage: confirmed here, as an engineer would after reading the warning.
        const confirm = edit.kind === 'feeds' ? '?confirm=second-main-feed' : '';
        if (edit.method === 'post') r = await request(t.app).post(`/api/${edit.kind}${confirm}`).set(t.auth('engineer')).send(edit.body);
        else {
          const current = await request(t.app).get(path).set(t.auth('engineer'));
          expect(current.status).toBe(200);
          const noun = { sites: 'site', services: 'service', groups: 'group', carriages: 'carriage', feeds: 'feed' }[edit.kind];
          const v = current.body[noun].version;
          r =
            edit.method === 'patch'
              ? await request(t.app).patch(`${path}${confirm}`).set(t.auth('engineer')).send({ ...edit.body, version: v })
              : await request(t.app).delete(`${path}?version=${v}&cascade=true&documents=delete`).set(t.auth('engineer'));
        }
        expect(r.status, `${edit.method} ${path}: ${JSON.stringify(r.body)}`).toBeLessThan(300);
        // an edit that sets the values already there changes nothing and keeps the version
        const got = Number(r.headers['x-network-version'] ?? r.body.networkVersion);
        expect([version, version + 1]).toContain(got);
        if (got === version) continue;
        version = got;
        // this process answers from the new version at once
        expect(here.model!.networkVersion).toBe(version);
        done++;
      }
      await waitFor('the other process', () => (other.model!.networkVersion === version ? true : undefined), 5000);
      const { document, version: stored } = await loadNetworkDocument(t.db.sequelize);
      expect(stored).toBe(version);
      const rebuilt = buildServedNetwork(document, stored);
      sameAsRebuild(here.model!, rebuilt);
      sameAsRebuild(other.model!, rebuilt);
      // every edit was an update in both processes, never a rebuild
      expect(here.status().updates - start.here.updates).toBe(150);
      expect(here.status().rebuilds).toBe(start.here.rebuilds);
      expect(other.status().updates - start.other.updates).toBe(150);
      expect(other.status().rebuilds).toBe(start.other.rebuilds);
    } finally {
      await other.close();
    }
  }, 240_000);

  it('catches an edit whose notification was lost within 30 s, with the default check interval', async () => {
    await t.reset();
    const imported = await request(t.app).post('/api/network/import').set(t.auth('engineer')).send(smallRandomNetwork({ seed: 5, sites: 6, services: 1, groups: 1, feeds: 8, originChance: 0.3, carriageChance: 1 }));
    expect(imported.status).toBe(200);
    const other = new NetworkStore(t.db.sequelize, t.db.url, buildServedNetwork, { update: updateServedNetwork });
    await other.start();
    try {
      const before = other.model!.networkVersion;
      // an edit committed without its notification, as when one is lost: households of S0 change, the version moves
      const tx = await t.db.sequelize.transaction();
      await t.db.sequelize.query(`UPDATE sites SET households = 123456 WHERE code = 'S0'`, { transaction: tx });
      await t.db.sequelize.query('UPDATE network_state SET version = version + 1 WHERE id = 1', { transaction: tx });
      await tx.commit();
      const t0 = Date.now();
      await waitFor('the periodic check', () => (other.model!.networkVersion === before + 1 ? true : undefined), 30_000, 100);
      expect(Date.now() - t0).toBeLessThan(30_000);
      expect(other.model!.sites.get('S0')!.households).toBe(123456);
      expect(other.status().rebuilds).toBeGreaterThanOrEqual(2);
    } finally {
      await other.close();
    }
  }, 60_000);
});

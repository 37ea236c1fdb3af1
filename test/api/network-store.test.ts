/**
 * The live network model: a rebuild swaps the model in whole, so a request
 * that arrives while one runs is answered from the last complete graphs.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { NetworkStore } from '@/server/services/networkStore';
import { buildServedNetwork } from '@/server/services/servedNetwork';
import { bumpNetworkVersion } from '@/server/db';
import { makeTestApp, type TestApp } from '../helpers/testApp';
import { waitFor } from '../helpers/cluster';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
  await t.reset();
});
afterAll(async () => t?.close());

describe('NetworkStore', () => {
  it('keeps answering from the last complete model while a rebuild runs, then swaps in the new one', async () => {
    const store = new NetworkStore(t.db.sequelize, t.db.url, buildServedNetwork);
    await store.refresh();
    const before = store.model!;
    const version = await t.db.sequelize.transaction((tx) => bumpNetworkVersion(t.db.sequelize, tx));

    // hold the rebuild inside its read of PostgreSQL: it cannot read the sites while this lock is held
    const lock = await t.db.sequelize.transaction();
    await t.db.sequelize.query('LOCK TABLE sites IN ACCESS EXCLUSIVE MODE', { transaction: lock });
    let finished = false;
    const rebuilding = store.refresh(version).then(() => (finished = true));
    await new Promise((r) => setTimeout(r, 300));
    expect(finished).toBe(false);
    // meanwhile readers see the old, complete model
    expect(store.model).toBe(before);
    expect(store.model!.networkVersion).toBeLessThan(version);
    await lock.commit();
    await rebuilding;
    expect(finished).toBe(true);
    expect(store.model).not.toBe(before);
    expect(store.model!.networkVersion).toBe(version);
    expect(store.model!.engine.networkVersion).toBe(version);

    // asking again for a version it already has does no work
    const same = store.model;
    await store.refresh(version);
    expect(store.model).toBe(same);
    await store.close();
  });

  it('catches a lost notification with the periodic version check', async () => {
    const store = new NetworkStore(t.db.sequelize, t.db.url, buildServedNetwork, { checkEveryMs: 300 });
    await store.start();
    try {
      const before = store.model!.networkVersion;
      // the version moves without a NOTIFY, as when a notification is lost
      const [rows] = await t.db.sequelize.query('UPDATE network_state SET version = version + 1 WHERE id = 1 RETURNING version');
      const version = Number((rows as { version: number }[])[0].version);
      expect(version).toBe(before + 1);
      await waitFor('the periodic check', () => (store.model!.networkVersion === version ? true : undefined), 5000);
    } finally {
      await store.close();
    }
  });

  it('opens exactly one new listener when its connection is cut, and none after close', async () => {
    const store = new NetworkStore(t.db.sequelize, t.db.url, buildServedNetwork, { retryMinMs: 50, retryMaxMs: 200, checkEveryMs: 600_000 });
    const listeners = async () => {
      const [rows] = await t.db.sequelize.query('SELECT pid FROM pg_stat_activity WHERE application_name = $1', { bind: [store.listenerName] });
      return (rows as { pid: number }[]).map((r) => r.pid);
    };
    await store.start();
    try {
      for (let cut = 1; cut <= 3; cut++) {
        const [pid] = await listeners();
        expect(await listeners()).toHaveLength(1);
        await t.db.sequelize.query('SELECT pg_terminate_backend($1)', { bind: [pid] });
        await waitFor('a new listener', async () => {
          const now = await listeners();
          return now.length === 1 && now[0] !== pid && store.status().listener === 'listening' ? true : undefined;
        }, 5000);
        // let any stray second reconnection show itself
        await new Promise((r) => setTimeout(r, 300));
        expect(await listeners()).toHaveLength(1);
        expect(store.status().openListeners).toBe(1);
      }
      // and it still hears changes
      const version = await t.db.sequelize.transaction((tx) => bumpNetworkVersion(t.db.sequelize, tx));
      await waitFor('the notification', () => (store.model!.networkVersion === version ? true : undefined), 3000);
    } finally {
      await store.close();
    }
    expect(store.status()).toMatchObject({ listener: 'closed', openListeners: 0 });
    await waitFor('the listener to leave', async () => ((await listeners()).length === 0 ? true : undefined), 3000);
  });
});

/**
 * The live network model: a rebuild swaps the model in whole, so a request
 * that arrives while one runs is answered from the last complete graphs.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { NetworkStore } from '@/server/services/networkStore';
import { buildNetworkModel } from '@/server/services/networkModel';
import { bumpNetworkVersion } from '@/server/db';
import { makeTestApp, type TestApp } from '../helpers/testApp';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
  await t.reset();
});
afterAll(async () => t?.close());

describe('NetworkStore', () => {
  it('keeps answering from the last complete model while a rebuild runs, then swaps in the new one', async () => {
    const store = new NetworkStore(t.db.sequelize, t.db.url, buildNetworkModel);
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
});

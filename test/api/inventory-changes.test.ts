/**
 * How inventory changes behave together: optimistic locking under two
 * simultaneous edits, deletes refused while dependents exist and cascaded on
 * request, the network version and the in-memory model after each change,
 * and roles.
 */
import request from 'supertest';
import { beforeEach, describe, expect, it } from 'vitest';
import { smallNetwork } from '../fixtures/small-network';
import { useTestApp, type TestApp } from '../helpers/testApp';

const app = useTestApp({ network: smallNetwork });
let t: TestApp;
beforeEach(() => {
  t = app();
});

const auditFor = async (kind: string, code: string) => {
  const r = await request(t.app).get(`/api/audit?kind=${kind}&code=${encodeURIComponent(code)}`).set(t.auth('admin'));
  expect(r.status).toBe(200);
  return r.body.items as Array<{ action: string; before: Record<string, unknown> | null; after: Record<string, unknown> | null; userEmail: string; networkVersion: number }>;
};

async function waitForLockWaiters(n: number): Promise<void> {
  for (let i = 0; i < 200; i++) {
    const [rows] = await t.db.sequelize.query(`SELECT count(*)::int AS n FROM pg_stat_activity WHERE datname = current_database() AND wait_event_type = 'Lock'`);
    if ((rows as { n: number }[])[0].n >= n) return;
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
  throw new Error(`${n} requests never waited on the network lock together`);
}

async function count(table: string): Promise<number> {
  const [rows] = await t.db.sequelize.query(`SELECT count(*)::int AS n FROM ${table}`);
  return (rows as { n: number }[])[0].n;
}

describe('optimistic locking', () => {
  it('lets one of two simultaneous updates with the same version through, refuses the other with 409, audits one', async () => {
    // Hold the network lock so both requests are surely in flight together, then let them go.
    const holder = await t.db.sequelize.transaction();
    await t.db.sequelize.query('SELECT version FROM network_state WHERE id = 1 FOR UPDATE', { transaction: holder });
    const both = Promise.all([
      request(t.app).patch('/api/sites/R1').set(t.auth('engineer')).send({ version: 1, name: 'Relay One A' }),
      request(t.app).patch('/api/sites/R1').set(t.auth('admin')).send({ version: 1, name: 'Relay One B' }),
    ]);
    try {
      await waitForLockWaiters(2);
    } finally {
      await holder.commit();
    }
    const [a, b] = await both;
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const [won, lost] = a.status === 200 ? [a, b] : [b, a];
    expect(won.body.version).toBe(2);
    expect(lost.body.error.details.currentVersion).toBe(2);
    expect(lost.body.error.details.current.name).toBe(won.body.name);
    expect(lost.body.error.message).toMatch(/version 1.*now at 2/);

    const updates = (await auditFor('sites', 'R1')).filter((e) => e.action === 'update');
    expect(updates).toHaveLength(1);
    expect(updates[0].before).toMatchObject({ name: 'Relay One', version: 1 });
    expect(updates[0].after).toMatchObject({ name: won.body.name, version: 2 });
  });

  it('refuses a delete with a stale version', async () => {
    await request(t.app).patch('/api/groups/G-TEL').set(t.auth('engineer')).send({ version: 1, name: 'Telecom route east' });
    const r = await request(t.app).delete('/api/feeds/R2.TV1.R?version=1').set(t.auth('engineer'));
    expect(r.status).toBe(200);
    const stale = await request(t.app).delete('/api/groups/G-SAT?version=7').set(t.auth('engineer'));
    expect(stale.status).toBe(409);
    expect(stale.body.error.details.currentVersion).toBe(1);
  });
});

describe('network version and model', () => {
  it('moves the version once per change, and this process answers from the new network at once', async () => {
    const before = (await request(t.app).get('/api/health')).body.networkVersion;
    const r = await request(t.app).post('/api/sites').set(t.auth('engineer')).send({ code: 'R7', name: 'Relay Seven', role: 'relay', lat: -38, lon: -29 });
    expect(Number(r.headers['x-network-version'])).toBe(before + 1);
    expect(t.ctx.network.model?.networkVersion).toBe(before + 1);
    expect(t.ctx.network.model?.sites.get('R7')?.name).toBe('Relay Seven');
    const summary = await request(t.app).get('/api/network/summary').set(t.auth('viewer'));
    expect(summary.body.counts.sites).toBe(6);
    // a refused change moves nothing
    await request(t.app).post('/api/sites').set(t.auth('engineer')).send({ code: 'R7', name: 'Again', role: 'relay', lat: 0, lon: 0 });
    expect((await request(t.app).get('/api/health')).body.networkVersion).toBe(before + 1);
  });
});

describe('delete with dependents', () => {
  it('refuses to delete a site with carriages and feeds, naming them', async () => {
    const r = await request(t.app).delete('/api/sites/M1?version=1').set(t.auth('engineer'));
    expect(r.status).toBe(409);
    expect(r.body.error.message).toMatch(/site M1 still has 2 carriages \(M1\.FM1, M1\.TV1\) and 5 feeds/);
    expect(r.body.error.details.dependents.carriages).toEqual({ count: 2, codes: ['M1.FM1', 'M1.TV1'] });
    expect(r.body.error.details.dependents.feeds.codes).toEqual(['M1.FM1.M', 'M1.TV1.M', 'M1.TV1.R', 'R1.TV1.M', 'R2.TV1.M']);
    expect(await count('sites')).toBe(5);
  });

  it('refuses a via-site and a carriage with feeds, and a group with members', async () => {
    const hop = await request(t.app).delete('/api/sites/H1?version=1').set(t.auth('engineer'));
    expect(hop.status).toBe(409);
    expect(hop.body.error.details.dependents).toEqual({ feeds: { count: 1, codes: ['M1.FM1.M'] } });
    const carriage = await request(t.app).delete('/api/carriages/R2.TV1?version=1').set(t.auth('engineer'));
    expect(carriage.status).toBe(409);
    expect(carriage.body.error.message).toMatch(/3 feeds \(R1\.TV1\.R, R2\.TV1\.M, R2\.TV1\.R\)/);
    const group = await request(t.app).delete('/api/groups/G-PWR?version=1').set(t.auth('engineer'));
    expect(group.status).toBe(409);
    expect(group.body.error.details.dependents).toEqual({ sites: { count: 1, codes: ['M1'] } });
  });

  it('cascades on request: deletes the dependents in one change and audits each', async () => {
    const v0 = (await request(t.app).get('/api/health')).body.networkVersion;
    const r = await request(t.app).delete('/api/sites/M1?version=1&cascade=true').set(t.auth('engineer'));
    expect(r.status).toBe(200);
    expect(r.body.deleted).toEqual({
      feeds: ['M1.FM1.M', 'M1.TV1.M', 'M1.TV1.R', 'R1.TV1.M', 'R2.TV1.M'],
      carriages: ['M1.FM1', 'M1.TV1'],
      sites: ['M1'],
    });
    expect(r.body.networkVersion).toBe(v0 + 1);
    expect(await count('sites')).toBe(4);
    expect(await count('carriages')).toBe(4);
    expect(await count('feeds')).toBe(2);
    expect(await count('site_groups')).toBe(0);
    const audit = await request(t.app).get(`/api/audit?action=delete&pageSize=200`).set(t.auth('admin'));
    expect(audit.body.total).toBe(8);
    expect(audit.body.items.every((e: { networkVersion: number }) => e.networkVersion === v0 + 1)).toBe(true);
    const feedEntry = (await auditFor('feeds', 'R1.TV1.M'))[0];
    expect(feedEntry).toMatchObject({ action: 'delete', after: null, userEmail: 'engineer@test.example' });
    expect(feedEntry.before).toMatchObject({ from: 'M1.TV1', to: 'R1.TV1', medium: 'off-air' });
  });

  it('cascades a service and a group (members leave the group, their versions move)', async () => {
    const svc = await request(t.app).delete('/api/services/FM1?version=1&cascade=true').set(t.auth('engineer'));
    expect(svc.status).toBe(200);
    expect(svc.body.deleted).toEqual({ feeds: ['M1.FM1.M'], carriages: ['M1.FM1', 'O1.FM1'], services: ['FM1'] });
    const grp = await request(t.app).delete('/api/groups/G-TEL?version=1&cascade=true').set(t.auth('engineer'));
    expect(grp.status).toBe(200);
    expect(grp.body).toMatchObject({ deleted: { groups: ['G-TEL'] }, updated: { feeds: ['M1.TV1.M', 'R2.TV1.R'] } });
    const feed = await request(t.app).get('/api/feeds/M1.TV1.M').set(t.auth('viewer'));
    expect(feed.body.feed).not.toHaveProperty('groups');
    expect(feed.body.feed.version).toBe(2);
    const entry = (await auditFor('feeds', 'M1.TV1.M'))[0];
    expect(entry).toMatchObject({ action: 'update', before: { groups: ['G-TEL'] } });
    expect(entry.after).not.toHaveProperty('groups');
  });

  it('deletes a feed that nothing depends on', async () => {
    const r = await request(t.app).delete('/api/feeds/M1.FM1.M?version=1').set(t.auth('engineer'));
    expect(r.status).toBe(200);
    expect(await count('feed_via_sites')).toBe(0);
    expect((await request(t.app).delete('/api/sites/H1?version=1').set(t.auth('engineer'))).status).toBe(200);
  });
});

describe('roles', () => {
  it('gives a viewer and an operator 403 on every write and lets them read', async () => {
    for (const role of ['viewer', 'operator'] as const) {
      const h = t.auth(role);
      expect((await request(t.app).post('/api/sites').set(h).send({ code: 'V1', name: 'V', role: 'relay', lat: 0, lon: 0 })).status).toBe(403);
      expect((await request(t.app).patch('/api/sites/R1').set(h).send({ version: 1, name: 'x' })).status).toBe(403);
      expect((await request(t.app).delete('/api/feeds/R1.TV1.M?version=1').set(h)).status).toBe(403);
      expect((await request(t.app).get('/api/feeds').set(h)).status).toBe(200);
      expect((await request(t.app).get('/api/audit').set(h)).status).toBe(403);
    }
    expect(await count('feeds')).toBe(smallNetwork().feeds.length);
  });
});

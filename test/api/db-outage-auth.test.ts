/**
 * While the database cannot be reached, authenticate uses the person's row
 * as read within the last minute, so read and analysis routes keep answering
 * from the in-memory network model; without such a row it answers 503.
 * The outage is simulated at the model call, with the error Sequelize itself
 * throws when a connection is refused (checked against a real refused
 * connection in the unit test beside isDatabaseUnavailableError).
 */
import request from 'supertest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ConnectionRefusedError } from 'sequelize';
import { useTestApp } from '../helpers/testApp';
import { smallNetwork } from '../fixtures/small-network';
import { User } from '@/server/db/models/user';

const getT = useTestApp({ network: smallNetwork });

const refused = () => new ConnectionRefusedError(Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:5432'), { code: 'ECONNREFUSED' }));

/**
 * The row read fails with `error`; and, as in a real outage, the listener
 * for changes to users is cut, so no cached row counts as confirmed current
 * and every request tries to read its row.
 */
function outage(t: ReturnType<typeof getT>, error: Error) {
  vi.spyOn(t.ctx.userChanges!, 'listening', 'get').mockReturnValue(false);
  return vi.spyOn(User, 'findByPk').mockRejectedValue(error);
}

afterEach(() => vi.restoreAllMocks());

describe('authentication while the database is down', () => {
  it('answers analysis and read routes from a row read within the last minute', async () => {
    const t = getT();
    const h = t.auth('operator');
    expect((await request(t.app).get('/api/analysis/spof').set(h)).status).toBe(200);
    const spy = outage(t, refused());
    const spof = await request(t.app).get('/api/analysis/spof').set(h);
    expect(spof.status).toBe(200);
    const summary = await request(t.app).get('/api/network/summary').set(h);
    expect(summary.status).toBe(200);
    expect(summary.body.counts.sites).toBeGreaterThan(0);
    expect(spy).toHaveBeenCalled();
  });

  it('answers 503 database-unavailable with a reason for someone with no fresh row', async () => {
    const t = getT();
    outage(t, refused());
    const r = await request(t.app).get('/api/analysis/spof').set(t.auth('viewer'));
    expect(r.status).toBe(503);
    expect(r.body.error.code).toBe('database-unavailable');
    expect(r.body.error.message).toMatch(/database cannot be reached/);
  });

  it('does not trust a cached row older than a minute', async () => {
    const t = getT();
    const h = t.auth('engineer');
    expect((await request(t.app).get('/api/analysis/spof').set(h)).status).toBe(200);
    const now = Date.now();
    vi.spyOn(Date, 'now').mockReturnValue(now + 61_000);
    outage(t, refused());
    const r = await request(t.app).get('/api/analysis/spof').set(h);
    expect(r.status).toBe(503);
    expect(r.body.error.code).toBe('database-unavailable');
  });

  it('passes any other database error on as a 500, without using the cache', async () => {
    const t = getT();
    const h = t.auth('viewer');
    expect((await request(t.app).get('/api/analysis/spof').set(h)).status).toBe(200);
    outage(t, new Error('some bug'));
    vi.spyOn(console, 'error').mockImplementation(() => undefined);
    expect((await request(t.app).get('/api/analysis/spof').set(h)).status).toBe(500);
  });
});

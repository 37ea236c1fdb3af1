/**
 * Time limits on request connections: an edit that arrives while an import
 * holds the network lock gets a clear 409 "network-busy" within a few
 * seconds instead of waiting for the import, and changes nothing.
 */
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { withNetworkWrite } from '@/server/services/inventory/networkWrite';
import { DEFAULT_LIMITS } from '@/server/db';
import { smallNetwork } from '../fixtures/small-network';
import { useTestApp } from '../helpers/testApp';

const app = useTestApp({ network: smallNetwork });

async function siteRow(code: string) {
  const [rows] = await app().db.sequelize.query('SELECT name, version FROM sites WHERE code = $1', { bind: [code] });
  return (rows as { name: string; version: number }[])[0];
}

describe('an edit while an import holds the network lock', () => {
  it('is refused with 409 network-busy within a few seconds, then goes through once the lock is gone', async () => {
    const t = app();
    const before = await siteRow('R1');
    // the same lock an import takes for its whole transaction (services/inventory/networkWrite.ts)
    let release!: () => void;
    const held = new Promise<void>((r) => (release = r));
    let locked!: () => void;
    const isLocked = new Promise<void>((r) => (locked = r));
    const importLike = withNetworkWrite(t.db.sequelize, { email: 'import@test.example' }, async () => {
      locked();
      await held;
    });
    try {
      await isLocked;
      const t0 = Date.now();
      const r = await request(t.app).patch('/api/sites/R1').set(t.auth('engineer')).send({ version: before.version, name: 'Changed during import' });
      const ms = Date.now() - t0;
      expect(r.status).toBe(409);
      expect(r.body.error.code).toBe('network-busy');
      expect(r.body.error.message).toMatch(/try again/i);
      expect(r.headers['retry-after']).toBeDefined();
      expect(JSON.stringify(r.body)).not.toMatch(/lock_timeout|network_state|FOR UPDATE|55P03/);
      expect(ms).toBeGreaterThanOrEqual(DEFAULT_LIMITS.lockTimeoutMs - 100);
      expect(ms).toBeLessThan(DEFAULT_LIMITS.lockTimeoutMs + 3000);
      expect(await siteRow('R1')).toEqual(before);
    } finally {
      release();
      await importLike;
    }

    const again = await request(t.app).patch('/api/sites/R1').set(t.auth('engineer')).send({ version: before.version, name: 'Changed after import' });
    expect(again.status).toBe(200);
    expect(await siteRow('R1')).toEqual({ name: 'Changed after import', version: before.version + 1 });
  });
});

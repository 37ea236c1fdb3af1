/**
 * The JSON export answered from the in-memory model is the same document
 * PostgreSQL holds, and a model that is behind the database is not used.
 */
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { loadNetworkDocument } from '@/server/services/networkLoader';
import { smallNetwork } from '../fixtures/small-network';
import { useTestApp } from '../helpers/testApp';

const app = useTestApp({ network: smallNetwork });

describe('JSON export', () => {
  it('equals the stored network, from memory when current and from PostgreSQL when the model is behind', async () => {
    const t = app();
    const first = await request(t.app).get('/api/network/export').set(t.auth('viewer'));
    expect(first.status).toBe(200);
    expect(first.headers['content-type']).toMatch(/^application\/json/);
    const stored = await loadNetworkDocument(t.db.sequelize);
    // the export names the version it was made from (a replace-import from it knows what it would undo)
    expect(first.body).toEqual({ ...stored.document, baseVersion: stored.version });
    expect(Number(first.headers['x-network-version'])).toBe(stored.version);
    const again = await request(t.app).get('/api/network/export').set(t.auth('viewer'));
    expect(again.text).toBe(first.text);

    // a change the model has not seen yet: the export reads PostgreSQL
    await t.db.sequelize.query(`UPDATE sites SET name = 'Renamed behind the model' WHERE code = 'R1'`);
    const [rows] = await t.db.sequelize.query('UPDATE network_state SET version = version + 1 WHERE id = 1 RETURNING version');
    const version = Number((rows as { version: number }[])[0].version);
    expect(t.ctx.network.model!.networkVersion).toBeLessThan(version);
    const fresh = await request(t.app).get('/api/network/export').set(t.auth('viewer'));
    expect(Number(fresh.headers['x-network-version'])).toBe(version);
    expect(fresh.body.sites.find((s: { code: string }) => s.code === 'R1').name).toBe('Renamed behind the model');
  });
});

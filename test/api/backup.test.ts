/**
 * Backup and restore round trip: a network, people and an audit log are
 * backed up with pg_dump, restored into a fresh database, and read back the
 * same; a database that is not empty is refused unless forced.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { Sequelize } from 'sequelize';
import { loadNetworkDocument } from '@/server/services/networkLoader';
import { ensureDatabase } from '@/scripts/lib/postgres';
import { backupDatabase, restoreDatabase, tablesIn } from '@/scripts/lib/backup';
import { smallNetwork } from '../fixtures/small-network';
import { useTestApp } from '../helpers/testApp';

const app = useTestApp({ network: smallNetwork });
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'headwater-backup-'));
const opened: Sequelize[] = [];
afterAll(async () => {
  for (const db of opened) await db.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

const withDatabase = (url: string, name: string) => {
  const u = new URL(url);
  u.pathname = `/${name}`;
  return u.toString();
};

/** A plain connection: openDatabase would bind the app's models to the copy. */
function open(url: string) {
  const s = new Sequelize(url, { dialect: 'postgres', logging: false });
  opened.push(s);
  return s;
}

async function snapshot(db: Sequelize) {
  const [users] = await db.query('SELECT email, name, role, password_hash, disabled FROM users ORDER BY email');
  const [audit] = await db.query('SELECT count(*)::int AS n, max(network_version)::int AS v FROM audit_log');
  const [migrations] = await db.query('SELECT name FROM schema_migrations ORDER BY name');
  return { document: (await loadNetworkDocument(db)).document, users, audit, migrations };
}

describe('backup and restore', () => {
  it('round-trips the network, the people and the audit log into a fresh database', async () => {
    const t = app();
    // one more audited change beyond the import
    const edit = await request(t.app).patch('/api/sites/R1').set(t.auth('engineer')).send({ version: 1, name: 'Relay One, backed up' });
    expect(edit.status).toBe(200);
    const before = await snapshot(t.db.sequelize);
    expect(before.document.sites).toHaveLength(5);
    expect(before.users.length).toBeGreaterThanOrEqual(4);
    expect((before.audit as { n: number }[])[0].n).toBeGreaterThanOrEqual(2);

    const file = path.join(dir, 'nested', 'headwater.dump');
    const written = await backupDatabase(t.db.url, file);
    expect(written.bytes).toBeGreaterThan(1000);
    expect(fs.readFileSync(file).subarray(0, 5).toString()).toBe('PGDMP');
    expect(fs.existsSync(`${file}.partial`)).toBe(false);

    const target = withDatabase(t.db.url, 'headwater_restore_test');
    await ensureDatabase(withDatabase(t.db.url, 'postgres'), 'headwater_restore_test', true);
    expect(await tablesIn(target)).toEqual([]);
    const restored = await restoreDatabase(target, file);
    expect(restored.tables).toBe((await tablesIn(t.db.url)).length);

    const copy = open(target);
    const after = await snapshot(copy);
    expect(after).toEqual(before);
    expect(after.document.sites.find((s) => s.code === 'R1')?.name).toBe('Relay One, backed up');
    // the restored database takes new writes where the old one left off
    const [v] = await copy.query('SELECT version FROM network_state');
    const [vOld] = await t.db.sequelize.query('SELECT version FROM network_state');
    expect(v).toEqual(vOld);

    // a second restore into the now non-empty database is refused, and changes nothing
    await copy.query(`UPDATE sites SET name = 'changed after restore' WHERE code = 'R2'`);
    await expect(restoreDatabase(target, file)).rejects.toThrow(/is not empty .*--force/);
    const [r2] = await copy.query(`SELECT name FROM sites WHERE code = 'R2'`);
    expect(r2).toEqual([{ name: 'changed after restore' }]);

    // --force replaces everything in it
    await restoreDatabase(target, file, { force: true });
    expect(await snapshot(copy)).toEqual(before);
  });

  it('refuses a file that does not exist, and leaves no file behind when the dump fails', async () => {
    const t = app();
    await expect(restoreDatabase(t.db.url, path.join(dir, 'missing.dump'))).rejects.toThrow(/no such backup file/);
    const bad = withDatabase(t.db.url, 'no_such_database_here');
    const file = path.join(dir, 'failed.dump');
    await expect(backupDatabase(bad, file)).rejects.toThrow(/pg_dump failed/);
    expect(fs.existsSync(file)).toBe(false);
    expect(fs.existsSync(`${file}.partial`)).toBe(false);
  });
});

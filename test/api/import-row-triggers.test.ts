/**
 * An import's bulk inserts of new rows run without PostgreSQL's per-row
 * foreign-key triggers where the role may turn them off
 * (server/services/import/rowTriggers.ts), and with them everywhere else:
 * the checks are on again before the transaction does anything more, and a
 * role that may not turn them off keeps them, its transaction going on.
 */
import { describe, expect, it } from 'vitest';
import type { Client } from 'pg';
import { clientOf, copyCreated } from '@/server/services/import/copy';
import { withoutRowTriggers } from '@/server/services/import/rowTriggers';
import { withNetworkWrite } from '@/server/services/inventory/networkWrite';
import { useTestApp } from '../helpers/testApp';

const app = useTestApp();

/** A role of its own with no more than the rights these statements need (roles belong to the whole cluster). */
const PLAIN_ROLE = 'headwater_test_plain_importer';

const setting = async (client: Client) => (await client.query('SHOW session_replication_role')).rows[0].session_replication_role as string;

/** Inserts a group link naming a site and a group that do not exist, in a savepoint; answers the SQL state of the refusal, or null. */
async function danglingLink(client: Client): Promise<string | null> {
  await client.query('SAVEPOINT dangling');
  try {
    await client.query('INSERT INTO site_groups (site_id, group_id) VALUES (999999, 999999)');
    await client.query('RELEASE SAVEPOINT dangling');
    return null;
  } catch (err) {
    await client.query('ROLLBACK TO SAVEPOINT dangling');
    return (err as { code?: string }).code ?? 'unknown';
  }
}

describe('per-row foreign-key checks of an import', () => {
  it('are off during the inserts of new rows where the role may, and on again before anything else', async () => {
    const [rows] = await app().db.sequelize.query(`SELECT has_parameter_privilege('session_replication_role', 'SET') AS may`);
    const may = (rows as { may: boolean }[])[0].may;
    let during = '';
    let off: boolean | undefined;
    let afterwards: string | null = 'not run';
    let settingAfter = '';
    await withNetworkWrite(app().db.sequelize, {}, async (w) => {
      const client = clientOf(w);
      await copyCreated(w, 'groups', [{ code: 'G1', name: 'Group one' }], { step: () => {} });
      off = await withoutRowTriggers(client, async () => {
        during = await setting(client);
      });
      await copyCreated(w, 'sites', [{ code: 'S1', name: 'Site one', role: 'relay', lat: -38, lon: -29, groups: ['G1'] }], { step: () => {} });
      settingAfter = await setting(client);
      afterwards = await danglingLink(client);
      w.markChanged();
    });
    expect(off).toBe(may);
    expect(during).toBe(may ? 'replica' : 'origin');
    expect(settingAfter).toBe('origin');
    expect(afterwards).toBe('23503');
    const [links] = await app().db.sequelize.query('SELECT s.code AS site, g.code AS grp FROM site_groups sg JOIN sites s ON s.id = sg.site_id JOIN risk_groups g ON g.id = sg.group_id');
    expect(links).toEqual([{ site: 'S1', grp: 'G1' }]);
    await app().ctx.network.refresh(await currentVersion());
  });

  it('stay on for a role that may not turn them off, and its transaction goes on', async () => {
    await app().db.sequelize.query(`DO $$ BEGIN IF NOT EXISTS (SELECT 1 FROM pg_roles WHERE rolname = '${PLAIN_ROLE}') THEN CREATE ROLE ${PLAIN_ROLE} NOLOGIN; END IF; END $$`);
    await app().db.sequelize.query(`GRANT SELECT, INSERT ON site_groups TO ${PLAIN_ROLE}`);
    let off: boolean | undefined;
    let refused: string | null = 'not run';
    let during = '';
    let after = 0;
    await app().db.sequelize.transaction(async (transaction) => {
      const client = clientOf({ sequelize: app().db.sequelize, transaction });
      await client.query(`SET LOCAL ROLE ${PLAIN_ROLE}`);
      off = await withoutRowTriggers(client, async () => {
        during = await setting(client);
        refused = await danglingLink(client);
      });
      after = (await client.query('SELECT 1 AS one')).rows[0].one;
    });
    expect(off).toBe(false);
    expect(during).toBe('origin');
    expect(refused).toBe('23503');
    expect(after).toBe(1);
    const [rows] = await app().db.sequelize.query('SELECT count(*)::int AS n FROM site_groups');
    expect((rows as { n: number }[])[0].n).toBe(0);
  });
});

async function currentVersion(): Promise<number> {
  const [rows] = await app().db.sequelize.query('SELECT version FROM network_state WHERE id = 1');
  return Number((rows as { version: number }[])[0].version);
}

/**
 * The importer writes new entities through COPY (server/services/import/copy.ts).
 * Text with COPY's special characters comes back as it went in; a COPY
 * refused midway, or an insert from its staging table refused, leaves no row
 * behind and the network version where it was.
 */
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { copyCreated } from '@/server/services/import/copy';
import { databaseRefusal } from '@/server/services/inventory/dbErrors';
import { withNetworkWrite } from '@/server/services/inventory/networkWrite';
import type { Fields } from '@/server/services/inventory/shape';
import { smallNetwork } from '../fixtures/small-network';
import { useTestApp } from '../helpers/testApp';

const app = useTestApp();

const count = async (table: string) => {
  const [rows] = await app().db.sequelize.query(`SELECT count(*)::int AS n FROM ${table}`);
  return (rows as { n: number }[])[0].n;
};
const version = async () => {
  const [rows] = await app().db.sequelize.query('SELECT version FROM network_state WHERE id = 1');
  return Number((rows as { version: number }[])[0].version);
};

/** Waits until the app's model has caught up with a write made here, so its rebuild does not run into the next test's reset. */
const settle = async () => app().ctx.network.refresh(await version());

/** Sites S0..S(n-1), valid, with a group each. */
const sites = (n: number): Fields[] =>
  Array.from({ length: n }, (_, i) => ({ code: `S${i}`, name: `Site ${i}`, role: 'relay', lat: -38 + i / 1e5, lon: -29, households: i, groups: ['G1'] }));

/** Runs copyCreated inside a network write, with group G1 stored first in the same transaction. */
async function copyInWrite(entities: Fields[]): Promise<unknown> {
  try {
    await withNetworkWrite(app().db.sequelize, {}, async (w) => {
      await copyCreated(w, 'groups', [{ code: 'G1', name: 'Group one' }], { step: () => {} });
      await copyCreated(w, 'sites', entities, { step: () => {} });
      w.markChanged();
    });
  } catch (err) {
    return err;
  }
  return undefined;
}

describe('import through COPY', () => {
  it('keeps tabs, newlines, backslashes, quotes and accents in text as they were', async () => {
    const doc = smallNetwork();
    const name = 'Tab\there, line\nbreak, CR\rback\\slash \\N "quoted" \'single\' Ærø ✓';
    doc.sites[0].name = name;
    doc.groups[2].note = '\\.\n\\t';
    const r = await request(app().app).post('/api/network/import').set(app().auth('engineer')).send(doc);
    expect(r.status).toBe(200);
    expect(r.body.ok).toBe(true);
    const [rows] = await app().db.sequelize.query(`SELECT name FROM sites WHERE code = 'O1'`);
    expect((rows as { name: string }[])[0].name).toBe(name);
    const [notes] = await app().db.sequelize.query(`SELECT note FROM risk_groups WHERE code = 'G-TEL'`);
    expect((notes as { note: string }[])[0].note).toBe('\\.\n\\t');
    const back = await request(app().app).get('/api/network/export').set(app().auth('engineer'));
    expect(back.body.sites.find((s: { code: string }) => s.code === 'O1').name).toBe(name);
  });

  it('writes all the rows and their link rows when nothing is refused', async () => {
    const v0 = await version();
    expect(await copyInWrite(sites(3000))).toBeUndefined();
    expect(await count('sites')).toBe(3000);
    expect(await count('site_groups')).toBe(3000);
    expect(await version()).toBe(v0 + 1);
    await settle();
  });

  it('copies one kind twice in one transaction, each time only what it was given', async () => {
    await withNetworkWrite(app().db.sequelize, {}, async (w) => {
      await copyCreated(w, 'groups', [{ code: 'G1', name: 'Group one' }], { step: () => {} });
      await copyCreated(w, 'groups', [{ code: 'G2', name: 'Group two' }], { step: () => {} });
      w.markChanged();
    });
    const [rows] = await app().db.sequelize.query('SELECT code FROM risk_groups ORDER BY code');
    expect(rows).toEqual([{ code: 'G1' }, { code: 'G2' }]);
    await settle();
  });

  it('a COPY that fails midway (a value its column cannot hold) leaves no row', async () => {
    const v0 = await version();
    const list = sites(6000);
    list[4000].households = 'many';
    const err = await copyInWrite(list);
    expect(err).toBeDefined();
    expect(databaseRefusal(err)?.sqlState, String(err)).toBe('22P02');
    expect(await count('sites')).toBe(0);
    expect(await count('risk_groups')).toBe(0);
    expect(await count('site_groups')).toBe(0);
    expect(await version()).toBe(v0);
  });

  it('a row the table refuses after the COPY (a latitude past 90) leaves no row', async () => {
    const v0 = await version();
    const list = sites(6000);
    list[5000].lat = 91;
    const err = await copyInWrite(list);
    expect(databaseRefusal(err)).toMatchObject({ sqlState: '23514', field: 'lat', status: 422 });
    expect(await count('sites')).toBe(0);
    expect(await count('risk_groups')).toBe(0);
    expect(await version()).toBe(v0);
  });

  it('stops at an aborted signal and leaves no row', async () => {
    const v0 = await version();
    const controller = new AbortController();
    let err: unknown;
    try {
      await withNetworkWrite(app().db.sequelize, {}, async (w) => {
        await copyCreated(w, 'sites', sites(60000).map(({ groups: _g, ...s }) => s), {
          signal: controller.signal,
          step: () => controller.abort(new Error('client gone')),
        });
        w.markChanged();
      });
    } catch (e) {
      err = e;
    }
    expect((err as Error)?.message).toBe('client gone');
    expect(await count('sites')).toBe(0);
    expect(await version()).toBe(v0);
  });
});

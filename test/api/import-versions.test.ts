/**
 * Import versioning: an export states the network version it was taken at
 * (baseVersion in JSON, manifest.csv in the zip); replacing the network with
 * a file made from an older version needs undoNewer=true, and the dry run
 * counts the changes it would undo.
 */
import JSZip from 'jszip';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import type { NetworkDocument } from '@/shared/schemas/network';
import { smallNetwork } from '../fixtures/small-network';
import { useTestApp } from '../helpers/testApp';
import { uploadFiles } from '../helpers/upload';

const app = useTestApp({ network: smallNetwork });
const eng = (method: 'get' | 'post' | 'patch', url: string) => request(app().app)[method](url).set(app().auth('engineer'));

/** A replace as a person makes it: the dry run, then the commit with the dry run's confirmation. */
async function confirmedReplace(doc: unknown, extra = '') {
  const dry = await eng('post', `/api/network/import?replace=true&dryRun=true${extra}`).send(doc as object);
  expect(dry.status).toBe(200);
  return eng('post', `/api/network/import?replace=true${extra}&confirmReplace=${dry.body.confirmReplace}`).send(doc as object);
}

const binary = (res: request.Response, done: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => done(null, Buffer.concat(chunks)));
};

async function siteName(code: string): Promise<string> {
  const [rows] = await app().db.sequelize.query('SELECT name FROM sites WHERE code = $1', { bind: [code] });
  return (rows as { name: string }[])[0].name;
}

/** Two single edits and an import of one changed group after the export: three changes. */
async function changeAfterExport(): Promise<void> {
  const r1 = await eng('get', '/api/sites/R1');
  expect((await eng('patch', '/api/sites/R1').send({ version: r1.body.site?.version ?? r1.body.version, name: 'Relay One B' })).status).toBe(200);
  const r2 = await eng('get', '/api/sites/R2');
  expect((await eng('patch', '/api/sites/R2').send({ version: r2.body.site?.version ?? r2.body.version, name: 'Relay Two B' })).status).toBe(200);
  const groups = smallNetwork().groups.map((g) => (g.code === 'G-TEL' ? { ...g, note: 'changed' } : g));
  expect((await eng('post', '/api/network/import').send({ format: 'network/1', groups })).status).toBe(200);
}

describe('import versioning', () => {
  it('states the version in the JSON export and in the zip manifest', async () => {
    const json = await eng('get', '/api/network/export');
    const version = Number(json.headers['x-network-version']);
    expect(json.body.baseVersion).toBe(version);
    const zip = await eng('get', '/api/network/export?format=csv').buffer(true).parse(binary);
    const manifest = await (await JSZip.loadAsync(zip.body as Buffer)).file('manifest.csv')!.async('string');
    expect(manifest).toBe(`format,baseVersion\nnetwork/1,${version}\n`);
  });

  it('refuses a replace from an older version with 409 counting the changes, reports them in the dry run, and carries it out with undoNewer', async () => {
    const old: NetworkDocument = (await eng('get', '/api/network/export')).body;
    await changeAfterExport();

    const dry = await eng('post', '/api/network/import?replace=true&dryRun=true').send(old);
    expect(dry.status).toBe(200);
    expect(dry.body.stale).toEqual({ baseVersion: old.baseVersion, currentVersion: old.baseVersion! + 3, changesSince: 3 });

    const refused = await eng('post', '/api/network/import?replace=true').send(old);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('stale-base');
    expect(refused.body.error.message).toMatch(/3 changes since/);
    expect(refused.body.error.message).toMatch(/undoNewer=true/);
    expect(await siteName('R1')).toBe('Relay One B');

    const done = await confirmedReplace(old, '&undoNewer=true');
    expect(done.status).toBe(200);
    expect(await siteName('R1')).toBe('Relay One');
    expect(await siteName('R2')).toBe('Relay Two');
  });

  it('reads the version of a CSV zip from its manifest', async () => {
    const zip = await eng('get', '/api/network/export?format=csv').buffer(true).parse(binary);
    await changeAfterExport();
    const refused = await uploadFiles(app(), [{ name: 'net.zip', data: zip.body as Buffer }], '?replace=true');
    expect(refused.status).toBe(409);
    expect(await siteName('R1')).toBe('Relay One B');
  });

  it('lets a merge, a replace from the current version and a file without a version through', async () => {
    const current: NetworkDocument = (await eng('get', '/api/network/export')).body;
    expect((await confirmedReplace(current)).status).toBe(200);
    const old = { ...current, baseVersion: 0 };
    expect((await eng('post', '/api/network/import').send(old)).status).toBe(200);
    const { baseVersion: _v, ...unversioned } = current;
    expect((await confirmedReplace(unversioned)).status).toBe(200);
  });
});

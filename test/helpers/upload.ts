/** Multipart uploads to the import route, for the API tests of files. */
import request from 'supertest';
import type { TestApp } from './testApp';

export function uploadFiles(t: TestApp, files: Array<{ name: string; data: Buffer | string }>, query = '') {
  let req = request(t.app).post(`/api/network/import${query}`).set(t.auth('engineer'));
  for (const f of files) req = req.attach('file', Buffer.from(f.data), f.name);
  return req;
}

export async function countOf(t: TestApp, table: string): Promise<number> {
  const [rows] = await t.db.sequelize.query(`SELECT count(*)::int AS n FROM ${table}`);
  return (rows as { n: number }[])[0].n;
}

/**
 * Refusals by PostgreSQL's own constraints, provoked for real, said in the
 * API's words: the field by its API name, never SQL text, a table, column
 * or constraint name, or PostgreSQL's message.
 */
import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { errorHandler } from '@/server/http/errors';
import { databaseRefusal } from '@/server/services/inventory/dbErrors';
import { useTestApp } from '../helpers/testApp';

const app = useTestApp();

/** Runs SQL that must fail and hands back the error. */
async function refusalOf(sql: string, bind: unknown[] = []) {
  try {
    await app().db.sequelize.query(sql, { bind });
  } catch (err) {
    return { err, refusal: databaseRefusal(err) };
  }
  throw new Error(`expected the database to refuse: ${sql}`);
}

const LEAKS = /sites_|services_|carriages_|_check|_fkey|_key\b|ground_height|site_id|violates|relation|constraint|INSERT|VALUES/i;

describe('database refusals in the API words', () => {
  it.each([
    ['a check', `INSERT INTO sites (code, name, role, lat, lon, ground_height_m) VALUES ('X1', 'n', 'origin', 0, 0, -1)`, [], 422, 'groundHeightM'],
    ['a not-null', `INSERT INTO sites (code, name, role, lat) VALUES ('X1', 'n', 'origin', 0)`, [], 422, 'lon'],
    ['a foreign key', `INSERT INTO carriages (code, site_id, service_id) VALUES ('C1', 999999, 999999)`, [], 409, 'site'],
    ['a number out of range', `INSERT INTO sites (code, name, role, lat, lon, households) VALUES ('X1', 'n', 'origin', 0, 0, 3000000000)`, [], 422, undefined],
  ] as const)('%s', async (_what, sql, bind, status, field) => {
    const { refusal } = await refusalOf(sql, [...bind]);
    expect(refusal).toBeDefined();
    expect(refusal!.status).toBe(status);
    expect(refusal!.field).toBe(field);
    expect(refusal!.message).not.toMatch(LEAKS);
  });

  it('a unique code', async () => {
    await app().db.sequelize.query(`INSERT INTO services (code, name, kind) VALUES ('S1', 'n', 'fm')`);
    const { refusal } = await refusalOf(`INSERT INTO services (code, name, kind) VALUES ('S1', 'm', 'fm')`);
    expect(refusal).toMatchObject({ status: 409, field: 'code' });
    expect(refusal!.message).not.toMatch(LEAKS);
  });

  it('the final error handler answers a refusal that reached it in the same words, and nothing else of a database error', async () => {
    const { err } = await refusalOf(`INSERT INTO sites (code, name, role, lat, lon, mast_height_m) VALUES ('X1', 'n', 'origin', 0, 0, -5)`);
    const { err: other } = await refusalOf(`SELECT * FROM no_such_table`).catch(() => ({ err: undefined }));
    const probe = express();
    probe.get('/refused', (_req, _res, next) => next(err));
    probe.get('/other', (_req, _res, next) => next(other ?? new Error('relation "no_such_table" does not exist')));
    probe.use(errorHandler);
    const refused = await request(probe).get('/refused');
    expect(refused.status).toBe(422);
    expect(refused.body.error.details).toEqual([expect.objectContaining({ field: 'mastHeightM' })]);
    expect(refused.text).not.toMatch(LEAKS);
    const failed = await request(probe).get('/other');
    expect(failed.status).toBe(500);
    expect(failed.text).not.toMatch(/no_such_table/);
  });
});

/**
 * Hostile uploads: cells built to make a pattern backtrack, files with more
 * problems than a report lists. Each answer is a quick 4xx with a bounded
 * body, and nothing is written.
 */
import { describe, expect, it } from 'vitest';
import { MAX_REPORTED_ISSUES } from '@/shared/schemas/import';
import { useTestApp } from '../helpers/testApp';
import { countOf, uploadFiles } from '../helpers/upload';

const app = useTestApp();

describe('long cells', () => {
  it('answers a 100 KB digit run in a number column quickly, without quoting it back', async () => {
    const cell = `${'1'.repeat(100_000)}x`;
    const started = Date.now();
    const r = await uploadFiles(app(), [{ name: 'sites.csv', data: `code,name,role,lat,lon\nS1,One,origin,${cell},0\n` }]);
    const took = Date.now() - started;
    expect(r.status).toBe(422);
    expect(r.body.errors).toEqual([expect.objectContaining({ file: 'sites.csv', row: 1, field: 'lat', rule: 'wrong-type' })]);
    expect(r.text.length).toBeLessThan(2_000);
    // the backtracking pattern took about 24 s here; a linear one takes milliseconds
    expect(took).toBeLessThan(3_000);
    expect(await countOf(app(), 'sites')).toBe(0);
  });
});

describe('many problems', () => {
  it(`lists the first ${MAX_REPORTED_ISSUES} errors and counts the rest`, async () => {
    const rows = Array.from({ length: 2_500 }, (_, i) => `S${i},Site ${i},nowhere,0,0`).join('\n');
    const r = await uploadFiles(app(), [{ name: 'sites.csv', data: `code,name,role,lat,lon\n${rows}\n` }]);
    expect(r.status).toBe(422);
    expect(r.body.errors).toHaveLength(MAX_REPORTED_ISSUES);
    expect(r.body.moreErrors).toBe(1_500);
    expect(r.body.errors[0]).toMatchObject({ row: 1, code: 'S0', rule: 'unknown-enum' });
    expect(await countOf(app(), 'sites')).toBe(0);
  });

  it('caps a JSON document report the same way', async () => {
    const sites = Array.from({ length: 1_200 }, (_, i) => ({ code: `S${i}`, name: `Site ${i}`, role: 'origin', lat: 99, lon: 0 }));
    const r = await (await import('supertest')).default(app().app).post('/api/network/import').set(app().auth('engineer')).send({ format: 'network/1', sites });
    expect(r.status).toBe(422);
    expect(r.body.errors).toHaveLength(MAX_REPORTED_ISSUES);
    expect(r.body.moreErrors).toBe(200);
  });
});

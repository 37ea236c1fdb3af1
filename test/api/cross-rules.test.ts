/**
 * The rules between entities are written once (server/interchange/crossRules.ts):
 * the same bad feed, or the same bad carriage move, gets the same rule and
 * the same sentence from an import, its dry run and a single edit, and
 * nothing is written by any of them.
 */
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { smallNetwork } from '../fixtures/small-network';
import { useTestApp } from '../helpers/testApp';
import { countOf } from '../helpers/upload';

const app = useTestApp({ network: smallNetwork });
const eng = () => request(app().app);
const as = (r: request.Test) => r.set(app().auth('engineer'));

/** A feed between carriages of two services, passing via its own source site. */
const badFeed = { code: 'X.BAD', from: 'M1.FM1', to: 'R1.TV1', medium: 'line', role: 'reserve', via: ['M1'] };

const issuesOf = (errors: Array<{ rule: string; message: string; field?: string }>) => errors.map(({ rule, message, field }) => ({ rule, message, field }));

describe('one set of cross-entity rules', () => {
  it('gives a bad feed the same rules and sentences from an import, its dry run and a single create', async () => {
    const feedsBefore = await countOf(app(), 'feeds');
    const imported = await as(eng().post('/api/network/import')).send({ format: 'network/1', feeds: [badFeed] });
    const dry = await as(eng().post('/api/network/import?dryRun=true')).send({ format: 'network/1', feeds: [badFeed] });
    const single = await as(eng().post('/api/feeds')).send(badFeed);
    expect(imported.status).toBe(422);
    expect(dry.status).toBe(422);
    expect(single.status).toBe(422);

    const fromImport = issuesOf(imported.body.errors);
    expect(fromImport.map((i) => i.rule).sort()).toEqual(['service-mismatch', 'via-endpoint']);
    expect(fromImport).toContainEqual({
      rule: 'service-mismatch', field: 'to',
      message: 'feed X.BAD: source carriage M1.FM1 carries service FM1 but receiving carriage R1.TV1 carries TV1; both ends of a feed carry the same service',
    });
    expect(issuesOf(dry.body.errors)).toEqual(fromImport);
    const fromEdit = (single.body.error.details as Array<{ rule: string; message: string; field: string }>).map(({ rule, message, field }) => ({ rule, message, field }));
    expect(fromEdit.sort((a, b) => a.rule.localeCompare(b.rule))).toEqual([...fromImport].sort((a, b) => a.rule.localeCompare(b.rule)));
    expect(single.body.error.message.startsWith(fromEdit[0].message)).toBe(true);
    expect(await countOf(app(), 'feeds')).toBe(feedsBefore);
  });

  it('gives a carriage moved away from its feeds the same sentence from an upsert import and a single edit', async () => {
    const moved = { code: 'R1.TV1', site: 'R1', service: 'FM1' };
    const imported = await as(eng().post('/api/network/import')).send({ format: 'network/1', carriages: [moved] });
    const current = await as(eng().get('/api/carriages/R1.TV1'));
    const version = current.body.carriage?.version ?? current.body.version;
    const single = await as(eng().patch('/api/carriages/R1.TV1')).send({ version, service: 'FM1' });
    expect(imported.status).toBe(422);
    expect(single.status).toBe(422);
    const fromImport = issuesOf(imported.body.errors).filter((i) => i.rule === 'service-mismatch');
    const fromEdit = issuesOf(single.body.error.details).filter((i) => i.rule === 'service-mismatch');
    expect(fromImport.length).toBeGreaterThan(0);
    expect(fromEdit.map((i) => i.message).sort()).toEqual(fromImport.map((i) => i.message).sort());
    const [rows] = await app().db.sequelize.query(`SELECT sv.code FROM carriages c JOIN services sv ON sv.id = c.service_id WHERE c.code = 'R1.TV1'`);
    expect(rows).toEqual([{ code: 'TV1' }]);
  });

  it('refuses a carriage moved to another service once per feed it has, either way round, in feed order, writing nothing', async () => {
    const r = await as(eng().patch('/api/carriages/R2.TV1')).send({ version: 1, service: 'FM1', channel: null, frequencyMHz: null });
    expect(r.status).toBe(422);
    const tail = 'change or delete the feed first, or import it too';
    expect(issuesOf(r.body.error.details)).toEqual([
      { rule: 'service-mismatch', field: 'service', message: `carriage R2.TV1: feed R1.TV1.R joins it to carriage R1.TV1, which carries TV1, not FM1; ${tail}` },
      { rule: 'service-mismatch', field: 'service', message: `carriage R2.TV1: feed R2.TV1.M joins it to carriage M1.TV1, which carries TV1, not FM1; ${tail}` },
      { rule: 'service-mismatch', field: 'service', message: `carriage R2.TV1: feed R2.TV1.R joins it to carriage O1.TV1, which carries TV1, not FM1; ${tail}` },
    ]);
    const [rows] = await app().db.sequelize.query(`SELECT sv.code AS service, c.channel, c.version FROM carriages c JOIN services sv ON sv.id = c.service_id WHERE c.code = 'R2.TV1'`);
    expect(rows).toEqual([{ service: 'TV1', channel: '37', version: 1 }]);
  });

  it('refuses a carriage moved onto a via-site of its feed, from either end, writing nothing', async () => {
    for (const [carriage, site] of [['M1.FM1', 'M1'], ['O1.FM1', 'O1']]) {
      const r = await as(eng().patch(`/api/carriages/${carriage}`)).send({ version: 1, site: 'H1' });
      expect(r.status).toBe(422);
      expect(issuesOf(r.body.error.details)).toEqual([
        { rule: 'via-endpoint', field: 'site', message: `carriage ${carriage}: feed M1.FM1.M into or out of it passes via site H1, which would become one of its ends; change the feed first, or import it too` },
      ]);
      const [rows] = await app().db.sequelize.query(`SELECT s.code FROM carriages c JOIN sites s ON s.id = c.site_id WHERE c.code = '${carriage}'`);
      expect(rows).toEqual([{ code: site }]);
    }
  });

  it('lets a carriage move when its feeds still hold', async () => {
    const r = await as(eng().patch('/api/carriages/M1.FM1')).send({ version: 1, site: 'R1' });
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ code: 'M1.FM1', site: 'R1', version: 2 });
    const [rows] = await app().db.sequelize.query(`SELECT s.code FROM carriages c JOIN sites s ON s.id = c.site_id WHERE c.code = 'M1.FM1'`);
    expect(rows).toEqual([{ code: 'R1' }]);
  });
});

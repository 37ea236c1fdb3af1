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
});

/**
 * Each import rule (docs/format.md) once failing and once
 * passing: the failing change breaks exactly that rule in the small network;
 * the passing change is the nearest valid value, so the rule is shown to
 * draw its line in the right place.
 */
import { describe, expect, it } from 'vitest';
import type { NetworkDocument } from '@/shared/schemas/network';
import { validateDocument } from './validate';
import { smallNetwork } from '@/test/fixtures/small-network';

type Loose = Record<string, Array<Record<string, unknown>>>;
type Change = (doc: Loose) => void;

interface RuleCase {
  rule: string;
  fail: Change;
  expect: { kind: string; index: number; field?: string; message: string | RegExp };
  pass: Change;
}

const site = (doc: Loose, code: string) => doc.sites.find((s) => s.code === code)!;
const carriage = (doc: Loose, code: string) => doc.carriages.find((c) => c.code === code)!;
const feed = (doc: Loose, code: string) => doc.feeds.find((f) => f.code === code)!;

const cases: RuleCase[] = [
  {
    rule: 'missing-code',
    fail: (d) => d.services.push({ name: 'Spare', kind: 'am' }),
    expect: { kind: 'services', index: 2, field: 'code', message: 'service at index 2: code is required' },
    pass: (d) => d.services.push({ code: 'AM1', name: 'Spare', kind: 'am' }),
  },
  {
    rule: 'invalid-code',
    fail: (d) => d.groups.push({ code: 'G X', name: 'Spare' }),
    expect: { kind: 'groups', index: 3, field: 'code', message: /^group at index 3: code: a code is 1-64 letters, digits/ },
    pass: (d) => d.groups.push({ code: `g.X_y-${'9'.repeat(58)}`, name: 'Spare' }),
  },
  {
    rule: 'duplicate-code',
    fail: (d) => d.groups.push({ code: 'G-PWR', name: 'Again' }),
    expect: { kind: 'groups', index: 3, field: 'code', message: 'group G-PWR: code G-PWR is used twice: the group at index 0 has it too; codes are unique within a kind' },
    pass: (d) => d.groups.push({ code: 'G-PWR2', name: 'Again' }) && d.services.push({ code: 'G-PWR', name: 'Same code, other kind', kind: 'other' }),
  },
  {
    rule: 'missing-field',
    fail: (d) => delete d.sites[2].name,
    expect: { kind: 'sites', index: 2, field: 'name', message: 'site R1: name is required' },
    pass: (d) => (d.sites[2].name = ' R '),
  },
  {
    rule: 'wrong-type',
    fail: (d) => (carriage(d, 'R2.TV1').onChannelRepeater = 'yes'),
    expect: { kind: 'carriages', index: 5, field: 'onChannelRepeater', message: 'carriage R2.TV1: onChannelRepeater must be a boolean (got "yes")' },
    pass: (d) => (carriage(d, 'R2.TV1').onChannelRepeater = true),
  },
  {
    rule: 'out-of-range',
    fail: (d) => (site(d, 'R1').lon = -180.5),
    expect: { kind: 'sites', index: 2, field: 'lon', message: 'site R1: longitude is between -180 and 180 (got -180.5)' },
    pass: (d) => Object.assign(site(d, 'R1'), { lon: -180, lat: -90 }),
  },
  {
    rule: 'negative-value',
    fail: (d) => (site(d, 'R2').households = -1),
    expect: { kind: 'sites', index: 3, field: 'households', message: 'site R2: households cannot be negative (got -1)' },
    pass: (d) => Object.assign(site(d, 'R2'), { households: 0, groundHeightM: 0, mastHeightM: 0 }),
  },
  {
    rule: 'unknown-enum',
    fail: (d) => (carriage(d, 'M1.TV1').polarisation = 'X'),
    expect: { kind: 'carriages', index: 2, field: 'polarisation', message: 'carriage M1.TV1: polarisation is one of H, V, M, C (got "X")' },
    pass: (d) => (carriage(d, 'M1.TV1').polarisation = 'C'),
  },
  {
    rule: 'unknown-field',
    fail: (d) => (feed(d, 'R1.TV1.M').bearing = 12),
    expect: { kind: 'feeds', index: 3, field: 'bearing', message: /feed R1.TV1.M: unknown field "bearing" \(the fields are code, from, to/ },
    pass: (d) => (feed(d, 'R1.TV1.M').bearingDeg = 12),
  },
  {
    rule: 'unknown-reference',
    fail: (d) => (feed(d, 'R1.TV1.M').from = 'M9.TV1'),
    expect: { kind: 'feeds', index: 3, field: 'from', message: 'feed R1.TV1.M: source carriage M9.TV1 does not exist' },
    pass: (d) => (feed(d, 'R1.TV1.M').from = 'O1.TV1'),
  },
  {
    rule: 'unknown-reference',
    fail: (d) => (feed(d, 'M1.FM1.M').groups = ['G-SAT', 'G-NONE']),
    expect: { kind: 'feeds', index: 2, field: 'groups[1]', message: 'feed M1.FM1.M: group G-NONE does not exist' },
    pass: (d) => (feed(d, 'M1.FM1.M').groups = ['G-SAT', 'G-TEL']),
  },
  {
    rule: 'unknown-reference',
    fail: (d) => (feed(d, 'M1.FM1.M').via = ['H2']),
    expect: { kind: 'feeds', index: 2, field: 'via[0]', message: 'feed M1.FM1.M: via-site H2 does not exist' },
    pass: (d) => (feed(d, 'M1.FM1.M').via = ['R2', 'H1']),
  },
  {
    rule: 'unknown-reference',
    fail: (d) => (carriage(d, 'O1.FM1').service = 'FM2'),
    expect: { kind: 'carriages', index: 1, field: 'service', message: 'carriage O1.FM1: service FM2 does not exist' },
    pass: (d) => d.services.push({ code: 'FM2', name: 'Two', kind: 'fm' }) && d.carriages.push({ code: 'O1.FM2', site: 'O1', service: 'FM2' }),
  },
  {
    rule: 'service-mismatch',
    fail: (d) => (feed(d, 'M1.FM1.M').from = 'O1.TV1'),
    expect: { kind: 'feeds', index: 2, field: 'to', message: 'feed M1.FM1.M: source carriage O1.TV1 carries service TV1 but receiving carriage M1.FM1 carries FM1; both ends of a feed carry the same service' },
    pass: (d) => (feed(d, 'M1.FM1.M').from = 'O1.FM1'),
  },
  {
    rule: 'self-feed',
    fail: (d) => (feed(d, 'R1.TV1.R').from = 'R1.TV1'),
    expect: { kind: 'feeds', index: 4, field: 'to', message: 'feed R1.TV1.R: source and receiving carriage are the same carriage R1.TV1; a feed joins two different carriages' },
    pass: (d) => (feed(d, 'R1.TV1.R').from = 'M1.TV1'),
  },
  {
    rule: 'via-endpoint',
    fail: (d) => (feed(d, 'M1.FM1.M').via = ['H1', 'M1']),
    expect: { kind: 'feeds', index: 2, field: 'via[1]', message: 'feed M1.FM1.M: via-site M1 is the receiving site (of carriage M1.FM1); a via-site is a hop between the two ends' },
    pass: (d) => (feed(d, 'M1.FM1.M').via = ['H1', 'R1']),
  },
  {
    rule: 'duplicate-carriage',
    fail: (d) => d.carriages.push({ code: 'R1.TV1.b', site: 'R1', service: 'TV1' }),
    expect: { kind: 'carriages', index: 6, field: 'service', message: 'carriage R1.TV1.b: site R1 already has carriage R1.TV1 for service TV1; a site radiates each service once' },
    pass: (d) => d.carriages.push({ code: 'R1.FM1', site: 'R1', service: 'FM1' }) && d.feeds.push({ code: 'R1.FM1.M', from: 'M1.FM1', to: 'R1.FM1', medium: 'off-air', role: 'main' }),
  },
];

function changed(change: Change): NetworkDocument {
  const doc = smallNetwork();
  change(doc as unknown as Loose);
  return doc;
}

describe.each(cases)('import rule $rule', ({ rule, fail, expect: want, pass }) => {
  it(`fails: ${typeof want.message === 'string' ? want.message : want.message.source}`, () => {
    const result = validateDocument(changed(fail));
    expect(result.document).toBeNull();
    expect(result.errors).toHaveLength(1);
    const [issue] = result.errors;
    expect(issue).toMatchObject({ kind: want.kind, index: want.index, rule, field: want.field });
    if (typeof want.message === 'string') expect(issue.message).toBe(want.message);
    else expect(issue.message).toMatch(want.message);
  });

  it('passes at the nearest valid value', () => {
    const result = validateDocument(changed(pass));
    expect(result.errors).toEqual([]);
    expect(result.document).not.toBeNull();
  });
});

describe('wrong types and ranges of every number field', () => {
  it.each([
    ['sites', 'M1', 'lat', 'ninety', 'wrong-type'],
    ['sites', 'M1', 'groundHeightM', -0.5, 'negative-value'],
    ['sites', 'M1', 'households', 10.5, 'wrong-type'],
    ['carriages', 'M1.TV1', 'frequencyMHz', 0, 'out-of-range'],
    ['carriages', 'M1.TV1', 'erpW', -1, 'negative-value'],
    ['carriages', 'M1.TV1', 'antennaHeightM', -2, 'negative-value'],
    ['carriages', 'M1.TV1', 'channel', 30, 'wrong-type'],
    ['feeds', 'R1.TV1.M', 'bearingDeg', 361, 'out-of-range'],
    ['feeds', 'R1.TV1.M', 'rxFrequencyMHz', '546', 'wrong-type'],
    ['feeds', 'R1.TV1.M', 'via', 'H1', 'wrong-type'],
    ['feeds', 'R1.TV1.M', 'role', 'backup', 'unknown-enum'],
    ['services', 'TV1', 'kind', 'tv', 'unknown-enum'],
  ] as const)('%s %s: %s = %j is %s', (kind, code, field, value, rule) => {
    const doc = smallNetwork() as unknown as Loose;
    doc[kind].find((e) => e.code === code)![field] = value;
    const { errors } = validateDocument(doc);
    expect(errors).toEqual([expect.objectContaining({ kind, code, field, rule })]);
    expect(errors[0].message).toContain(`(got ${JSON.stringify(value)})`);
  });

  it('reports an entity that is not an object', () => {
    const doc = smallNetwork() as unknown as { groups: unknown[] };
    doc.groups.push(null, 'G-X');
    const { errors } = validateDocument(doc);
    expect(errors.map((e) => [e.kind, e.index, e.rule])).toEqual([
      ['groups', 3, 'wrong-type'],
      ['groups', 4, 'wrong-type'],
    ]);
    expect(errors[1].message).toBe('group at index 4: must be an object with fields (got "G-X")');
  });
});

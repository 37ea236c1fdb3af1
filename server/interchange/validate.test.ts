import { describe, expect, it } from 'vitest';
import { validateDocument } from './validate';
import { smallNetwork } from '@/test/fixtures/small-network';

describe('validateDocument: the whole document', () => {
  it('accepts the small network with no error and no warning, and returns it', () => {
    const doc = smallNetwork();
    const result = validateDocument(doc);
    expect(result.errors).toEqual([]);
    expect(result.warnings).toEqual([]);
    expect(result.document).toEqual(doc);
  });

  it.each([
    ['null', null],
    ['a list', []],
    ['a string', 'network/1'],
    ['a number', 3],
  ])('rejects %s as a document', (_, raw) => {
    const result = validateDocument(raw);
    expect(result.document).toBeNull();
    expect(result.errors).toHaveLength(1);
    expect(result.errors[0]).toMatchObject({ kind: 'document', rule: 'not-an-object' });
    expect(result.errors[0].message).toMatch(/must be a JSON object/);
  });

  it('names every unknown top-level key, a wrong format and a kind that is not a list', () => {
    const result = validateDocument({ format: 'network/2', site: [], extra: 1, sites: { S1: {} } });
    expect(result.document).toBeNull();
    const byRule = result.errors.map((e) => [e.rule, e.field]);
    expect(byRule).toEqual(
      expect.arrayContaining([
        ['unknown-key', 'site'],
        ['unknown-key', 'extra'],
        ['wrong-format', 'format'],
        ['not-a-list', 'sites'],
      ]),
    );
    expect(result.errors).toHaveLength(4);
    expect(result.errors.find((e) => e.rule === 'wrong-format')?.message).toBe('format must be "network/1" (got "network/2")');
    expect(result.errors.find((e) => e.field === 'extra')?.message).toMatch(/unknown top-level key "extra"/);
  });

  it('reports a missing format', () => {
    const { errors } = validateDocument({ sites: [] });
    expect(errors).toEqual([expect.objectContaining({ kind: 'document', rule: 'wrong-format', field: 'format' })]);
  });

  it('treats a missing kind as empty', () => {
    const { errors, document } = validateDocument({ format: 'network/1' });
    expect(errors).toEqual([]);
    expect(document).toEqual({ format: 'network/1', sites: [], services: [], groups: [], carriages: [], feeds: [] });
  });

  it('reads null optional fields as absent', () => {
    const doc = smallNetwork() as unknown as { sites: Record<string, unknown>[] };
    doc.sites[0].households = null;
    const result = validateDocument(doc);
    expect(result.errors).toEqual([]);
    expect(result.document?.sites[0]).not.toHaveProperty('households');
  });
});

describe('validateDocument: a document with many planted errors reports every one', () => {
  const raw = {
    format: 'network/1',
    sites: [
      { code: 'S1', name: 'Alpha', role: 'origin', lat: 95, lon: 10 },
      { code: 'S2', name: 'Beta', role: 'tower', lat: 10, lon: 10, mastHeightM: -5, groups: ['NOPE'] },
      { code: 'S1', name: 'Alpha again', role: 'relay', lat: 10, lon: 10 },
      { name: 'No code', role: 'relay', lat: 10, lon: 10 },
    ],
    services: [{ code: 'TV', name: 'TV', kind: 'dtt' }, { code: 'FM', name: 'FM', kind: 'fm' }],
    groups: [],
    carriages: [
      { code: 'C1', site: 'S1', service: 'TV' },
      { code: 'C2', site: 'S2', service: 'FM', erpW: 'lots' },
      { code: 'C3', site: 'S9', service: 'TV' },
      { code: 'C4', site: 'S2', service: 'FM' },
    ],
    feeds: [
      { code: 'F1', from: 'C1', to: 'C2', medium: 'off-air', role: 'main' },
      { code: 'F2', from: 'C99', to: 'C3', medium: 'radio', role: 'main' },
      { code: 'F3', from: 'C2', to: 'C2', medium: 'line', role: 'main', via: ['S2'] },
    ],
  };
  const result = validateDocument(raw);

  const expected = [
    { kind: 'sites', index: 0, code: 'S1', field: 'lat', rule: 'out-of-range', message: 'site S1: latitude is between -90 and 90 (got 95)' },
    { kind: 'sites', index: 1, code: 'S2', field: 'role', rule: 'unknown-enum', message: 'site S2: role is one of origin, main, relay (got "tower")' },
    { kind: 'sites', index: 1, code: 'S2', field: 'mastHeightM', rule: 'negative-value', message: 'site S2: mast height cannot be negative (got -5)' },
    { kind: 'sites', index: 1, code: 'S2', field: 'groups[0]', rule: 'unknown-reference', message: 'site S2: group NOPE does not exist' },
    { kind: 'sites', index: 2, code: 'S1', field: 'code', rule: 'duplicate-code', message: 'site S1: code S1 is used twice: the site at index 0 has it too; codes are unique within a kind' },
    { kind: 'sites', index: 3, code: undefined, field: 'code', rule: 'missing-code', message: 'site at index 3: code is required' },
    { kind: 'carriages', index: 1, code: 'C2', field: 'erpW', rule: 'wrong-type', message: 'carriage C2: erpW must be a number (got "lots")' },
    { kind: 'carriages', index: 2, code: 'C3', field: 'site', rule: 'unknown-reference', message: 'carriage C3: site S9 does not exist' },
    { kind: 'carriages', index: 3, code: 'C4', field: 'service', rule: 'duplicate-carriage', message: 'carriage C4: site S2 already has carriage C2 for service FM; a site radiates each service once' },
    { kind: 'feeds', index: 0, code: 'F1', field: 'to', rule: 'service-mismatch', message: 'feed F1: source carriage C1 carries service TV but receiving carriage C2 carries FM; both ends of a feed carry the same service' },
    { kind: 'feeds', index: 1, code: 'F2', field: 'medium', rule: 'unknown-enum', message: 'feed F2: medium is one of off-air, satellite, line, microwave (got "radio")' },
    { kind: 'feeds', index: 1, code: 'F2', field: 'from', rule: 'unknown-reference', message: 'feed F2: source carriage C99 does not exist' },
    { kind: 'feeds', index: 2, code: 'F3', field: 'to', rule: 'self-feed', message: 'feed F3: source and receiving carriage are the same carriage C2; a feed joins two different carriages' },
    { kind: 'feeds', index: 2, code: 'F3', field: 'via[0]', rule: 'via-endpoint', message: 'feed F3: via-site S2 is the source site (of carriage C2); a via-site is a hop between the two ends' },
  ];

  it('finds exactly the planted errors, in document order', () => {
    expect(result.document).toBeNull();
    expect(result.errors.map((e) => ({ kind: e.kind, index: e.index, code: e.code, field: e.field, rule: e.rule, message: e.message }))).toEqual(expected);
  });

  it('puts a JSON index on every issue and no CSV row', () => {
    for (const issue of [...result.errors, ...result.warnings]) {
      expect(issue.index).toEqual(expect.any(Number));
      expect(issue.row).toBeUndefined();
      expect(issue.file).toBeUndefined();
    }
  });
});

describe('validateDocument: CSV locations', () => {
  it('reports the file and the data row instead of the index', () => {
    const raw = { format: 'network/1', sites: [{ code: 'S1', name: 'A', role: 'origin', lat: 0, lon: 0 }, { code: 'S2', name: 'B', role: 'main', lat: 91, lon: 0 }] };
    const { errors } = validateDocument(raw, { rowsOf: { sites: { file: 'sites.csv', rows: [1, 3] } } });
    expect(errors).toEqual([
      { kind: 'sites', row: 3, file: 'sites.csv', code: 'S2', field: 'lat', rule: 'out-of-range', message: 'site S2: latitude is between -90 and 90 (got 91)' },
    ]);
  });

  it('names a list column, not its item, as the field', () => {
    const raw = { format: 'network/1', sites: [{ code: 'S1', name: 'A', role: 'origin', lat: 0, lon: 0, groups: ['G1'] }] };
    const { errors } = validateDocument(raw, { rowsOf: { sites: { file: 'sites.csv', rows: [1] } } });
    expect(errors).toEqual([expect.objectContaining({ row: 1, field: 'groups', rule: 'unknown-reference' })]);
  });

  it('describes an entity with no usable code by its row', () => {
    const { errors } = validateDocument({ format: 'network/1', groups: [{ code: 'bad code', name: 'x' }] }, { rowsOf: { groups: { file: 'groups.csv', rows: [7] } } });
    expect(errors[0].message).toBe('group in row 7 of groups.csv: code: a code is 1-64 letters, digits, "-", "_" or "." (got "bad code")');
    expect(errors[0]).toMatchObject({ rule: 'invalid-code', row: 7, file: 'groups.csv', field: 'code' });
  });
});

describe('validateDocument: against a stored network', () => {
  it('resolves references into the stored network, so one file can be imported alone', () => {
    const stored = smallNetwork();
    const feedsOnly = { format: 'network/1', feeds: [{ code: 'R1.TV1.R2', from: 'O1.TV1', to: 'R1.TV1', medium: 'line', role: 'reserve' }] };
    expect(validateDocument(feedsOnly).errors.map((e) => e.rule)).toEqual(['unknown-reference', 'unknown-reference']);
    const result = validateDocument(feedsOnly, { context: stored });
    expect(result.errors).toEqual([]);
    expect(result.warnings).toEqual([]);
  });

  it('catches a second carriage of a service at a site that already has one stored', () => {
    const stored = smallNetwork();
    const { errors } = validateDocument({ format: 'network/1', carriages: [{ code: 'R1.TV1.b', site: 'R1', service: 'TV1' }] }, { context: stored });
    expect(errors).toEqual([expect.objectContaining({ rule: 'duplicate-carriage', code: 'R1.TV1.b', message: expect.stringContaining('already has carriage R1.TV1') })]);
  });

  it('lets the document replace a stored entity with the same code (upsert)', () => {
    const stored = smallNetwork();
    const { errors } = validateDocument({ format: 'network/1', carriages: [{ code: 'R1.TV1', site: 'R1', service: 'TV1', erpW: 120 }] }, { context: stored });
    expect(errors).toEqual([]);
  });
});

describe('households bound', () => {
  it('refuses households above the stored integer range, in the fast path too', () => {
    const doc = {
      format: 'network/1',
      sites: [{ code: 'S1', name: 'Big', role: 'origin', lat: 0, lon: 0, households: 3_000_000_000 }],
      services: [],
      groups: [],
      carriages: [],
      feeds: [],
    };
    const r = validateDocument(doc);
    expect(r.errors.map((e) => e.field)).toContain('households');
  });
});

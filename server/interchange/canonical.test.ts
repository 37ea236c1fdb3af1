import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ENTITY_KINDS, entitySchemas, FEED_ROLES, MEDIA, POLARISATIONS, SERVICE_KINDS, SITE_ROLES, type EntityKind } from '@/shared/schemas/network';
import { generateNetwork } from '@/scripts/generator';
import { buildDemoNetwork } from '@/scripts/generator/demo-network';
import { isCanonical } from './canonical';

// Values on both sides of every line the schemas draw, plus wrong types.
const codes = ['A1', 'a.b-c_d', 'x'.repeat(64), 'x'.repeat(65), '', 'has space', 'é', 5, null];
const names = ['Name', ' padded ', '', '   ', 'x'.repeat(200), 'x'.repeat(201), 3, null];
const numbers = [0, -0, 1.5, -1, -0.001, 90, 90.0001, -90, 180, -180.5, 360, 361, Number.NaN, Infinity, -Infinity, 2 ** 53, 12, '12', null, undefined];
const flags = [true, false, 'true', 0, null];
const lists = [[], ['A'], ['A', 'bad code'], 'A', [1], null];
const channels = ['21', ' 21', '12B', '', 'x'.repeat(16), 'x'.repeat(17), 21];
const enums = (values: readonly string[]) => [...values, 'other-value', '', 1, null];

const FIELDS: Record<EntityKind, Record<string, unknown[]>> = {
  sites: { code: codes, name: names, role: enums(SITE_ROLES), lat: numbers, lon: numbers, groundHeightM: numbers, mastHeightM: numbers, households: numbers, groups: lists },
  services: { code: codes, name: names, kind: enums(SERVICE_KINDS) },
  groups: { code: codes, name: names, note: ['', 'a note', 'x'.repeat(2001), 7, null] },
  carriages: {
    code: codes, site: codes, service: codes, frequencyMHz: numbers, channel: channels, erpW: numbers,
    polarisation: enums(POLARISATIONS), antennaHeightM: numbers, onChannelRepeater: flags,
  },
  feeds: {
    code: codes, from: codes, to: codes, medium: enums(MEDIA), role: enums(FEED_ROLES), via: lists, groups: lists,
    rxFrequencyMHz: numbers, rxChannel: channels, rxAntenna: ['yagi', '', 'x'.repeat(201), 4], bearingDeg: numbers,
  },
};

/** Entities whose fields are each absent or drawn from the pools, sometimes with an unknown field. */
function entityOf(kind: EntityKind) {
  const pools = Object.entries(FIELDS[kind]);
  const shape = entitySchemas[kind].shape as Record<string, { safeParse: (v: unknown) => { success: boolean } }>;
  const required = pools.map(([key]) => key).filter((key) => !shape[key].safeParse(undefined).success);
  const anyValues = Object.fromEntries(pools.map(([key, pool]) => [key, fc.constantFrom(...pool)]));
  // Each pool starts with a valid value: a valid base with optional fields present or not.
  const base = fc.record(Object.fromEntries(pools.map(([key, pool]) => [key, fc.constant(pool[0])])), { requiredKeys: required });
  const oneChanged = fc
    .tuple(base, fc.constantFrom(...pools))
    .chain(([entity, [key, pool]]) => fc.constantFrom(...pool).map((value) => ({ ...entity, [key]: value })));
  return fc.oneof(fc.record(anyValues, { requiredKeys: [] }), oneChanged, base.map((e) => ({ ...e, extra: 1 })), base);
}

describe('isCanonical agrees with the schemas', () => {
  it.each(ENTITY_KINDS)('%s: whenever the fast path accepts, the schema accepts and outputs the same object', (kind) => {
    let accepted = 0;
    fc.assert(
      fc.property(entityOf(kind), (drawn) => {
        // fast-check draws records without a prototype; an import reads plain objects.
        const entity = { ...drawn };
        if (!isCanonical(kind, entity)) return;
        accepted++;
        const parsed = entitySchemas[kind].safeParse(entity);
        expect(parsed.success).toBe(true);
        expect(parsed.data).toStrictEqual(entity);
      }),
      { numRuns: 3000 },
    );
    expect(accepted).toBeGreaterThan(100);
  });

  it('accepts every entity of the demo and of a generated network, so large imports take the fast path', () => {
    for (const doc of [buildDemoNetwork(), generateNetwork({ sites: 500, seed: 2 })]) {
      for (const kind of ENTITY_KINDS) {
        for (const entity of doc[kind]) expect(isCanonical(kind, entity), `${kind} ${entity.code}`).toBe(true);
      }
    }
  });

  it('refuses what the schema would change or reject', () => {
    expect(isCanonical('sites', { code: 'S', name: ' S', role: 'main', lat: 0, lon: 0 })).toBe(false);
    expect(isCanonical('sites', { code: 'S', name: 'S', role: 'main', lat: 0, lon: 0, households: null })).toBe(false);
    expect(isCanonical('sites', { code: 'S', name: 'S', role: 'main', lat: 0 })).toBe(false);
    expect(isCanonical('services', Object.assign(Object.create({ inherited: 1 }), { code: 'S', name: 'S', kind: 'fm' }))).toBe(false);
    expect(isCanonical('services', { code: 'S', name: 'S', kind: 'fm' })).toBe(true);
  });
});

describe('isCanonical and the names every object answers to', () => {
  it('does not count "constructor" or "__proto__" as one of the required fields', () => {
    const site = JSON.parse('{"code":"S1","name":"One","role":"origin","lat":0,"constructor":1}');
    expect(isCanonical('sites', site)).toBe(false);
    const proto = JSON.parse('{"code":"S1","name":"One","role":"origin","lat":0,"lon":0,"__proto__":{}}');
    expect(() => isCanonical('sites', proto)).not.toThrow();
    expect(isCanonical('sites', proto)).toBe(false);
  });

  it('refuses the reserved names as codes, and text PostgreSQL cannot store', () => {
    for (const code of ['__proto__', 'constructor', 'prototype']) expect(isCanonical('services', { code, name: 'X', kind: 'fm' })).toBe(false);
    expect(isCanonical('services', { code: 'S', name: 'a\u0000b', kind: 'fm' })).toBe(false);
    expect(isCanonical('services', { code: 'S', name: 'a\ud800b', kind: 'fm' })).toBe(false);
    expect(isCanonical('services', { code: 'S', name: 'a\ud83d\udce1b', kind: 'fm' })).toBe(true);
  });
});

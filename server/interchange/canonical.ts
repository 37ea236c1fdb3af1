/**
 * A fast path for the common case of an import: an entity that is already
 * valid and written exactly as its schema would output it (names trimmed, no
 * null fields). Such an entity is taken as it is; anything else goes through
 * the zod schema (shared/schemas/network.ts), which stays the one authority
 * for errors and their messages. The path only ever says "certainly valid and
 * unchanged" or "ask the schema"; canonical.test.ts checks that on random
 * entities against the schema. Why: at 400k entities the schema's copying
 * and checking is most of the import time. A field the schema gains and this
 * table lacks needs nothing here to be right: an entity carrying it is not
 * taken as canonical, so it goes through the schema (only slower).
 */
import { isStorableText } from '@/shared/text';
import { CODE_PATTERN, FEED_ROLES, MEDIA, POLARISATIONS, SERVICE_KINDS, SITE_ROLES, type EntityKind } from '@/shared/schemas/network';

type Rec = Record<string, unknown>;
type FieldCheck = (value: unknown) => boolean;

// A module-level copy: an imported binding may be read through a getter on every use.
const CODE = CODE_PATTERN;
const isCode: FieldCheck = (v) => typeof v === 'string' && CODE.test(v);
const isCodeList: FieldCheck = (v) => Array.isArray(v) && v.every(isCode);
const isNumber = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);
const nonNegative: FieldCheck = (v) => isNumber(v) && v >= 0;
const positive: FieldCheck = (v) => isNumber(v) && v > 0;
const within = (low: number, high: number): FieldCheck => (v) => isNumber(v) && v >= low && v <= high;
const oneOf = (values: readonly string[]): FieldCheck => {
  const set = new Set(values);
  return (v) => typeof v === 'string' && set.has(v);
};
/** A string the schema's trim() leaves as it is, with a length the schema allows. */
const trimmed = (max: number): FieldCheck => (v) => typeof v === 'string' && v.length >= 1 && v.length <= max && v.trim() === v && isStorableText(v);
const text = (max: number): FieldCheck => (v) => typeof v === 'string' && v.length <= max && isStorableText(v);

interface Shape {
  required: Record<string, FieldCheck>;
  optional: Record<string, FieldCheck>;
}

const SHAPES: Record<EntityKind, Shape> = {
  sites: {
    required: { code: isCode, name: trimmed(200), role: oneOf(SITE_ROLES), lat: within(-90, 90), lon: within(-180, 180) },
    optional: {
      groundHeightM: nonNegative,
      mastHeightM: nonNegative,
      households: (v) => typeof v === 'number' && Number.isSafeInteger(v) && v >= 0 && v <= 2_147_483_647,
      groups: isCodeList,
    },
  },
  services: { required: { code: isCode, name: trimmed(200), kind: oneOf(SERVICE_KINDS) }, optional: {} },
  groups: { required: { code: isCode, name: trimmed(200) }, optional: { note: text(2000) } },
  carriages: {
    required: { code: isCode, site: isCode, service: isCode },
    optional: {
      frequencyMHz: positive,
      channel: trimmed(16),
      erpW: nonNegative,
      polarisation: oneOf(POLARISATIONS),
      antennaHeightM: nonNegative,
      onChannelRepeater: (v) => typeof v === 'boolean',
    },
  },
  feeds: {
    required: { code: isCode, from: isCode, to: isCode, medium: oneOf(MEDIA), role: oneOf(FEED_ROLES) },
    optional: {
      via: isCodeList,
      groups: isCodeList,
      rxFrequencyMHz: positive,
      rxChannel: trimmed(16),
      rxAntenna: text(200),
      bearingDeg: within(0, 360),
    },
  },
};

/** True only when the schema would accept `raw` and output an equal object. */
export function isCanonical(kind: EntityKind, raw: unknown): raw is Rec {
  if (raw === null || typeof raw !== 'object') return false;
  const proto = Object.getPrototypeOf(raw);
  if (proto !== Object.prototype && proto !== null) return false;
  const shape = SHAPES[kind];
  const entity = raw as Rec;
  let required = 0;
  for (const key in entity) {
    if (!Object.prototype.hasOwnProperty.call(entity, key)) return false;
    const value = entity[key];
    // Own keys only: "constructor" or "__proto__" must not find Object.prototype's members.
    if (Object.hasOwn(shape.required, key)) {
      if (!shape.required[key](value)) return false;
      required++;
      continue;
    }
    if (!Object.hasOwn(shape.optional, key) || !shape.optional[key](value)) return false;
  }
  return required === REQUIRED_COUNT[kind];
}

const REQUIRED_COUNT = Object.fromEntries(Object.entries(SHAPES).map(([kind, shape]) => [kind, Object.keys(shape.required).length])) as Record<EntityKind, number>;

/**
 * The network document, version 1 (docs/format.md), as zod
 * schemas. The server validates imports and edits with these; the client's
 * forms validate with the same ones, so a message reads the same on both sides.
 */
import { z } from 'zod';
import { isStorableText, RESERVED_KEYS, UNSTORABLE_TEXT_MESSAGE } from '../text';

const CODE_CHARS = /^[A-Za-z0-9._-]{1,64}$/;
/**
 * A valid code: the characters, and none of the names every JavaScript object
 * answers to (a code is a key in maps and objects throughout).
 */
/**
 * Codes in order of their characters' code units ("B1" before "a1"), as the
 * server sorts them. Not localeCompare: its first call sets up the browser's
 * collation, some 20 ms on a phone, for codes of plain ASCII.
 */
export const compareCodes = (a: { code: string }, b: { code: string }): number => (a.code < b.code ? -1 : a.code > b.code ? 1 : 0);

/**
 * The usual code of a carriage: its site's code, a dot and its service's code
 * ("S1.TV1"). Codes are free; the inventory form proposes this one, the
 * generated networks use it, and the diagram's drawing sends only the codes
 * that differ from it.
 */
export const usualCarriageCode = (site: string, service: string): string => `${site}.${service}`;

export const CODE_PATTERN = /^(?!(?:__proto__|constructor|prototype)$)[A-Za-z0-9._-]{1,64}$/;
export const codeSchema = z
  .string({ error: 'a code is required' })
  .regex(CODE_CHARS, 'a code is 1-64 letters, digits, "-", "_" or "."')
  .refine((code) => !RESERVED_KEYS.has(code), 'a code cannot be __proto__, constructor or prototype');

/** Free text stored as it is: refuses what PostgreSQL cannot store (shared/text.ts). */
const storable = <T extends z.ZodString>(s: T) => s.refine(isStorableText, UNSTORABLE_TEXT_MESSAGE);

export const SITE_ROLES = ['origin', 'main', 'relay'] as const;
export const SERVICE_KINDS = ['dtt', 'fm', 'dab', 'am', 'other'] as const;
export const POLARISATIONS = ['H', 'V', 'M', 'C'] as const;
export const MEDIA = ['off-air', 'satellite', 'line', 'microwave'] as const;
export const FEED_ROLES = ['main', 'reserve'] as const;
/** What can fail (docs/domain.md): a carriage is one transmitter; its failure takes it and every feed it is the source of down. */
export const ELEMENT_KINDS = ['site', 'carriage', 'feed', 'group'] as const;
/** The kinds that lists and rankings of weak points cover unless carriages are asked for. */
export const DEFAULT_WEAK_POINT_KINDS = ['site', 'feed', 'group'] as const;

export type SiteRole = (typeof SITE_ROLES)[number];
export type ServiceKind = (typeof SERVICE_KINDS)[number];
export type Medium = (typeof MEDIA)[number];
export type FeedRole = (typeof FEED_ROLES)[number];
export type ElementKind = (typeof ELEMENT_KINDS)[number];

/** An optional field: absent, or null (read as absent). */
const opt = <T extends z.ZodTypeAny>(s: T) => s.nullish().transform((v) => (v ?? undefined) as z.output<T> | undefined);

const name = storable(z.string({ error: 'a name is required' }).trim().min(1, 'a name is required').max(200, 'a name is at most 200 characters'));
const nonNegative = (what: string) => z.number({ error: `${what} must be a number` }).finite().min(0, `${what} cannot be negative`);

export const siteSchema = z.strictObject({
  code: codeSchema,
  name,
  role: z.enum(SITE_ROLES, { error: 'role is one of origin, main, relay' }),
  lat: z.number({ error: 'latitude must be a number' }).min(-90, 'latitude is between -90 and 90').max(90, 'latitude is between -90 and 90'),
  lon: z.number({ error: 'longitude must be a number' }).min(-180, 'longitude is between -180 and 180').max(180, 'longitude is between -180 and 180'),
  groundHeightM: opt(nonNegative('ground height')),
  mastHeightM: opt(nonNegative('mast height')),
  households: opt(nonNegative('households').int('households is a whole number').max(2_147_483_647, 'households is at most 2,147,483,647')),
  groups: opt(z.array(codeSchema)),
});

export const serviceSchema = z.strictObject({
  code: codeSchema,
  name,
  kind: z.enum(SERVICE_KINDS, { error: 'kind is one of dtt, fm, dab, am, other' }),
});

export const groupSchema = z.strictObject({
  code: codeSchema,
  name,
  note: opt(storable(z.string().max(2000))),
});

export const carriageSchema = z.strictObject({
  code: codeSchema,
  site: codeSchema,
  service: codeSchema,
  frequencyMHz: opt(z.number().finite().positive('frequency must be above 0 MHz')),
  channel: opt(storable(z.string().trim().min(1).max(16))),
  erpW: opt(nonNegative('ERP')),
  polarisation: opt(z.enum(POLARISATIONS, { error: 'polarisation is one of H, V, M, C' })),
  antennaHeightM: opt(nonNegative('antenna height')),
  onChannelRepeater: opt(z.boolean()),
});

export const feedSchema = z.strictObject({
  code: codeSchema,
  from: codeSchema,
  to: codeSchema,
  medium: z.enum(MEDIA, { error: 'medium is one of off-air, satellite, line, microwave' }),
  role: z.enum(FEED_ROLES, { error: 'role is one of main, reserve' }),
  via: opt(z.array(codeSchema)),
  groups: opt(z.array(codeSchema)),
  rxFrequencyMHz: opt(z.number().finite().positive('receive frequency must be above 0 MHz')),
  rxChannel: opt(storable(z.string().trim().min(1).max(16))),
  rxAntenna: opt(storable(z.string().max(200))),
  bearingDeg: opt(z.number().finite().min(0, 'bearing is 0-360°').max(360, 'bearing is 0-360°')),
});

export const NETWORK_FORMAT = 'network/1' as const;

/** Top-level shape only; entities are checked one by one so every error is reported. */
export const networkDocumentShape = z.strictObject({
  format: z.literal(NETWORK_FORMAT, { error: `format must be "${NETWORK_FORMAT}"` }),
  /** the network version the document was exported at (or made from); see server/interchange/README.md */
  baseVersion: z.number({ error: 'baseVersion must be a whole number' }).int('baseVersion must be a whole number').min(0).optional(),
  sites: z.array(z.unknown()).optional(),
  services: z.array(z.unknown()).optional(),
  groups: z.array(z.unknown()).optional(),
  carriages: z.array(z.unknown()).optional(),
  feeds: z.array(z.unknown()).optional(),
});

export const networkDocumentSchema = z.strictObject({
  format: z.literal(NETWORK_FORMAT),
  baseVersion: z.number().int().min(0).optional(),
  sites: z.array(siteSchema),
  services: z.array(serviceSchema),
  groups: z.array(groupSchema),
  carriages: z.array(carriageSchema),
  feeds: z.array(feedSchema),
});

/** Keys whose value may be undefined become optional keys (the schema's optional fields). */
type UndefinedKeys<T> = { [K in keyof T]-?: undefined extends T[K] ? K : never }[keyof T];
type Optionalize<T> = { [K in Exclude<keyof T, UndefinedKeys<T>>]: T[K] } & { [K in UndefinedKeys<T>]?: Exclude<T[K], undefined> };
type Flat<T> = { [K in keyof T]: T[K] };
type EntityOf<S extends z.ZodTypeAny> = Flat<Optionalize<z.output<S>>>;

export type Site = EntityOf<typeof siteSchema>;
export type Service = EntityOf<typeof serviceSchema>;
export type Group = EntityOf<typeof groupSchema>;
export type Carriage = EntityOf<typeof carriageSchema>;
export type Feed = EntityOf<typeof feedSchema>;
export interface NetworkDocument {
  format: typeof NETWORK_FORMAT;
  /** the network version it was exported at; an import from an older one may undo later changes */
  baseVersion?: number;
  sites: Site[];
  services: Service[];
  groups: Group[];
  carriages: Carriage[];
  feeds: Feed[];
}

export const ENTITY_KINDS = ['sites', 'services', 'groups', 'carriages', 'feeds'] as const;
export type EntityKind = (typeof ENTITY_KINDS)[number];

export const entitySchemas = {
  sites: siteSchema,
  services: serviceSchema,
  groups: groupSchema,
  carriages: carriageSchema,
  feeds: feedSchema,
} as const;

/** An entity as the API returns it: the document fields plus the optimistic-lock version. */
export type Stored<T> = T & { version: number; updatedAt: string };

/** The version an update must carry (optimistic locking). */
export const versionSchema = z.object({ version: z.number({ error: 'version is required' }).int().min(1) });

/**
 * The network as the diagram draws it (GET /api/network/drawing): only the
 * fields drawn, in columns, with references as array positions rather than
 * repeated codes. At 20,000 sites the full export is some 26 MB of JSON,
 * whose parse and check held the first frame of the diagram for over a
 * second; this is a few MB of mostly numbers. `drawingOf` makes it from a
 * network document (server), `expandDrawing` turns it back into the rows the
 * diagram's model reads (client); the API docs describe it.
 */
import { z } from 'zod';
import { compareCodes, usualCarriageCode, FEED_ROLES, MEDIA, SITE_ROLES, type FeedRole, type Medium, type NetworkDocument, type SiteRole } from './network';

// Columns are checked by one tight loop each: a schema per element cost the browser over half a second
// for the 750,000 values of a 20,000-site network, before the first frame. Written out as indexed
// loops rather than every() with a callback: the checks run once, in code the browser has not yet
// optimised, and the loops took half the time (10 against 19 ms in Node for 20,000 sites, checks
// and positions together).
const column = <T>(what: string, all: (v: unknown[]) => boolean) => z.custom<T[]>((v) => Array.isArray(v) && all(v), { error: `a list of ${what}` });
const strings = column<string>('texts', (v) => {
  for (let i = 0; i < v.length; i++) if (typeof v[i] !== 'string') return false;
  return true;
});
const numbers = column<number>('numbers', (v) => {
  for (let i = 0; i < v.length; i++) {
    const x = v[i];
    if (typeof x !== 'number' || !Number.isFinite(x)) return false;
  }
  return true;
});
const indices = column<number>('positions (whole numbers from 0)', (v) => {
  for (let i = 0; i < v.length; i++) {
    const x = v[i];
    if (typeof x !== 'number' || !Number.isInteger(x) || x < 0) return false;
  }
  return true;
});
const counts = column<number | null>('whole numbers or null', (v) => {
  for (let i = 0; i < v.length; i++) {
    const x = v[i];
    if (x !== null && (typeof x !== 'number' || !Number.isInteger(x) || x < 0)) return false;
  }
  return true;
});

export const drawingDocumentSchema = z.object({
  networkVersion: z.number().int().min(0),
  services: z.array(z.object({ code: z.string(), name: z.string(), kind: z.string() })),
  groups: z.array(z.object({ code: z.string(), name: z.string() })),
  /** Per site; role is a position in SITE_ROLES (origin, main, relay). */
  sites: z.object({ code: strings, name: strings, role: indices, lat: numbers, lon: numbers, households: counts }),
  /**
   * Per carriage: its site and service as positions in `sites` and `services`.
   * Its code is its site's code, a dot and its service's code ("S1.TV1"),
   * except for the carriages in `otherCodes`: their positions here
   * (increasing) and their codes. At 20,000 sites the codes were a quarter
   * of the bytes and over a third of the parse (in Node); a network coded
   * that way sends none (carriageCodeOf reads them back).
   */
  carriages: z.object({ site: indices, service: indices, otherCodes: z.object({ at: indices, code: strings }) }),
  /**
   * Per feed, in code order: its ends as positions in `carriages`, medium in
   * MEDIA, role in FEED_ROLES. The codes themselves are left out: the diagram
   * never shows them, and at 20,000 sites they were a quarter of the bytes
   * and of the browser's parse; their order is kept (the schematic's tie-break).
   */
  feeds: z.object({ from: indices, to: indices, medium: indices, role: indices }),
});
export type DrawingDocument = z.infer<typeof drawingDocumentSchema>;

/** The rows the diagram's model reads (the export's fields that are drawn). */
export interface ExpandedDrawing {
  sites: { code: string; name: string; role: SiteRole; lat: number; lon: number; households: number | null }[];
  services: { code: string; name: string; kind: string }[];
  groups: { code: string; name: string }[];
  carriages: { code: string; site: string; service: string }[];
  /** In code order (the codes are not in the columns). */
  feeds: { from: string; to: string; medium: Medium; role: FeedRole }[];
}

/** The fields of a network the drawing reads: a network document, or rows of the same shape (tests). */
export type DrawableNetwork = {
  services: readonly { code: string; name: string; kind: string }[];
  groups: readonly { code: string; name: string }[];
  sites: readonly (Pick<NetworkDocument['sites'][number], 'code' | 'name' | 'role' | 'lat' | 'lon'> & { households?: number | null })[];
  carriages: readonly Pick<NetworkDocument['carriages'][number], 'code' | 'site' | 'service'>[];
  feeds: readonly Pick<NetworkDocument['feeds'][number], 'code' | 'from' | 'to' | 'medium' | 'role'>[];
};

export function drawingOf(doc: DrawableNetwork, networkVersion: number): DrawingDocument {
  const run = drawingSteps(doc, networkVersion);
  let r = run.next();
  while (!r.done) r = run.next();
  return r.value;
}


/**
 * `drawingOf` as steps that pause every 4,096 entries or so: at 100,000 sites
 * the columns hold about a million entries, a second of work in one piece
 * on a server that should go on answering meanwhile.
 */
export function* drawingSteps(doc: DrawableNetwork, networkVersion: number): Generator<void, DrawingDocument, void> {
  const STEP = 4096;
  function* column<T, R>(rows: readonly T[], cell: (row: T) => R): Generator<void, R[], void> {
    const out = new Array<R>(rows.length);
    for (let i = 0; i < rows.length; i++) {
      out[i] = cell(rows[i]);
      if (i % STEP === STEP - 1) yield;
    }
    return out;
  }
  function* index<T extends { code: string }>(rows: readonly T[]): Generator<void, Map<string, number>, void> {
    const at = new Map<string, number>();
    for (let i = 0; i < rows.length; i++) {
      at.set(rows[i].code, i);
      if (i % STEP === STEP - 1) yield;
    }
    return at;
  }
  function* kept<T>(rows: readonly T[], keep: (row: T) => boolean): Generator<void, T[], void> {
    const out: T[] = [];
    for (let i = 0; i < rows.length; i++) {
      if (keep(rows[i])) out.push(rows[i]);
      if (i % STEP === STEP - 1) yield;
    }
    return out;
  }
  function* otherCodes(rows: readonly { code: string; site: string; service: string }[]): Generator<void, { at: number[]; code: string[] }, void> {
    const at: number[] = [];
    const code: string[] = [];
    for (let i = 0; i < rows.length; i++) {
      const c = rows[i];
      if (c.code !== usualCarriageCode(c.site, c.service)) {
        at.push(i);
        code.push(c.code);
      }
      if (i % STEP === STEP - 1) yield;
    }
    return { at, code };
  }
  const siteAt = yield* index(doc.sites);
  const serviceAt = new Map(doc.services.map((s, i) => [s.code, i]));
  const carriages = yield* kept(doc.carriages, (c) => siteAt.has(c.site) && serviceAt.has(c.service));
  const carriageAt = yield* index(carriages);
  const feeds = yield* kept(doc.feeds, (f) => carriageAt.has(f.from) && carriageAt.has(f.to));
  // A served document is in code order already: the sort (one piece) only for one that is not.
  let sorted = true;
  for (let i = 1; i < feeds.length && sorted; i++) sorted = compareCodes(feeds[i - 1], feeds[i]) <= 0;
  if (!sorted) feeds.sort(compareCodes);
  yield;
  return {
    networkVersion,
    services: doc.services.map(({ code, name, kind }) => ({ code, name, kind })),
    groups: doc.groups.map(({ code, name }) => ({ code, name })),
    sites: {
      code: yield* column(doc.sites, (s) => s.code),
      name: yield* column(doc.sites, (s) => s.name),
      role: yield* column(doc.sites, (s) => SITE_ROLES.indexOf(s.role)),
      lat: yield* column(doc.sites, (s) => s.lat),
      lon: yield* column(doc.sites, (s) => s.lon),
      households: yield* column(doc.sites, (s) => s.households ?? null),
    },
    carriages: {
      site: yield* column(carriages, (c) => siteAt.get(c.site)!),
      service: yield* column(carriages, (c) => serviceAt.get(c.service)!),
      otherCodes: yield* otherCodes(carriages),
    },
    feeds: {
      from: yield* column(feeds, (f) => carriageAt.get(f.from)!),
      to: yield* column(feeds, (f) => carriageAt.get(f.to)!),
      medium: yield* column(feeds, (f) => MEDIA.indexOf(f.medium)),
      role: yield* column(feeds, (f) => FEED_ROLES.indexOf(f.role)),
    },
  };
}

/**
 * Throws a RangeError naming the first column that does not line up or
 * points past its table: after it, every position in `d` can be followed
 * without a check (the diagram's model reads the columns directly).
 */
export function checkDrawing(d: DrawingDocument): void {
  const same = (what: string, cols: Record<string, unknown[]>) => {
    const [first, ...rest] = Object.entries(cols);
    for (const [name, col] of rest) if (col.length !== first[1].length) throw new RangeError(`${what}.${name} has ${col.length} entries, ${what}.${first[0]} ${first[1].length}`);
  };
  same('sites', d.sites);
  same('carriages', { site: d.carriages.site, service: d.carriages.service });
  same('carriages.otherCodes', d.carriages.otherCodes);
  same('feeds', d.feeds);
  const within = (col: readonly number[], size: number, what: string) => {
    for (let i = 0; i < col.length; i++) if (col[i] >= size) throw new RangeError(`${what} points to entry ${col[i]} of ${size}`);
  };
  within(d.sites.role, SITE_ROLES.length, 'sites.role');
  within(d.carriages.site, d.sites.code.length, 'carriages.site');
  within(d.carriages.service, d.services.length, 'carriages.service');
  const nCarriages = d.carriages.site.length;
  within(d.carriages.otherCodes.at, nCarriages, 'carriages.otherCodes.at');
  const { at } = d.carriages.otherCodes;
  for (let i = 1; i < at.length; i++) if (at[i] <= at[i - 1]) throw new RangeError(`carriages.otherCodes.at is not increasing at entry ${i} (${at[i - 1]}, then ${at[i]})`);
  within(d.feeds.from, nCarriages, 'feeds.from');
  within(d.feeds.to, nCarriages, 'feeds.to');
  within(d.feeds.medium, MEDIA.length, 'feeds.medium');
  within(d.feeds.role, FEED_ROLES.length, 'feeds.role');
}

/**
 * A reader of carriage codes for a checked drawing: the code of the carriage
 * at position `c` (its site's code, a dot and its service's code, unless it
 * is one of `otherCodes`).
 */
export function carriageCodeOf(d: DrawingDocument): (c: number) => string {
  const { at, code } = d.carriages.otherCodes;
  const other = new Map<number, string>();
  for (let i = 0; i < at.length; i++) other.set(at[i], code[i]);
  const { site, service } = d.carriages;
  return (c) => other.get(c) ?? usualCarriageCode(d.sites.code[site[c]], d.services[service[c]].code);
}

/** Back to rows (checked first, as checkDrawing). */
export function expandDrawing(d: DrawingDocument): ExpandedDrawing {
  checkDrawing(d);
  const codeOf = carriageCodeOf(d);
  const sites = d.sites.code.map((code, i) => ({ code, name: d.sites.name[i], role: SITE_ROLES[d.sites.role[i]], lat: d.sites.lat[i], lon: d.sites.lon[i], households: d.sites.households[i] }));
  const carriageCodes = d.carriages.site.map((_, c) => codeOf(c));
  const carriages = carriageCodes.map((code, i) => ({ code, site: d.sites.code[d.carriages.site[i]], service: d.services[d.carriages.service[i]].code }));
  const feeds = d.feeds.from.map((from, i) => ({
    from: carriageCodes[from],
    to: carriageCodes[d.feeds.to[i]],
    medium: MEDIA[d.feeds.medium[i]],
    role: FEED_ROLES[d.feeds.role[i]],
  }));
  return { sites, services: d.services, groups: d.groups, carriages, feeds };
}

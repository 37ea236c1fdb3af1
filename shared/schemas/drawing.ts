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
import { FEED_ROLES, MEDIA, SITE_ROLES, type FeedRole, type Medium, type NetworkDocument, type SiteRole } from './network';

// Columns are checked by one tight loop each: a schema per element cost the browser over half a second
// for the 750,000 values of a 20,000-site network, before the first frame.
const column = <T>(what: string, ok: (v: unknown) => boolean) => z.custom<T[]>((v) => Array.isArray(v) && v.every(ok), { error: `a list of ${what}` });
const strings = column<string>('texts', (v) => typeof v === 'string');
const numbers = column<number>('numbers', (v) => typeof v === 'number' && Number.isFinite(v));
const indices = column<number>('positions (whole numbers from 0)', (v) => typeof v === 'number' && Number.isInteger(v) && v >= 0);
const counts = column<number | null>('whole numbers or null', (v) => v === null || (typeof v === 'number' && Number.isInteger(v) && v >= 0));

export const drawingDocumentSchema = z.object({
  networkVersion: z.number().int().min(0),
  services: z.array(z.object({ code: z.string(), name: z.string(), kind: z.string() })),
  groups: z.array(z.object({ code: z.string(), name: z.string() })),
  /** Per site; role is a position in SITE_ROLES (origin, main, relay). */
  sites: z.object({ code: strings, name: strings, role: indices, lat: numbers, lon: numbers, households: counts }),
  /** Per carriage: its site and service as positions in `sites` and `services`. */
  carriages: z.object({ code: strings, site: indices, service: indices }),
  /** Per feed, in code order: its ends as positions in `carriages`, medium in MEDIA, role in FEED_ROLES. */
  feeds: z.object({ code: strings, from: indices, to: indices, medium: indices, role: indices }),
});
export type DrawingDocument = z.infer<typeof drawingDocumentSchema>;

/** The rows the diagram's model reads (the export's fields that are drawn). */
export interface ExpandedDrawing {
  sites: { code: string; name: string; role: SiteRole; lat: number; lon: number; households: number | null }[];
  services: { code: string; name: string; kind: string }[];
  groups: { code: string; name: string }[];
  carriages: { code: string; site: string; service: string }[];
  feeds: { code: string; from: string; to: string; medium: Medium; role: FeedRole }[];
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
  const siteAt = new Map(doc.sites.map((s, i) => [s.code, i]));
  const serviceAt = new Map(doc.services.map((s, i) => [s.code, i]));
  const carriages = doc.carriages.filter((c) => siteAt.has(c.site) && serviceAt.has(c.service));
  const carriageAt = new Map(carriages.map((c, i) => [c.code, i]));
  const feeds = doc.feeds.filter((f) => carriageAt.has(f.from) && carriageAt.has(f.to)).sort((a, b) => (a.code < b.code ? -1 : a.code > b.code ? 1 : 0));
  return {
    networkVersion,
    services: doc.services.map(({ code, name, kind }) => ({ code, name, kind })),
    groups: doc.groups.map(({ code, name }) => ({ code, name })),
    sites: {
      code: doc.sites.map((s) => s.code),
      name: doc.sites.map((s) => s.name),
      role: doc.sites.map((s) => SITE_ROLES.indexOf(s.role)),
      lat: doc.sites.map((s) => s.lat),
      lon: doc.sites.map((s) => s.lon),
      households: doc.sites.map((s) => s.households ?? null),
    },
    carriages: { code: carriages.map((c) => c.code), site: carriages.map((c) => siteAt.get(c.site)!), service: carriages.map((c) => serviceAt.get(c.service)!) },
    feeds: {
      code: feeds.map((f) => f.code),
      from: feeds.map((f) => carriageAt.get(f.from)!),
      to: feeds.map((f) => carriageAt.get(f.to)!),
      medium: feeds.map((f) => MEDIA.indexOf(f.medium)),
      role: feeds.map((f) => FEED_ROLES.indexOf(f.role)),
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
  same('carriages', d.carriages);
  same('feeds', d.feeds);
  const within = (col: readonly number[], size: number, what: string) => {
    for (const at of col) if (at >= size) throw new RangeError(`${what} points to entry ${at} of ${size}`);
  };
  within(d.sites.role, SITE_ROLES.length, 'sites.role');
  within(d.carriages.site, d.sites.code.length, 'carriages.site');
  within(d.carriages.service, d.services.length, 'carriages.service');
  within(d.feeds.from, d.carriages.code.length, 'feeds.from');
  within(d.feeds.to, d.carriages.code.length, 'feeds.to');
  within(d.feeds.medium, MEDIA.length, 'feeds.medium');
  within(d.feeds.role, FEED_ROLES.length, 'feeds.role');
}

/** Back to rows (checked first, as checkDrawing). */
export function expandDrawing(d: DrawingDocument): ExpandedDrawing {
  checkDrawing(d);
  const sites = d.sites.code.map((code, i) => ({ code, name: d.sites.name[i], role: SITE_ROLES[d.sites.role[i]], lat: d.sites.lat[i], lon: d.sites.lon[i], households: d.sites.households[i] }));
  const carriages = d.carriages.code.map((code, i) => ({ code, site: d.sites.code[d.carriages.site[i]], service: d.services[d.carriages.service[i]].code }));
  const feeds = d.feeds.code.map((code, i) => ({
    code,
    from: d.carriages.code[d.feeds.from[i]],
    to: d.carriages.code[d.feeds.to[i]],
    medium: MEDIA[d.feeds.medium[i]],
    role: FEED_ROLES[d.feeds.role[i]],
  }));
  return { sites, services: d.services, groups: d.groups, carriages, feeds };
}

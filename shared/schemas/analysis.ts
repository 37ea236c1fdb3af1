/** Analysis API bodies and answers (docs/api.md). */
import { z } from 'zod';
import { codeSchema, DEFAULT_WEAK_POINT_KINDS, ELEMENT_KINDS, type ElementKind, type Medium, type FeedRole } from './network';
import { MAX_PAGE, pageQueryShape, type Paged } from './paging';

export const MAX_FAILED_ELEMENTS = 5000;

export const elementSchema = z.strictObject({
  kind: z.enum(ELEMENT_KINDS, { error: 'kind is one of site, carriage, feed, group' }),
  code: codeSchema,
});
export type Element = { kind: ElementKind; code: string };

export const reachRequestSchema = z.strictObject({
  failed: z
    .array(elementSchema, { error: 'failed must be an array of { kind, code } elements' })
    .min(1, 'failed needs at least one element')
    .max(MAX_FAILED_ELEMENTS, `failed holds at most ${MAX_FAILED_ELEMENTS} elements`),
});

export interface ReachAnswer {
  networkVersion: number;
  lost: string[];
  fallback: string[];
  households: { lost: number; fallback: number };
  byService: { service: string; lost: number; fallback: number }[];
  sites: { site: string; lost: string[]; fallback?: string[] }[];
}

/** `POST /api/analysis/reach?with=sites` adds `siteInfo`: each listed site's name and households. */
export interface SiteInfo {
  name: string;
  households: number;
}

/**
 * `POST /api/analysis/reach?with=sites&first=N`: the reach for a screen. `sites` (off air
 * first, then most households), `lost` and `fallback` hold only their first N rows,
 * `counts` the length of each whole list; the rest come a page at a time from
 * `POST /api/analysis/reach/sites` and `/reach/carriages`.
 */
export const reachQuerySchema = z.strictObject({
  with: z.enum(['sites'], { error: 'with is sites (or left out)' }).optional(),
  first: z.coerce.number({ error: 'first must be a number' }).int('first is a whole number').min(1, 'first is at least 1').max(MAX_PAGE, `first is at most ${MAX_PAGE}`).optional(),
});

export interface BriefReachAnswer extends ReachAnswer {
  siteInfo: Record<string, SiteInfo>;
  counts: { sites: number; lost: number; fallback: number };
}

/** One row of `POST /api/analysis/reach/sites?limit&offset` (body: the failure set). */
export interface ReachSiteRow extends SiteInfo {
  site: string;
  lost: string[];
  fallback: string[];
}

export interface ReachSitesPage extends Paged {
  networkVersion: number;
  sites: ReachSiteRow[];
}

/** `POST /api/analysis/reach/carriages?state=lost|fallback&limit&offset` (body: the failure set). */
export const reachCarriagesQuerySchema = z.strictObject({
  state: z.enum(['lost', 'fallback'], { error: 'state is lost or fallback' }),
  ...pageQueryShape,
});

export interface ReachCarriagesPage extends Paged {
  networkVersion: number;
  state: 'lost' | 'fallback';
  carriages: string[];
}

export interface SpofAnswer {
  networkVersion: number;
  carriages: { carriage: string; spof: Element[] }[];
}

export interface ExposureRow {
  element: Element;
  households: number;
  carriages: number;
}
export interface ExposureAnswer {
  networkVersion: number;
  elements: ExposureRow[];
}

/** Exposure with elements that take off exactly the same carriages in one row; `elements[0]` names the row. */
export interface ExposureGroupsAnswer {
  networkVersion: number;
  groups: { elements: Element[]; households: number; carriages: number }[];
}

export interface DiversityAnswer {
  networkVersion: number;
  /**
   * Carriages with a diversity gap (rule 9, revised): a reserve feed and at
   * least one avoidable single point of failure. `spof` is the full list,
   * `avoidable` the part another feed could avoid (some origin of the service
   * keeps programme); both sorted site, feed, group, then code. Carriages
   * are left out of both: a parent transmitter that is a weak point always
   * comes with its site, which is listed.
   */
  carriages: { carriage: string; service: string; site: string; spof: Element[]; avoidable: Element[] }[];
}

/** Critical pairs (rule 10), highest households first, ties by the first element then the second (kind, then code). */
export interface PairsAnswer {
  networkVersion: number;
  /** with `sample=N`, `jointLost` holds the first N carriages and `jointLostCount` their number */
  pairs: { elements: [Element, Element]; jointLost: string[]; jointLostCount?: number; households: number }[];
}

/** A new reserve feed that closes (part of) a diversity gap; radio figures are null for satellite and line. */
export interface Proposal {
  carriage: string;
  from: string;
  medium: Medium;
  removes: Element[];
  householdsProtected: number;
  distanceKm: number;
  bearingDeg: number;
  fieldStrengthDbuvm: number | null;
  minimumDbuvm: number | null;
  warnings: string[];
}

export interface ProposalsAnswer {
  networkVersion: number;
  proposals: Proposal[];
}

export const MAX_ANALYSIS_LIMIT = 1000;
const limitSchema = z.coerce
  .number({ error: 'limit must be a number' })
  .int('limit is a whole number')
  .min(1, 'limit is at least 1')
  .max(MAX_ANALYSIS_LIMIT, `limit is at most ${MAX_ANALYSIS_LIMIT}`);

/** `GET /api/analysis/proposals?carriage=CODE&limit=N` */
export const proposalsQuerySchema = z.strictObject({
  carriage: codeSchema.optional(),
  limit: limitSchema.optional(),
});

const KINDS_MESSAGE = 'kinds is a comma-separated list of site, carriage, feed, group';

/** A `kinds=site,carriage` query field: known kinds, each once, in the order given; `fallback` when absent. */
export const kindsQuery = (fallback: readonly ElementKind[]) =>
  z
    .string({ error: KINDS_MESSAGE })
    .max(40, KINDS_MESSAGE)
    .transform((v) => [...new Set(v.split(',').map((k) => k.trim()))])
    .pipe(z.array(z.enum(ELEMENT_KINDS, { error: KINDS_MESSAGE })).min(1, KINDS_MESSAGE))
    .default([...fallback]);

/** `GET /api/analysis/pairs?limit=N&kinds=site,group` (kinds default to site and group) */
export const pairsQuerySchema = z.strictObject({
  limit: limitSchema.default(100),
  kinds: kindsQuery(['site', 'group']),
  /** sample=N: each pair lists only its first N carriages off air together, with `jointLostCount` (a screen shows a few; a pair at 20,000 sites holds thousands) */
  sample: z.coerce.number({ error: 'sample must be a number' }).int('sample is a whole number').min(0, 'sample is at least 0').max(1000, 'sample is at most 1000').optional(),
});

/** `GET /api/analysis/spof?kinds=...` (default site, feed, group; `carriage` adds parent transmitters) */
export const spofQuerySchema = z.object({
  kinds: kindsQuery(DEFAULT_WEAK_POINT_KINDS),
});

/** Answers that can also be had as a spreadsheet file: `format=csv`. */
const formatField = z.enum(['json', 'csv'], { error: 'format is json or csv' }).default('json');

/** `GET /api/analysis/exposure?limit=N&kinds=...&format=csv` */
export const exposureQuerySchema = z.object({
  limit: z.coerce.number({ error: 'limit must be a number' }).int('limit is a whole number').min(1, 'limit is at least 1').max(100_000, 'limit is at most 100,000').optional(),
  kinds: kindsQuery(DEFAULT_WEAK_POINT_KINDS),
  format: formatField,
});

/** `GET /api/analysis/carriage-search?q=...&pageSize=N`: carriages by code, or by site and service words together. */
export const carriageSearchQuerySchema = z.object({
  q: z.string({ error: 'q is the text to look for' }).max(200, 'q is at most 200 characters'),
  pageSize: z.coerce.number({ error: 'pageSize must be a number' }).int('pageSize is a whole number').min(1, 'pageSize is at least 1').max(50, 'pageSize is at most 50').default(6),
});

export interface CarriageSearchAnswer {
  networkVersion: number;
  items: { code: string; site: string; siteName: string; service: string; serviceName: string }[];
  total: number;
}

/** `GET /api/analysis/diversity` and `/unfed`: `format=csv` for the file. */
export const listFormatQuerySchema = z.object({ format: formatField });

const CHAIN_FIELDS = ['direction', 'view', 'level', 'under', 'limit', 'offset'];

/**
 * `GET /api/carriages/:code/chain?direction=up|down` with at most one of `view=levels`,
 * `level=K` or `under=CODE` (the last two paged by `limit` and `offset`). Strict: a
 * mistyped field (`levle=2`) is a 400 naming it rather than the whole tree answered.
 */
export const chainQuerySchema = z
  .strictObject(
    {
      direction: z.enum(['up', 'down'], { error: 'direction is up or down' }).default('up'),
      view: z.enum(['levels'], { error: 'view is levels (or left out)' }).optional(),
      level: z.coerce.number({ error: 'level must be a number' }).int('level is a whole number').min(0, 'level is at least 0').max(1_000_000, 'level is too large').optional(),
      under: z.string({ error: 'under is one carriage code' }).min(1, 'under is one carriage code').max(200, 'under is one carriage code').optional(),
      ...pageQueryShape,
    },
    { error: (issue) => (issue.code === 'unrecognized_keys' ? `${issue.keys.join(', ')} ${issue.keys.length > 1 ? 'are' : 'is'} not known here: the chain takes ${CHAIN_FIELDS.join(', ')}` : undefined) },
  )
  .refine((q) => [q.view, q.level, q.under].filter((x) => x !== undefined).length <= 1, { message: 'ask for one of view, level or under' })
  .refine((q) => (q.limit === undefined && q.offset === undefined) || q.level !== undefined || q.under !== undefined, { message: 'limit and offset page a level or the carriages under one (level= or under=)' });

/** `GET` pairs while the background job runs (HTTP 202). */
export interface PairsRunning {
  state: 'running';
  networkVersion: number;
  progress: { done: number; total: number; percent: number };
}

/** `GET` proposals over the network (no carriage) while the ranking runs (HTTP 202): the same shape. */
export type ProposalsRunning = PairsRunning;

/** `POST /api/analysis/plans` */
export const MAX_BUDGET = 10;
export const planRequestSchema = z.strictObject({
  budget: z
    .number({ error: 'budget is a number of new feeds' })
    .int('budget is a whole number of feeds')
    .min(1, 'budget is at least 1 feed')
    .max(MAX_BUDGET, `budget is at most ${MAX_BUDGET} feeds`),
});

export interface PlanAnswer {
  id: string;
  networkVersion: number;
  budget: number;
  /** when the sandbox is forgotten (ISO 8601, UTC) */
  expiresAt: string;
  /** in the order picked; each was the best on the network with the earlier ones added */
  picks: (Proposal & { feed: string })[];
  householdsProtected: number;
  gaps: { before: number; after: number };
  exposure: { before: ExposureRow[]; after: ExposureRow[] };
}

export interface UnfedAnswer {
  networkVersion: number;
  carriages: { carriage: string; service: string; site: string }[];
}

/** One node of a chain tree (upstream or downstream). */
export interface ChainNode {
  carriage: string;
  site: string;
  siteName: string;
  service: string;
  origin: boolean;
  /** the feed that links this node to its parent in the tree (absent at the root) */
  via?: {
    feed: string;
    medium: Medium;
    role: FeedRole;
    up: boolean;
    distanceKm: number | null;
    hops: string[];
    warnings: string[];
  };
  /** true when the carriage has programme with nothing failed */
  onAir: boolean;
  /** set when this node closes a loop: the subtree is cut here */
  loop?: boolean;
  /** set when an upstream walk ends at a non-origin carriage with no feed */
  deadEnd?: boolean;
  /** set when this carriage is already expanded elsewhere in the same tree: shown once, so the tree stays as large as the network, not as the number of paths */
  repeated?: boolean;
  children: ChainNode[];
}

export interface ChainAnswer {
  networkVersion: number;
  direction: 'up' | 'down';
  root: ChainNode;
}

/** One carriage of a chain as a row of a level or branch page: the node without its subtree, placed in the tree. */
export interface ChainRow extends Omit<ChainNode, 'children'> {
  /** hops from the chain's own carriage (1 = fed by it directly, downstream) */
  depth: number;
  /** the carriage it hangs from in the tree (absent at the root) */
  parent?: string;
  /** carriages hanging directly from it in the tree */
  childCount: number;
  /** carriages anywhere below it in the tree */
  below: number;
}

/**
 * `?view=levels`: the chain folded by level. `levels[k]` carriages sit k hops
 * away (levels[0] = 1, the carriage itself; they sum to `size`). When the tree
 * is small (`complete`), `root` holds all of it; otherwise `root` comes
 * without children and the levels or branches are read in pages.
 */
export interface ChainLevelsAnswer extends ChainAnswer {
  size: number;
  levels: number[];
  complete: boolean;
}

/** `?level=K` or `?under=CODE`, paged by `limit` and `offset`: the rows of one level, or the carriages hanging directly from one, in tree order. */
export interface ChainPageAnswer {
  networkVersion: number;
  direction: 'up' | 'down';
  level?: number;
  under?: string;
  rows: ChainRow[];
  total: number;
  offset: number;
}

export const elementKey = (e: Element) => `${e.kind}:${e.code}`;
export const KIND_ORDER: Record<ElementKind, number> = { site: 0, carriage: 1, feed: 2, group: 3 };
export const compareElements = (a: Element, b: Element) =>
  KIND_ORDER[a.kind] - KIND_ORDER[b.kind] || (a.code < b.code ? -1 : a.code > b.code ? 1 : 0);

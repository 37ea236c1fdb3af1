/**
 * Shapes of the API answers the client reads, checked with zod so a contract
 * drift fails with a message naming the field (see parseAnswer in client.ts).
 * Request bodies the server validates are not repeated here.
 */
import { z } from 'zod';
import { ROLES } from '@/shared/api';
import { CHECK_NAMES, CHECK_SEVERITIES } from '@/shared/schemas/checks';
import { MEDIA } from '@/shared/schemas/network';
import { carriageSchema, ENTITY_KINDS, feedSchema, groupSchema, serviceSchema, siteSchema } from '@/shared/schemas/network';
import { IMPORT_STAGES } from '@/shared/schemas/import';

export const userSchema = z.object({
  id: z.union([z.number(), z.string()]),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  /** true after an admin set a temporary password: the person must choose a new one first */
  mustChangePassword: z.boolean().optional(),
});
export type User = z.infer<typeof userSchema>;

export const loginAnswerSchema = z.object({ token: z.string().min(1), user: userSchema });
export type LoginAnswer = z.infer<typeof loginAnswerSchema>;

export const meAnswerSchema = z.object({ user: userSchema });

export const summarySchema = z.object({
  networkVersion: z.union([z.number(), z.string()]),
  counts: z.object({
    sites: z.number(),
    services: z.number(),
    groups: z.number(),
    carriages: z.number(),
    feeds: z.number(),
  }),
  sitesByRole: z.object({ origin: z.number(), main: z.number(), relay: z.number() }),
});
export type NetworkSummary = z.infer<typeof summarySchema>;

export const accountSchema = userSchema.extend({
  disabled: z.boolean(),
  createdAt: z.string(),
});
export type Account = z.infer<typeof accountSchema>;

export const accountsAnswerSchema = z.object({ users: z.array(accountSchema) });

// ---- Inventory, import and audit answers (server/routes/inventory.ts, network.ts) ----
// Entities reuse the shared document schemas (shared/schemas/network.ts) as
// plain objects, so a field the server adds later is ignored, not fatal.
const stamp = { version: z.number().int(), updatedAt: z.string() };
export const storedSiteSchema = z.object({ ...siteSchema.shape, ...stamp });
export const storedServiceSchema = z.object({ ...serviceSchema.shape, ...stamp });
export const storedGroupSchema = z.object({ ...groupSchema.shape, ...stamp });
export const storedCarriageSchema = z.object({ ...carriageSchema.shape, ...stamp });
export const storedFeedSchema = z.object({ ...feedSchema.shape, ...stamp });
export type StoredSite = z.infer<typeof storedSiteSchema>;
export type StoredService = z.infer<typeof storedServiceSchema>;
export type StoredGroup = z.infer<typeof storedGroupSchema>;
export type StoredCarriage = z.infer<typeof storedCarriageSchema>;
export type StoredFeed = z.infer<typeof storedFeedSchema>;

export const storedEntitySchemas = {
  sites: storedSiteSchema,
  services: storedServiceSchema,
  groups: storedGroupSchema,
  carriages: storedCarriageSchema,
  feeds: storedFeedSchema,
} as const;
export type StoredEntities = { [K in keyof typeof storedEntitySchemas]: z.infer<(typeof storedEntitySchemas)[K]> };

export const pageOf = <T extends z.ZodTypeAny>(item: T) =>
  z.object({ items: z.array(item), total: z.number().int(), page: z.number().int(), pageSize: z.number().int() });

export const siteDetailSchema = z.object({
  site: storedSiteSchema,
  carriages: z.array(storedCarriageSchema),
  feedsIn: z.array(storedFeedSchema),
  feedsOut: z.array(storedFeedSchema),
  feedsVia: z.array(storedFeedSchema),
});
export const serviceDetailSchema = z.object({
  service: storedServiceSchema,
  counts: z.object({ carriages: z.number(), feeds: z.number() }),
});
export const groupDetailSchema = z.object({
  group: storedGroupSchema,
  members: z.object({ sites: z.array(z.string()), feeds: z.array(z.string()) }),
});
export const carriageDetailSchema = z.object({
  carriage: storedCarriageSchema,
  site: storedSiteSchema.optional(),
  service: storedServiceSchema.optional(),
  feedsIn: z.array(storedFeedSchema),
  feedsOut: z.array(storedFeedSchema),
});
const feedEndSchema = z.object({ carriage: storedCarriageSchema.optional(), site: storedSiteSchema.optional() });
export const feedDetailSchema = z.object({
  feed: storedFeedSchema,
  source: feedEndSchema,
  target: feedEndSchema,
  via: z.array(storedSiteSchema),
});
export type SiteDetail = z.infer<typeof siteDetailSchema>;
export type ServiceDetail = z.infer<typeof serviceDetailSchema>;
export type GroupDetail = z.infer<typeof groupDetailSchema>;
export type CarriageDetail = z.infer<typeof carriageDetailSchema>;
export type FeedDetail = z.infer<typeof feedDetailSchema>;

const importIssueSchema = z.object({
  kind: z.enum([...ENTITY_KINDS, 'document']),
  index: z.number().int().optional(),
  row: z.number().int().optional(),
  file: z.string().optional(),
  code: z.string().optional(),
  field: z.string().optional(),
  rule: z.string(),
  message: z.string(),
});
const kindCountsSchema = z.object({ received: z.number(), created: z.number(), updated: z.number(), unchanged: z.number(), deleted: z.number() });
export const importReportSchema = z.object({
  ok: z.boolean(),
  dryRun: z.boolean(),
  replace: z.boolean(),
  counts: z.object({ sites: kindCountsSchema, services: kindCountsSchema, groups: kindCountsSchema, carriages: kindCountsSchema, feeds: kindCountsSchema }),
  errors: z.array(importIssueSchema),
  warnings: z.array(importIssueSchema),
  moreErrors: z.number().int().optional(),
  stale: z.object({ baseVersion: z.number(), currentVersion: z.number(), changesSince: z.number() }).optional(),
  moreWarnings: z.number().int().optional(),
  confirmReplace: z.string().optional(),
  networkVersion: z.number().optional(),
});

export const importProgressSchema = z.object({ stage: z.enum(IMPORT_STAGES), done: z.number(), total: z.number() });

export const AUDIT_KINDS = [...ENTITY_KINDS, 'network', 'people', 'works', 'incidents'] as const;
/** What was done to people (server/services/audit.ts PEOPLE_ACTIONS). */
export const PEOPLE_AUDIT_ACTIONS = ['invite', 'role-change', 'disable', 'enable', 'password-change', 'password-set', 'sign-in', 'sign-in-failed', 'sign-out'] as const;
export const AUDIT_ACTIONS = ['create', 'update', 'delete', 'import', ...PEOPLE_AUDIT_ACTIONS] as const;
export const auditItemSchema = z.object({
  id: z.number(),
  at: z.string(),
  userEmail: z.string().nullable(),
  action: z.enum(AUDIT_ACTIONS),
  entityKind: z.enum(AUDIT_KINDS),
  entityCode: z.string().nullable(),
  before: z.unknown(),
  after: z.unknown(),
  networkVersion: z.number().nullable(),
});
export type AuditItem = z.infer<typeof auditItemSchema>;
export const auditPageSchema = pageOf(auditItemSchema);

// ---- Analysis answers (docs/api.md; types in shared/schemas/analysis.ts) ----
// This part's imports sit with it (imports are hoisted), so parts of this file
// can be added independently without touching one shared import list.
import type * as analysisTypes from '@/shared/schemas/analysis';
import * as networkDoc from '@/shared/schemas/network';

const analysisElementSchema = z.object({ kind: z.enum(networkDoc.ELEMENT_KINDS), code: z.string() });
const mediumSchema = z.enum(networkDoc.MEDIA);
const feedRoleSchema = z.enum(networkDoc.FEED_ROLES);

export const reachAnswerSchema = z.object({
  networkVersion: z.number(),
  lost: z.array(z.string()),
  fallback: z.array(z.string()),
  households: z.object({ lost: z.number(), fallback: z.number() }),
  byService: z.array(z.object({ service: z.string(), lost: z.number(), fallback: z.number() })),
  sites: z.array(z.object({ site: z.string(), lost: z.array(z.string()), fallback: z.array(z.string()).optional() })),
  siteInfo: z.record(z.string(), z.object({ name: z.string(), households: z.number() })).optional(),
}) satisfies z.ZodType<analysisTypes.ReachAnswer>;
/** `?first=N`: the first rows of each list, every listed site named, and the length of each whole list. */
export const briefReachAnswerSchema = reachAnswerSchema.extend({
  siteInfo: z.record(z.string(), z.object({ name: z.string(), households: z.number() })),
  counts: z.object({ sites: z.number(), lost: z.number(), fallback: z.number() }),
}) satisfies z.ZodType<analysisTypes.BriefReachAnswer>;
export const reachSitesPageSchema = z.object({
  networkVersion: z.number(),
  sites: z.array(z.object({ site: z.string(), name: z.string(), households: z.number(), lost: z.array(z.string()), fallback: z.array(z.string()) })),
  total: z.number(),
  offset: z.number(),
}) satisfies z.ZodType<analysisTypes.ReachSitesPage>;
export type ReachSitesReply = z.infer<typeof reachSitesPageSchema>;
export const reachCarriagesPageSchema = z.object({
  networkVersion: z.number(),
  state: z.enum(['lost', 'fallback']),
  carriages: z.array(z.string()),
  total: z.number(),
  offset: z.number(),
}) satisfies z.ZodType<analysisTypes.ReachCarriagesPage>;
export type ReachCarriagesReply = z.infer<typeof reachCarriagesPageSchema>;

export const exposureAnswerSchema = z.object({
  networkVersion: z.number(),
  elements: z.array(z.object({ element: analysisElementSchema, households: z.number(), carriages: z.number() })),
  /** with=names: "kind:code" -> name of the listed elements */
  names: z.record(z.string(), z.string()).optional(),
}) satisfies z.ZodType<analysisTypes.ExposureAnswer>;

const carriagePlaceSchema = { carriage: z.string(), service: z.string(), site: z.string() };
export const diversityAnswerSchema = z.object({
  networkVersion: z.number(),
  carriages: z.array(z.object({ ...carriagePlaceSchema, spof: z.array(analysisElementSchema), avoidable: z.array(analysisElementSchema) })),
  total: z.number().optional(),
  offset: z.number().optional(),
}) satisfies z.ZodType<analysisTypes.DiversityAnswer>;

export const unfedAnswerSchema = z.object({
  networkVersion: z.number(),
  carriages: z.array(z.object(carriagePlaceSchema)),
  total: z.number().optional(),
  offset: z.number().optional(),
}) satisfies z.ZodType<analysisTypes.UnfedAnswer>;

/** A chain node's own fields, shared by the tree (with children) and the rows of a folded chain's pages. */
const chainNodeShape = {
  carriage: z.string(),
  site: z.string(),
  siteName: z.string(),
  service: z.string(),
  origin: z.boolean(),
  via: z
    .object({
      feed: z.string(),
      medium: mediumSchema,
      role: feedRoleSchema,
      up: z.boolean(),
      distanceKm: z.number().nullable(),
      hops: z.array(z.string()),
      warnings: z.array(z.string()),
    })
    .optional(),
  onAir: z.boolean(),
  loop: z.boolean().optional(),
  deadEnd: z.boolean().optional(),
  repeated: z.boolean().optional(),
};
export const chainNodeSchema: z.ZodType<analysisTypes.ChainNode> = z.lazy(() => z.object({ ...chainNodeShape, children: z.array(chainNodeSchema) }));
export const chainAnswerSchema = z.object({ networkVersion: z.number(), direction: z.enum(['up', 'down']), root: chainNodeSchema }) satisfies z.ZodType<analysisTypes.ChainAnswer>;
export const chainLevelsAnswerSchema = chainAnswerSchema.extend({ size: z.number(), levels: z.array(z.number()), complete: z.boolean() }) satisfies z.ZodType<analysisTypes.ChainLevelsAnswer>;
export const chainRowSchema = z.object({ ...chainNodeShape, depth: z.number(), parent: z.string().optional(), childCount: z.number(), below: z.number() }) satisfies z.ZodType<analysisTypes.ChainRow>;
export const chainPageAnswerSchema = z.object({
  networkVersion: z.number(),
  direction: z.enum(['up', 'down']),
  level: z.number().optional(),
  under: z.string().optional(),
  rows: z.array(chainRowSchema),
  total: z.number(),
  offset: z.number(),
}) satisfies z.ZodType<analysisTypes.ChainPageAnswer>;
export type ChainPageReply = z.infer<typeof chainPageAnswerSchema>;

/** The whole network (GET /api/network/export) as the diagram reads it: optional fields it does not draw are left unchecked. */
export const networkDrawingSchema = z.object({
  sites: z.array(z.object({ code: z.string(), name: z.string(), role: z.enum(networkDoc.SITE_ROLES), lat: z.number(), lon: z.number(), households: z.number().nullish() })),
  services: z.array(z.object({ code: z.string(), name: z.string(), kind: z.string() })),
  groups: z.array(z.object({ code: z.string(), name: z.string() })),
  carriages: z.array(z.object({ code: z.string(), site: z.string(), service: z.string() })),
  feeds: z.array(z.object({ code: z.string(), from: z.string(), to: z.string(), medium: mediumSchema, role: feedRoleSchema })),
});
export type NetworkDrawing = z.infer<typeof networkDrawingSchema>;

/** One page of a list endpoint as the element search reads it: code and, where the kind has one, name. */
export const codeNamePageSchema = z.object({
  items: z.array(z.object({ code: z.string(), name: z.string().optional(), from: z.string().optional(), to: z.string().optional() })),
  total: z.number(),
});
export type CodeNamePage = z.infer<typeof codeNamePageSchema>;

/** GET /api/analysis/exposure-groups */
export const exposureGroupsAnswerSchema = z.object({
  networkVersion: z.number(),
  groups: z.array(z.object({ elements: z.array(analysisElementSchema).min(1), households: z.number(), carriages: z.number() })),
});

/** GET /api/analysis/carriage-search */
export const carriageSearchSchema = z.object({
  items: z.array(z.object({ code: z.string(), site: z.string(), siteName: z.string(), service: z.string(), serviceName: z.string() })),
  total: z.number(),
});
export type CarriageSearchPage = z.infer<typeof carriageSearchSchema>;

/** GET /api/carriages/:code as the chain screen reads it: the carriage, where it is, and its feeds. */
const feedLineSchema = z.object({ code: z.string(), from: z.string(), to: z.string(), medium: mediumSchema, role: feedRoleSchema });
export const carriageFeedsSchema = z.object({
  carriage: z.object({
    code: z.string(),
    site: z.string(),
    service: z.string(),
    frequencyMHz: z.number().nullish(),
    channel: z.string().nullish(),
    erpW: z.number().nullish(),
    polarisation: z.string().nullish(),
  }),
  site: z.object({ code: z.string(), name: z.string(), role: z.enum(networkDoc.SITE_ROLES) }).optional(),
  service: z.object({ code: z.string(), name: z.string(), kind: z.string() }).optional(),
  feedsIn: z.array(feedLineSchema),
  feedsOut: z.array(feedLineSchema),
});
export type CarriageFeeds = z.infer<typeof carriageFeedsSchema>;

// Feed checks (shared/schemas/checks.ts; docs/checks.md).
export const feedCheckSchema = z.object({
  name: z.enum(CHECK_NAMES),
  value: z.number().nullable(),
  unit: z.string(),
  limit: z.number().nullable().optional(),
  ok: z.boolean().nullable(),
  note: z.string(),
  limitConfidence: z.enum(['confirmed', 'secondary', 'recalled']).optional(),
});

export const feedChecksAnswerSchema = z.object({
  feed: z.string(),
  distanceKm: z.number(),
  bearingDeg: z.number(),
  reverseBearingDeg: z.number(),
  medium: z.enum(MEDIA),
  checks: z.array(feedCheckSchema),
  warnings: z.array(z.string()),
  rxFrequencyMHz: z.number().nullable().optional(),
});
export type FeedChecksReply = z.infer<typeof feedChecksAnswerSchema>;

export const checkFailureSchema = z.object({
  feed: z.string(),
  from: z.string(),
  to: z.string(),
  medium: z.enum(MEDIA),
  check: feedCheckSchema,
  severity: z.enum(CHECK_SEVERITIES),
  margin: z.number().optional(),
});

const kindCountSchema = z.object({ name: z.enum(CHECK_NAMES), count: z.number() });
export const failureCountsSchema = z.object({ total: z.number(), errors: z.number(), warnings: z.number(), feeds: z.number(), byCheck: z.array(kindCountSchema) });

export const checksListAnswerSchema = z.object({
  networkVersion: z.union([z.number(), z.string()]).optional(),
  failures: z.array(checkFailureSchema),
  total: z.number().optional(),
  offset: z.number().optional(),
  counts: failureCountsSchema.optional(),
  kinds: z.array(kindCountSchema).optional(),
  unfiltered: z.number().optional(),
});
export type ChecksListReply = z.infer<typeof checksListAnswerSchema>;

/** A site as the calculator needs it: where it is and how high its antennas can sit. */
export const sitePositionSchema = z.object({
  code: z.string(),
  name: z.string(),
  lat: z.number(),
  lon: z.number(),
  groundHeightM: z.number().nullish(),
  mastHeightM: z.number().nullish(),
});
export type SitePosition = z.infer<typeof sitePositionSchema>;

export const sitePositionsPageSchema = z.object({ items: z.array(sitePositionSchema), total: z.number() });

// ---- Resilience planner (proposals, critical pairs, plans; shared/schemas/analysis.ts) ----
const exposureRowSchema = z.object({ element: analysisElementSchema, households: z.number(), carriages: z.number() });
export const proposalSchema = z.object({
  carriage: z.string(),
  from: z.string(),
  medium: mediumSchema,
  removes: z.array(analysisElementSchema),
  householdsProtected: z.number(),
  distanceKm: z.number(),
  bearingDeg: z.number(),
  fieldStrengthDbuvm: z.number().nullable(),
  minimumDbuvm: z.number().nullable(),
  warnings: z.array(z.string()),
}) satisfies z.ZodType<analysisTypes.Proposal>;
export const proposalsAnswerSchema = z.object({ networkVersion: z.number(), proposals: z.array(proposalSchema) }) satisfies z.ZodType<analysisTypes.ProposalsAnswer>;
const jobRunningSchema = z.object({ state: z.literal('running'), networkVersion: z.number(), progress: z.object({ done: z.number(), total: z.number(), percent: z.number() }) });
/** Proposals over the network: 202 with progress while the server ranks them, then the answer. */
export const networkProposalsStateSchema = z.discriminatedUnion('state', [jobRunningSchema, proposalsAnswerSchema.extend({ state: z.literal('done') })]);
export type NetworkProposalsState = z.infer<typeof networkProposalsStateSchema>;
export const pairsStateSchema = z.discriminatedUnion('state', [
  jobRunningSchema,
  z.object({
    state: z.literal('done'),
    networkVersion: z.number(),
    pairs: z.array(z.object({ elements: z.tuple([analysisElementSchema, analysisElementSchema]), jointLost: z.array(z.string()), jointLostCount: z.number().optional(), households: z.number() })),
  }),
]);
export type PairsState = z.infer<typeof pairsStateSchema>;
export const planAnswerSchema = z.object({
  id: z.string(),
  networkVersion: z.number(),
  budget: z.number(),
  expiresAt: z.string(),
  picks: z.array(proposalSchema.extend({ feed: z.string() })),
  householdsProtected: z.number(),
  gaps: z.object({ before: z.number(), after: z.number() }),
  exposure: z.object({ before: z.array(exposureRowSchema), after: z.array(exposureRowSchema) }),
}) satisfies z.ZodType<analysisTypes.PlanAnswer>;
export type PlanResult = z.infer<typeof planAnswerSchema>;
export const sandboxDiversitySchema = diversityAnswerSchema.extend({ sandbox: z.string() });
export const applyPlanAnswerSchema = z.object({ networkVersion: z.number(), created: z.array(z.string()) });

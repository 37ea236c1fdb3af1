/**
 * Feed engineering screening answers (docs/checks.md:
 * `GET /api/feeds/:code/checks` and `GET /api/checks`).
 */
import { z } from 'zod';
import type { Medium } from './network';
import { pageQueryShape } from './paging';

export const CHECK_NAMES = [
  'free-space-loss',
  'field-strength',
  'horizon',
  'earth-bulge',
  'fresnel-f1',
  'clearance',
  'channel-clash',
  'bearing-record',
] as const;
export type CheckName = (typeof CHECK_NAMES)[number];

/**
 * How sure a reference value (e.g. a planning minimum) is: docs/checks.md marks
 * [C] confirmed (read in the named source), [S] secondary (read only where another text
 * quotes it), [M] recalled (from memory, not read in the source).
 */
export type Confidence = 'confirmed' | 'secondary' | 'recalled';

/** How a user reads each confidence, beside the source's name; null: the source alone says it. */
export const CONFIDENCE_WORDS: Readonly<Record<Confidence, string | null>> = {
  confirmed: null,
  secondary: 'value from a secondary source quoting it',
  recalled: 'value not checked against the published text',
};

export interface FeedCheck {
  name: CheckName;
  /** null when not computed (missing input) or not applicable to this medium; never 0 in its place. */
  value: number | null;
  unit: string;
  /** The threshold the value is held against, when the check has one. */
  limit?: number | null;
  /** true passes, false fails, null = not computed or not applicable (the note says which). */
  ok: boolean | null;
  /** Plain English: what was compared, the assumptions, or "not computed: <field> missing ...". */
  note: string;
  /** Extension: how sure `limit` is, when it comes from a published table (field-strength). */
  limitConfidence?: Confidence;
}

export interface FeedChecksAnswer {
  feed: string;
  /** Ellipsoidal (WGS84) distance between the two sites, km. */
  distanceKm: number;
  /** Initial bearing from the target (receiving) site to the source (parent) site, deg from true north, [0, 360). */
  bearingDeg: number;
  /** Initial bearing from the source site to the target site, [0, 360). */
  reverseBearingDeg: number;
  medium: Medium;
  checks: FeedCheck[];
  /** One plain-English sentence per failed check. */
  warnings: string[];
  /** Extension: the receive frequency used for the frequency-dependent checks, null when unknown. */
  rxFrequencyMHz?: number | null;
}

export const CHECK_SEVERITIES = ['warning', 'error'] as const;

/**
 * Orders of `GET /api/checks?sort=`: worst first (the default); severity (errors
 * first when ascending); feed code and from -> to (text, numbers in codes in
 * numeric order); check (in the order the kinds stop a feed working, CHECK_NAMES);
 * margin (yes/no checks, which have none, last in either direction).
 */
export const FAILURE_SORTS = ['worst', 'severity', 'feed', 'route', 'check', 'margin'] as const;
export type FailureSort = (typeof FAILURE_SORTS)[number];
export type CheckSeverity = (typeof CHECK_SEVERITIES)[number];

/**
 * `GET /api/checks?severity=...`: the lowest severity to list. `warning` (the default) lists
 * warnings and errors; `error` lists errors only.
 */
export const checksQuerySchema = z.strictObject({
  severity: z.enum(CHECK_SEVERITIES, { error: 'severity is one of warning, error' }).optional(),
  /** kinds of check to list (comma-separated); all when absent */
  check: z
    .string({ error: 'check is a comma-separated list of check names' })
    .max(400, 'check is a comma-separated list of check names')
    .transform((v) => v.split(',').map((k) => k.trim()))
    .pipe(z.array(z.enum(CHECK_NAMES, { error: `check is a comma-separated list of: ${CHECK_NAMES.join(', ')}` })))
    .optional(),
  /** the column the list is sorted by (default worst: the order described at ChecksListAnswer); rows that tie keep the worst-first order */
  sort: z.enum(FAILURE_SORTS, { error: `sort is one of ${FAILURE_SORTS.join(', ')}` }).default('worst'),
  direction: z.enum(['asc', 'desc'], { error: 'direction is asc or desc' }).default('asc'),
  ...pageQueryShape,
  /** csv: the list as a spreadsheet file */
  format: z.enum(['json', 'csv'], { error: 'format is json or csv' }).default('json'),
});

export interface CheckFailure {
  feed: string;
  /** Source carriage code. */
  from: string;
  /** Target carriage code. */
  to: string;
  medium: Medium;
  check: FeedCheck;
  /**
   * error: the feed is not viable as recorded (a co-channel receive, a field strength below
   * the planning minimum, a path beyond radio horizon, a microwave path without clearance).
   * warning: the record is inconsistent but the path may work (a recorded bearing that
   * disagrees with the computed one).
   */
  severity: CheckSeverity;
  /**
   * Signed distance from the limit in the check's unit, negative when failing: field strength
   * minus minimum (dB), horizon minus distance (km), clearance (m), 5 deg minus the bearing
   * error (deg). Absent for channel-clash, which is a yes/no check.
   */
  margin?: number;
}

/**
 * Worst first: errors before warnings; then by check (channel-clash, field-strength,
 * clearance, horizon, bearing-record: the order in which they stop a feed working);
 * then by margin, most negative first (same check, so same unit); then by feed code.
 */
export interface ChecksListAnswer {
  networkVersion?: number;
  failures: CheckFailure[];
  /** failures in the whole filtered list (this page may hold fewer) */
  total?: number;
  offset?: number;
  /** the whole filtered list counted (severity and check), whatever the page */
  counts?: FailureCounts;
  /** failures per kind of check at the severity asked, whichever kinds are chosen: what filter chips show */
  kinds?: { name: CheckName; count: number }[];
  /** failures in the network, no filter */
  unfiltered?: number;
}

export interface FailureCounts {
  total: number;
  errors: number;
  warnings: number;
  /** distinct feeds with at least one failure in the list */
  feeds: number;
  /** failures per kind of check, in CHECK_NAMES order, kinds with none left out */
  byCheck: { name: CheckName; count: number }[];
}

/**
 * Planned works, incidents and availability: request bodies (zod, shared by
 * the server and the client's forms) and answer shapes. See
 * server/operations/README.md for the rules behind them.
 */
import { z } from 'zod';
import { elementSchema, type Element } from './analysis';

/** Stored state names, in the order a work normally passes through them. */
export const WORK_STATES = ['draft', 'requested', 'approved', 'in-progress', 'done', 'cancelled'] as const;
export type WorkState = (typeof WORK_STATES)[number];
export const WORK_STATE_LABELS: Record<WorkState, string> = {
  draft: 'Drafted',
  requested: 'Awaiting approval',
  approved: 'Approved',
  'in-progress': 'Under way',
  done: 'Finished',
  cancelled: 'Cancelled',
};
/** States of a work that will or may still happen: only these take part in clashes. */
export const LIVE_WORK_STATES: readonly WorkState[] = ['draft', 'requested', 'approved', 'in-progress'];
/** States of a work that is going ahead: a clash with one of these is told to people. */
export const FIRM_WORK_STATES: readonly WorkState[] = ['approved', 'in-progress'];

export const MAX_WINDOW_DAYS = 90;
export const MAX_OPERATION_ELEMENTS = 500;

const instant = (what: string) =>
  z.iso.datetime({ offset: true, error: `${what} is a date and time in ISO 8601 with a zone, e.g. 2027-03-01T06:00:00+01:00 or ...Z` });

export const elementsSchema = z
  .array(elementSchema, { error: 'elements must be an array of { kind, code } elements' })
  .min(1, 'elements needs at least one element (a site, carriage, feed or group)')
  .max(MAX_OPERATION_ELEMENTS, `elements holds at most ${MAX_OPERATION_ELEMENTS} elements`);

const title = z.string({ error: 'a title is required' }).trim().min(1, 'a title is required').max(200, 'a title is at most 200 characters');
const notes = z.string({ error: 'notes are text' }).max(5000, 'notes are at most 5000 characters');
const version = z.number({ error: 'version is required: the version you read' }).int('version is a whole number').min(1, 'version is at least 1');

export const workCreateSchema = z.strictObject({
  title,
  elements: elementsSchema,
  start: instant('start'),
  end: instant('end'),
  notes: notes.optional(),
  /** submit straight for approval instead of keeping a draft */
  submit: z.boolean({ error: 'submit is true or false' }).optional(),
});
export type WorkCreate = z.infer<typeof workCreateSchema>;

export const workPatchSchema = z.strictObject({
  version,
  title: title.optional(),
  elements: elementsSchema.optional(),
  start: instant('start').optional(),
  end: instant('end').optional(),
  notes: notes.optional(),
});
export type WorkPatch = z.infer<typeof workPatchSchema>;

export const workTransitionSchema = z.strictObject({
  to: z.enum(WORK_STATES, { error: `to is one of ${WORK_STATES.join(', ')}` }),
  version,
});
export const workApproveSchema = z.strictObject({ version });

export const worksQuerySchema = z.strictObject({
  from: instant('from').optional(),
  to: instant('to').optional(),
  state: z
    .string()
    .transform((s) => s.split(',').filter(Boolean))
    .pipe(z.array(z.enum(WORK_STATES, { error: `state is one or more of ${WORK_STATES.join(', ')}, comma separated` })))
    .optional(),
});

export const incidentCreateSchema = z.strictObject({
  title,
  elements: elementsSchema,
  startedAt: instant('startedAt').optional(),
  note: notes.optional(),
});
export const incidentPatchSchema = z.strictObject({
  version,
  title: title.optional(),
  startedAt: instant('startedAt').optional(),
});
export const incidentUpdateSchema = z.strictObject({
  version,
  at: instant('at').optional(),
  note: notes.optional(),
  add: z.array(elementSchema).max(MAX_OPERATION_ELEMENTS).optional(),
  restore: z.array(elementSchema).max(MAX_OPERATION_ELEMENTS).optional(),
  close: z.boolean({ error: 'close is true or false' }).optional(),
});
export type IncidentUpdate = z.infer<typeof incidentUpdateSchema>;

export const availabilityQuerySchema = z.strictObject({
  from: instant('from'),
  to: instant('to'),
  service: z.string().max(64).optional(),
  format: z.enum(['json', 'csv'], { error: 'format is json or csv' }).optional(),
});

/** Reach as shown with a work or stored with an incident step (rules 4, 5 and 7). */
export interface OperationsReach {
  lost: string[];
  fallback: string[];
  households: { lost: number; fallback: number };
  byService: { service: string; lost: number; fallback: number }[];
  sites: { site: string; lost: string[]; fallback?: string[] }[];
}
/** A step's reach as stored: also which site and service each lost carriage was, so a later network edit cannot change the record. */
export interface FrozenReach extends OperationsReach {
  places: { carriage: string; site: string; service: string }[];
}

export interface Clash {
  /** the other work's code, or the incident's code */
  work: string;
  /** 'work' or 'incident' */
  with: 'work' | 'incident';
  otherState: WorkState | 'open';
  overlap: { start: string; end: string | null };
  jointLost: string[];
  households: number;
}

export interface WorkAnswer {
  code: string;
  title: string;
  elements: Element[];
  start: string;
  end: string;
  notes: string;
  state: WorkState;
  stateLabel: string;
  requestedBy: string | null;
  approvedBy: string | null;
  version: number;
  updatedAt: string;
  networkVersion: number;
  /** elements the current network no longer has (left out of the reach) */
  missing: Element[];
  reach: OperationsReach;
  clashes: Clash[];
}

export interface IncidentStepAnswer {
  at: string;
  note: string;
  added: Element[];
  restored: Element[];
  elements: Element[];
  networkVersion: number;
  reach: FrozenReach;
  by: string | null;
}

export interface IncidentAnswer {
  code: string;
  title: string;
  elements: Element[];
  startedAt: string;
  endedAt: string | null;
  open: boolean;
  openedBy: string | null;
  version: number;
  householdMinutes: number | null;
  carriageMinutes: Record<string, number> | null;
  networkVersion: number;
  steps: IncidentStepAnswer[];
  clashes: Clash[];
}

export interface AvailabilityRow {
  code: string;
  site: string;
  service: string | null;
  minutesOffAir: number;
  minutesPlanned: number;
  /** share of the period on air, from incidents only, 0..1 */
  availability: number;
}
export interface AvailabilityAnswer {
  networkVersion: number;
  from: string;
  to: string;
  minutesInPeriod: number;
  service: string | null;
  carriages: AvailabilityRow[];
  sites: AvailabilityRow[];
  services: { service: string; carriages: number; minutesOffAir: number; minutesPlanned: number; availability: number }[];
}

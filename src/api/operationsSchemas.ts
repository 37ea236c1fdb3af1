/**
 * Answer shapes of planned works, incidents and availability, checked on
 * arrival. The types come from shared/schemas/operations.ts, so the server
 * and the client cannot drift apart silently.
 */
import { z } from 'zod';
import type { AvailabilityAnswer, IncidentAnswer, WorkAnswer } from '@/shared/schemas/operations';
import { ELEMENT_KINDS } from '@/shared/schemas/network';

const element = z.object({ kind: z.enum(ELEMENT_KINDS), code: z.string() });
const reach = z.object({
  lost: z.array(z.string()),
  fallback: z.array(z.string()),
  households: z.object({ lost: z.number(), fallback: z.number() }),
  byService: z.array(z.object({ service: z.string(), lost: z.number(), fallback: z.number() })),
  sites: z.array(z.object({ site: z.string(), lost: z.array(z.string()), fallback: z.array(z.string()).optional() })),
});
const clash = z.object({
  work: z.string(),
  with: z.enum(['work', 'incident']),
  otherState: z.string(),
  overlap: z.object({ start: z.string(), end: z.string().nullable() }),
  jointLost: z.array(z.string()),
  households: z.number(),
});
const state = z.enum(['draft', 'requested', 'approved', 'in-progress', 'done', 'cancelled']);

export const workAnswerSchema = z.object({
  code: z.string(),
  title: z.string(),
  elements: z.array(element),
  start: z.string(),
  end: z.string(),
  notes: z.string(),
  state,
  stateLabel: z.string(),
  requestedBy: z.string().nullable(),
  approvedBy: z.string().nullable(),
  version: z.number(),
  updatedAt: z.string(),
  networkVersion: z.number(),
  missing: z.array(element),
  reach,
  clashes: z.array(clash),
}) as unknown as z.ZodType<WorkAnswer>;

export const worksAnswerSchema = z.object({ networkVersion: z.number(), items: z.array(workAnswerSchema) });

const step = z.object({
  at: z.string(),
  note: z.string(),
  added: z.array(element),
  restored: z.array(element),
  elements: z.array(element),
  networkVersion: z.number(),
  reach: reach.extend({ places: z.array(z.object({ carriage: z.string(), site: z.string(), service: z.string() })) }),
  by: z.string().nullable(),
});
export const incidentAnswerSchema = z.object({
  code: z.string(),
  title: z.string(),
  elements: z.array(element),
  startedAt: z.string(),
  endedAt: z.string().nullable(),
  open: z.boolean(),
  openedBy: z.string().nullable(),
  version: z.number(),
  householdMinutes: z.number().nullable(),
  carriageMinutes: z.record(z.string(), z.number()).nullable(),
  networkVersion: z.number(),
  steps: z.array(step),
  clashes: z.array(clash),
}) as unknown as z.ZodType<IncidentAnswer>;

export const incidentListSchema = z.object({
  networkVersion: z.number(),
  items: z.array(
    z.object({ code: z.string(), title: z.string(), elements: z.array(element), startedAt: z.string(), endedAt: z.string().nullable(), open: z.boolean(), householdMinutes: z.number().nullable(), version: z.number() }),
  ),
});
export type IncidentListItem = z.infer<typeof incidentListSchema>['items'][number];

const availabilityRow = z.object({ code: z.string(), site: z.string(), service: z.string().nullable(), minutesOffAir: z.number(), minutesPlanned: z.number(), availability: z.number() });
export const availabilityAnswerSchema = z.object({
  networkVersion: z.number(),
  from: z.string(),
  to: z.string(),
  minutesInPeriod: z.number(),
  service: z.string().nullable(),
  carriages: z.array(availabilityRow),
  sites: z.array(availabilityRow),
  services: z.array(z.object({ service: z.string(), carriages: z.number(), minutesOffAir: z.number(), minutesPlanned: z.number(), availability: z.number() })),
}) satisfies z.ZodType<AvailabilityAnswer>;

/**
 * The resilience planner's answers: proposals (new reserve feeds) and critical
 * pairs (both computed in the background by the server: asked again every
 * second while it reports progress), plans and their sandbox, and creating a
 * plan's feeds for real.
 */
import useSWR from 'swr';
import type { z } from 'zod';
import { api } from '@/shared/api';
import { useSend, type Send } from '../ApiProvider';
import { parseAnswer, type ApiError } from '../client';
import { freshness } from '../freshness';
import { applyPlanAnswerSchema, networkProposalsStateSchema, pairsStateSchema, planAnswerSchema, sandboxDiversitySchema, type NetworkProposalsState, type PairsState } from '../schemas';
import { useApiQuery } from '../useApiQuery';

export const plannerKeys = {
  proposals: (q: { carriage?: string; limit?: number }) => api.proposals(q),
  pairs: (limit: number, kinds: string, sample?: number) => api.pairs(limit, kinds, sample),
  sandboxDiversity: (id: string) => api.planAnswer(id, 'diversity'),
};

/** A server job's answer, asked again every second while it reports progress. */
function useBackgroundWork<S extends { state: string }>(path: string, schema: z.ZodType<S>) {
  const send = useSend();
  return useSWR<S, ApiError>(path, async (p: string) => parseAnswer(schema, p, await send(p)), {
    ...freshness.network,
    refreshInterval: (latest) => (latest?.state === 'running' ? 1000 : 0),
  });
}

/** Each gap carriage's best proposal, ranked over the network: the first `limit`. */
export function useNetworkProposals(limit: number) {
  return useBackgroundWork<NetworkProposalsState>(plannerKeys.proposals({ limit }), networkProposalsStateSchema);
}

/** `sample`: carriages listed per pair (with their count), for a screen that names a few. */
export function usePairs(limit: number, kinds = 'site,group', sample?: number) {
  return useBackgroundWork<PairsState>(plannerKeys.pairs(limit, kinds, sample), pairsStateSchema);
}

export function useSandboxDiversity(id: string | null) {
  return useApiQuery(id ? plannerKeys.sandboxDiversity(id) : null, sandboxDiversitySchema, 'network');
}

export async function makePlan(send: Send, budget: number) {
  return parseAnswer(planAnswerSchema, api.plans, await send(api.plans, { method: 'POST', body: { budget } }));
}

export async function applyPlan(send: Send, id: string) {
  const path = api.applyPlan(id);
  return parseAnswer(applyPlanAnswerSchema, path, await send(path, { method: 'POST', body: {} }));
}

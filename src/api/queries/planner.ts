/**
 * The resilience planner's answers: proposals (new reserve feeds), critical
 * pairs (computed in the background by the server: asked again every second
 * while it reports progress), plans and their sandbox, and creating a plan's
 * feeds for real.
 */
import useSWR from 'swr';
import { api } from '@/shared/api';
import { useSend, type Send } from '../ApiProvider';
import { parseAnswer, type ApiError } from '../client';
import { freshness } from '../freshness';
import { applyPlanAnswerSchema, pairsStateSchema, planAnswerSchema, proposalsAnswerSchema, sandboxDiversitySchema, type PairsState } from '../schemas';
import { useApiQuery } from '../useApiQuery';

export const plannerKeys = {
  proposals: (q: { carriage?: string; limit?: number }) => api.proposals(q),
  pairs: (limit: number, kinds: string) => api.pairs(limit, kinds),
  sandboxDiversity: (id: string) => api.planAnswer(id, 'diversity'),
};

export function useProposals(q: { carriage?: string; limit?: number }) {
  return useApiQuery(plannerKeys.proposals(q), proposalsAnswerSchema, 'network');
}

export function usePairs(limit: number, kinds = 'site,group') {
  const send = useSend();
  return useSWR<PairsState, ApiError>(plannerKeys.pairs(limit, kinds), async (path: string) => parseAnswer(pairsStateSchema, path, await send(path)), {
    ...freshness.network,
    refreshInterval: (latest) => (latest?.state === 'running' ? 1000 : 0),
  });
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

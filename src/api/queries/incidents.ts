/** Incidents (server/operations): the list, one incident with its frozen steps, opening and updating. */
import { useMemo } from 'react';
import { useSWRConfig } from 'swr';
import { api } from '@/shared/api';
import type { Element } from '@/shared/schemas/analysis';
import type { IncidentAnswer } from '@/shared/schemas/operations';
import { useSend } from '../ApiProvider';
import { parseAnswer } from '../client';
import { incidentAnswerSchema, incidentListSchema } from '../operationsSchemas';
import { useApiQuery } from '../useApiQuery';

export const incidentsKey = () => api.incidents;
export const incidentKey = (code: string) => api.incident(code);
const isIncidentKey = (key: unknown) => typeof key === 'string' && (key.startsWith(api.incidents) || key.startsWith(api.works));

export function useIncidents() {
  return useApiQuery(incidentsKey(), incidentListSchema, 'incident');
}

export function useIncident(code: string | null) {
  return useApiQuery(code ? incidentKey(code) : null, incidentAnswerSchema, 'incident');
}

export interface IncidentChange {
  version: number;
  note?: string;
  add?: Element[];
  restore?: Element[];
  close?: boolean;
  at?: string;
}

export function useIncidentActions() {
  const send = useSend();
  const { mutate } = useSWRConfig();
  return useMemo(() => {
    const done = async (path: string, answer: unknown): Promise<IncidentAnswer> => {
      const i = parseAnswer(incidentAnswerSchema, path, answer);
      await mutate(isIncidentKey);
      return i;
    };
    return {
      open: async (body: { title: string; elements: Element[]; startedAt?: string; note?: string }) =>
        done(api.incidents, await send(api.incidents, { method: 'POST', body })),
      update: async (code: string, change: IncidentChange) => done(api.incidentUpdates(code), await send(api.incidentUpdates(code), { method: 'POST', body: change })),
      change: async (code: string, change: { version: number; title?: string; startedAt?: string }) =>
        done(api.incident(code), await send(api.incident(code), { method: 'PATCH', body: change })),
    };
  }, [send, mutate]);
}

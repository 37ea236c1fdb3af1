/** Incidents (server/operations): the list, one incident with its frozen steps, opening and updating. */
import { useMemo } from 'react';
import { api } from '@/shared/api';
import type { Element } from '@/shared/schemas/analysis';
import { incidentAnswerSchema, incidentListSchema } from '../operationsSchemas';
import { useApiQuery, useRecordWrites } from '../useApiQuery';

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
  const { write } = useRecordWrites(incidentAnswerSchema, isIncidentKey);
  return useMemo(
    () => ({
      open: (body: { title: string; elements: Element[]; startedAt?: string; note?: string }) => write(api.incidents, 'POST', body),
      update: (code: string, change: IncidentChange) => write(api.incidentUpdates(code), 'POST', change),
      change: (code: string, change: { version: number; title?: string; startedAt?: string }) => write(api.incident(code), 'PATCH', change),
    }),
    [write],
  );
}

/** Planned works (server/operations): the list, one work with its reach and clashes, and the changes. */
import { useMemo } from 'react';
import { api } from '@/shared/api';
import type { Element } from '@/shared/schemas/analysis';
import type { WorkState } from '@/shared/schemas/operations';
import { workAnswerSchema, worksAnswerSchema } from '../operationsSchemas';
import { useApiQuery, useRecordWrites } from '../useApiQuery';

export const worksKey = (q: { from?: string; to?: string; state?: WorkState[] } = {}) => {
  const params = new URLSearchParams();
  if (q.from) params.set('from', q.from);
  if (q.to) params.set('to', q.to);
  if (q.state?.length) params.set('state', q.state.join(','));
  const s = params.toString();
  return s ? `${api.works}?${s}` : api.works;
};
export const workKey = (code: string) => api.work(code);
const isWorksKey = (key: unknown) => typeof key === 'string' && key.startsWith(api.works);

export function useWorks(q: { from?: string; to?: string; state?: WorkState[] } = {}) {
  return useApiQuery(worksKey(q), worksAnswerSchema, 'incident');
}

export function useWork(code: string | null) {
  return useApiQuery(code ? workKey(code) : null, workAnswerSchema, 'incident');
}

export interface WorkDraft {
  title: string;
  elements: Element[];
  start: string;
  end: string;
  notes?: string;
  submit?: boolean;
}

export function useWorkActions() {
  const { write, remove } = useRecordWrites(workAnswerSchema, isWorksKey);
  return useMemo(
    () => ({
      create: (draft: WorkDraft) => write(api.works, 'POST', draft),
      change: (code: string, change: Partial<WorkDraft> & { version: number }) => write(api.work(code), 'PATCH', change),
      approve: (code: string, version: number) => write(api.workApprove(code), 'POST', { version }),
      move: (code: string, to: WorkState, version: number) => write(api.workTransition(code), 'POST', { to, version }),
      remove: (code: string) => remove(api.work(code)),
    }),
    [write, remove],
  );
}

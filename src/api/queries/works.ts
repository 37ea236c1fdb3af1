/** Planned works (server/operations): the list, one work with its reach and clashes, and the changes. */
import { useMemo } from 'react';
import { useSWRConfig } from 'swr';
import { api } from '@/shared/api';
import type { Element } from '@/shared/schemas/analysis';
import type { WorkAnswer, WorkState } from '@/shared/schemas/operations';
import { useSend } from '../ApiProvider';
import { parseAnswer } from '../client';
import { workAnswerSchema, worksAnswerSchema } from '../operationsSchemas';
import { useApiQuery } from '../useApiQuery';

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
  const send = useSend();
  const { mutate } = useSWRConfig();
  return useMemo(() => {
    const done = async (path: string, answer: unknown): Promise<WorkAnswer> => {
      const w = parseAnswer(workAnswerSchema, path, answer);
      await mutate(isWorksKey);
      return w;
    };
    return {
      create: async (draft: WorkDraft) => done(api.works, await send(api.works, { method: 'POST', body: draft })),
      change: async (code: string, change: Partial<WorkDraft> & { version: number }) =>
        done(api.work(code), await send(api.work(code), { method: 'PATCH', body: change })),
      approve: async (code: string, version: number) => done(api.workApprove(code), await send(api.workApprove(code), { method: 'POST', body: { version } })),
      move: async (code: string, to: WorkState, version: number) =>
        done(api.workTransition(code), await send(api.workTransition(code), { method: 'POST', body: { to, version } })),
      remove: async (code: string) => {
        await send(api.work(code), { method: 'DELETE' });
        await mutate(isWorksKey);
      },
    };
  }, [send, mutate]);
}

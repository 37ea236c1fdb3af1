/** Service codes to names (GET /api/services), for labelling per-service figures. A network has tens of services, so one page holds them. */
import useSWR from 'swr';
import { api } from '@/shared/api';
import { useSend } from '../ApiProvider';
import { parseAnswer, type ApiError } from '../client';
import { freshness } from '../freshness';
import { codeNamePageSchema } from '../schemas';

export const serviceNamesKey = () => ['service-names', `${api.list('services')}?pageSize=200`] as const;

export function useServiceNames() {
  const send = useSend();
  return useSWR<Map<string, string>, ApiError>(
    serviceNamesKey(),
    async ([, path]: readonly [string, string]) => {
      const page = parseAnswer(codeNamePageSchema, path, await send(path));
      return new Map(page.items.map((s) => [s.code, s.name ?? s.code]));
    },
    freshness.network,
  );
}

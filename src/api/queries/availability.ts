/** Availability over a period (server/operations/availability.ts), and its CSV. */
import { useMemo } from 'react';
import { api } from '@/shared/api';
import { useSession } from '@/src/session/SessionProvider';
import { ApiError } from '../client';
import { availabilityAnswerSchema } from '../operationsSchemas';
import { useApiQuery } from '../useApiQuery';
import { attachmentName, type DownloadedFile } from './network';

export const availabilityKey = (from: string, to: string, service?: string, format?: 'csv') => {
  const p = new URLSearchParams({ from, to });
  if (service) p.set('service', service);
  if (format) p.set('format', format);
  return `${api.availability}?${p.toString()}`;
};

export function useAvailability(period: { from: string; to: string; service?: string } | null) {
  return useApiQuery(period ? availabilityKey(period.from, period.to, period.service) : null, availabilityAnswerSchema, 'network');
}

/** The same report as a CSV file (the bearer token rides along, so a plain link would not do). */
export function useAvailabilityCsv() {
  const { tokenRef } = useSession();
  return useMemo(
    () =>
      async (from: string, to: string, service?: string): Promise<DownloadedFile> => {
        const token = tokenRef.current;
        let res: Response;
        try {
          res = await fetch(availabilityKey(from, to, service, 'csv'), { headers: { Accept: 'text/csv', ...(token ? { Authorization: `Bearer ${token}` } : {}) } });
        } catch {
          throw new ApiError(0, 'network', 'Could not reach the Headwater server. Check the connection and try again.');
        }
        if (!res.ok) throw new ApiError(res.status, `http-${res.status}`, `The server answered ${res.status}.`);
        return { name: attachmentName(res.headers.get('Content-Disposition'), 'availability.csv'), blob: await res.blob() };
      },
    [tokenRef],
  );
}

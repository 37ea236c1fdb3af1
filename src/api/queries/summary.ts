import { api } from '@/shared/api';
import { summarySchema } from '../schemas';
import { useApiQuery } from '../useApiQuery';

export const summaryKey = () => api.summary;

/** Counts of the network's records and its version. */
export function useSummary() {
  return useApiQuery(summaryKey(), summarySchema, 'network');
}

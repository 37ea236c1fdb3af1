import { api } from '@/shared/api';
import { meAnswerSchema } from '../schemas';
import { useApiQuery } from '../useApiQuery';

export const meKey = () => api.me;

/** The signed-in person as the server sees them now (role changes show up here). */
export function useMe(enabled = true) {
  return useApiQuery(enabled ? meKey() : null, meAnswerSchema, 'account');
}

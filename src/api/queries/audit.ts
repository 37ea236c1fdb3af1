/** The audit log of network changes (GET /api/audit, admins only: shared/api.ts `can.manageUsers`). */
import { auditPageSchema } from '../schemas';
import { useApiQuery } from '../useApiQuery';

export const auditKeys = {
  /** `path` from src/screens/audit/auditView.ts auditApiPath (query string included) */
  page: (path: string) => path,
};

export function useAuditPage(path: string | null) {
  return useApiQuery(path ? auditKeys.page(path) : null, auditPageSchema, 'admin');
}

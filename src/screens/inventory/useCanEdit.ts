import { can } from '@/shared/api';
import { useSession } from '@/src/session/SessionProvider';

/**
 * Whether the signed-in person may change the network (shared/api.ts
 * `can.editNetwork`). Screens hide edit controls from everyone else; the
 * server refuses them anyway.
 */
export function useCanEdit(): boolean {
  const { user } = useSession();
  return !!user && can.editNetwork.includes(user.role);
}

/** Whether the signed-in person may add and delete documents (`can.editDocuments`: the desk too). */
export function useCanEditDocuments(): boolean {
  const { user } = useSession();
  return !!user && can.editDocuments.includes(user.role);
}

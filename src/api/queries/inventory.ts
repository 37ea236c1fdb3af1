/**
 * The inventory: lists and details of sites, services, groups, carriages and
 * feeds (GET /api/<kind>, GET /api/<kind>/:code) and their writes (POST,
 * PATCH with the version read, DELETE with ?version and ?cascade), as in
 * server/routes/inventory.ts.
 *
 * After a write every cached answer under /api/ except the account ones is
 * revalidated: a changed site moves lists, details, the summary and every
 * analysis (reach, exposure, checks), and naming each of them here would
 * miss the next one someone adds.
 */
import { useMemo } from 'react';
import { useSWRConfig } from 'swr';
import type { ZodType } from 'zod';
import { api } from '@/shared/api';
import type { EntityKind } from '@/shared/schemas/network';
import { useSend } from '../ApiProvider';
import { parseAnswer } from '../client';
import {
  carriageDetailSchema,
  feedDetailSchema,
  type CarriageDetail,
  type FeedDetail,
  type GroupDetail,
  type ServiceDetail,
  type SiteDetail,
  groupDetailSchema,
  pageOf,
  serviceDetailSchema,
  siteDetailSchema,
  storedEntitySchemas,
  type StoredEntities,
} from '../schemas';
import { useApiQuery } from '../useApiQuery';

export const inventoryKeys = {
  /** `path` is a list path built by src/screens/inventory/listQuery.ts (query string included). */
  list: (path: string) => path,
  detail: (kind: EntityKind, code: string) => api.entity(kind, code),
};

const listSchemas = {
  sites: pageOf(storedEntitySchemas.sites),
  services: pageOf(storedEntitySchemas.services),
  groups: pageOf(storedEntitySchemas.groups),
  carriages: pageOf(storedEntitySchemas.carriages),
  feeds: pageOf(storedEntitySchemas.feeds),
};

export const detailSchemas = {
  sites: siteDetailSchema,
  services: serviceDetailSchema,
  groups: groupDetailSchema,
  carriages: carriageDetailSchema,
  feeds: feedDetailSchema,
};

export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

/** One page of a list; `path` from listApiPath (null waits). */
export function useInventoryList<K extends EntityKind>(kind: K, path: string | null) {
  return useApiQuery(path ? inventoryKeys.list(path) : null, listSchemas[kind] as unknown as ZodType<Page<StoredEntities[K]>>, 'network');
}

export interface DetailOf {
  sites: SiteDetail;
  services: ServiceDetail;
  groups: GroupDetail;
  carriages: CarriageDetail;
  feeds: FeedDetail;
}

/** One record with its neighbours (null code waits). */
export function useEntityDetail<K extends EntityKind>(kind: K, code: string | null) {
  return useApiQuery(code ? inventoryKeys.detail(kind, code) : null, detailSchemas[kind] as unknown as ZodType<DetailOf[K]>, 'network');
}

/**
 * Keys that change when the network does: everything under /api/ but the
 * account and people answers. Array keys (a path plus its parameters) count
 * when any part is such a path.
 */
export function isNetworkKey(key: unknown): boolean {
  if (Array.isArray(key)) return key.some(isNetworkKey);
  return typeof key === 'string' && key.startsWith('/api/') && !key.startsWith('/api/auth') && !key.startsWith('/api/users');
}

export interface DeleteAnswer {
  deleted: Partial<Record<EntityKind, string[]>>;
  updated: Partial<Record<EntityKind, string[]>>;
  networkVersion: number;
}

/** Create, change and delete; each refreshes what the network change can touch once the server has answered. */
export function useInventoryActions() {
  const send = useSend();
  const { mutate } = useSWRConfig();
  return useMemo(() => {
    const refresh = (except?: string) => mutate((key: unknown) => isNetworkKey(key) && key !== except);
    return {
      refresh: () => refresh(),
      /** `confirm` names a warning the person accepted (server/services/inventory/editRules.ts), e.g. second-main-feed */
      create: async <K extends EntityKind>(kind: K, entity: Record<string, unknown>, confirm?: string): Promise<StoredEntities[K]> => {
        const path = `${api.list(kind)}${confirm ? `?confirm=${encodeURIComponent(confirm)}` : ''}`;
        const answer = parseAnswer(storedEntitySchemas[kind] as unknown as ZodType<StoredEntities[K]>, path, await send(path, { method: 'POST', body: entity }));
        await refresh();
        return answer;
      },
      update: async <K extends EntityKind>(kind: K, code: string, version: number, changes: Record<string, unknown>, confirm?: string): Promise<StoredEntities[K]> => {
        const path = `${api.entity(kind, code)}${confirm ? `?confirm=${encodeURIComponent(confirm)}` : ''}`;
        const answer = parseAnswer(storedEntitySchemas[kind] as unknown as ZodType<StoredEntities[K]>, path, await send(path, { method: 'PATCH', body: { ...changes, version } }));
        await refresh();
        return answer;
      },
      remove: async (kind: EntityKind, code: string, version: number, cascade: boolean, documents?: 'delete' | 'keep'): Promise<DeleteAnswer> => {
        const path = `${api.entity(kind, code)}?version=${version}${cascade ? '&cascade=true' : ''}${documents ? `&documents=${documents}` : ''}`;
        const answer = (await send(path, { method: 'DELETE' })) as DeleteAnswer;
        // The deleted record's own detail would answer 404 if revalidated; drop it instead.
        const gone = inventoryKeys.detail(kind, code);
        await mutate(gone, undefined, { revalidate: false });
        await refresh(gone);
        return answer;
      },
    };
  }, [send, mutate]);
}

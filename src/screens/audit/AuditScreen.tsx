/**
 * The audit log (admins only): every change to the network, newest first,
 * filtered by kind, a page at a time. Others see a plain "not allowed";
 * the server refuses them anyway.
 */
import { countOf } from '@/shared/format';
import { useLocalSearchParams, useRouter } from 'expo-router';
import { useMemo } from 'react';
import { StyleSheet, View } from 'react-native';
import { can } from '@/shared/api';
import { useAuditPage } from '@/src/api/queries/audit';
import { AUDIT_KINDS } from '@/src/api/schemas';
import { Choice } from '@/src/components/Choice';
import { Screen } from '@/src/components/layout/Screen';
import { Section } from '@/src/components/layout/Section';
import { EmptyState, ErrorState, LoadingState } from '@/src/components/states';
import { useSession } from '@/src/session/SessionProvider';
import { space } from '@/src/theme';
import { Pager } from '../inventory/parts/Pager';
import { AuditEntry } from './AuditEntry';
import { AUDIT_PAGE_SIZE, auditApiPath, auditFilterFromParams, type AuditKindFilter } from './auditView';

const ALL = 'all';
const KIND_LABEL: Record<AuditKindFilter, string> = { sites: 'sites', services: 'services', groups: 'groups', carriages: 'carriages', feeds: 'feeds', network: 'imports', people: 'people and sign-ins', works: 'planned works', incidents: 'incidents' };

export function AuditScreen() {
  const { user } = useSession();
  const allowed = !!user && can.manageUsers.includes(user.role);
  const params = useLocalSearchParams<Record<string, string>>();
  const router = useRouter();
  const filter = useMemo(() => auditFilterFromParams(params), [params]);
  const audit = useAuditPage(allowed ? auditApiPath(filter) : null);

  if (!allowed) {
    return (
      <Screen title="Audit log" testID="audit-screen">
        <EmptyState title="Not allowed" message="Only admins can read the log of changes to the network." testID="not-allowed" />
      </Screen>
    );
  }

  return (
    <Screen title="Audit log" subtitle="Who changed the network or the people, when, and what it was before; sign-ins too" testID="audit-screen">
      <Choice
        label="Kind"
        options={[{ value: ALL, label: 'all' }, ...AUDIT_KINDS.map((k) => ({ value: k, label: KIND_LABEL[k] }))]}
        value={filter.kind ?? ALL}
        onChange={(k) => router.setParams({ kind: k === ALL ? undefined : k, page: undefined })}
        testID="audit-kind"
      />
      <Section title={audit.data ? countOf(audit.data.total, 'change') : 'Changes'} note="Newest first" testID="audit-list">
        {audit.data ? (
          audit.data.total === 0 ? (
            <EmptyState title="No changes recorded" message={filter.kind ? 'Nothing of this kind has changed yet.' : 'Nothing has been recorded yet.'} testID="audit-empty" />
          ) : (
            <>
              <View style={styles.list}>
                {audit.data.items.map((item) => (
                  <AuditEntry key={item.id} item={item} />
                ))}
              </View>
              <Pager page={filter.page} pageSize={AUDIT_PAGE_SIZE} total={audit.data.total} noun="changes" onPage={(page) => router.setParams({ page: page === 1 ? undefined : String(page) })} />
            </>
          )
        ) : audit.error ? (
          <ErrorState what="the audit log" error={audit.error} onRetry={() => void audit.mutate()} />
        ) : (
          <LoadingState what="the audit log" />
        )}
      </Section>
    </Screen>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
});

/**
 * What every record's page shares: loading, a missing record, the record
 * itself (drawn by the kind's own body), and for engineers and admins the
 * edit form (`?edit=1`, so the back button leaves it), the record's own
 * change history and the delete steps.
 */
import { useLocalSearchParams, useRouter } from 'expo-router';
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import type { EntityKind } from '@/shared/schemas/network';
import { isApiError } from '@/src/api/client';
import { useEntityDetail, type DetailOf } from '@/src/api/queries/inventory';
import { Button } from '@/src/components/Button';
import { Screen } from '@/src/components/layout/Screen';
import { Section } from '@/src/components/layout/Section';
import { EmptyState, ErrorState, LoadingState } from '@/src/components/states';
import { space } from '@/src/theme';
import { EntityForm, type StoredRecord } from '../forms/EntityForm';
import { listHref, WORDS } from '../kinds';
import { DeletePanel } from '../parts/DeletePanel';
import { InventoryNav } from '../parts/InventoryNav';
import { LinkButton } from '../parts/LinkButton';
import { RecordHistory } from '../parts/RecordHistory';
import { useCanEdit } from '../useCanEdit';

export interface DetailFrameProps<K extends EntityKind> {
  kind: K;
  code: string;
  /** the page title once loaded, e.g. "Corrant Beacon" */
  title: (detail: DetailOf[K]) => string;
  subtitle?: (detail: DetailOf[K]) => string;
  children: (detail: DetailOf[K]) => ReactNode;
}

const capital = (s: string) => `${s[0].toUpperCase()}${s.slice(1)}`;

export function DetailFrame<K extends EntityKind>({ kind, code, title, subtitle, children }: DetailFrameProps<K>) {
  const params = useLocalSearchParams<{ edit?: string }>();
  const router = useRouter();
  const canEdit = useCanEdit();
  const detail = useEntityDetail(kind, code);
  const words = WORDS[kind];
  const record = detail.data ? ((detail.data as unknown as Record<string, unknown>)[words.one] as StoredRecord) : null;
  const editing = params.edit === '1' && canEdit;
  const reload = () => void detail.mutate();

  if (!detail.data) {
    const missing = isApiError(detail.error) && detail.error.status === 404;
    return (
      <Screen title={`${capital(words.one)} ${code}`} testID={`${kind}-detail-screen`}>
        <InventoryNav current={kind} />
        {missing ? (
          <EmptyState
            title={`No ${words.one} with code ${code}`}
            message="It may have been deleted or renamed in an import."
            action={<LinkButton href={listHref(kind)} label={`All ${words.many}`} />}
            testID="detail-missing"
          />
        ) : detail.error ? (
          <ErrorState what={`${words.one} ${code}`} error={detail.error} onRetry={reload} />
        ) : (
          <LoadingState what={`${words.one} ${code}`} />
        )}
      </Screen>
    );
  }

  const data = detail.data as DetailOf[K];
  if (editing && record) {
    return (
      <Screen title={`Edit ${words.one} ${code}`} testID={`${kind}-edit-screen`}>
        <InventoryNav current={kind} />
        <EntityForm
          kind={kind}
          stored={record}
          onSaved={() => router.setParams({ edit: undefined })}
          onCancel={() => router.setParams({ edit: undefined })}
          onReload={reload}
        />
      </Screen>
    );
  }

  return (
    <Screen
      title={title(data)}
      subtitle={subtitle ? subtitle(data) : `${capital(words.one)} ${code}`}
      actions={canEdit ? <Button label={`Edit ${words.one}`} variant="secondary" onPress={() => router.setParams({ edit: '1' })} testID="detail-edit" /> : undefined}
      testID={`${kind}-detail-screen`}
    >
      <InventoryNav current={kind} />
      {children(data)}
      <RecordHistory kind={kind} code={code} />
      {canEdit && record ? (
        <Section title="Remove" testID="detail-remove">
          <View style={styles.remove}>
            <DeletePanel kind={kind} code={code} version={record.version} onDeleted={() => router.replace(listHref(kind))} onReload={reload} />
          </View>
        </Section>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  remove: { gap: space.md, maxWidth: 720 },
});

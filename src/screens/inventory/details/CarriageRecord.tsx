/**
 * A carriage's page is its chain view (src/screens/chain); these are the
 * record parts it shares with every other record's page: "Edit carriage"
 * (`?edit=1`, so the back button leaves the form), the edit screen itself,
 * the delete steps with what the delete would take off air, and the
 * carriage's own change history for engineers and admins.
 */
import { useLocalSearchParams, useRouter } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { useEntityDetail } from '@/src/api/queries/inventory';
import { Button } from '@/src/components/Button';
import { Screen } from '@/src/components/layout/Screen';
import { Section } from '@/src/components/layout/Section';
import { ErrorState, LoadingState } from '@/src/components/states';
import { space } from '@/src/theme';
import { EntityForm, type StoredRecord } from '../forms/EntityForm';
import { listHref } from '../kinds';
import { DeletePanel } from '../parts/DeletePanel';
import { InventoryNav } from '../parts/InventoryNav';
import { RecordHistory } from '../parts/RecordHistory';
import { useCanEdit } from '../useCanEdit';

/** "Edit carriage" for the page's header; nothing for those who cannot edit. */
export function CarriageEditButton() {
  const router = useRouter();
  const canEdit = useCanEdit();
  if (!canEdit) return null;
  return <Button label="Edit carriage" variant="secondary" onPress={() => router.setParams({ edit: '1' })} testID="detail-edit" />;
}

/** Delete steps and history under the chain, for engineers and admins. */
export function CarriageRecordFooter({ code }: { code: string }) {
  const router = useRouter();
  const canEdit = useCanEdit();
  const detail = useEntityDetail('carriages', canEdit ? code : null);
  const record = detail.data?.carriage;
  if (!canEdit || !record) return null;
  return (
    <>
      <RecordHistory kind="carriages" code={code} />
      <Section title="Remove" testID="detail-remove">
        <View style={styles.remove}>
          <DeletePanel kind="carriages" code={code} version={record.version} onDeleted={() => router.replace(listHref('carriages'))} onReload={() => void detail.mutate()} />
        </View>
      </Section>
    </>
  );
}

/** The carriage's edit form on its own page (`/carriages/<code>?edit=1`). */
export function CarriageEditScreen({ code }: { code: string }) {
  const router = useRouter();
  const detail = useEntityDetail('carriages', code);
  const record = detail.data?.carriage as StoredRecord | undefined;
  const leave = () => router.setParams({ edit: undefined });
  return (
    <Screen title={`Edit carriage ${code}`} testID="carriages-edit-screen">
      <InventoryNav current="carriages" />
      {record ? (
        <EntityForm kind="carriages" stored={record} onSaved={leave} onCancel={leave} onReload={() => void detail.mutate()} />
      ) : detail.error ? (
        <ErrorState what={`carriage ${code}`} error={detail.error} onRetry={() => void detail.mutate()} />
      ) : (
        <LoadingState what={`carriage ${code}`} />
      )}
    </Screen>
  );
}

/** Whether the carriage page shows its edit form: `?edit=1` and a role that may edit. */
export function useCarriageEditing(): boolean {
  const { edit } = useLocalSearchParams<{ edit?: string }>();
  return useCanEdit() && edit === '1';
}

const styles = StyleSheet.create({
  remove: { gap: space.md, maxWidth: 720 },
});

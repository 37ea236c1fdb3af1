/**
 * One list screen for every kind of record (sites, services, groups,
 * carriages, feeds): search, sort, filters and paging kept in the URL, a
 * table on a wide screen and cards on a phone, each row opening its record.
 * `?new=1` turns the screen into the create form (prefilled from the list's
 * filters, so "add a carriage" from a site's page starts with the site);
 * `?edit=<code>` edits (or deletes) a record whose own page has no form of
 * its own: a carriage, whose page is its chain view.
 */
import { useLocalSearchParams, useRouter } from 'expo-router';
import { useMemo } from 'react';
import { StyleSheet, Text } from 'react-native';
import { api } from '@/shared/api';
import type { EntityKind } from '@/shared/schemas/network';
import { useEntityDetail, useInventoryList } from '@/src/api/queries/inventory';
import type { StoredEntities } from '@/src/api/schemas';
import { Button } from '@/src/components/Button';
import { DataTable } from '@/src/components/DataTable/DataTable';
import { Screen } from '@/src/components/layout/Screen';
import { Section } from '@/src/components/layout/Section';
import { EmptyState, ErrorState, LoadingState } from '@/src/components/states';
import { useBreakpoints } from '@/src/hooks/useBreakpoints';
import { type } from '@/src/theme';
import { EntityForm, type StoredRecord } from './forms/EntityForm';
import { FORM_FIELDS } from './forms/fields';
import { countOf, detailHref, listHref, WORDS } from './kinds';
import { LIST_PAGE_SIZE, listApiPath, listStateFromParams, routeParamsFor, type ListState } from './listQuery';
import { ROW_VIEWS } from './listRows';
import { DeletePanel } from './parts/DeletePanel';
import { InventoryNav } from './parts/InventoryNav';
import { ListControls } from './parts/ListControls';
import { Pager } from './parts/Pager';
import { RecordCards } from './parts/RecordCards';
import { useCanEdit } from './useCanEdit';

const SERVICES_PATH = `${api.list('services')}?page=1&pageSize=200&sort=code&order=asc`;
const capital = (s: string) => `${s[0].toUpperCase()}${s.slice(1)}`;

export function InventoryListScreen<K extends EntityKind>({ kind }: { kind: K }) {
  const params = useLocalSearchParams<Record<string, string>>();
  const router = useRouter();
  const canEdit = useCanEdit();
  const words = WORDS[kind];
  const state = useMemo(() => listStateFromParams(kind, params), [kind, params]);
  const creating = params.new === '1' && canEdit;
  const editing = typeof params.edit === 'string' && params.edit !== '' && canEdit ? params.edit : null;

  if (creating || editing) {
    const prefill: Record<string, string> = {};
    for (const f of FORM_FIELDS[kind]) if (state.filters[f.name]) prefill[f.name] = state.filters[f.name];
    return (
      <FormMode
        kind={kind}
        code={editing}
        prefill={prefill}
        onDone={(code) => (code ? router.replace(detailHref(kind, code)) : router.setParams({ new: undefined, edit: undefined }))}
        onDeleted={() => router.replace(listHref(kind))}
      />
    );
  }

  return (
    <Screen
      title={words.title}
      subtitle={`Inventory: ${words.many}`}
      actions={canEdit ? <Button label={`New ${words.one}`} onPress={() => router.setParams({ new: '1' })} testID="list-new" /> : undefined}
      testID={`${kind}-list-screen`}
    >
      <InventoryNav current={kind} />
      <ListBody kind={kind} state={state} onChange={(next) => router.setParams(routeParamsFor(kind, next))} />
    </Screen>
  );
}

function ListBody<K extends EntityKind>({ kind, state, onChange }: { kind: K; state: ListState; onChange: (next: ListState) => void }) {
  const { wide } = useBreakpoints();
  const router = useRouter();
  const list = useInventoryList(kind, listApiPath(kind, state));
  const needsServices = kind === 'carriages' || kind === 'feeds';
  const services = useInventoryList('services', needsServices ? SERVICES_PATH : null);
  const serviceCodes = useMemo(() => services.data?.items.map((s) => s.code) ?? [], [services.data]);
  const view = ROW_VIEWS[kind] as unknown as (typeof ROW_VIEWS)['sites'];
  const rows = (list.data?.items ?? []) as unknown as StoredEntities['sites'][];
  const words = WORDS[kind];
  const filtered = state.q.trim() !== '' || Object.keys(state.filters).length > 0;

  return (
    <>
      <ListControls kind={kind} state={state} services={serviceCodes} onChange={onChange} />
      <Section title={list.data ? countOf(kind, list.data.total) : capital(words.many)} note={filtered ? 'Matching the search and filters' : undefined} testID="list-results">
        {list.data ? (
          list.data.total === 0 ? (
            <EmptyState
              title={filtered ? `No ${words.many} match` : `No ${words.many} yet`}
              message={filtered ? 'Change the search text or the filters.' : `Add one with "New ${words.one}", or import a network document.`}
              testID="list-empty"
            />
          ) : (
            <>
              {wide ? (
                <DataTable
                  caption={capital(words.many)}
                  columns={view.columns}
                  rows={rows}
                  rowKey={(r) => r.code}
                  onRowPress={(r) => router.push(detailHref(kind, r.code))}
                  rowLabel={(r) => {
                    const l = view.card(r);
                    return `${capital(words.one)} ${l.code}, ${l.title}`;
                  }}
                  testID="list-table"
                />
              ) : (
                <RecordCards rows={rows} lines={view.card} href={(r) => detailHref(kind, r.code)} />
              )}
              <Pager page={state.page} pageSize={LIST_PAGE_SIZE} total={list.data.total} noun={words.many} onPage={(page) => onChange({ ...state, page })} />
            </>
          )
        ) : list.error ? (
          <ErrorState what={`the list of ${words.many}`} error={list.error} onRetry={() => void list.mutate()} />
        ) : (
          <LoadingState what={`the list of ${words.many}`} />
        )}
        {list.data && list.error ? <Text style={styles.stale}>Showing the last list received; refreshing it failed.</Text> : null}
      </Section>
    </>
  );
}

interface FormModeProps {
  kind: EntityKind;
  code: string | null;
  prefill: Record<string, string>;
  onDone: (code: string | null) => void;
  onDeleted: () => void;
}

function FormMode({ kind, code, prefill, onDone, onDeleted }: FormModeProps) {
  const words = WORDS[kind];
  const detail = useEntityDetail(kind, code);
  const record = detail.data ? ((detail.data as unknown as Record<string, unknown>)[words.one] as StoredRecord) : null;
  return (
    <Screen title={code ? `Edit ${words.one} ${code}` : `New ${words.one}`} testID={`${kind}-form-screen`}>
      <InventoryNav current={kind} />
      {!code ? (
        <EntityForm kind={kind} prefill={prefill} onSaved={(saved) => onDone(saved.code)} onCancel={() => onDone(null)} />
      ) : record ? (
        <>
          <EntityForm kind={kind} stored={record} onSaved={(saved) => onDone(saved.code)} onCancel={() => onDone(code)} onReload={() => void detail.mutate()} />
          <Section title="Remove" testID="detail-remove">
            <DeletePanel kind={kind} code={code} version={record.version} onDeleted={onDeleted} onReload={() => void detail.mutate()} />
          </Section>
        </>
      ) : detail.error ? (
        <ErrorState what={`${words.one} ${code}`} error={detail.error} onRetry={() => void detail.mutate()} />
      ) : (
        <LoadingState what={`${words.one} ${code}`} />
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  stale: { ...type.small },
});

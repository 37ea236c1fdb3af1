/**
 * A record's own change history (GET /api/<kind>/:code/history, from the
 * audit log), newest first, a page at a time: when (local time, zone
 * named), who, and each field that changed with its form label, before and
 * after. Shown to those who may edit the network (engineers and admins);
 * the server refuses everyone else anyway.
 */
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { formatCount, unitText } from '@/shared/format';
import type { EntityKind } from '@/shared/schemas/network';
import { useRecordHistory } from '@/src/api/queries/recordTools';
import { Section } from '@/src/components/layout/Section';
import { EmptyState, ErrorState, LoadingState } from '@/src/components/states';
import { localText } from '@/src/screens/operations/time';
import { colors, fonts, radius, space, type } from '@/src/theme';
import { FORM_FIELDS } from '../forms/fields';
import { WORDS } from '../kinds';
import { useCanEdit } from '../useCanEdit';
import { Pager } from './Pager';

const PAGE_SIZE = 20;
const ACTION_WORDS: Record<string, string> = { create: 'Created', update: 'Changed', delete: 'Deleted', import: 'Imported' };

function valueText(v: unknown): string {
  if (v === undefined || v === null) return 'not set';
  if (Array.isArray(v)) return v.length ? v.join('; ') : 'none';
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  if (typeof v === 'number') return v.toLocaleString('en-GB', { maximumFractionDigits: 6 });
  return String(v);
}

export function RecordHistory({ kind, code }: { kind: EntityKind; code: string }) {
  const canEdit = useCanEdit();
  const [page, setPage] = useState(1);
  const history = useRecordHistory(kind, canEdit ? code : null, page);
  if (!canEdit) return null;
  const labels = new Map(FORM_FIELDS[kind].map((f) => [f.name, f.unit ? `${f.label} (${unitText(f.unit)})` : f.label]));
  const data = history.data;
  return (
    <Section title="Change history" note={`Each change to this ${WORDS[kind].one}, newest first, from the audit log.`} testID="record-history">
      {data ? (
        data.total === 0 ? (
          <EmptyState title="No changes recorded" message={`This ${WORDS[kind].one} came in with an import, and nobody has changed it since.`} testID="record-history-empty" />
        ) : (
          <>
            <View style={styles.list}>
              {data.items.map((item) => (
                <View key={item.id} style={styles.entry} testID="record-history-entry">
                  <Text style={styles.what}>{ACTION_WORDS[item.action] ?? item.action}</Text>
                  <Text style={styles.meta}>{`${localText(item.at)} · by ${item.userEmail ?? 'unknown'}${item.networkVersion !== null ? ` · network version ${formatCount(item.networkVersion)}` : ''}`}</Text>
                  {item.action === 'update'
                    ? item.changes.map((c) => (
                        <Text key={c.field} style={styles.change} selectable>
                          {`${labels.get(c.field) ?? c.field}: ${valueText(c.before)} → ${valueText(c.after)}`}
                        </Text>
                      ))
                    : null}
                </View>
              ))}
            </View>
            <Pager page={page} pageSize={PAGE_SIZE} total={data.total} noun="changes" onPage={setPage} testID="record-history-pager" />
          </>
        )
      ) : history.error ? (
        <ErrorState what="the change history" error={history.error} onRetry={() => void history.mutate()} />
      ) : (
        <LoadingState what="the change history" />
      )}
    </Section>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm, maxWidth: 720 },
  entry: { gap: space.xs, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.surface },
  what: { ...type.label },
  meta: { ...type.small },
  change: { fontFamily: fonts.mono, fontSize: 15, lineHeight: 22, color: colors.ink },
});

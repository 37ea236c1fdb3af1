/**
 * One change in the audit log: who, when, what was done to which record,
 * and on request the record's fields before and after, the changed ones
 * marked by a word and a bar, not by colour alone.
 */
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { EntityKind } from '@/shared/schemas/network';
import type { AuditItem } from '@/src/api/schemas';
import { Badge, type Tone } from '@/src/components/Badge';
import { Button } from '@/src/components/Button';
import { colors, fonts, radius, space, type } from '@/src/theme';
import { whenText } from '@/shared/format';
import { FORM_FIELDS } from '../inventory/forms/fields';
import { detailHref, WORDS } from '../inventory/kinds';
import { CodeLink } from '../inventory/parts/CodeLink';
import { fieldChanges } from './auditView';

const ACTION_TONE: Record<AuditItem['action'], Tone> = {
  create: 'good',
  update: 'accent',
  delete: 'bad',
  import: 'neutral',
  invite: 'good',
  'role-change': 'accent',
  disable: 'bad',
  enable: 'good',
  'password-change': 'neutral',
  'password-set': 'accent',
  'sign-in': 'neutral',
  'sign-in-failed': 'bad',
  'sign-out': 'neutral',
};
const ACTION_WORD: Record<AuditItem['action'], string> = {
  create: 'created',
  update: 'changed',
  delete: 'deleted',
  import: 'imported',
  invite: 'invited',
  'role-change': 'role changed',
  disable: 'disabled',
  enable: 'enabled',
  'password-change': 'own password changed',
  'password-set': 'temporary password set',
  'sign-in': 'signed in',
  'sign-in-failed': 'sign-in refused',
  'sign-out': 'signed out everywhere',
};

const OTHER_WORD: Record<string, string> = { network: 'network', people: 'account', works: 'planned work', incidents: 'incident' };
const isEntity = (kind: AuditItem['entityKind']): kind is EntityKind => !(kind in OTHER_WORD);
const kindWord = (kind: AuditItem['entityKind']) => (isEntity(kind) ? WORDS[kind].one : OTHER_WORD[kind]);

export function AuditEntry({ item }: { item: AuditItem }) {
  const [open, setOpen] = useState(false);
  const kind = item.entityKind;
  const order = isEntity(kind) ? ['code', ...FORM_FIELDS[kind].map((f) => f.name), 'version'] : [];
  const changes = open ? fieldChanges(item.before, item.after, order) : [];
  // Only an update has two sides to compare; a create or delete has one.
  const compare = item.action === 'update';
  const linkable = item.entityCode && isEntity(kind) && item.action !== 'delete';
  return (
    <View style={styles.card} testID={`audit-${item.id}`}>
      <View style={styles.head}>
        <Badge label={ACTION_WORD[item.action]} tone={ACTION_TONE[item.action]} />
        <Text style={styles.what}>{kindWord(item.entityKind)}</Text>
        {item.entityCode ? (
          linkable ? (
            <CodeLink href={detailHref(item.entityKind as EntityKind, item.entityCode)} code={item.entityCode} label={`${kindWord(item.entityKind)} ${item.entityCode}`} />
          ) : (
            <Text style={styles.code}>{item.entityCode}</Text>
          )
        ) : null}
      </View>
      <Text style={styles.meta}>{`${whenText(item.at)} · by ${item.userEmail ?? (item.entityKind === 'people' ? 'nobody signed in' : 'unknown')}${item.networkVersion !== null ? ` · network version ${item.networkVersion}` : ''}`}</Text>
      <Button
        label={open ? 'Hide before and after' : 'Show before and after'}
        variant="quiet"
        onPress={() => setOpen((o) => !o)}
        accessibilityLabel={`${open ? 'Hide' : 'Show'} before and after of change ${item.id}`}
        testID={`audit-${item.id}-toggle`}
        style={styles.toggle}
      />
      {open ? (
        <View style={styles.table} testID={`audit-${item.id}-changes`}>
          <View style={[styles.row, styles.headRow]}>
            <Text style={[styles.cell, styles.field, styles.headText]}>Field</Text>
            <Text style={[styles.cell, styles.headText]}>Before</Text>
            <Text style={[styles.cell, styles.headText]}>After</Text>
          </View>
          {changes.length === 0 ? <Text style={styles.meta}>No fields recorded.</Text> : null}
          {changes.map((c) => (
            <View key={c.field} style={[styles.row, compare && c.changed && styles.changedRow]}>
              <Text style={[styles.cell, styles.field]}>{compare && c.changed ? `${c.field} (changed)` : c.field}</Text>
              <Text style={[styles.cell, styles.value]} selectable>
                {c.before}
              </Text>
              <Text style={[styles.cell, styles.value]} selectable>
                {c.after}
              </Text>
            </View>
          ))}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.xs, padding: space.md, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.surface },
  head: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', columnGap: space.sm },
  what: { ...type.label },
  code: { fontFamily: fonts.mono, fontSize: 16, color: colors.ink },
  meta: { ...type.small },
  toggle: { alignSelf: 'flex-start', paddingHorizontal: 0 },
  table: { borderTopWidth: 1, borderTopColor: colors.line },
  row: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: colors.line, borderLeftWidth: 4, borderLeftColor: 'transparent' },
  headRow: { backgroundColor: colors.sunken },
  changedRow: { borderLeftColor: colors.accent, backgroundColor: colors.accentSoft },
  cell: { flex: 1, padding: space.xs, ...type.small, color: colors.ink },
  headText: { fontFamily: fonts.textBold },
  field: { flex: 0.8, fontFamily: fonts.mono },
  value: { fontFamily: fonts.mono, fontVariant: ['tabular-nums'] },
});

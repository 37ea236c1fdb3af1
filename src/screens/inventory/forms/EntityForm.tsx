/**
 * The create and edit form of any kind of record, drawn from its field list
 * (./fields.ts). Each field is checked with the shared schema as soon as the
 * person leaves it (and all of them on saving), so the message the server
 * would give appears under the field before anything is sent. What the
 * server still refuses lands under its field too (./serverErrors.ts). An
 * edit sends the version it started from; if someone saved in between, the
 * form says so and offers to reload the stored record.
 *
 * It also does the typing it can (./formAssist.ts): a new carriage's or
 * feed's code is proposed from its site and service or its target and role
 * until the person types one; a carriage's channel fills its frequency and is
 * checked against the bands of its service's kind. A second main feed into
 * one carriage is saved only after the person confirms the server's warning.
 */
import { useMemo, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { CODE_PATTERN, type EntityKind } from '@/shared/schemas/network';
import { isApiError } from '@/src/api/client';
import { useEntityDetail, useInventoryActions } from '@/src/api/queries/inventory';
import { Button } from '@/src/components/Button';
import { Card } from '@/src/components/Card';
import { colors, fonts, radius, space, type } from '@/src/theme';
import { WORDS } from '../kinds';
import { FORM_FIELDS } from './fields';
import { bandErrors, frequencyForChannel, proposedCode } from './formAssist';
import { FormField } from './FormField';
import { changesBetween, checkDraft, draftFromEntity, emptyDraft, type Draft, type Entity, type FieldErrors } from './formValues';
import { refusalFromError } from './serverErrors';

export interface StoredRecord extends Entity {
  code: string;
  version: number;
}

export interface EntityFormProps {
  kind: EntityKind;
  /** the record being edited; absent for a new one */
  stored?: StoredRecord | null;
  /** starting text for a new record's fields, e.g. { site: 'R-ARV' } */
  prefill?: Record<string, string>;
  onSaved: (saved: StoredRecord) => void;
  onCancel: () => void;
  /** asks the detail page to fetch the record again */
  onReload?: () => void;
}

/** The warning a second main feed into one carriage raises (server/services/inventory/editRules.ts). */
const SECOND_MAIN = 'second-main-feed';

export function EntityForm({ kind, stored, prefill, onSaved, onCancel, onReload }: EntityFormProps) {
  const actions = useInventoryActions();
  const fields = FORM_FIELDS[kind];
  const names = useMemo(() => fields.map((f) => f.name), [fields]);
  const [base, setBase] = useState<StoredRecord | null>(stored ?? null);
  const [draft, setDraft] = useState<Draft>(() => (stored ? draftFromEntity(kind, stored) : { ...emptyDraft(kind), ...(prefill ?? {}) }));
  const [touched, setTouched] = useState<Set<string>>(new Set());
  const [submitted, setSubmitted] = useState(false);
  const [server, setServer] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [stale, setStale] = useState<{ current?: Entity } | null>(null);
  const [note, setNote] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  /** the code as proposed, until the person types their own */
  const [ownCode, setOwnCode] = useState(!!stored);
  /** the frequency as filled from the channel, until the person types their own */
  const [ownFrequency, setOwnFrequency] = useState(!!stored);
  /** the server's reason to confirm a second main feed */
  const [secondMain, setSecondMain] = useState<string | null>(null);

  const serviceCode = kind === 'carriages' && typeof draft.service === 'string' && CODE_PATTERN.test(draft.service.trim()) ? draft.service.trim() : null;
  const serviceKind = useEntityDetail('services', serviceCode).data?.service.kind;

  const checked = useMemo(() => checkDraft(kind, draft), [kind, draft]);
  const bands = useMemo(() => bandErrors(kind, draft, serviceKind), [kind, draft, serviceKind]);
  const localErrors: FieldErrors = { ...bands, ...(checked.ok ? {} : checked.errors) };
  const errorOf = (name: string) => server[name] ?? (submitted || touched.has(name) ? localErrors[name] : undefined);

  const set = (name: string, value: string | boolean) => {
    if (name === 'code') setOwnCode(true);
    if (name === 'frequencyMHz') setOwnFrequency(true);
    if (name === 'role' || name === 'to') setSecondMain(null);
    setDraft((d) => {
      const next: Draft = { ...d, [name]: value };
      const code = ownCode ? null : proposedCode(kind, next);
      if (code && name !== 'code') next.code = code;
      const frequency = name === 'channel' && !ownFrequency ? frequencyForChannel(serviceKind, value) : null;
      if (frequency) next.frequencyMHz = frequency;
      return next;
    });
    setServer(({ [name]: _gone, ...rest }) => rest);
    setNote(null);
  };
  const leave = (name: string) => setTouched((t) => (t.has(name) ? t : new Set(t).add(name)));

  async function save(confirm?: string) {
    setSubmitted(true);
    setFormError(null);
    setNote(null);
    if (!checked.ok) {
      if (checked.errors.form) setFormError(checked.errors.form);
      return;
    }
    if (Object.keys(bands).length > 0) return;
    let changes: Entity | null = null;
    if (base) {
      changes = changesBetween(kind, base, checked.entity);
      if (Object.keys(changes).length === 0) {
        setNote('Nothing to save: no field differs from the stored record.');
        return;
      }
    }
    setBusy(true);
    try {
      const saved = base ? await actions.update(kind, base.code, base.version, changes!, confirm) : await actions.create(kind, checked.entity, confirm);
      setSecondMain(null);
      onSaved(saved as unknown as StoredRecord);
    } catch (e) {
      if (isApiError(e) && e.code === SECOND_MAIN) {
        const d = (e.details ?? {}) as { carriage?: string; mainFeeds?: string[] };
        setSecondMain(`Carriage ${d.carriage ?? ''} already has a main feed (${(d.mainFeeds ?? []).join(', ')}). A second one is unusual, and is often a reserve feed entered as main.`);
        return;
      }
      const refusal = refusalFromError(e, names);
      setServer(refusal.fields);
      setFormError(refusal.form ?? null);
      setStale(refusal.stale ?? null);
    } finally {
      setBusy(false);
    }
  }

  function reload() {
    const current = stale?.current;
    if (current && typeof current.version === 'number') {
      const record = current as StoredRecord;
      setBase(record);
      setDraft(draftFromEntity(kind, record));
    }
    setStale(null);
    setFormError(null);
    setServer({});
    setSubmitted(false);
    setTouched(new Set());
    onReload?.();
  }

  const one = WORDS[kind].one;
  const marked = submitted ? names.filter((n) => errorOf(n)).length : 0;
  return (
    <Card testID={`${kind}-form`}>
      <View style={styles.fields}>
        {fields.map((f) => (
          <FormField
            key={f.name}
            spec={f}
            value={draft[f.name]}
            error={errorOf(f.name)}
            locked={!!base && f.name === 'code'}
            onChange={(v) => set(f.name, v)}
            onLeave={() => leave(f.name)}
            kind={kind}
            receiving={kind === 'feeds' && typeof draft.to === 'string' ? draft.to : null}
          />
        ))}
      </View>
      {secondMain ? (
        <View style={styles.stale} accessibilityRole="alert" testID="form-second-main">
          <Text style={styles.staleText}>{`⚠ A second main feed. ${secondMain}`}</Text>
          <Text style={styles.note}>Choose "reserve feed" under "Main or reserve" above, or save it as a second main feed if both are meant to carry the programme.</Text>
          <Button label="Save as a second main feed" variant="secondary" busy={busy} onPress={() => void save(SECOND_MAIN)} testID="form-confirm-second-main" style={styles.left} />
        </View>
      ) : null}
      {stale ? (
        <View style={styles.stale} accessibilityRole="alert" testID="form-stale">
          <Text style={styles.staleText}>{`⚠ Someone changed this since you opened it. Reload to see the stored ${one}; what you typed here will be replaced.`}</Text>
          <Button label="Reload" icon="retry" variant="secondary" onPress={reload} testID="form-reload" style={styles.left} />
        </View>
      ) : formError ? (
        <Text style={styles.failure} accessibilityRole="alert" testID="form-error">
          {`⚠ ${formError}`}
        </Text>
      ) : marked > 0 ? (
        <Text style={styles.failure} accessibilityRole="alert" testID="form-marked">
          {`⚠ ${marked === 1 ? 'One field needs' : `${marked} fields need`} a change: see the ${marked === 1 ? 'message' : 'messages'} above.`}
        </Text>
      ) : null}
      <View style={styles.buttons}>
        <Button label={`Save ${one}`} onPress={() => void save()} busy={busy} disabled={!!secondMain} testID="form-save" />
        <Button label="Cancel" variant="quiet" onPress={onCancel} testID="form-cancel" />
      </View>
      {note ? (
        <Text style={styles.note} accessibilityLiveRegion="polite" testID="form-note">
          {note}
        </Text>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  fields: { gap: space.lg, maxWidth: 640 },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, marginTop: space.md },
  left: { alignSelf: 'flex-start' },
  failure: { ...type.body, color: colors.bad, fontFamily: fonts.textBold },
  stale: { gap: space.sm, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderLeftWidth: 6, borderColor: colors.warn, backgroundColor: colors.warnSoft },
  staleText: { ...type.body, fontFamily: fonts.textBold, color: colors.ink },
  note: { ...type.body, color: colors.inkMuted },
});

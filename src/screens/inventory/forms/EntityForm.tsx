/**
 * The create and edit form of any kind of record, drawn from its field list
 * (./fields.ts). Each field is checked with the shared schema as soon as the
 * person leaves it (and all of them on saving), so the message the server
 * would give appears under the field before anything is sent. What the
 * server still refuses lands under its field too (./serverErrors.ts). An
 * edit sends the version it started from; if someone saved in between, the
 * form says so and offers to reload the stored record.
 */
import { useMemo, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { EntityKind } from '@/shared/schemas/network';
import { useInventoryActions } from '@/src/api/queries/inventory';
import { Button } from '@/src/components/Button';
import { Card } from '@/src/components/Card';
import { Choice } from '@/src/components/Choice';
import { TextField } from '@/src/components/TextField';
import { colors, fonts, radius, space, type } from '@/src/theme';
import { WORDS } from '../kinds';
import { FORM_FIELDS, type FieldSpec } from './fields';
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

const NOT_SET = '';

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

  const checked = useMemo(() => checkDraft(kind, draft), [kind, draft]);
  const localErrors: FieldErrors = checked.ok ? {} : checked.errors;
  const errorOf = (name: string) => server[name] ?? (submitted || touched.has(name) ? localErrors[name] : undefined);

  const set = (name: string, value: string | boolean) => {
    setDraft((d) => ({ ...d, [name]: value }));
    setServer(({ [name]: _gone, ...rest }) => rest);
    setNote(null);
  };
  const leave = (name: string) => setTouched((t) => (t.has(name) ? t : new Set(t).add(name)));

  async function save() {
    setSubmitted(true);
    setFormError(null);
    setNote(null);
    if (!checked.ok) {
      if (checked.errors.form) setFormError(checked.errors.form);
      return;
    }
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
      const saved = base ? await actions.update(kind, base.code, base.version, changes!) : await actions.create(kind, checked.entity);
      onSaved(saved as unknown as StoredRecord);
    } catch (e) {
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
          <Field key={f.name} spec={f} value={draft[f.name]} error={errorOf(f.name)} locked={!!base && f.name === 'code'} onChange={(v) => set(f.name, v)} onLeave={() => leave(f.name)} kind={kind} />
        ))}
      </View>
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
        <Button label={`Save ${one}`} onPress={() => void save()} busy={busy} testID="form-save" />
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

interface FieldProps {
  kind: EntityKind;
  spec: FieldSpec;
  value: string | boolean | undefined;
  error?: string;
  locked: boolean;
  onChange: (value: string | boolean) => void;
  onLeave: () => void;
}

function Field({ kind, spec, value, error, locked, onChange, onLeave }: FieldProps) {
  const testID = `field-${kind}-${spec.name}`;
  if (spec.type === 'choice') {
    const options = (spec.options ?? []).map((o) => ({ value: o, label: spec.optionLabels?.[o] ?? o }));
    if (!spec.required) options.unshift({ value: NOT_SET, label: 'not set' });
    return (
      <Choice
        label={spec.label}
        options={options}
        value={typeof value === 'string' ? value : NOT_SET}
        onChange={(v) => {
          onChange(v);
          onLeave();
        }}
        error={error}
        testID={testID}
      />
    );
  }
  if (spec.type === 'flag') {
    return (
      <View style={styles.flag}>
        <Choice
          label={spec.label}
          options={[
            { value: 'no', label: 'no' },
            { value: 'yes', label: 'yes' },
          ]}
          value={value === true ? 'yes' : 'no'}
          onChange={(v) => onChange(v === 'yes')}
          error={error}
          testID={testID}
        />
        {spec.hint ? <Text style={styles.hint}>{spec.hint}</Text> : null}
      </View>
    );
  }
  const numeric = spec.type === 'number' || spec.type === 'int';
  return (
    <TextField
      label={spec.label}
      value={typeof value === 'string' ? value : ''}
      onChangeText={onChange}
      onBlur={onLeave}
      error={error}
      hint={locked ? 'The code cannot change: other records and the audit log refer to it.' : spec.hint}
      editable={!locked}
      mono={spec.type === 'code' || spec.type === 'codes' || numeric}
      autoCapitalize={spec.type === 'text' ? 'sentences' : 'none'}
      autoCorrect={spec.type === 'text'}
      // Latitude and longitude need a minus sign, which a phone's decimal pad lacks.
      inputMode={numeric ? (spec.name === 'lat' || spec.name === 'lon' ? 'text' : 'decimal') : 'text'}
      testID={testID}
    />
  );
}

const styles = StyleSheet.create({
  fields: { gap: space.lg, maxWidth: 640 },
  flag: { gap: space.xs },
  hint: { ...type.small },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, marginTop: space.md },
  left: { alignSelf: 'flex-start' },
  failure: { ...type.body, color: colors.bad, fontFamily: fonts.textBold },
  stale: { gap: space.sm, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderLeftWidth: 6, borderColor: colors.warn, backgroundColor: colors.warnSoft },
  staleText: { ...type.body, fontFamily: fonts.textBold, color: colors.ink },
  note: { ...type.body, color: colors.inkMuted },
});

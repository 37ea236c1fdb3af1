/**
 * One field of the record form (./EntityForm.tsx), drawn by its type: a
 * choice, a yes/no, a searchable picker for codes (./CodePicker.tsx, or
 * ./CodeListPicker.tsx for a list), or a text field.
 */
import { StyleSheet, Text, View } from 'react-native';
import type { EntityKind } from '@/shared/schemas/network';
import { Choice } from '@/src/components/Choice';
import { TextField } from '@/src/components/TextField';
import { space, type } from '@/src/theme';
import { CodeListPicker } from './CodeListPicker';
import { CodePicker, type PickerSource } from './CodePicker';
import type { FieldSpec } from './fields';

const NOT_SET = '';

export interface FieldProps {
  kind: EntityKind;
  spec: FieldSpec;
  value: string | boolean | undefined;
  error?: string;
  locked: boolean;
  onChange: (value: string | boolean) => void;
  onLeave: () => void;
  /** for a feed's source carriage: the receiving carriage, so the nearest come first */
  receiving?: string | null;
}

export function FormField({ kind, spec, value, error, locked, onChange, onLeave, receiving }: FieldProps) {
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
  const text = typeof value === 'string' ? value : '';
  if (spec.picker) {
    const source: PickerSource = spec.picker === 'sources' ? { kind: 'sources', carriage: receiving?.trim() || null } : { kind: spec.picker };
    if (spec.type === 'codes') {
      return <CodeListPicker label={spec.label} value={text} onChange={onChange} onLeave={onLeave} source={source} error={error} hint={spec.hint} isSet={spec.isSet} testID={testID} />;
    }
    return <CodePicker label={spec.label} value={text} onChange={onChange} onLeave={onLeave} source={source} error={error} hint={spec.hint} testID={testID} />;
  }
  const numeric = spec.type === 'number' || spec.type === 'int';
  return (
    <TextField
      label={spec.label}
      value={text}
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
  flag: { gap: space.xs },
  hint: { ...type.small },
});

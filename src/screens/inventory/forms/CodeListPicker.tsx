/**
 * A list of codes picked one at a time (a record's shared-risk groups, a
 * feed's via-sites in path order): each chosen code is a row with its own
 * "Remove" button, and a search field below adds the next one
 * (./CodePicker.tsx). The form keeps the list as its usual "A; B" text.
 */
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { Button } from '@/src/components/Button';
import { colors, fonts, radius, space, type } from '@/src/theme';
import { CodePicker, type PickerSource } from './CodePicker';
import { splitCodes } from './formValues';

export interface CodeListPickerProps {
  label: string;
  value: string;
  onChange: (text: string) => void;
  onLeave: () => void;
  source: PickerSource;
  error?: string;
  hint?: string;
  /** a set (groups): a code is listed once; a path (via-sites) keeps order */
  isSet?: boolean;
  testID: string;
}

export function CodeListPicker({ label, value, onChange, onLeave, source, error, hint, isSet, testID }: CodeListPickerProps) {
  const [search, setSearch] = useState('');
  const codes = splitCodes(value, isSet);
  const write = (next: string[]) => {
    onChange(next.join('; '));
    onLeave();
  };
  return (
    <View style={styles.wrap} testID={`${testID}-list`}>
      {codes.length > 0 ? (
        <View style={styles.chosen} accessibilityRole="list" accessibilityLabel={`${label}: chosen`}>
          {codes.map((code, i) => (
            <View key={`${code}-${i}`} style={styles.row}>
              <Text style={styles.code}>{isSet ? code : `${i + 1}. ${code}`}</Text>
              <Button label="Remove" accessibilityLabel={`Remove ${code} from ${label}`} variant="quiet" onPress={() => write(codes.filter((_c, j) => j !== i))} testID={`${testID}-remove`} />
            </View>
          ))}
        </View>
      ) : null}
      <CodePicker
        label={label}
        value={search}
        onChange={setSearch}
        onLeave={() => undefined}
        onPick={(code) => {
          write([...codes, code]);
          setSearch('');
        }}
        exclude={isSet ? codes : undefined}
        source={source}
        error={error}
        hint={hint}
        testID={testID}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  chosen: { gap: space.xs },
  row: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm, paddingLeft: space.md, borderRadius: radius.md, backgroundColor: colors.sunken },
  code: { fontFamily: fonts.mono, fontSize: 15, color: colors.ink, ...{ lineHeight: type.small.lineHeight } },
});

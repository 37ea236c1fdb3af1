/**
 * Choosing the files to import, on the web: a real <input type="file">, so
 * the browser's own picker, drag and drop onto it and automation
 * (setInputFiles) all work, under a visible label that is its accessible name.
 */
import { createElement, useId } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { UploadFile } from '@/src/api/queries/network';
import { colors, fonts, space, type } from '@/src/theme';
import { ACCEPTED_TYPES, type FilePickerProps } from './filePickerTypes';

export function FilePicker({ label, onPick, disabled, testID }: FilePickerProps) {
  const id = useId();
  return (
    <View style={styles.wrap}>
      {createElement('label', { htmlFor: id, style: labelStyle }, label)}
      {createElement('input', {
        id,
        type: 'file',
        multiple: true,
        accept: ACCEPTED_TYPES.join(','),
        disabled,
        'data-testid': testID,
        style: inputStyle,
        onChange: (event: { target: HTMLInputElement }) => {
          const list = Array.from(event.target.files ?? []);
          const files: UploadFile[] = list.map((f) => ({ name: f.name, size: f.size, part: f }));
          if (files.length) onPick(files);
        },
      })}
      <Text style={styles.hint}>A network document (.json), one or more CSV files named after their kind (sites.csv, feeds.csv, ...), or a .zip of them.</Text>
    </View>
  );
}

const labelStyle = { fontFamily: fonts.textBold, fontSize: 15, lineHeight: '20px', color: colors.ink };
const inputStyle = {
  minHeight: 48,
  padding: space.sm,
  border: `2px solid ${colors.lineStrong}`,
  borderRadius: 8,
  background: colors.surface,
  fontFamily: fonts.text,
  fontSize: 16,
  color: colors.ink,
  maxWidth: '100%',
  boxSizing: 'border-box' as const,
};

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  hint: { ...type.small },
});

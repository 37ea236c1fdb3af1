/**
 * Choosing the files to import on a phone: the system document picker
 * (expo-document-picker). The web uses FilePicker.web.tsx.
 */
import * as DocumentPicker from 'expo-document-picker';
import { StyleSheet, Text, View } from 'react-native';
import { Button } from '@/src/components/Button';
import { space, type } from '@/src/theme';
import { ACCEPTED_TYPES, type FilePickerProps } from './filePickerTypes';

export function FilePicker({ label, onPick, disabled, testID }: FilePickerProps) {
  async function pick() {
    const result = await DocumentPicker.getDocumentAsync({ multiple: true, type: ACCEPTED_TYPES.filter((t) => t.includes('/')) as string[], copyToCacheDirectory: true });
    if (result.canceled) return;
    onPick(
      result.assets.map((a) => ({
        name: a.name,
        size: a.size ?? null,
        part: { uri: a.uri, name: a.name, type: a.mimeType ?? 'application/octet-stream' },
      })),
    );
  }
  return (
    <View style={styles.wrap}>
      <Button label={label} variant="secondary" onPress={() => void pick()} disabled={disabled} testID={testID} style={styles.left} />
      <Text style={styles.hint}>A network document (.json), one or more CSV files named after their kind (sites.csv, feeds.csv, ...), or a .zip of them.</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  left: { alignSelf: 'flex-start' },
  hint: { ...type.small },
});

/** Copies the full address of this failure set, so it can be sent to whoever must act. */
import * as Clipboard from 'expo-clipboard';
import * as Linking from 'expo-linking';
import { useEffect, useState } from 'react';
import { Platform, StyleSheet, Text, View } from 'react-native';
import type { Element } from '@/shared/schemas/analysis';
import { Button } from '@/src/components/Button';
import { colors, space, type } from '@/src/theme';
import { reachUrl } from './failSet';

function appOrigin(): string {
  if (Platform.OS === 'web' && typeof window !== 'undefined') return window.location.origin;
  // On a device the app's own scheme opens the same screen.
  return Linking.createURL('').replace(/\/$/, '');
}

export function CopyLinkButton({ elements }: { elements: readonly Element[] }) {
  const [said, setSaid] = useState<string | null>(null);
  // A failure is said in the error colour, never the success green.
  const [failed, setFailed] = useState(false);
  useEffect(() => {
    if (!said) return;
    const t = setTimeout(() => setSaid(null), 4000);
    return () => clearTimeout(t);
  }, [said]);
  const url = reachUrl(appOrigin(), elements);
  return (
    <View style={styles.wrap}>
      <Button
        label="Copy link"
        variant="secondary"
        testID="reach-copy-link"
        onPress={async () => {
          try {
            await Clipboard.setStringAsync(url);
            setFailed(false);
            setSaid('Link copied.');
          } catch {
            setFailed(true);
            setSaid(`Could not copy. The link is: ${url}`);
          }
        }}
      />
      <Text style={[styles.said, failed && styles.failed]} accessibilityLiveRegion="polite" testID="reach-copy-status">
        {said ?? ''}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xxs, alignItems: 'flex-end' },
  said: { ...type.small, color: colors.good, minHeight: 20 },
  failed: { color: colors.bad },
});

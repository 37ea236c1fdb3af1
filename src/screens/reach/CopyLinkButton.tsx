/**
 * Copies the full address of this failure set, so it can be sent to whoever
 * must act; beside it, Share opens the device's own share sheet (the Web
 * Share API in a browser that has it, the system sheet in the app).
 */
import * as Clipboard from 'expo-clipboard';
import * as Linking from 'expo-linking';
import { useEffect, useState } from 'react';
import { Platform, Share, StyleSheet, Text, View } from 'react-native';
import type { Element } from '@/shared/schemas/analysis';
import { Button } from '@/src/components/Button';
import { colors, space, type } from '@/src/theme';
import { reachUrl } from './failSet';

function appOrigin(): string {
  if (Platform.OS === 'web' && typeof window !== 'undefined') return window.location.origin;
  // On a device the app's own scheme opens the same screen.
  return Linking.createURL('').replace(/\/$/, '');
}

type WebShare = { share?: (data: { title?: string; text?: string; url?: string }) => Promise<void> };
const webShare = (): WebShare['share'] | undefined =>
  Platform.OS === 'web' && typeof navigator !== 'undefined' && typeof (navigator as WebShare).share === 'function' ? (navigator as WebShare).share!.bind(navigator) : undefined;

/** Whether this device offers a share sheet: every phone app does; a browser only when it has the Web Share API. */
export const canShare = () => Platform.OS !== 'web' || webShare() !== undefined;

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
  const title = `Fault reach: ${elements.map((e) => `${e.kind} ${e.code}`).join(', ')}`;

  const share = async () => {
    try {
      const web = webShare();
      if (web) await web({ title, url });
      else await Share.share({ title, message: url, url });
    } catch (e) {
      // Closing the sheet without choosing is not a failure worth a word.
      if ((e as { name?: string })?.name !== 'AbortError') {
        setFailed(true);
        setSaid(`Could not share. The link is: ${url}`);
      }
    }
  };

  return (
    <View style={styles.wrap}>
      <View style={styles.buttons}>
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
        {canShare() ? <Button label="Share" variant="secondary" testID="reach-share" accessibilityLabel="Share the link to this fault reach" onPress={() => void share()} /> : null}
      </View>
      <Text style={[styles.said, failed && styles.failed]} accessibilityLiveRegion="polite" testID="reach-copy-status">
        {said ?? ''}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xxs, alignItems: 'flex-end' },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, justifyContent: 'flex-end' },
  said: { ...type.small, color: colors.good, minHeight: 20 },
  failed: { color: colors.bad },
});

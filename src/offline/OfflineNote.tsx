/**
 * The line a screen shows when its answer came from the offline copy: which
 * network version it is and when this device fetched it, so nobody mistakes
 * it for the live network.
 */
import { StyleSheet, Text, View } from 'react-native';
import { StatusShape } from '@/src/components/StatusShape';
import { colors, radius, space, type } from '@/src/theme';
import { offlineLine } from './offlineLine';

export function OfflineNote({ networkVersion, fetchedAt }: { networkVersion: number; fetchedAt: string }) {
  return (
    <View style={styles.box} accessibilityRole="alert" testID="offline-note">
      <View style={styles.head}>
        <StatusShape shape="triangle" color={colors.warn} size={16} />
        <Text style={styles.title}>{offlineLine(networkVersion, fetchedAt)}</Text>
      </View>
      <Text style={styles.body}>
        Worked out on this device from its stored copy of the network. Changes made since then are not in it, and nothing can be changed until the connection returns.
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { borderWidth: 1, borderLeftWidth: 6, borderColor: colors.warn, backgroundColor: colors.warnSoft, borderRadius: radius.md, padding: space.md, gap: space.xs },
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  title: { ...type.label, color: colors.ink },
  body: { ...type.small, color: colors.ink },
});

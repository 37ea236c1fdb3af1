/**
 * The chosen site's card over the diagram, so it opens where the person is
 * looking rather than below the fold: a sheet over the lower part of the
 * diagram on a phone, a panel down its right side on a wide screen. The
 * diagram keeps its size beneath (no re-fit under the person's finger).
 */
import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { colors, space } from '@/src/theme';

/** Wide panel width, px; the phone sheet takes at most this share of the diagram's height. */
const PANEL_PX = 360;
const SHEET_SHARE = 0.72;

export function SiteSheet({ wide, height, name, children }: { wide: boolean; height: number; name: string; children: ReactNode }) {
  return (
    <View
      style={[styles.base, wide ? [styles.panel, { width: PANEL_PX, maxHeight: height }] : [styles.sheet, { maxHeight: Math.round(height * SHEET_SHARE) }]]}
      role="dialog"
      aria-label={`Site ${name}`}
      testID={wide ? 'network-site-panel' : 'network-site-sheet'}
    >
      {wide ? null : <View style={styles.grip} aria-hidden />}
      <ScrollView contentContainerStyle={styles.scroll}>{children}</ScrollView>
    </View>
  );
}

const styles = StyleSheet.create({
  base: { position: 'absolute', backgroundColor: colors.canvas, borderColor: colors.lineStrong, shadowColor: '#000', shadowOpacity: 0.18, shadowRadius: 10, shadowOffset: { width: 0, height: 2 } },
  sheet: { left: 0, right: 0, bottom: 0, borderTopWidth: 1, borderTopLeftRadius: 12, borderTopRightRadius: 12 },
  panel: { top: 0, right: 0, bottom: 0, borderLeftWidth: 1 },
  grip: { alignSelf: 'center', width: 40, height: 4, borderRadius: 2, backgroundColor: colors.lineStrong, marginTop: space.xs },
  scroll: { padding: space.sm },
});

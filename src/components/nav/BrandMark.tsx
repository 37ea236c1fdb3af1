import { StyleSheet, Text, View } from 'react-native';
import Svg, { Circle, Path } from 'react-native-svg';
import { colors, fonts } from '@/src/theme';

/**
 * Headwater's mark: a spring at the top and the programme flowing down into
 * two branches (the name's metaphor, docs/screens.md "Labels and looks").
 */
export function BrandMark({ size = 28, showName = true }: { size?: number; showName?: boolean }) {
  return (
    <View style={styles.row}>
      <Svg width={size} height={size} viewBox="0 0 28 28" aria-hidden accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
        <Circle cx={14} cy={5} r={3.5} fill={colors.accent} />
        <Path d="M14 8.5v5c0 3-6 3.5-6 8v3" stroke={colors.accent} strokeWidth={2.6} fill="none" strokeLinecap="round" />
        <Path d="M14 13.5c0 3 6 3.5 6 8v3" stroke={colors.accent} strokeWidth={2.6} fill="none" strokeLinecap="round" />
      </Svg>
      {showName ? <Text style={styles.name}>Headwater</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: 8 },
  name: { fontFamily: fonts.textBold, fontSize: 20, lineHeight: 26, color: colors.ink },
});

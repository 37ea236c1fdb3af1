/**
 * The look of a pressable option that is on or off (choices, filter chips),
 * shared so every such control reads the same. Plain objects, spread into
 * each component's StyleSheet with its own shape (corner, spacing, face).
 */
import type { TextStyle, ViewStyle } from 'react-native';
import { colors, fonts, radius, space, TOUCH_MIN, type } from '@/src/theme';

export const toggleOption: ViewStyle = {
  minHeight: TOUCH_MIN,
  flexDirection: 'row',
  alignItems: 'center',
  gap: space.sm,
  paddingHorizontal: space.md,
  borderWidth: 2,
  borderColor: colors.line,
  borderRadius: radius.md,
  backgroundColor: colors.surface,
};
export const toggleOn: ViewStyle = { borderColor: colors.accent, backgroundColor: colors.accentSoft };
export const togglePressed: ViewStyle = { opacity: 0.8 };
export const toggleText: TextStyle = { ...type.body, fontSize: 16 };
export const toggleOnText: TextStyle = { fontFamily: fonts.textBold, color: colors.accent };

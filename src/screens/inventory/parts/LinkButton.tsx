/**
 * A link that looks like a button, for moving to another screen ("Fault
 * reach", "Upstream chain"): a real <a href> on the web, at least 44 px.
 */
import { Link, type Href } from 'expo-router';
import { Pressable, StyleSheet, Text } from 'react-native';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/src/theme';

export function LinkButton({ href, label, testID }: { href: Href; label: string; testID?: string }) {
  return (
    <Link href={href} asChild>
      <Pressable accessibilityRole="link" accessibilityLabel={label} testID={testID} style={styles.button}>
        <Text style={styles.label}>{label}</Text>
      </Pressable>
    </Link>
  );
}

// Link asChild merges plain style objects only (see src/components/nav/NavLink.tsx).
const styles = StyleSheet.create({
  button: {
    minHeight: TOUCH_MIN,
    minWidth: TOUCH_MIN,
    paddingHorizontal: space.lg,
    borderRadius: radius.md,
    borderWidth: 2,
    borderColor: colors.accent,
    backgroundColor: colors.surface,
    justifyContent: 'center',
    alignItems: 'center',
    alignSelf: 'flex-start',
  },
  label: { fontFamily: fonts.textBold, fontSize: 17, lineHeight: 22, color: colors.accent },
});

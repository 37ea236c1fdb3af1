/**
 * A code that opens its record: a real link (an <a href> on the web), in the
 * monospaced face, at least 44 px tall so it can be tapped in a list.
 *
 *   <CodeLink href="/feeds/R-ARV.FMA.M" code="R-ARV.FMA.M" note="main, off-air" />
 */
import { Link, type Href } from 'expo-router';
import { Pressable, StyleSheet, Text } from 'react-native';
import { colors, fonts, space, TOUCH_MIN } from '@/src/theme';

export interface CodeLinkProps {
  href: Href;
  code: string;
  /** the accessible name, when more than the visible words helps; it must contain them (WCAG 2.5.3 label in name) */
  label?: string;
  /** words after the code, in the text face */
  note?: string;
  testID?: string;
}

export function CodeLink({ href, code, label, note, testID }: CodeLinkProps) {
  return (
    <Link href={href} asChild>
      <Pressable accessibilityRole="link" accessibilityLabel={label} testID={testID} style={styles.link}>
        <Text style={styles.line}>
          <Text style={styles.code}>{code}</Text>
          {note ? <Text style={styles.note}>{`  ${note}`}</Text> : null}
        </Text>
      </Pressable>
    </Link>
  );
}

// Link asChild merges plain style objects only (see src/components/nav/NavLink.tsx).
const styles = StyleSheet.create({
  link: { minHeight: TOUCH_MIN, paddingVertical: space.xs, justifyContent: 'center', alignSelf: 'flex-start' },
  line: { lineHeight: 24 },
  code: { fontFamily: fonts.mono, fontSize: 16, color: colors.accent, textDecorationLine: 'underline' },
  note: { fontFamily: fonts.text, fontSize: 16, color: colors.ink },
});

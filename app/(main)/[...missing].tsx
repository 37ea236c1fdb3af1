/**
 * Any path under the signed-in area that no route matches. Living inside the
 * group means a signed-out visitor is sent to sign-in first (and brought back
 * here), and a signed-in one keeps the navigation while reading the message.
 */
import { Link, usePathname } from 'expo-router';
import { StyleSheet, Text } from 'react-native';
import { Screen } from '@/src/components/layout/Screen';
import { EmptyState } from '@/src/components/states';
import { colors, fonts, TOUCH_MIN, type } from '@/src/theme';

export default function MissingRoute() {
  const pathname = usePathname();
  return (
    <Screen title="Not found" testID="not-found">
      <EmptyState
        title="There is no page here"
        message={`Nothing in Headwater lives at ${pathname}. The link may be mistyped, or the page may have moved.`}
        action={
          <Link href="/" style={styles.link}>
            <Text style={styles.linkText}>Go to Home</Text>
          </Link>
        }
      />
    </Screen>
  );
}

const styles = StyleSheet.create({
  link: { minHeight: TOUCH_MIN, paddingVertical: 10 },
  linkText: { ...type.body, fontFamily: fonts.textBold, color: colors.accent, textDecorationLine: 'underline' },
});

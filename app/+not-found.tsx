import { Link, usePathname } from 'expo-router';
import Head from 'expo-router/head';
import { StyleSheet, Text, View } from 'react-native';
import { StatusShape } from '@/src/components/StatusShape';
import { heading } from '@/src/components/webAria';
import { colors, fonts, radius, space, TOUCH_MIN, type } from '@/src/theme';

export default function NotFoundRoute() {
  const pathname = usePathname();
  return (
    <View style={styles.page} testID="not-found">
      <Head>
        <title>Not found · Headwater</title>
      </Head>
      <View style={styles.box}>
        <StatusShape shape="ring" color={colors.inkMuted} size={22} />
        <Text style={styles.title} {...heading(1)}>
          There is no page here
        </Text>
        <Text style={styles.body}>
          Nothing in Headwater lives at <Text style={styles.path}>{pathname}</Text>. The link may be mistyped, or the page may have moved.
        </Text>
        <Link href="/" style={styles.link} accessibilityLabel="Go to Home">
          Go to Home
        </Link>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, alignItems: 'center', justifyContent: 'center', padding: space.lg, backgroundColor: colors.canvas },
  box: { width: '100%', maxWidth: 520, gap: space.md, padding: space.xl, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.surface },
  title: { ...type.heading },
  body: { ...type.body },
  path: { fontFamily: fonts.mono },
  link: { ...type.body, fontFamily: fonts.textBold, color: colors.accent, textDecorationLine: 'underline', minHeight: TOUCH_MIN, paddingVertical: space.sm },
});

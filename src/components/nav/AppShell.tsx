/**
 * The signed-in frame. One set of routes (rendered by `Slot`) inside one of
 * two layouts chosen by src/breakpoints.ts: bottom tabs on a phone, side
 * navigation on a wide window. Built from our own components rather than a
 * navigator library, so a route looks the same whichever layout shows it.
 */
import { Slot, usePathname, useRouter } from 'expo-router';
import { useEffect } from 'react';
import { StyleSheet, View } from 'react-native';
import { SafeAreaView } from 'react-native-safe-area-context';
import { useMe } from '@/src/api/queries/me';
import { useBreakpoints } from '@/src/hooks/useBreakpoints';
import { useSession } from '@/src/session/SessionProvider';
import { colors, space } from '@/src/theme';
import { ErrorCatcher } from '../ErrorCatcher';
import { BrandMark } from './BrandMark';
import { SideNav } from './SideNav';
import { TabBar } from './TabBar';

export function AppShell() {
  const { wide } = useBreakpoints();
  const pathname = usePathname();
  const router = useRouter();
  const { user, replaceUser } = useSession();
  const role = user?.role ?? null;

  // Keeps name and role current if an admin changes them; a 401 here (expired
  // token) signs the person out through ApiProvider.
  const me = useMe();
  useEffect(() => {
    if (me.data) replaceUser(me.data.user);
  }, [me.data, replaceUser]);

  const content = (
    <View style={styles.content} role="main">
      <ErrorCatcher resetKey={pathname} onHome={() => router.replace('/')}>
        <Slot />
      </ErrorCatcher>
    </View>
  );

  if (wide) {
    return (
      <SafeAreaView style={[styles.root, styles.row]} edges={['top', 'bottom', 'left']}>
        <SideNav pathname={pathname} role={role} />
        {content}
      </SafeAreaView>
    );
  }
  return (
    <SafeAreaView style={styles.root} edges={['top', 'left', 'right']}>
      <View style={styles.phoneHeader} role="banner">
        <BrandMark size={24} />
      </View>
      {content}
      <TabBar pathname={pathname} role={role} />
    </SafeAreaView>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1, backgroundColor: colors.canvas },
  row: { flexDirection: 'row' },
  content: { flex: 1 },
  phoneHeader: {
    paddingHorizontal: space.lg,
    paddingVertical: space.sm,
    backgroundColor: colors.surface,
    borderBottomWidth: 1,
    borderBottomColor: colors.line,
  },
});

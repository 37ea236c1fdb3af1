/**
 * Everything behind sign-in. Waits for the stored session to be read, sends
 * a signed-out visitor to /sign-in (remembering where they were going, so a
 * shared link still works after signing in), and otherwise draws the shell.
 */
import { Redirect, usePathname, type Href } from 'expo-router';
import { Platform, StyleSheet, View } from 'react-native';
import { AppShell } from '@/src/components/nav/AppShell';
import { LoadingState } from '@/src/components/states';
import { signInHref } from '@/src/session/nextPath';
import { useSession } from '@/src/session/SessionProvider';
import { colors } from '@/src/theme';

// The query exactly as typed; route params (like a site code in the path)
// are already in the pathname and must not be repeated.
function currentSearch(): string {
  return Platform.OS === 'web' && typeof window !== 'undefined' ? window.location.search : '';
}

export default function SignedInLayout() {
  const session = useSession();
  const pathname = usePathname();

  if (session.status === 'restoring') {
    return (
      <View style={styles.wait}>
        <LoadingState what="your session" />
      </View>
    );
  }
  if (session.status === 'signedOut') {
    // After choosing to sign out there is nothing to come back to.
    const href = session.lastSignOut === 'chosen' ? '/sign-in' : signInHref(pathname, currentSearch());
    return <Redirect href={href as Href} />;
  }
  return <AppShell />;
}

const styles = StyleSheet.create({
  wait: { flex: 1, alignItems: 'center', justifyContent: 'center', backgroundColor: colors.canvas },
});

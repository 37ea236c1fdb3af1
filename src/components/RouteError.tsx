/**
 * What a person sees when a screen crashes while drawing: a plain apology,
 * the error's message, and a way to try again or go home. Used as the root
 * layout's `ErrorBoundary` (Expo Router) and by ErrorCatcher inside the shell.
 * It needs no providers: the crash may have come from one of them.
 */
import { StyleSheet, Text, View } from 'react-native';
import { colors, fonts, space, type } from '@/src/theme';
import { Button } from './Button';
import { StatusShape } from './StatusShape';
import { heading } from './webAria';

export interface RouteErrorProps {
  error: Error;
  retry: () => void | Promise<void>;
  /** Offers a way out when retrying the same screen keeps failing. */
  onHome?: () => void;
}

export function RouteError({ error, retry, onHome }: RouteErrorProps) {
  return (
    <View style={styles.page} accessibilityRole="alert" testID="route-error">
      <View style={styles.box}>
        <StatusShape shape="cross" color={colors.bad} size={24} />
        <Text style={styles.title} {...heading(1)}>
          This screen stopped working
        </Text>
        <Text style={styles.body}>
          Something went wrong while showing it. Try again; if it keeps happening, tell whoever looks after Headwater
          what you were doing and pass on this message:
        </Text>
        <Text style={styles.message} selectable>
          {error.message || String(error)}
        </Text>
        <View style={styles.actions}>
          <Button label="Try again" icon="retry" onPress={() => void retry()} />
          {onHome ? <Button label="Go to Home" icon="home" variant="secondary" onPress={onHome} /> : null}
        </View>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, backgroundColor: colors.canvas, alignItems: 'center', justifyContent: 'center', padding: space.lg },
  box: {
    width: '100%',
    maxWidth: 560,
    backgroundColor: colors.surface,
    borderColor: colors.bad,
    borderWidth: 1,
    borderLeftWidth: 6,
    borderRadius: 12,
    padding: space.xl,
    gap: space.md,
  },
  title: { ...type.heading },
  body: { ...type.body },
  message: { fontFamily: fonts.mono, fontSize: 15, lineHeight: 21, color: colors.ink, backgroundColor: colors.sunken, padding: space.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});

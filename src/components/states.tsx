/**
 * The three states every data screen has besides "here is the data".
 * Each says what it is about in words, so nobody is left guessing:
 *
 *   <LoadingState what="the network summary" />
 *   <EmptyState title="No people yet" message="Invite someone below." />
 *   <ErrorState what="the network summary" error={error} onRetry={() => mutate()} />
 */
import type { ReactNode } from 'react';
import { ActivityIndicator, StyleSheet, Text, View } from 'react-native';
import { isApiError } from '@/src/api/client';
import { colors, fonts, radius, space, type } from '@/src/theme';
import { Button } from './Button';
import { StatusShape } from './StatusShape';

export function LoadingState({ what, testID }: { what: string; testID?: string }) {
  return (
    <View style={styles.box} accessibilityLiveRegion="polite" testID={testID ?? 'loading'}>
      {/* a progress indicator is named, or a screen reader announces a nameless "progress bar" */}
      <ActivityIndicator color={colors.accent} accessibilityLabel={`Loading ${what}`} />
      <Text style={styles.muted}>Loading {what}…</Text>
    </View>
  );
}

export function EmptyState({ title, message, action, testID }: { title: string; message?: string; action?: ReactNode; testID?: string }) {
  return (
    <View style={[styles.box, styles.framed]} testID={testID ?? 'empty'}>
      <StatusShape shape="ring" color={colors.inkMuted} size={18} />
      <Text style={styles.title}>{title}</Text>
      {message ? <Text style={styles.muted}>{message}</Text> : null}
      {action}
    </View>
  );
}

/** Plain words for an error, whatever threw it. */
export function describeError(error: unknown): string {
  if (isApiError(error)) {
    if (error.status === 403) return 'Your role does not allow this.';
    if (error.status === 429) return 'Too many requests just now. Wait a minute and try again.';
    return error.message;
  }
  if (error instanceof Error && error.message) return error.message;
  return 'Something went wrong.';
}

export interface ErrorStateProps {
  /** What failed, as a phrase: "the network summary", "the people list". */
  what: string;
  error?: unknown;
  onRetry?: () => void;
  testID?: string;
}

export function ErrorState({ what, error, onRetry, testID }: ErrorStateProps) {
  return (
    <View style={[styles.box, styles.framed, styles.error]} accessibilityRole="alert" testID={testID ?? 'error'}>
      <StatusShape shape="cross" color={colors.bad} size={18} />
      <Text style={styles.title}>Could not load {what}.</Text>
      {error !== undefined ? <Text style={styles.detail}>{describeError(error)}</Text> : null}
      {onRetry ? <Button label="Try again" icon="retry" variant="secondary" onPress={onRetry} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { alignItems: 'flex-start', gap: space.sm, paddingVertical: space.lg },
  framed: {
    padding: space.lg,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.line,
    backgroundColor: colors.surface,
  },
  error: { borderColor: colors.bad, borderLeftWidth: 6 },
  title: { ...type.label, fontSize: 17, lineHeight: 22 },
  muted: { ...type.small },
  detail: { ...type.body, fontFamily: fonts.text, color: colors.ink },
});

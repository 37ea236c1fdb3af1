/**
 * A boxed warning a person should read before going on: a triangle and a
 * title, the words, and optionally a button that deals with it. Drawn with
 * the caution box's parts (Caution.tsx) so every warning reads alike.
 *
 *   <WarningBox title="Some of these are not in the network" testID="x">Not found: site A.</WarningBox>
 */
import type { ReactNode } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { colors } from '@/src/theme';
import { cautionParts } from './Caution';
import { StatusShape } from './StatusShape';

export function WarningBox({ title, children, action, testID }: { title: string; children: string; action?: ReactNode; testID: string }) {
  return (
    <View style={styles.box} accessibilityRole="alert" testID={testID}>
      <View style={styles.head}>
        <StatusShape shape="triangle" color={colors.warn} size={18} />
        <Text style={styles.title}>{title}</Text>
      </View>
      <Text style={styles.body}>{children}</Text>
      {action}
    </View>
  );
}

const styles = StyleSheet.create({ ...cautionParts, title: { ...cautionParts.title, color: colors.ink } });

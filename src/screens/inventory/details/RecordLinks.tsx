/**
 * Lists of links to related records, with a line of facts each, used by the
 * detail pages: a site's carriages, its feeds in and out, a group's members.
 */
import type { Href } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import type { StoredCarriage, StoredFeed } from '@/src/api/schemas';
import { type } from '@/src/theme';
import { detailHref } from '../kinds';
import { erpText, withUnit } from '@/shared/format';
import { CodeLink } from '../parts/CodeLink';

export function carriageNote(c: StoredCarriage): string {
  const parts = [c.service];
  if (c.channel) parts.push(`ch ${c.channel}`);
  if (c.frequencyMHz !== undefined) parts.push(withUnit(c.frequencyMHz, 'MHz', 3));
  if (c.erpW !== undefined) parts.push(`ERP ${erpText(c.erpW)}`);
  return parts.join(', ');
}

export function feedNote(f: StoredFeed, end: 'from' | 'to'): string {
  return `${f.role}, ${f.medium}, ${end} ${end === 'from' ? f.from : f.to}`;
}

export interface LinkItem {
  code: string;
  href: Href;
  note?: string;
}

export function LinkList({ items, empty, testID }: { items: readonly LinkItem[]; empty: string; testID?: string }) {
  if (items.length === 0) return <Text style={styles.empty} testID={testID}>{empty}</Text>;
  return (
    <View style={styles.list} testID={testID}>
      {items.map((i) => (
        <CodeLink key={i.code} href={i.href} code={i.code} note={i.note} testID={testID ? `${testID}-${i.code}` : undefined} />
      ))}
    </View>
  );
}

export const carriageLinks = (carriages: readonly StoredCarriage[]): LinkItem[] =>
  carriages.map((c) => ({ code: c.code, href: detailHref('carriages', c.code), note: carriageNote(c) }));

export const feedLinks = (feeds: readonly StoredFeed[], end: 'from' | 'to'): LinkItem[] =>
  feeds.map((f) => ({ code: f.code, href: detailHref('feeds', f.code), note: feedNote(f, end) }));

export const codeLinks = (kind: 'sites' | 'groups' | 'feeds' | 'carriages' | 'services', codes: readonly string[]): LinkItem[] =>
  codes.map((code) => ({ code, href: detailHref(kind, code) }));

const styles = StyleSheet.create({
  list: { gap: 0 },
  empty: { ...type.small },
});

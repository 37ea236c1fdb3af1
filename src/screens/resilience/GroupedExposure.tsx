/**
 * The exposure ranking for a manager: elements that take off exactly the
 * same carriages share one row ("site X with 11 more: 9 feeds, 2 groups"),
 * which opens to list them; a filter by kind; and the resilience lists as
 * CSV files from the server (grouped exposure, diversity gaps, unfed
 * carriages, failing checks).
 */
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { api } from '@/shared/api';
import type { Element } from '@/shared/schemas/analysis';
import { countOf, formatCount } from '@/shared/format';
import { useCsvDownload, useExposureGroups } from '@/src/api/queries/analysis';
import { Button } from '@/src/components/Button';
import { Choice } from '@/src/components/Choice';
import { describeError, ErrorState, LoadingState } from '@/src/components/states';
import { colors, radius, space, TOUCH_MIN, type } from '@/src/theme';
import { saveFile } from '../importer/download';
import { elementWords, type ElementNamer } from './elementNames';

export const GROUPS_SHOWN = 50;

const KIND_FILTERS = [
  { value: 'site,feed,group', label: 'Sites, feeds, groups' },
  { value: 'site,carriage,feed,group', label: 'All, carriages too' },
  { value: 'site', label: 'Sites' },
  { value: 'carriage', label: 'Carriages' },
  { value: 'feed', label: 'Feeds' },
  { value: 'group', label: 'Groups' },
] as const;
type KindFilter = (typeof KIND_FILTERS)[number]['value'];

/** "9 feeds, 2 groups": the other members of a row, counted by kind. */
export function othersText(others: readonly Element[]): string {
  const order: Element['kind'][] = ['site', 'carriage', 'feed', 'group'];
  return order
    .map((k) => ({ k, n: others.filter((e) => e.kind === k).length }))
    .filter((c) => c.n > 0)
    .map((c) => countOf(c.n, c.k))
    .join(', ');
}

/** The row's title: its first element, and how many more take off the same carriages. */
export function groupTitle(elements: readonly Element[]): string {
  const [lead, ...others] = elements;
  return others.length === 0 ? elementWords(lead) : `${elementWords(lead)} with ${formatCount(others.length)} more: ${othersText(others)}`;
}

export function GroupedExposure({ name }: { name: ElementNamer }) {
  const router = useRouter();
  const [kinds, setKinds] = useState<KindFilter>('site,feed,group');
  const [open, setOpen] = useState<string | null>(null);
  const groups = useExposureGroups(GROUPS_SHOWN, kinds);
  const csv = useCsvDownload();
  const [said, setSaid] = useState<string | null>(null);

  const download = async (path: string, fallback: string) => {
    setSaid(null);
    try {
      const file = await csv(path, fallback);
      saveFile(file);
      setSaid(`Downloaded ${file.name}.`);
    } catch (e) {
      setSaid(`Could not download: ${describeError(e)}`);
    }
  };

  let body;
  if (groups.data) {
    body = (
      <View style={styles.list} testID="exposure-groups">
        {groups.data.groups.map((g, i) => {
          const key = g.elements.map((e) => `${e.kind}:${e.code}`).join(',');
          const expanded = open === key;
          const lead = g.elements[0];
          const leadName = name(lead);
          return (
            <View key={key} style={styles.row}>
              <Pressable
                accessibilityRole="button"
                accessibilityState={{ expanded }}
                accessibilityLabel={`${i + 1}. ${groupTitle(g.elements)}${leadName ? `, ${leadName}` : ''}: ${formatCount(g.households)} households, ${countOf(g.carriages, 'carriage')} off air. ${expanded ? 'Hide' : 'Show'} the elements.`}
                onPress={() => setOpen(expanded ? null : key)}
                style={({ pressed }) => [styles.head, pressed && styles.pressed]}
                testID={`exposure-group-${i + 1}`}
              >
                <Text style={styles.title}>{`${i + 1}. ${groupTitle(g.elements)}`}</Text>
                <Text style={styles.figures}>{`${formatCount(g.households)} households · ${countOf(g.carriages, 'carriage')} off air`}</Text>
                {g.elements.length > 1 ? <Text style={styles.muted}>{expanded ? '▲ Hide elements' : '▼ Show elements'}</Text> : null}
              </Pressable>
              {expanded || g.elements.length === 1 ? (
                <View style={styles.members}>
                  {g.elements.map((e) => (
                    <Pressable key={`${e.kind}:${e.code}`} accessibilityRole="link" onPress={() => router.push(`/reach?fail=${e.kind}:${e.code}`)} style={styles.member}>
                      <Text style={styles.link}>{`${elementWords(e)}${name(e) ? `, ${name(e)}` : ''}: open its fault reach`}</Text>
                    </Pressable>
                  ))}
                </View>
              ) : null}
            </View>
          );
        })}
      </View>
    );
  } else if (groups.error) body = <ErrorState what="the grouped ranking" error={groups.error} onRetry={() => void groups.mutate()} />;
  else body = <LoadingState what="the grouped ranking" />;

  return (
    <View style={styles.wrap}>
      <Choice<KindFilter> label="Kinds" value={kinds} onChange={setKinds} options={[...KIND_FILTERS]} testID="exposure-kinds" />
      {body}
      <View style={styles.tools}>
        <Button label="Grouped ranking (CSV)" icon="inventory" variant="secondary" onPress={() => void download(api.exposureGroups({ kinds, format: 'csv' }), 'exposure-grouped.csv')} testID="csv-exposure-groups" />
        <Button label="Diversity gaps (CSV)" icon="inventory" variant="secondary" onPress={() => void download(api.csv.diversity, 'diversity-gaps.csv')} testID="csv-diversity" />
        <Button label="Unfed carriages (CSV)" icon="inventory" variant="secondary" onPress={() => void download(api.csv.unfed, 'unfed-carriages.csv')} testID="csv-unfed" />
        <Button label="Failing checks (CSV)" icon="inventory" variant="secondary" onPress={() => void download(api.csv.checks, 'failing-checks.csv')} testID="csv-checks" />
      </View>
      <Text style={said?.startsWith('Could not') ? styles.error : styles.said} accessibilityLiveRegion="polite" testID="csv-status">
        {said ?? ''}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  list: { gap: space.xs },
  row: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md },
  head: { minHeight: TOUCH_MIN, padding: space.sm, gap: 2 },
  pressed: { opacity: 0.7 },
  title: { ...type.body, fontWeight: '600' },
  figures: { ...type.body },
  muted: { ...type.small },
  members: { paddingHorizontal: space.sm, paddingBottom: space.sm, gap: 2 },
  member: { minHeight: TOUCH_MIN, justifyContent: 'center' },
  link: { ...type.body, color: colors.accent, textDecorationLine: 'underline' },
  tools: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  said: { ...type.small },
  error: { ...type.small, color: colors.bad },
});

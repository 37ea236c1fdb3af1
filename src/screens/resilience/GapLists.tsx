/** Diversity gaps (with the elements main and reserve still share) and unfed carriages, each row opening the carriage's chain. */
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { useDiversityPages } from '@/src/api/queries/analysis';
import { ErrorState } from '@/src/components/states';
import type { Element } from '@/shared/schemas/analysis';
import { Capped } from '@/src/screens/reach/Capped';
import { LinkRow } from '@/src/screens/reach/LinkRow';
import { space, type } from '@/src/theme';
import { elementWords } from './elementNames';

const carriageKey = (g: { carriage: string }) => g.carriage;

type Gap = { carriage: string; service: string; site: string; spof: Element[]; avoidable: Element[] };

/** The weak points no other feed can fix: each holds every origin of the service. */
export const unavoidableOf = (g: Gap) => g.spof.filter((x) => !g.avoidable.some((a) => a.kind === x.kind && a.code === x.code));

function gapWords(g: Gap): string {
  const fixable = `Another feed could avoid: ${g.avoidable.map(elementWords).join(', ')}.`;
  const fixed = unavoidableOf(g);
  if (fixed.length === 0) return fixable;
  return `${fixable} No feed can avoid ${fixed.map(elementWords).join(', ')}: it holds every origin of ${g.service}.`;
}

/**
 * `first` is the first rows of the gaps and `total` their number; on "Show all"
 * the list is read from the server a page at a time as it scrolls (a
 * 20,000-site network has thousands of gaps, 3 MB whole).
 */
export function DiversityList({ first, total }: { first: Gap[]; total: number }) {
  const [all, setAll] = useState(false);
  const pages = useDiversityPages(all && first.length < total);
  const paged = all && pages.rows.length > 0;
  if (all && pages.error && !paged) return <ErrorState what="all the diversity gaps" error={pages.error} onRetry={pages.retry} />;
  if (first.length === 0) return <Text style={styles.none}>None: every reserve feed protects its carriage from every failure another feed could avoid.</Text>;
  return (
    <Capped
      items={paged ? pages.rows : first}
      what="carriages"
      first={10}
      keyOf={carriageKey}
      testID="diversity-list"
      total={total}
      // opens at once on the rows already here; the pages follow
      loadingAll={false}
      onEndReached={pages.loadMore}
      onShowAll={() => setAll(true)}
      render={(g) => (
        <LinkRow key={g.carriage} href={`/carriages/${encodeURIComponent(g.carriage)}`} title={g.carriage} detail={gapWords(g)} />
      )}
    />
  );
}

export function UnfedList({ unfed }: { unfed: { carriage: string; service: string; site: string }[] }) {
  if (unfed.length === 0) return <Text style={styles.none}>None: every carriage has programme with nothing failed.</Text>;
  return (
    <View style={styles.wrap}>
      <Capped
        items={unfed}
        what="carriages"
        first={10}
        keyOf={carriageKey}
        testID="unfed-list"
        render={(u) => <LinkRow key={u.carriage} href={`/carriages/${encodeURIComponent(u.carriage)}`} title={u.carriage} status="off-air" detail={`${u.service} at ${u.site}: no programme even with nothing failed`} />}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  none: { ...type.body, fontSize: 16 },
});

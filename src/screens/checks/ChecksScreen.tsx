/**
 * Every failing feed check in the network, worst first (GET /api/checks), with filters by
 * kind of check and severity kept in the URL. Cards on a phone, a table on a wide window.
 * The server filters, counts and pages: the list loads a page at a time as it scrolls, and
 * the summary and chips count the whole filtered list.
 */
import { Link } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import type { CheckSeverity } from '@/shared/schemas/checks';
import { formatCount } from '@/shared/format';
import { useCheckFailurePages, type FailureOrder } from '@/src/api/queries/checks';
import { Button } from '@/src/components/Button';
import { Choice } from '@/src/components/Choice';
import { Screen } from '@/src/components/layout/Screen';
import { Section } from '@/src/components/layout/Section';
import { EmptyState, ErrorState, LoadingState } from '@/src/components/states';
import { useBreakpoints } from '@/src/hooks/useBreakpoints';
import { colors, radius, space, TOUCH_MIN, type } from '@/src/theme';
import { CheckChips } from './CheckChips';
import { CHECK_SHORT } from './checkWords';
import { chipCounts, chipLabel, summaryWords, toggleCheck, type FailureFilter } from './failureList';
import { FailureCards, FailureTable, orderWords } from './FailureViews';
import { MastCautions } from './MastCautions';
import { ScreeningCaution } from './ScreeningCaution';

const WORST_FIRST: FailureOrder = { sort: 'worst', direction: 'asc' };

const SEVERITY_OPTIONS: readonly { value: CheckSeverity; label: string }[] = [
  { value: 'error', label: 'Errors only' },
  { value: 'warning', label: 'Errors and warnings' },
];

export interface ChecksScreenProps {
  filter: FailureFilter;
  onFilter: (next: FailureFilter) => void;
}

function CalculatorLink() {
  return (
    <Link href={'/calculator'} asChild>
      <Pressable accessibilityRole="link" accessibilityLabel="Open the calculator" style={styles.calcLink} testID="open-calculator">
        <Text style={styles.calcLinkText}>Open the calculator</Text>
      </Pressable>
    </Link>
  );
}

export function ChecksScreen({ filter, onFilter }: ChecksScreenProps) {
  const { wide } = useBreakpoints();
  // The table's column sort; the server sorts, so every page arrives in this order. Cards on a phone stay worst first.
  const [tableOrder, setTableOrder] = useState<FailureOrder>(WORST_FIRST);
  const order = wide ? tableOrder : WORST_FIRST;
  const pages = useCheckFailurePages(filter.severity, filter.checks, order);
  const first = pages.first;
  const counts = first?.counts;
  const unfiltered = first?.unfiltered ?? counts?.total ?? 0;
  const chipOptions = chipCounts(first?.kinds ?? [], filter.checks).map(({ name, count }) => ({ value: name, label: chipLabel(name, count) }));

  const filtered = counts !== undefined && counts.total !== unfiltered;
  const note = counts ? `${summaryWords(counts)}${filtered ? ` (of ${formatCount(unfiltered)} in all)` : ''}` : undefined;
  const footer = pages.rows.length > 0 ? <ListFooter shown={pages.rows.length} total={pages.total} order={order} loading={pages.loadingMore} onMore={pages.loadMore} /> : null;

  return (
    <Screen title="Checks" subtitle="Feed checks that fail anywhere in the network, worst first" actions={<CalculatorLink />} testID="checks-screen">
      <Section title="Show" testID="checks-filters">
        <Choice label="Severity" options={SEVERITY_OPTIONS} value={filter.severity} onChange={(severity) => onFilter({ ...filter, severity })} testID="severity" />
        {chipOptions.length > 0 ? (
          <CheckChips label="Kind of check (none chosen: all)" options={chipOptions} chosen={filter.checks} onToggle={(name) => onFilter(toggleCheck(filter, name))} testID="check-kind" />
        ) : null}
      </Section>

      <Section title="Failing checks" note={note} testID="failing-checks">
        {first && counts ? (
          <>
            <View style={styles.counts} testID="failing-checks-counts">
              <Text style={styles.count}>{`Errors: ${formatCount(counts.errors)}`}</Text>
              <Text style={styles.count}>{`Warnings: ${formatCount(counts.warnings)}`}</Text>
              <Text style={styles.count}>{`Feeds: ${formatCount(counts.feeds)}`}</Text>
              {first.networkVersion !== undefined ? <Text style={styles.version}>{`Network version ${first.networkVersion}`}</Text> : null}
            </View>
            {counts.total === 0 ? (
              unfiltered === 0 ? (
                <EmptyState title="No check fails" message="Every feed passes the checks that could be computed. Checks that could not be computed are listed on each feed's page." testID="failing-checks-none" />
              ) : (
                <EmptyState
                  title="Nothing matches these filters"
                  message={`${formatCount(unfiltered)} failing checks are hidden by the filters${filter.checks.length ? ` (${filter.checks.map((c) => CHECK_SHORT[c]).join(', ')})` : ''}.`}
                  testID="failing-checks-filtered-out"
                />
              )
            ) : wide ? (
              <FailureTable failures={pages.rows} onEndReached={pages.loadMore} footer={footer} order={tableOrder} onOrder={setTableOrder} />
            ) : (
              <FailureCards failures={pages.rows} onEndReached={pages.loadMore} footer={footer} />
            )}
            {pages.error ? <Text style={styles.stale}>Showing the last list received; refreshing failed.</Text> : null}
          </>
        ) : pages.error ? (
          <ErrorState what="the failing checks" error={pages.error} onRetry={pages.retry} />
        ) : (
          <LoadingState what="the failing checks" />
        )}
      </Section>

      <ScreeningCaution />
      <MastCautions />
    </Screen>
  );
}

/** Under the list: how much of it has arrived, and a button for the next page (scrolling to the end asks for it too). */
function ListFooter({ shown, total, order, loading, onMore }: { shown: number; total: number; order: FailureOrder; loading: boolean; onMore: () => void }) {
  return (
    <View style={styles.footer} testID="failing-checks-footer">
      <Text style={styles.version}>{shown < total ? `Showing ${formatCount(shown)} of ${formatCount(total)}, ${orderWords(order)}` : `All ${formatCount(total)} shown`}</Text>
      {shown < total ? <Button label={loading ? 'Loading more…' : 'Show more'} variant="quiet" disabled={loading} onPress={onMore} testID="failing-checks-more" /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  counts: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
  count: { ...type.figure, backgroundColor: colors.surface, borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, paddingHorizontal: space.md, paddingVertical: space.xs },
  version: { ...type.small },
  stale: { ...type.small },
  footer: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm, paddingVertical: space.sm },
  calcLink: { minHeight: TOUCH_MIN, justifyContent: 'center', paddingHorizontal: space.lg, borderWidth: 2, borderColor: colors.accent, borderRadius: radius.md, backgroundColor: colors.surface, alignSelf: 'flex-start' },
  calcLinkText: { ...type.label, fontSize: 17, color: colors.accent },
});

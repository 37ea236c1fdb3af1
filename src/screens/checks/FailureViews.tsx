/**
 * The failing checks as cards (phone) or a table (wide). Both keep the server's order, worst
 * first unless a column of the table sorts it (pages are appended as the list scrolls) and name the feed (a link to its page), the carriages from -> to, the check, the
 * value against its limit and the margin.
 */
import { Link, type Href } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import { FAILURE_SORTS, type CheckFailure, type FailureSort } from '@/shared/schemas/checks';
import type { FailureOrder } from '@/src/api/queries/checks';
import type { SortState } from '@/src/components/DataTable/sortRows';
import { DataTable } from '@/src/components/DataTable/DataTable';
import { VirtualList } from '@/src/components/VirtualList';
import { colors, fonts, radius, space, TOUCH_MIN, type } from '@/src/theme';
import { CHECK_SHORT, CHECK_TITLES, SEVERITY_WORDS } from './checkWords';
import { marginWords, valueAgainstLimit } from './failureList';
import { StateTag } from './StateTag';

const feedHref = (code: string): Href => `/feeds/${encodeURIComponent(code)}`;
const failureKey = (f: CheckFailure) => `${f.feed}/${f.check.name}`;

export function FeedLink({ code }: { code: string }) {
  return (
    <Link href={feedHref(code)} style={styles.link} accessibilityLabel={`Feed ${code}`} testID={`failure-feed-${code}`}>
      {code}
    </Link>
  );
}

function Severity({ f }: { f: CheckFailure }) {
  const s = SEVERITY_WORDS[f.severity];
  return <StateTag words={s.words} shape={s.shape} tone={s.tone} />;
}

function FailureCard({ f }: { f: CheckFailure }) {
  return (
    <View style={[styles.card, f.severity === 'error' ? styles.cardError : styles.cardWarning]} testID={`failure-${failureKey(f)}`}>
      <View style={styles.cardHead}>
        <Severity f={f} />
        <Text style={styles.checkName}>{CHECK_TITLES[f.check.name]}</Text>
      </View>
      <View style={styles.feedLine}>
        <Text style={styles.key}>Feed</Text>
        <FeedLink code={f.feed} />
      </View>
      <Text style={styles.route}>
        <Text style={styles.code}>{f.from}</Text>
        {' → '}
        <Text style={styles.code}>{f.to}</Text>
        {`  ·  ${f.medium}`}
      </Text>
      <Text style={styles.figures}>
        <Text style={styles.key}>Value </Text>
        {valueAgainstLimit(f)}
      </Text>
      <Text style={styles.figures}>
        <Text style={styles.key}>Margin </Text>
        {marginWords(f)}
      </Text>
      <Text style={styles.note} selectable>
        {f.check.note}
      </Text>
    </View>
  );
}

const renderCard = (f: CheckFailure) => <FailureCard f={f} />;

/** Thousands of failures on a big network: only the cards on screen are rendered. */
export function FailureCards({ failures, onEndReached, footer }: { failures: readonly CheckFailure[]; onEndReached?: () => void; footer?: React.ReactElement | null }) {
  return <VirtualList data={failures} keyOf={failureKey} renderRow={renderCard} estimatedRowHeight={230} label="Failing checks, worst first" testID="failing-checks-list" framed={false} onEndReached={onEndReached} footer={footer} />;
}

/** The table's sortable columns are the server's orders (GET /api/checks?sort=): rows arrive page by page already in the order chosen. */
const SORT_COLUMNS: readonly string[] = FAILURE_SORTS;
const orderOfColumn = (s: SortState): FailureOrder => ({ sort: SORT_COLUMNS.includes(s.column) ? (s.column as FailureSort) : 'worst', direction: s.direction });

export function FailureTable({ failures, onEndReached, footer, order, onOrder }: { failures: readonly CheckFailure[]; onEndReached?: () => void; footer?: React.ReactElement | null; order: FailureOrder; onOrder: (next: FailureOrder) => void }) {
  return (
    <DataTable
      caption={`Failing checks, ${orderWords(order)}`}
      rows={failures}
      rowKey={failureKey}
      testID="failures-table"
      virtual
      onEndReached={onEndReached}
      footer={footer}
      sort={order.sort === 'worst' ? null : { column: order.sort, direction: order.direction }}
      onSort={(s) => onOrder(orderOfColumn(s))}
      columns={[
        { key: 'severity', label: 'Severity', width: 130, value: (f) => (f.severity === 'error' ? 0 : 1), render: (f) => <Severity f={f} /> },
        { key: 'feed', label: 'Feed', width: 170, value: (f) => f.feed, render: (f) => <FeedLink code={f.feed} /> },
        { key: 'route', label: 'From → to', mono: true, width: 220, value: (f) => `${f.from} → ${f.to}` },
        { key: 'check', label: 'Check', width: 150, value: (f) => CHECK_SHORT[f.check.name] },
        { key: 'value', label: 'Value against limit', width: 250, sortable: false, value: (f) => valueAgainstLimit(f) },
        { key: 'margin', label: 'Margin', numeric: true, width: 130, value: (f) => f.margin ?? null, format: (_v, f) => (f.margin === undefined ? 'yes/no check' : marginWords(f)) },
      ]}
    />
  );
}

const ORDER_WORDS: Record<Exclude<FailureSort, 'worst'>, [string, string]> = {
  severity: ['errors first', 'warnings first'],
  feed: ['by feed, A to Z', 'by feed, Z to A'],
  route: ['by from → to, A to Z', 'by from → to, Z to A'],
  check: ['by check, most serious kind first', 'by check, least serious kind first'],
  margin: ['by margin, furthest below the limit first', 'by margin, closest to the limit first'],
};

/** The order in words, for the table's name and the count under the list. */
export function orderWords(order: FailureOrder): string {
  if (order.sort === 'worst') return order.direction === 'asc' ? 'worst first' : 'least bad first';
  return ORDER_WORDS[order.sort][order.direction === 'asc' ? 0 : 1];
}

const styles = StyleSheet.create({
  card: { marginBottom: space.sm, backgroundColor: colors.surface, borderWidth: 1, borderColor: colors.line, borderLeftWidth: 6, borderRadius: radius.lg, padding: space.md, gap: space.xs },
  cardError: { borderLeftColor: colors.bad },
  cardWarning: { borderLeftColor: colors.warn },
  cardHead: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  checkName: { ...type.label, fontSize: 17, lineHeight: 22, flexShrink: 1 },
  feedLine: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  key: { ...type.small, color: colors.inkMuted },
  link: { fontFamily: fonts.mono, fontSize: 16, color: colors.accent, textDecorationLine: 'underline', minHeight: TOUCH_MIN, paddingVertical: space.sm + 2 },
  route: { ...type.body, fontSize: 16 },
  code: { fontFamily: fonts.mono, fontSize: 15 },
  figures: { ...type.figure, fontFamily: fonts.text, fontSize: 16 },
  note: { ...type.small, fontSize: 14, lineHeight: 19 },
});

/**
 * Home's "needs attention now" from the analyses: carriages with no
 * programme at all (unfed), carriages whose reserve does not protect them
 * (diversity gaps), and the elements whose failure alone would take the
 * most households off air. Each item links to where it can be acted on.
 */
import { StyleSheet, Text, View } from 'react-native';
import { useDiversity, useExposure, useUnfed } from '@/src/api/queries/analysis';
import { Card } from '@/src/components/Card';
import { countOf, formatCount } from '@/shared/format';
import { Columns } from '@/src/components/layout/Columns';
import { ErrorState, LoadingState } from '@/src/components/states';
import { LinkRow } from '@/src/screens/reach/LinkRow';
import { colors, radius, type } from '@/src/theme';

const FIRST = 3;

function Rows({ children }: { children: React.ReactNode }) {
  return <View style={styles.rows}>{children}</View>;
}

function UnfedCard() {
  // the first few and the count: a national network's lists are megabytes
  const unfed = useUnfed(FIRST);
  if (unfed.error && !unfed.data) return <ErrorState what="the unfed carriages" error={unfed.error} onRetry={() => void unfed.mutate()} testID="attention-unfed-error" />;
  if (!unfed.data) return <LoadingState what="the unfed carriages" testID="attention-unfed-loading" />;
  const list = unfed.data.carriages;
  const count = unfed.data.total ?? list.length;
  return (
    <Card title={`Unfed carriages: ${formatCount(count)}`} emphasis={count > 0 ? 'attention' : 'none'} testID="attention-unfed">
      {count === 0 ? (
        <Text style={styles.ok}>Every carriage has programme with nothing failed.</Text>
      ) : (
        <Rows>
          {list.slice(0, FIRST).map((u) => (
            <LinkRow key={u.carriage} href={`/carriages/${encodeURIComponent(u.carriage)}`} title={u.carriage} status="off-air" detail="no programme with nothing failed" />
          ))}
          {count > FIRST ? <LinkRow href="/resilience" title={`All ${countOf(count, 'unfed carriage')}`} /> : null}
        </Rows>
      )}
    </Card>
  );
}

function GapsCard() {
  const gaps = useDiversity(FIRST);
  if (gaps.error && !gaps.data) return <ErrorState what="the diversity gaps" error={gaps.error} onRetry={() => void gaps.mutate()} testID="attention-gaps-error" />;
  if (!gaps.data) return <LoadingState what="the diversity gaps" testID="attention-gaps-loading" />;
  const list = gaps.data.carriages;
  const count = gaps.data.total ?? list.length;
  return (
    <Card title={`Diversity gaps: ${formatCount(count)}`} emphasis={count > 0 ? 'attention' : 'none'} testID="attention-gaps">
      {count === 0 ? (
        <Text style={styles.ok}>Every reserve feed protects its carriage.</Text>
      ) : (
        <Rows>
          {list.slice(0, FIRST).map((g) => (
            <LinkRow key={g.carriage} href={`/carriages/${encodeURIComponent(g.carriage)}`} title={g.carriage} detail={`another feed could avoid ${g.avoidable.map((e) => `${e.kind} ${e.code}`).join(', ')}`} />
          ))}
          {count > FIRST ? <LinkRow href="/resilience" title={`All ${countOf(count, 'carriage')} with a gap`} /> : null}
        </Rows>
      )}
    </Card>
  );
}

function ExposureCard() {
  const exposure = useExposure(FIRST);
  if (exposure.error && !exposure.data) return <ErrorState what="the exposure ranking" error={exposure.error} onRetry={() => void exposure.mutate()} testID="attention-exposure-error" />;
  if (!exposure.data) return <LoadingState what="the exposure ranking" testID="attention-exposure-loading" />;
  const list = exposure.data.elements;
  return (
    <Card title="Most exposed" testID="attention-exposure">
      {list.length === 0 ? (
        <Text style={styles.ok}>No single failure takes any household off air.</Text>
      ) : (
        <Rows>
          {list.map((r) => (
            <LinkRow
              key={`${r.element.kind}:${r.element.code}`}
              href={`/reach?fail=${r.element.kind}:${r.element.code}`}
              title={`${r.element.kind} ${r.element.code}`}
              detail={`${countOf(r.households, 'household')} off air if it fails`}
            />
          ))}
          <LinkRow href="/resilience" title="The whole ranking" />
        </Rows>
      )}
    </Card>
  );
}

export function AttentionList() {
  return (
    <Columns max={3} testID="attention-analysis">
      <UnfedCard />
      <GapsCard />
      <ExposureCard />
    </Columns>
  );
}

const styles = StyleSheet.create({
  rows: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, overflow: 'hidden' },
  ok: { ...type.body, fontSize: 16, color: colors.good },
});

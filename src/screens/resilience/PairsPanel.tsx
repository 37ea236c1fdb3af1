/**
 * Critical pairs (rule 10): the top pairs of sites and groups in one sentence
 * each, opening the fault reach of the pair. The server computes them in the
 * background; until then this shows its progress and the rest of the screen
 * stays usable.
 */
import { StyleSheet, Text } from 'react-native';
import { usePairs } from '@/src/api/queries/planner';
import { Capped } from '@/src/screens/reach/Capped';
import { LinkRow } from '@/src/screens/reach/LinkRow';
import { formatFailSet } from '@/src/screens/reach/failSet';
import { ErrorState, LoadingState } from '@/src/components/states';
import { type } from '@/src/theme';
import { formatCount } from '@/shared/format';
import type { ElementNamer } from './elementNames';
import { pairSentence } from './plannerWords';
import { WorkProgress } from './WorkProgress';

export const PAIRS_SHOWN = 20;
const PAIR_SAMPLE = 4;

export function PairsPanel({ name }: { name: ElementNamer }) {
  // Four carriages named per pair, and their count: a pair at 20,000 sites takes off thousands.
  const pairs = usePairs(PAIRS_SHOWN, 'site,group', PAIR_SAMPLE);
  if (pairs.error && !pairs.data) return <ErrorState what="the critical pairs" error={pairs.error} onRetry={() => void pairs.mutate()} />;
  if (!pairs.data) return <LoadingState what="the critical pairs" />;
  if (pairs.data.state === 'running') {
    return <WorkProgress what="Working out every pair of sites and groups" label="Critical pairs worked out so far" progress={pairs.data.progress} testID="pairs-running" />;
  }
  const list = pairs.data.pairs;
  if (list.length === 0) return <Text style={styles.body}>No two sites or groups take anything off air together that neither takes alone.</Text>;
  return (
    <Capped
      items={list}
      what="pairs"
      first={5}
      render={(p) => {
        const fail = formatFailSet(p.elements);
        const together = p.jointLostCount ?? p.jointLost.length;
        return (
          <LinkRow
            key={fail}
            href={`/reach?fail=${encodeURIComponent(fail).replace(/%2C/g, ',').replace(/%3A/g, ':')}`}
            title={pairSentence(name, p.elements, p.households, together)}
            detail={`Only together: ${p.jointLost.slice(0, PAIR_SAMPLE).join(', ')}${together > PAIR_SAMPLE ? ` and ${formatCount(together - PAIR_SAMPLE)} more` : ''}. Open the fault reach of the pair.`}
          />
        );
      }}
    />
  );
}

const styles = StyleSheet.create({
  body: { ...type.body, fontSize: 16 },
});

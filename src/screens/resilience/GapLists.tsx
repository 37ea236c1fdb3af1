/** Diversity gaps (with the elements main and reserve still share) and unfed carriages, each row opening the carriage's chain. */
import { StyleSheet, Text, View } from 'react-native';
import type { Element } from '@/shared/schemas/analysis';
import { Capped } from '@/src/screens/reach/Capped';
import { LinkRow } from '@/src/screens/reach/LinkRow';
import { space, type } from '@/src/theme';
import { elementWords } from './elementNames';

export function DiversityList({ gaps }: { gaps: { carriage: string; service: string; site: string; shared: Element[] }[] }) {
  if (gaps.length === 0) return <Text style={styles.none}>None: every reserve feed protects its carriage from all single failures.</Text>;
  return (
    <Capped
      items={gaps}
      what="carriages"
      first={10}
      render={(g) => (
        <LinkRow key={g.carriage} href={`/carriages/${encodeURIComponent(g.carriage)}`} title={g.carriage} detail={`Main and reserve share: ${g.shared.map(elementWords).join(', ')}`} />
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
        render={(u) => <LinkRow key={u.carriage} href={`/carriages/${encodeURIComponent(u.carriage)}`} title={u.carriage} status="off-air" detail={`${u.service} at ${u.site}: no programme even with nothing failed`} />}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  none: { ...type.body, fontSize: 16 },
});

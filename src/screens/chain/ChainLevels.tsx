/**
 * A big chain folded by level: how many carriages sit at each hop from this
 * one, and a button per hop that opens the tree down to it (what lies
 * deeper stays folded, with its count on each folded carriage).
 */
import { StyleSheet, Text, View } from 'react-native';
import { formatCount } from '@/shared/format';
import { Button } from '@/src/components/Button';
import { colors, radius, space, type } from '@/src/theme';

export function ChainLevels({ levels, onOpenTo }: { levels: number[]; onOpenTo: (depth: number) => void }) {
  // levels[0] is the carriage itself; hop k holds levels[k] carriages.
  let upTo = 1;
  return (
    <View style={styles.box} testID="chain-levels" role="list" aria-label="Carriages by hop">
      {levels.slice(1).map((count, i) => {
        const hop = i + 1;
        upTo += count;
        return (
          <View key={hop} style={styles.row} role="listitem">
            <Text style={styles.words}>
              <Text style={styles.figure}>{formatCount(count)}</Text>
              {` carriage${count === 1 ? '' : 's'} at hop ${hop}`}
            </Text>
            <Button
              label={`Open to hop ${hop}`}
              variant="quiet"
              accessibilityLabel={`Open to hop ${hop}: ${formatCount(upTo)} carriages in the tree`}
              onPress={() => onOpenTo(hop)}
              testID={`chain-open-to-${hop}`}
            />
          </View>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, backgroundColor: colors.surface, paddingHorizontal: space.md, paddingVertical: space.xs },
  row: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', flexWrap: 'wrap', gap: space.sm },
  words: { ...type.body, fontSize: 16 },
  figure: { ...type.figure, fontSize: 16 },
});

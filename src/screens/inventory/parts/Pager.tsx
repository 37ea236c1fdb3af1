/**
 * Previous and next page, with where the person is in words:
 * "Page 2 of 13, sites 26-50 of 312".
 */
import { StyleSheet, Text, View } from 'react-native';
import { Button } from '@/src/components/Button';
import { space, type } from '@/src/theme';
import { pageCount, rangeText } from '../listQuery';

export interface PagerProps {
  page: number;
  pageSize: number;
  total: number;
  /** "sites" */
  noun: string;
  onPage: (page: number) => void;
  testID?: string;
}

export function Pager({ page, pageSize, total, noun, onPage, testID = 'pager' }: PagerProps) {
  const pages = pageCount(total, pageSize);
  return (
    <View style={styles.row} testID={testID}>
      <Button label="Previous page" variant="secondary" disabled={page <= 1} onPress={() => onPage(page - 1)} testID={`${testID}-previous`} />
      <Text style={styles.where} accessibilityLiveRegion="polite" testID={`${testID}-where`}>
        {`Page ${page} of ${pages}, ${noun} ${rangeText(page, pageSize, total)}`}
      </Text>
      <Button label="Next page" variant="secondary" disabled={page >= pages} onPress={() => onPage(page + 1)} testID={`${testID}-next`} />
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', flexWrap: 'wrap', gap: space.sm },
  where: { ...type.small, flexShrink: 1, textAlign: 'center', fontVariant: ['tabular-nums'] },
});

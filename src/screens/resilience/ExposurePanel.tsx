/**
 * Elements ranked by exposure (docs/domain.md rule 7: households that lose at
 * least one service if that element alone fails), sortable, with the whole
 * ranking downloadable as CSV. Each row opens the fault reach for that element.
 */
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { analysisKeys } from '@/src/api/queries/analysis';
import type { ExposureRow } from '@/shared/schemas/analysis';
import { useSend } from '@/src/api/ApiProvider';
import { parseAnswer } from '@/src/api/client';
import { exposureAnswerSchema } from '@/src/api/schemas';
import { Button } from '@/src/components/Button';
import { formatCount } from '@/shared/format';
import { DataTable } from '@/src/components/DataTable/DataTable';
import { describeError } from '@/src/components/states';
import { colors, space, type } from '@/src/theme';
import { elementWords, type ElementNamer } from './elementNames';
import { exposureCsv, exposureFileName } from './exposureCsv';
import { saveCsv } from './saveCsv';

export const EXPOSURE_SHOWN = 100;

export function ExposurePanel({ rows, networkVersion, name }: { rows: ExposureRow[]; networkVersion: number; name: ElementNamer }) {
  const router = useRouter();
  const send = useSend();
  const [busy, setBusy] = useState(false);
  const [said, setSaid] = useState<string | null>(null);
  // A failure is said in the error colour, never the success green.
  const [failed, setFailed] = useState(false);
  const ranked = rows.map((r, i) => ({ ...r, rank: i + 1 }));

  const download = async () => {
    setBusy(true);
    setSaid(null);
    setFailed(false);
    try {
      // The file holds the whole ranking, not only the rows on screen.
      const path = analysisKeys.namedExposure();
      const all = parseAnswer(exposureAnswerSchema, path, await send(path));
      const nameOf = (e: ExposureRow['element']) => all.names?.[`${e.kind}:${e.code}`] ?? name(e);
      const csv = exposureCsv(all.elements.map((r, i) => ({ rank: i + 1, element: r.element, name: nameOf(r.element), households: r.households, carriages: r.carriages })));
      setSaid(await saveCsv(exposureFileName(all.networkVersion, new Date()), csv));
    } catch (e) {
      setFailed(true);
      setSaid(`Could not export: ${describeError(e)}`);
    } finally {
      setBusy(false);
    }
  };

  return (
    <View style={styles.wrap}>
      <View style={styles.tools}>
        <Button label="Download CSV" icon="inventory" variant="secondary" busy={busy} onPress={() => void download()} testID="exposure-csv" />
        <Text style={[styles.said, failed && styles.failed]} accessibilityLiveRegion="polite" testID="exposure-csv-status">
          {said ?? ''}
        </Text>
      </View>
      {/* The ranking scrolls in its own box (rows on screen only) so the charts and lists below stay within reach; cards on a phone. */}
      <DataTable
        caption="Elements ranked by exposure"
        testID="exposure-table"
        virtual
        cardsOnPhone={{ lead: 'households', title: (r) => `${r.rank}. ${elementWords(r.element)}${name(r.element) ? `, ${name(r.element)}` : ''}`, hide: ['rank', 'kind', 'code', 'name'] }}
        rows={ranked}
        rowKey={(r) => `${r.element.kind}:${r.element.code}`}
        initialSort={{ column: 'households', direction: 'desc' }}
        onRowPress={(r) => router.push(`/reach?fail=${r.element.kind}:${r.element.code}`)}
        rowLabel={(r) => `${elementWords(r.element)}${name(r.element) ? `, ${name(r.element)}` : ''}: ${formatCount(r.households)} households, ${r.carriages} carriages. Open its fault reach.`}
        columns={[
          { key: 'rank', label: 'Rank', numeric: true, width: 70, value: (r) => r.rank },
          { key: 'kind', label: 'Kind', width: 80, value: (r) => r.element.kind },
          { key: 'code', label: 'Element', mono: true, width: 150, value: (r) => r.element.code },
          { key: 'name', label: 'Name', width: 180, value: (r) => name(r.element) ?? '' },
          { key: 'households', label: 'Households', unit: 'off air', numeric: true, width: 140, value: (r) => r.households, format: (v) => formatCount(v as number) },
          { key: 'carriages', label: 'Carriages', unit: 'off air', numeric: true, width: 130, value: (r) => r.carriages, format: (v) => formatCount(v as number) },
        ]}
      />
      <Text style={styles.note}>{`Network version ${networkVersion}. Press a row to see what that element's failure takes off air.`}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  tools: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', gap: space.md },
  said: { ...type.small, color: colors.good },
  failed: { color: colors.bad },
  note: { ...type.small },
});

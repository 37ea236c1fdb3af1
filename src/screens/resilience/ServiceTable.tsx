/** Counts per service (carriages, diversity gaps, unfed) as a sortable table and a chart of the gaps. */
import { useMemo } from 'react';
import { Text, View, StyleSheet } from 'react-native';
import type { NetworkDrawing } from '@/src/api/schemas';
import { BarChart } from '@/src/components/charts/BarChart';
import { formatCount } from '@/shared/format';
import { DataTable } from '@/src/components/DataTable/DataTable';
import { ErrorState, LoadingState } from '@/src/components/states';
import { space, type } from '@/src/theme';
import { serviceCounts } from './serviceCounts';

type Listing = { carriages: { service: string }[] };

export interface ServiceTableProps {
  drawing: NetworkDrawing | undefined;
  diversity: Listing | undefined;
  unfed: Listing | undefined;
  error: unknown;
  onRetry: () => void;
}

export function ServiceTable({ drawing, diversity, unfed, error, onRetry }: ServiceTableProps) {
  const rows = useMemo(() => (drawing && diversity && unfed ? serviceCounts(drawing.carriages, diversity.carriages, unfed.carriages) : null), [drawing, diversity, unfed]);
  const names = useMemo(() => new Map((drawing?.services ?? []).map((s) => [s.code, s.name])), [drawing]);
  if (!rows) {
    return error ? (
      <ErrorState what="the counts per service" error={error} onRetry={onRetry} />
    ) : (
      <LoadingState what="the counts per service" />
    );
  }
  if (rows.length === 0) return <Text style={styles.small}>No services yet.</Text>;
  const withGaps = rows.filter((r) => r.gaps > 0).sort((a, b) => b.gaps - a.gaps);
  return (
    <View style={styles.wrap}>
      <DataTable
        caption="Counts per service"
        testID="service-counts"
        rows={rows}
        rowKey={(r) => r.service}
        initialSort={{ column: 'service', direction: 'asc' }}
        cardsOnPhone={{ lead: 'carriages', title: (r) => `${names.get(r.service) ?? r.service} (${r.service})`, hide: ['service', 'name'] }}
        columns={[
          { key: 'service', label: 'Service', mono: true, width: 80, value: (r) => r.service },
          { key: 'name', label: 'Name', width: 150, value: (r) => names.get(r.service) ?? '' },
          { key: 'carriages', label: 'Carriages', numeric: true, width: 100, value: (r) => r.carriages, format: (v) => formatCount(v as number) },
          { key: 'gaps', label: 'Gaps', numeric: true, width: 80, value: (r) => r.gaps, format: (v) => formatCount(v as number) },
          { key: 'unfed', label: 'Unfed', numeric: true, width: 80, value: (r) => r.unfed, format: (v) => formatCount(v as number) },
        ]}
      />
      {withGaps.length > 0 ? <BarChart title="Diversity gaps per service" unit="carriages" rows={withGaps.map((r) => ({ key: r.service, label: r.service, value: r.gaps }))} testID="gaps-chart" /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  small: { ...type.small },
});

/**
 * Availability over a period: the share of the period each carriage and site
 * was on air, from recorded incidents, worst first; carried-out planned work
 * apart. A table and a chart on a wide screen, cards on a phone; CSV download.
 */
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { AvailabilityRow } from '@/shared/schemas/operations';
import { useAvailability, useAvailabilityCsv } from '@/src/api/queries/availability';
import { BarChart } from '@/src/components/charts/BarChart';
import { Button } from '@/src/components/Button';
import { Card } from '@/src/components/Card';
import { formatCount, formatPercent } from '@/shared/format';
import { Screen } from '@/src/components/layout/Screen';
import { Section } from '@/src/components/layout/Section';
import { describeError, EmptyState, ErrorState, LoadingState } from '@/src/components/states';
import { TextField } from '@/src/components/TextField';
import { useBreakpoints } from '@/src/hooks/useBreakpoints';
import { colors, space, type } from '@/src/theme';
import { saveFile } from '../importer/download';
import { fromLocalInput, toLocalInput, zoneName } from './time';

const pct = (x: number) => formatPercent(x);
const mins = (m: number) => `${formatCount(Math.round(m))} min`;

export function AvailabilityScreen() {
  const { wide } = useBreakpoints();
  const today = new Date();
  const [fromText, setFrom] = useState(toLocalInput(new Date(today.getFullYear(), today.getMonth(), today.getDate() - 30)).slice(0, 10));
  const [toText, setTo] = useState(toLocalInput(new Date(today.getFullYear(), today.getMonth(), today.getDate() + 1)).slice(0, 10));
  const [service, setService] = useState('');
  const [csvError, setCsvError] = useState<string | null>(null);
  const from = fromLocalInput(`${fromText} 00:00`);
  const to = fromLocalInput(`${toText} 00:00`);
  const report = useAvailability(from && to ? { from, to, service: service.trim() || undefined } : null);
  const csv = useAvailabilityCsv();
  const a = report.data;

  const download = async () => {
    if (!from || !to) return;
    setCsvError(null);
    try {
      saveFile(await csv(from, to, service.trim() || undefined));
    } catch (e) {
      setCsvError(describeError(e));
    }
  };

  let body: React.ReactNode;
  if (!from || !to) body = <Text style={styles.error}>Type both dates as YYYY-MM-DD.</Text>;
  else if (report.error && !a) body = <ErrorState what="availability" error={report.error} onRetry={() => void report.mutate()} />;
  else if (!a) body = <LoadingState what="availability" />;
  else
    body = (
      <>
        <Section title="Per service" note={`Over ${formatCount(Math.round(a.minutesInPeriod))} minutes; network version ${a.networkVersion}.`}>
          {a.services.map((s) => (
            <Text key={s.service} style={styles.plain}>{`${s.service}: ${pct(s.availability)} on air across ${formatCount(s.carriages)} carriages; ${mins(s.minutesOffAir)} off air, ${mins(s.minutesPlanned)} planned`}</Text>
          ))}
        </Section>
        <Section title="Carriages, worst first" note="Only carriages with an outage in the period are listed; all others were on air throughout.">
          {a.carriages.length === 0 ? (
            <EmptyState title="Nothing was off air" message="No recorded incident or carried-out work touched this period." />
          ) : wide ? (
            <>
              <BarChart title="Minutes off air (incidents)" unit="min" rows={a.carriages.slice(0, 12).map((r) => ({ key: r.code, label: r.code, value: Math.round(r.minutesOffAir) }))} testID="availability-chart" />
              <Table rows={a.carriages} first="Carriage" />
            </>
          ) : (
            <View style={styles.list}>
              {a.carriages.map((r) => (
                <Card key={r.code} title={r.code} testID={`availability-card-${r.code}`}>
                  <Text style={styles.plain}>{`${pct(r.availability)} on air · ${mins(r.minutesOffAir)} off air`}</Text>
                  <Text style={styles.small}>{`Planned work: ${mins(r.minutesPlanned)} · site ${r.site}`}</Text>
                </Card>
              ))}
            </View>
          )}
        </Section>
        {wide && a.sites.length ? (
          <Section title="Sites, worst first">
            <Table rows={a.sites} first="Site" />
          </Section>
        ) : null}
      </>
    );

  return (
    <Screen title="Availability" subtitle="How much of a period each carriage and site was on air." actions={<Button label="Download CSV" variant="secondary" onPress={() => void download()} testID="availability-csv" />} testID="availability-screen">
      <Section title="Period" note={`Dates in ${zoneName()}, from the start of the first day to the start of the second.`}>
        <View style={styles.row}>
          <TextField label="From (YYYY-MM-DD)" value={fromText} onChangeText={setFrom} mono testID="availability-from" />
          <TextField label="To (YYYY-MM-DD)" value={toText} onChangeText={setTo} mono testID="availability-to" />
          <TextField label="Service code (optional)" value={service} onChangeText={setService} autoCapitalize="none" testID="availability-service" />
        </View>
        {csvError ? <Text style={styles.error} accessibilityRole="alert">{csvError}</Text> : null}
      </Section>
      {body}
    </Screen>
  );
}

function Table({ rows, first }: { rows: readonly AvailabilityRow[]; first: string }) {
  return (
    <View style={styles.table} accessibilityRole="none" testID={`availability-table-${first.toLowerCase()}`}>
      <View style={[styles.tr, styles.th]}>
        {[first, 'On air', 'Off air', 'Planned work'].map((h) => (
          <Text key={h} style={[styles.td, styles.head]}>{h}</Text>
        ))}
      </View>
      {rows.map((r) => (
        <View key={r.code} style={styles.tr} testID={`availability-row-${r.code}`}>
          <Text style={[styles.td, styles.mono]}>{r.code}</Text>
          <Text style={styles.td}>{pct(r.availability)}</Text>
          <Text style={styles.td}>{mins(r.minutesOffAir)}</Text>
          <Text style={styles.td}>{mins(r.minutesPlanned)}</Text>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  list: { gap: space.md },
  plain: { ...type.body },
  small: { ...type.small },
  error: { ...type.body, color: colors.bad },
  table: { borderWidth: 1, borderColor: colors.line, backgroundColor: colors.surface },
  tr: { flexDirection: 'row', borderBottomWidth: 1, borderColor: colors.line, minHeight: 40, alignItems: 'center' },
  th: { backgroundColor: colors.sunken },
  td: { flex: 1, ...type.body, fontSize: 15, paddingHorizontal: space.sm },
  head: { ...type.label },
  mono: { fontVariant: ['tabular-nums'] },
});

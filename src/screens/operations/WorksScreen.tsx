/**
 * Planned work: a list on a phone, a week or month timeline on a wide
 * screen; filters by state, element and service. Clashes show by shape and
 * words on both.
 */
import { Link, useRouter } from 'expo-router';
import { useMemo, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { WORK_STATE_LABELS, WORK_STATES, type WorkAnswer, type WorkState } from '@/shared/schemas/operations';
import { useWorks } from '@/src/api/queries/works';
import { Button } from '@/src/components/Button';
import { Card } from '@/src/components/Card';
import { Choice } from '@/src/components/Choice';
import { Screen } from '@/src/components/layout/Screen';
import { Section } from '@/src/components/layout/Section';
import { EmptyState, ErrorState, LoadingState } from '@/src/components/states';
import { StatusShape } from '@/src/components/StatusShape';
import { TextField } from '@/src/components/TextField';
import { useBreakpoints } from '@/src/hooks/useBreakpoints';
import { colors, space, type } from '@/src/theme';
import { clashSentence, StateBadge, WorkCautions } from './parts';
import { localText, zoneName } from './time';
import { WorkTimeline } from './WorkTimeline';

type StateFilter = WorkState | 'all';
const DAY = 86_400_000;

function startOf(view: 'week' | 'month', d: Date): Date {
  if (view === 'month') return new Date(d.getFullYear(), d.getMonth(), 1);
  const monday = new Date(d.getFullYear(), d.getMonth(), d.getDate());
  monday.setDate(monday.getDate() - ((monday.getDay() + 6) % 7));
  return monday;
}

export function matchesFilter(w: WorkAnswer, element: string, service: string): boolean {
  const e = element.trim().toLowerCase();
  const s = service.trim().toLowerCase();
  if (e && !w.elements.some((x) => x.code.toLowerCase().includes(e))) return false;
  if (s && !w.reach.byService.some((b) => b.service.toLowerCase() === s)) return false;
  return true;
}

export function WorksScreen() {
  const router = useRouter();
  const { wide } = useBreakpoints();
  const [state, setState] = useState<StateFilter>('all');
  const [element, setElement] = useState('');
  const [service, setService] = useState('');
  const [view, setView] = useState<'week' | 'month'>('month');
  const [anchor, setAnchor] = useState(() => new Date());
  const works = useWorks(state === 'all' ? {} : { state: [state] });
  const from = startOf(view, anchor);
  const days = view === 'week' ? 7 : new Date(from.getFullYear(), from.getMonth() + 1, 0).getDate();
  const shown = useMemo(() => (works.data?.items ?? []).filter((w) => matchesFilter(w, element, service)), [works.data, element, service]);

  let body: React.ReactNode;
  if (works.error && !works.data) body = <ErrorState what="planned work" error={works.error} onRetry={() => void works.mutate()} />;
  else if (!works.data) body = <LoadingState what="planned work" />;
  else if (wide)
    body = (
      <Section
        title={view === 'week' ? `Week from ${from.toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric' })}` : from.toLocaleDateString('en-GB', { month: 'long', year: 'numeric' })}
        note={`Times in ${zoneName()}. Stacked bars overlap in time; a triangle and the word "clash" mark work that takes more off air together with another.`}
        aside={
          <View style={styles.row}>
            <Button label="Earlier" variant="secondary" onPress={() => setAnchor(new Date(from.getTime() - (view === 'week' ? 7 : 20) * DAY))} />
            <Button label="Later" variant="secondary" onPress={() => setAnchor(new Date(from.getTime() + (view === 'week' ? 7 : 40) * DAY))} />
            <Button label={view === 'week' ? 'Show month' : 'Show week'} variant="quiet" onPress={() => setView(view === 'week' ? 'month' : 'week')} />
          </View>
        }
      >
        <WorkTimeline works={shown} from={from} days={days} />
        <WorkList works={shown} />
      </Section>
    );
  else body = shown.length ? <WorkList works={shown} /> : <EmptyState title="No planned work" message="Nothing matches these filters." />;

  return (
    <Screen title="Planned work" subtitle="Work that takes sites, feeds or groups out of service, its reach and its clashes." actions={<Button label="Plan work" icon="reach" onPress={() => router.push('/works/new')} testID="works-new" />} testID="works-screen">
      <Section title="Filter">
        <View style={wide ? styles.filtersWide : styles.filters}>
          <Choice<StateFilter> label="State" value={state} onChange={setState} options={[{ value: 'all', label: 'All' }, ...WORK_STATES.map((s) => ({ value: s, label: WORK_STATE_LABELS[s] }))]} testID="works-state" />
          <TextField label="Element code" value={element} onChangeText={setElement} placeholder="site, carriage, feed or group" autoCapitalize="none" testID="works-element" />
          <TextField label="Service code" value={service} onChangeText={setService} placeholder="a service it affects" autoCapitalize="none" testID="works-service" />
        </View>
      </Section>
      {body}
      <WorkCautions />
    </Screen>
  );
}

function WorkList({ works }: { works: readonly WorkAnswer[] }) {
  return (
    <View style={styles.list} testID="works-list">
      {works.map((w) => (
        <Card key={w.code} title={`${w.code} · ${w.title}`} emphasis={w.clashes.length ? 'attention' : 'none'} testID={`work-${w.code}`}>
          <View style={styles.row}>
            <StateBadge state={w.state} label={w.stateLabel} />
            <Text style={styles.small}>{`${localText(w.start, false)} to ${localText(w.end)}`}</Text>
          </View>
          <Text style={styles.plain}>{`Off air: ${w.reach.lost.length}, on reserve: ${w.reach.fallback.length}`}</Text>
          {w.clashes.map((c) => (
            <View key={c.work} style={styles.row}>
              <StatusShape shape="triangle" color={colors.warn} />
              <Text style={styles.plain}>{`Clash: ${clashSentence(c)}`}</Text>
            </View>
          ))}
          <Link href={`/works/${w.code}`} style={styles.link}>{`Open ${w.code}`}</Link>
        </Card>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  filters: { gap: space.md },
  filtersWide: { flexDirection: 'row', gap: space.lg, flexWrap: 'wrap', alignItems: 'flex-start' },
  list: { gap: space.md },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  plain: { ...type.body },
  small: { ...type.small },
  link: { ...type.label, color: colors.accent, minHeight: 44, paddingVertical: space.md },
});

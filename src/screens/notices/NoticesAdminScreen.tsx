/** Notices sent, waiting and failed (admins), newest first, with the reason of the last failed try. */
import { StyleSheet, Text, View } from 'react-native';
import type { NoticeInfo } from '@/shared/schemas/notices';
import { useNotices } from '@/src/api/queries/notices';
import { Badge, type Tone } from '@/src/components/Badge';
import { formatCount } from '@/shared/format';
import { Section } from '@/src/components/layout/Section';
import type { ShapeName } from '@/src/components/StatusShape';
import { EmptyState, ErrorState, LoadingState } from '@/src/components/states';
import { whenText } from '@/shared/format';
import { colors, space, type } from '@/src/theme';
import { AdminOnly, useIsNoticeAdmin } from './AdminOnly';

const STATUS: Record<NoticeInfo['status'], { label: string; tone: Tone; shape: ShapeName }> = {
  sent: { label: 'Sent', tone: 'good', shape: 'solid' },
  waiting: { label: 'Waiting', tone: 'warn', shape: 'half' },
  failed: { label: 'Failed', tone: 'bad', shape: 'cross' },
};

function NoticeRow({ n }: { n: NoticeInfo }) {
  const s = STATUS[n.status];
  return (
    <View style={styles.row} testID={`notice-${n.id}`}>
      <Badge label={s.label} tone={s.tone} shape={s.shape} />
      <View style={styles.text}>
        <Text style={type.label}>{n.subject}</Text>
        <Text style={type.small}>
          To {n.address}; queued {whenText(n.createdAt)}
          {n.sentAt ? `; sent ${whenText(n.sentAt)}` : ''}; {n.attempts === 1 ? '1 try' : `${formatCount(n.attempts)} tries`}
        </Text>
        {n.lastError && n.status !== 'sent' ? <Text style={[type.small, styles.reason]}>Last try failed: {n.lastError}</Text> : null}
      </View>
    </View>
  );
}

export function NoticesAdminScreen() {
  const notices = useNotices(useIsNoticeAdmin());
  const c = notices.data?.counts;
  return (
    <AdminOnly title="Notices" subtitle="Mail sent about faults and planned work" testID="notices-admin">
      <Section title="Latest" note={c ? `${formatCount(c.sent)} sent, ${formatCount(c.waiting)} waiting, ${formatCount(c.failed)} failed` : undefined} testID="notices-list">
        {!notices.data ? (
          notices.error ? <ErrorState what="the notices" error={notices.error} onRetry={() => void notices.mutate()} /> : <LoadingState what="the notices" />
        ) : notices.data.items.length === 0 ? (
          <EmptyState title="No notices yet" message="They appear when a fault or planned work reaches someone's choice." />
        ) : (
          notices.data.items.map((n) => <NoticeRow key={n.id} n={n} />)
        )}
      </Section>
    </AdminOnly>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', gap: space.md, alignItems: 'flex-start', paddingVertical: space.sm, borderBottomWidth: 1, borderBottomColor: colors.line },
  text: { flex: 1, gap: space.xxs },
  reason: { color: colors.bad },
});

/**
 * The local mailbox (admins): what the SMTP stand-in received, so a person
 * trying Headwater on a laptop sees the mail it sent. Shown only while the
 * stand-in runs; with a real SMTP server the mail is in real inboxes.
 */
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { MailInfo } from '@/shared/schemas/notices';
import { isApiError } from '@/src/api/client';
import { useMailbox } from '@/src/api/queries/notices';
import { Button } from '@/src/components/Button';
import { Section } from '@/src/components/layout/Section';
import { EmptyState, ErrorState, LoadingState } from '@/src/components/states';
import { whenText } from '@/shared/format';
import { colors, space, type } from '@/src/theme';
import { AdminOnly, useIsNoticeAdmin } from './AdminOnly';

function Mail({ m }: { m: MailInfo }) {
  const [open, setOpen] = useState(false);
  return (
    <View style={styles.mail} testID="mailbox-mail">
      <Text style={type.label}>{m.subject}</Text>
      <Text style={type.small}>
        To {m.to.join(', ')}; received {whenText(m.receivedAt)}
      </Text>
      <Button label={open ? 'Hide text' : 'Show text'} variant="quiet" onPress={() => setOpen(!open)} accessibilityLabel={`${open ? 'Hide' : 'Show'} the text of ${m.subject}`} />
      {open ? <Text style={[type.code, styles.body]}>{m.text}</Text> : null}
    </View>
  );
}

export function MailboxScreen() {
  const box = useMailbox(useIsNoticeAdmin());
  const off = box.error && isApiError(box.error) && box.error.status === 404;
  return (
    <AdminOnly title="Local mailbox" subtitle="Mail received by the built-in SMTP stand-in" testID="mailbox">
      <Section title="Received" note={box.data ? `${box.data.items.length} shown, kept in ${box.data.folder}` : undefined}>
        {off ? (
          <EmptyState title="No local mailbox" message="This server sends mail through a real SMTP server (SMTP_URL), so the mail is in people's inboxes." />
        ) : !box.data ? (
          box.error ? <ErrorState what="the mailbox" error={box.error} onRetry={() => void box.mutate()} /> : <LoadingState what="the mailbox" />
        ) : box.data.items.length === 0 ? (
          <EmptyState title="Empty" message="Mail arrives here when a fault or planned work reaches someone's notice choice." testID="mailbox-empty" />
        ) : (
          box.data.items.map((m) => <Mail key={m.id} m={m} />)
        )}
      </Section>
    </AdminOnly>
  );
}

const styles = StyleSheet.create({
  mail: { paddingVertical: space.sm, borderBottomWidth: 1, borderBottomColor: colors.line, gap: space.xxs },
  body: { backgroundColor: colors.sunken, padding: space.sm },
});

import { MailboxScreen } from '@/src/screens/notices/MailboxScreen';

export default function MailboxRoute() {
  return <MailboxScreen />;
}

import { deferredScreen } from '@/src/screens/deferredRoute';

const MailboxScreen = deferredScreen((s) => s.MailboxScreen);

export default function MailboxRoute() {
  return <MailboxScreen />;
}

import { deferredScreen } from '@/src/screens/deferredRoute';

const ContactsScreen = deferredScreen((s) => s.ContactsScreen);

export default function ContactsRoute() {
  return <ContactsScreen />;
}

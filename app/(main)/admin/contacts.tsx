import { ContactsScreen } from '@/src/screens/notices/ContactsScreen';

export default function ContactsRoute() {
  return <ContactsScreen />;
}

import { PeopleScreen } from '@/src/screens/people/PeopleScreen';

export default function PeopleRoute() {
  return <PeopleScreen />;
}

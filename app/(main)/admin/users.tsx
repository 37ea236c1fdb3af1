import { deferredScreen } from '@/src/screens/deferredRoute';

const PeopleScreen = deferredScreen((s) => s.PeopleScreen);

export default function PeopleRoute() {
  return <PeopleScreen />;
}

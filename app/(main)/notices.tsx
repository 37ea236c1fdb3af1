import { deferredScreen } from '@/src/screens/deferredRoute';

const MyNoticesScreen = deferredScreen((s) => s.MyNoticesScreen);

export default function MyNoticesRoute() {
  return <MyNoticesScreen />;
}

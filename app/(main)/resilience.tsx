import { deferredScreen } from '@/src/screens/deferredRoute';

const ResilienceScreen = deferredScreen((s) => s.ResilienceScreen);

export default function ResilienceRoute() {
  return <ResilienceScreen />;
}

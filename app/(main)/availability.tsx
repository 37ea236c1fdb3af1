import { deferredScreen } from '@/src/screens/deferredRoute';

const AvailabilityScreen = deferredScreen((s) => s.AvailabilityScreen);

export default function AvailabilityRoute() {
  return <AvailabilityScreen />;
}

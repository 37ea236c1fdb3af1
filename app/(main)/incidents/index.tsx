import { deferredScreen } from '@/src/screens/deferredRoute';

const IncidentsScreen = deferredScreen((s) => s.IncidentsScreen);

export default function IncidentsRoute() {
  return <IncidentsScreen />;
}

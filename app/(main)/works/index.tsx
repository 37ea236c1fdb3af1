import { deferredScreen } from '@/src/screens/deferredRoute';

const WorksScreen = deferredScreen((s) => s.WorksScreen);

export default function WorksRoute() {
  return <WorksScreen />;
}

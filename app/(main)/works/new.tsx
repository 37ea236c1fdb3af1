import { deferredScreen } from '@/src/screens/deferredRoute';

const WorkFormScreen = deferredScreen((s) => s.WorkFormScreen);

export default function NewWorkRoute() {
  return <WorkFormScreen />;
}

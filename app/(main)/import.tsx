import { deferredScreen } from '@/src/screens/deferredRoute';

const ImportScreen = deferredScreen((s) => s.ImportScreen);

export default function ImportRoute() {
  return <ImportScreen />;
}

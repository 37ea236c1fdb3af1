import { ImportScreen } from '@/src/screens/importer/ImportScreen';

export default function ImportRoute() {
  return <ImportScreen />;
}

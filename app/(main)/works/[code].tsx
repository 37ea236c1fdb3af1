import { useLocalSearchParams } from 'expo-router';
import { deferredScreen } from '@/src/screens/deferredRoute';

const WorkDetailScreen = deferredScreen((s) => s.WorkDetailScreen);

export default function WorkRoute() {
  const { code } = useLocalSearchParams<{ code: string }>();
  return <WorkDetailScreen code={String(code)} />;
}

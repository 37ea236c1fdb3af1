import { useLocalSearchParams } from 'expo-router';
import { deferredScreen } from '@/src/screens/deferredRoute';

const GroupDetailScreen = deferredScreen((s) => s.GroupDetailScreen);

export default function GroupRoute() {
  const { code } = useLocalSearchParams<{ code: string }>();
  return <GroupDetailScreen code={String(code)} />;
}

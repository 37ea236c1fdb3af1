import { useLocalSearchParams } from 'expo-router';
import { deferredScreen } from '@/src/screens/deferredRoute';

const FeedDetailScreen = deferredScreen((s) => s.FeedDetailScreen);

export default function FeedRoute() {
  const { code } = useLocalSearchParams<{ code: string }>();
  return <FeedDetailScreen code={String(code)} />;
}

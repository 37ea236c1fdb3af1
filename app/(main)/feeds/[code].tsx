import { useLocalSearchParams } from 'expo-router';
import { FeedDetailScreen } from '@/src/screens/inventory/details/FeedDetailScreen';

export default function FeedRoute() {
  const { code } = useLocalSearchParams<{ code: string }>();
  return <FeedDetailScreen code={String(code)} />;
}

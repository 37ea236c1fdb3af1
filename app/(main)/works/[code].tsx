import { useLocalSearchParams } from 'expo-router';
import { WorkDetailScreen } from '@/src/screens/operations/WorkDetailScreen';

export default function WorkRoute() {
  const { code } = useLocalSearchParams<{ code: string }>();
  return <WorkDetailScreen code={String(code)} />;
}

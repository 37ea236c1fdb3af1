import { useLocalSearchParams } from 'expo-router';
import { GroupDetailScreen } from '@/src/screens/inventory/details/GroupDetailScreen';

export default function GroupRoute() {
  const { code } = useLocalSearchParams<{ code: string }>();
  return <GroupDetailScreen code={String(code)} />;
}

import { useLocalSearchParams } from 'expo-router';
import { IncidentDetailScreen } from '@/src/screens/operations/IncidentDetailScreen';

export default function IncidentRoute() {
  const { code } = useLocalSearchParams<{ code: string }>();
  return <IncidentDetailScreen code={String(code)} />;
}

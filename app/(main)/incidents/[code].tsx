import { useLocalSearchParams } from 'expo-router';
import { deferredScreen } from '@/src/screens/deferredRoute';

const IncidentDetailScreen = deferredScreen((s) => s.IncidentDetailScreen);

export default function IncidentRoute() {
  const { code } = useLocalSearchParams<{ code: string }>();
  return <IncidentDetailScreen code={String(code)} />;
}

import { useLocalSearchParams } from 'expo-router';
import { ServiceDetailScreen } from '@/src/screens/inventory/details/ServiceDetailScreen';

export default function ServiceRoute() {
  const { code } = useLocalSearchParams<{ code: string }>();
  return <ServiceDetailScreen code={String(code)} />;
}

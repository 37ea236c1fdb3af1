import { useLocalSearchParams } from 'expo-router';
import { deferredScreen } from '@/src/screens/deferredRoute';

const ServiceDetailScreen = deferredScreen((s) => s.ServiceDetailScreen);

export default function ServiceRoute() {
  const { code } = useLocalSearchParams<{ code: string }>();
  return <ServiceDetailScreen code={String(code)} />;
}

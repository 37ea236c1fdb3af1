import { useLocalSearchParams } from 'expo-router';
import { deferredScreen } from '@/src/screens/deferredRoute';

const ChecksScreen = deferredScreen((s) => s.ChecksRouteScreen);

export default function ChecksRoute() {
  const params = useLocalSearchParams<{ severity?: string; check?: string }>();
  return <ChecksScreen params={params} />;
}

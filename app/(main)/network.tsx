import { useLocalSearchParams } from 'expo-router';
import { NetworkScreen } from '@/src/screens/network/NetworkScreen';

export default function NetworkRoute() {
  const { service, fail } = useLocalSearchParams<{ service?: string; fail?: string | string[] }>();
  return <NetworkScreen service={typeof service === 'string' && service !== '' ? service : null} failParam={fail} />;
}

import { useLocalSearchParams } from 'expo-router';
import { NetworkScreen } from '@/src/screens/network/NetworkScreen';

export default function NetworkRoute() {
  const { service, fail, view } = useLocalSearchParams<{ service?: string; fail?: string | string[]; view?: string }>();
  return <NetworkScreen service={typeof service === 'string' && service !== '' ? service : null} failParam={fail} mode={view === 'schematic' ? 'schematic' : 'map'} />;
}

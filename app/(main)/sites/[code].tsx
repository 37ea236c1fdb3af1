import { useLocalSearchParams } from 'expo-router';
import { SiteDetailScreen } from '@/src/screens/inventory/details/SiteDetailScreen';

export default function SiteRoute() {
  const { code } = useLocalSearchParams<{ code: string }>();
  return <SiteDetailScreen code={String(code)} />;
}

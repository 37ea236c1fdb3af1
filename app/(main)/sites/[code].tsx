import { useLocalSearchParams } from 'expo-router';
import { deferredScreen } from '@/src/screens/deferredRoute';

const SiteDetailScreen = deferredScreen((s) => s.SiteDetailScreen);

export default function SiteRoute() {
  const { code } = useLocalSearchParams<{ code: string }>();
  return <SiteDetailScreen code={String(code)} />;
}

import { useLocalSearchParams } from 'expo-router';
import { deferredScreen } from '@/src/screens/deferredRoute';

const ReachScreen = deferredScreen((s) => s.ReachScreen);

export default function ReachRoute() {
  const { fail } = useLocalSearchParams<{ fail?: string | string[] }>();
  return <ReachScreen failParam={fail} />;
}

import { useLocalSearchParams } from 'expo-router';
import { ReachScreen } from '@/src/screens/reach/ReachScreen';

export default function ReachRoute() {
  const { fail } = useLocalSearchParams<{ fail?: string | string[] }>();
  return <ReachScreen failParam={fail} />;
}

import { router, useLocalSearchParams } from 'expo-router';
import { filterParams, readFilter } from '@/src/screens/checks/failureList';
import { ChecksScreen } from '@/src/screens/checks/ChecksScreen';

export default function ChecksRoute() {
  const params = useLocalSearchParams<{ severity?: string; check?: string }>();
  return <ChecksScreen filter={readFilter(params)} onFilter={(next) => router.setParams(filterParams(next))} />;
}

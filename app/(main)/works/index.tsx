import { WorksScreen } from '@/src/screens/operations/WorksScreen';

export default function WorksRoute() {
  return <WorksScreen />;
}

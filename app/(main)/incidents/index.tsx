import { IncidentsScreen } from '@/src/screens/operations/IncidentsScreen';

export default function IncidentsRoute() {
  return <IncidentsScreen />;
}

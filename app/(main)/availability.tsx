import { AvailabilityScreen } from '@/src/screens/operations/AvailabilityScreen';

export default function AvailabilityRoute() {
  return <AvailabilityScreen />;
}

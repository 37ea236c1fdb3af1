import { ResilienceScreen } from '@/src/screens/resilience/ResilienceScreen';

export default function ResilienceRoute() {
  return <ResilienceScreen />;
}

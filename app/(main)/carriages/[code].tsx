import { useLocalSearchParams } from 'expo-router';
import { deferredScreen } from '@/src/screens/deferredRoute';

const CarriageScreen = deferredScreen((s) => s.CarriageScreen);

export default function CarriageRoute() {
  const { code, direction } = useLocalSearchParams<{ code: string; direction?: string }>();
  return <CarriageScreen code={String(code)} direction={direction === 'down' ? 'down' : 'up'} />;
}

import { useLocalSearchParams } from 'expo-router';
import { CarriageChainScreen } from '@/src/screens/chain/CarriageChainScreen';

export default function CarriageRoute() {
  const { code, direction } = useLocalSearchParams<{ code: string; direction?: string }>();
  return <CarriageChainScreen code={String(code)} direction={direction === 'down' ? 'down' : 'up'} />;
}

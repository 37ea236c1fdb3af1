import { useLocalSearchParams } from 'expo-router';
import { CarriageChainScreen } from '@/src/screens/chain/CarriageChainScreen';
import { CarriageEditScreen, useCarriageEditing } from '@/src/screens/inventory/details/CarriageRecord';

export default function CarriageRoute() {
  const { code, direction } = useLocalSearchParams<{ code: string; direction?: string }>();
  if (useCarriageEditing()) return <CarriageEditScreen code={String(code)} />;
  return <CarriageChainScreen code={String(code)} direction={direction === 'down' ? 'down' : 'up'} />;
}

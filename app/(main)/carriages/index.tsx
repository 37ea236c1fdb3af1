import { deferredScreen } from '@/src/screens/deferredRoute';

const InventoryListScreen = deferredScreen((s) => s.InventoryListScreen);

export default function CarriagesListRoute() {
  return <InventoryListScreen kind="carriages" />;
}

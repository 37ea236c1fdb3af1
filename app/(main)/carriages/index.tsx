import { InventoryListScreen } from '@/src/screens/inventory/InventoryListScreen';

export default function CarriagesListRoute() {
  return <InventoryListScreen kind="carriages" />;
}

import { InventoryListScreen } from '@/src/screens/inventory/InventoryListScreen';

export default function ServicesListRoute() {
  return <InventoryListScreen kind="services" />;
}

import { InventoryListScreen } from '@/src/screens/inventory/InventoryListScreen';

export default function FeedsListRoute() {
  return <InventoryListScreen kind="feeds" />;
}

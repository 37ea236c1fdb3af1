import { InventoryListScreen } from '@/src/screens/inventory/InventoryListScreen';

export default function SitesListRoute() {
  return <InventoryListScreen kind="sites" />;
}

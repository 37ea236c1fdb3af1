import { InventoryListScreen } from '@/src/screens/inventory/InventoryListScreen';

export default function GroupsListRoute() {
  return <InventoryListScreen kind="groups" />;
}

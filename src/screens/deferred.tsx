/**
 * Every screen that is not needed to open the app, in one script chunk that
 * the browser fetches on the first visit to any of them (see deferredRoute.tsx
 * and docs/bench/web-bundle-2026-12-05.txt). Sign-in, home and the network
 * diagram stay out: the first two are the first screen, the diagram has its
 * own chunk.
 *
 * One chunk, not one per route: the web export loads up front every module
 * that two chunks share, so screens split apart would share their forms,
 * tables and queries back into the first screen's script.
 */
import { router } from 'expo-router';
import { filterParams, readFilter } from '@/src/screens/checks/failureList';
import { ChecksScreen } from '@/src/screens/checks/ChecksScreen';
import { CarriageChainScreen } from '@/src/screens/chain/CarriageChainScreen';
import { CarriageEditScreen, useCarriageEditing } from '@/src/screens/inventory/details/CarriageRecord';

export { AuditScreen } from '@/src/screens/audit/AuditScreen';
export { ContactsScreen } from '@/src/screens/notices/ContactsScreen';
export { MailboxScreen } from '@/src/screens/notices/MailboxScreen';
export { NoticesAdminScreen } from '@/src/screens/notices/NoticesAdminScreen';
export { MyNoticesScreen } from '@/src/screens/notices/MyNoticesScreen';
export { PeopleScreen } from '@/src/screens/people/PeopleScreen';
export { AvailabilityScreen } from '@/src/screens/operations/AvailabilityScreen';
export { IncidentDetailScreen } from '@/src/screens/operations/IncidentDetailScreen';
export { IncidentsScreen } from '@/src/screens/operations/IncidentsScreen';
export { WorkDetailScreen } from '@/src/screens/operations/WorkDetailScreen';
export { WorkFormScreen } from '@/src/screens/operations/WorkFormScreen';
export { WorksScreen } from '@/src/screens/operations/WorksScreen';
export { CalculatorScreen } from '@/src/screens/checks/calculator/CalculatorScreen';
export { InventoryListScreen } from '@/src/screens/inventory/InventoryListScreen';
export { FeedDetailScreen } from '@/src/screens/inventory/details/FeedDetailScreen';
export { GroupDetailScreen } from '@/src/screens/inventory/details/GroupDetailScreen';
export { ServiceDetailScreen } from '@/src/screens/inventory/details/ServiceDetailScreen';
export { SiteDetailScreen } from '@/src/screens/inventory/details/SiteDetailScreen';
export { ImportScreen } from '@/src/screens/importer/ImportScreen';
export { ReachScreen } from '@/src/screens/reach/ReachScreen';
export { ResilienceScreen } from '@/src/screens/resilience/ResilienceScreen';

/** A carriage's page: its chain, or its record form while it is being edited. */
export function CarriageScreen({ code, direction }: { code: string; direction: 'up' | 'down' }) {
  if (useCarriageEditing()) return <CarriageEditScreen code={code} />;
  return <CarriageChainScreen code={code} direction={direction} />;
}

/** The feed checks with their filter kept in the address. */
export function ChecksRouteScreen({ params }: { params: { severity?: string; check?: string } }) {
  return <ChecksScreen filter={readFilter(params)} onFilter={(next) => router.setParams(filterParams(next))} />;
}

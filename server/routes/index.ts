/**
 * Route modules beyond sign-in and health. Each registers its routes, with
 * the roles they allow, on the shared RouteTable.
 */
import type { RouteTable } from '../http/routes';
import type { AppContext } from '../context';
import { registerAnalysisRoutes } from './analysis';
import { registerCheckRoutes } from './checks';
import { registerDocsRoutes } from './docs';
import { registerDocumentRoutes } from './documents';
import { registerNoticeRoutes } from './notices';
import { registerInventoryRoutes } from './inventory';
import { registerNetworkRoutes } from './network';
import { registerOperationsRoutes } from './operations';
import { registerRecordToolRoutes } from './recordTools';

export type RouteRegistrar = (routes: RouteTable, ctx: AppContext) => void;

export const routeRegistrars: RouteRegistrar[] = [registerAnalysisRoutes, registerCheckRoutes, registerInventoryRoutes, registerRecordToolRoutes, registerNetworkRoutes, registerOperationsRoutes, registerDocumentRoutes, registerNoticeRoutes, registerDocsRoutes];

import { can } from '@/shared/api';
import type { RouteTable } from '../http/routes';
import type { AppContext } from '../context';
import { checkHealth } from '../services/health';
import { currentModel } from './checks';

export function registerSystemRoutes(routes: RouteTable, ctx: AppContext) {
  routes.add('get', '/health', 'public', async (_req, res) => {
    const health = await checkHealth(ctx);
    res.status(health.ok ? 200 : 503).json(health);
  });

  routes.add('get', '/network/summary', can.read, async (_req, res) => {
    const m = currentModel(ctx);
    const sitesByRole = { origin: 0, main: 0, relay: 0 };
    for (const s of m.document.sites) sitesByRole[s.role] += 1;
    res.json({
      networkVersion: m.networkVersion,
      counts: { sites: m.sites.size, services: m.services.size, groups: m.groups.size, carriages: m.carriages.size, feeds: m.feeds.size },
      sitesByRole,
    });
  });
}

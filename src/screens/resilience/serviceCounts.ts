/** Per service: carriages, diversity gaps and unfed carriages (docs/domain.md rules 8 and 9), for the resilience review. */
export interface ServiceCount {
  service: string;
  carriages: number;
  gaps: number;
  unfed: number;
}

export function serviceCounts(
  carriages: readonly { service: string }[],
  gaps: readonly { service: string }[],
  unfed: readonly { service: string }[],
): ServiceCount[] {
  const rows = new Map<string, ServiceCount>();
  const row = (service: string) => {
    let r = rows.get(service);
    if (!r) rows.set(service, (r = { service, carriages: 0, gaps: 0, unfed: 0 }));
    return r;
  };
  for (const c of carriages) row(c.service).carriages++;
  for (const g of gaps) row(g.service).gaps++;
  for (const u of unfed) row(u.service).unfed++;
  return [...rows.values()].sort((a, b) => a.service.localeCompare(b.service));
}

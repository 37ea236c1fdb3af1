/**
 * Reads the whole network out of PostgreSQL as a network document.
 * Raw SQL in a handful of set-based queries rather than Sequelize instances:
 * a 20,000-site network is several hundred thousand rows, and model
 * instances would cost seconds and hundreds of megabytes for nothing.
 * The same reader serves the graph rebuild and the export.
 */
import type { Sequelize, Transaction } from 'sequelize';
import { NETWORK_FORMAT, type NetworkDocument, type Site, type Carriage, type Feed } from '@/shared/schemas/network';

type Row = Record<string, unknown>;

/** Drop null fields so the document carries only what is set (round trip). */
function clean<T extends object>(o: Row): T {
  const out: Row = {};
  for (const [k, v] of Object.entries(o)) if (v !== null && v !== undefined) out[k] = v;
  return out as T;
}

export async function loadNetworkDocument(sequelize: Sequelize, transaction?: Transaction): Promise<{ document: NetworkDocument; version: number }> {
  // One snapshot: REPEATABLE READ makes all the reads see the same committed state.
  const run = async (t?: Transaction) => {
    const query = async (sql: string) => (await sequelize.query(sql, { transaction: t }))[0] as Row[];
    const [versionRows, sites, siteGroups, services, groups, carriages, feeds, via, feedGroups] = [
      await query('SELECT version FROM network_state WHERE id = 1'),
      await query(`SELECT id, code, name, role, lat, lon, ground_height_m AS "groundHeightM", mast_height_m AS "mastHeightM", households FROM sites ORDER BY code`),
      await query(`SELECT s.id AS site, g.code FROM site_groups sg JOIN sites s ON s.id = sg.site_id JOIN risk_groups g ON g.id = sg.group_id ORDER BY g.code`),
      await query(`SELECT code, name, kind FROM services ORDER BY code`),
      await query(`SELECT code, name, note FROM risk_groups ORDER BY code`),
      await query(`SELECT c.code, s.code AS site, v.code AS service, c.frequency_mhz AS "frequencyMHz", c.channel, c.erp_w AS "erpW",
                     c.polarisation, c.antenna_height_m AS "antennaHeightM", c.on_channel_repeater AS "onChannelRepeater"
                   FROM carriages c JOIN sites s ON s.id = c.site_id JOIN services v ON v.id = c.service_id ORDER BY c.code`),
      await query(`SELECT f.id, f.code, a.code AS "from", b.code AS "to", f.medium, f.role, f.rx_frequency_mhz AS "rxFrequencyMHz",
                     f.rx_channel AS "rxChannel", f.rx_antenna AS "rxAntenna", f.bearing_deg AS "bearingDeg"
                   FROM feeds f JOIN carriages a ON a.id = f.from_carriage_id JOIN carriages b ON b.id = f.to_carriage_id ORDER BY f.code`),
      await query(`SELECT v.feed_id AS feed, s.code FROM feed_via_sites v JOIN sites s ON s.id = v.site_id ORDER BY v.feed_id, v.position`),
      await query(`SELECT fg.feed_id AS feed, g.code FROM feed_groups fg JOIN risk_groups g ON g.id = fg.group_id ORDER BY g.code`),
    ];
    return { versionRows, sites, siteGroups, services, groups, carriages, feeds, via, feedGroups };
  };
  let r: Awaited<ReturnType<typeof run>>;
  if (transaction) {
    r = await run(transaction);
  } else {
    r = await sequelize.transaction({ isolationLevel: 'REPEATABLE READ' as Transaction.ISOLATION_LEVELS, readOnly: true } as never, (t) => run(t));
  }
  const listBy = (rows: Row[], key: string) => {
    const m = new Map<number, string[]>();
    for (const row of rows) {
      const id = Number(row[key]);
      let l = m.get(id);
      if (!l) m.set(id, (l = []));
      l.push(String(row.code));
    }
    return m;
  };
  const siteGroups = listBy(r.siteGroups, 'site');
  const viaByFeed = listBy(r.via, 'feed');
  const groupsByFeed = listBy(r.feedGroups, 'feed');

  const document: NetworkDocument = {
    format: NETWORK_FORMAT,
    sites: r.sites.map(({ id, ...s }) => clean<Site>({ ...s, groups: siteGroups.get(Number(id)) })),
    services: r.services.map((s) => clean(s)),
    groups: r.groups.map((g) => clean(g)),
    carriages: r.carriages.map((c) => clean<Carriage>(c)),
    feeds: r.feeds.map(({ id, ...f }) => clean<Feed>({ ...f, via: viaByFeed.get(Number(id)), groups: groupsByFeed.get(Number(id)) })),
  };
  return { document, version: Number(r.versionRows[0].version) };
}

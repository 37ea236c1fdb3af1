/**
 * The network read (server/services/networkLoader.ts) streams rows as arrays
 * and builds each entity straight from them. Here it is checked against a
 * read of its own through the Sequelize models (instances and includes, no
 * SQL of the loader's): on random networks with every optional field set on
 * some entities and absent on others, the whole document is the same, keys
 * in the same order, and reading some codes gives those entities exactly.
 */
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import type { Model } from 'sequelize';
import { loadEntities, loadNetworkDocument } from '@/server/services/networkLoader';
import { selectedFields } from '@/server/db/columns';
import {
  CARRIAGE_ATTRIBUTES,
  CarriageRow,
  FEED_ATTRIBUTES,
  FeedRow,
  GROUP_ATTRIBUTES,
  RiskGroupRow,
  SERVICE_ATTRIBUTES,
  SITE_ATTRIBUTES,
  ServiceRow,
  SiteRow,
} from '@/server/db/models/inventory';
import { ENTITY_KINDS, type NetworkDocument } from '@/shared/schemas/network';
import { prng, smallRandomNetwork } from '../helpers/random-network';
import { useTestApp } from '../helpers/testApp';

const app = useTestApp();

/** The random network with each optional field set on about half of the entities (values the import keeps as they are). */
function decorated(seed: number): NetworkDocument {
  const doc = smallRandomNetwork({ seed, sites: 30, services: 3, groups: 5, feeds: 80, originChance: 0.15, carriageChance: 0.6 });
  const rnd = prng(seed + 1000);
  const some = () => rnd() < 0.5;
  for (const s of doc.sites) {
    if (some()) s.groundHeightM = Math.round(rnd() * 9000) / 10;
    if (some()) s.mastHeightM = Math.round(rnd() * 3000) / 10;
    if (some()) delete s.households;
    if (s.groups?.length === 0 || some()) delete s.groups;
  }
  for (const g of doc.groups) if (some()) g.note = `note on ${g.code}\twith a tab`;
  for (const c of doc.carriages) {
    if (some()) c.frequencyMHz = 470 + Math.round(rnd() * 3000) / 10;
    if (some()) c.channel = `ch ${Math.floor(rnd() * 60)}`;
    if (some()) c.erpW = Math.round(rnd() * 1e6) / 10;
    if (some()) c.polarisation = (['H', 'V', 'M', 'C'] as const)[Math.floor(rnd() * 4)];
    if (some()) c.antennaHeightM = Math.round(rnd() * 1500) / 10;
    if (some()) c.onChannelRepeater = rnd() < 0.5;
  }
  for (const f of doc.feeds) {
    if (some()) f.rxFrequencyMHz = 100 + Math.round(rnd() * 1000) / 10;
    if (some()) f.rxChannel = `rx ${Math.floor(rnd() * 60)}`;
    if (some()) f.rxAntenna = `yagi ${Math.floor(rnd() * 9)}`;
    if (some()) f.bearingDeg = Math.round(rnd() * 3600) / 10;
    if (f.via?.length === 0 || some()) delete f.via;
    if (f.groups?.length === 0 || some()) delete f.groups;
  }
  return doc;
}

type Plain = Record<string, unknown>;
/** Code-unit order, as COLLATE "C" sorts ASCII codes. */
const byCode = (a: { code: string }, b: { code: string }) => (a.code < b.code ? -1 : a.code > b.code ? 1 : 0);

/** The fields of a model row that are set, in the model's order, after the given leading ones. */
function fieldsOf(row: Model, fields: string[], lead: Plain = {}): Plain {
  const out: Plain = { ...lead };
  for (const f of fields) {
    const v = row.get(f);
    if (v !== null && v !== undefined) out[f] = v;
  }
  return out;
}

/** The stored network read through the models, independently of the loader's SQL. */
async function readThroughModels(): Promise<NetworkDocument> {
  const groupCodes = (row: Model) => (row.get('groups') as Model[]).map((g) => g.get('code') as string).sort();
  const sites = (await SiteRow.findAll({ include: [{ model: RiskGroupRow, as: 'groups' }] })).map((row) => {
    const site = fieldsOf(row, selectedFields(SITE_ATTRIBUTES));
    if (groupCodes(row).length > 0) site.groups = groupCodes(row);
    return site;
  });
  const services = (await ServiceRow.findAll()).map((row) => fieldsOf(row, selectedFields(SERVICE_ATTRIBUTES)));
  const groups = (await RiskGroupRow.findAll()).map((row) => fieldsOf(row, selectedFields(GROUP_ATTRIBUTES)));
  const carriages = (await CarriageRow.findAll({ include: ['site', 'service'] })).map((row) =>
    fieldsOf(row, selectedFields(CARRIAGE_ATTRIBUTES, ['code', 'siteId', 'serviceId']), {
      code: row.get('code'),
      site: (row.get('site') as Model).get('code'),
      service: (row.get('service') as Model).get('code'),
    }),
  );
  const feeds = (await FeedRow.findAll({ include: ['from', 'to', { association: 'viaSites', include: ['site'] }, { model: RiskGroupRow, as: 'groups' }] })).map((row) => {
    const feed = fieldsOf(row, selectedFields(FEED_ATTRIBUTES, ['code', 'fromCarriageId', 'toCarriageId']), {
      code: row.get('code'),
      from: (row.get('from') as Model).get('code'),
      to: (row.get('to') as Model).get('code'),
    });
    const hops = (row.get('viaSites') as Model[]).sort((a, b) => (a.get('position') as number) - (b.get('position') as number));
    if (hops.length > 0) feed.via = hops.map((h) => (h.get('site') as Model).get('code'));
    if (groupCodes(row).length > 0) feed.groups = groupCodes(row);
    return feed;
  });
  const sorted = (list: Plain[]) => (list as { code: string }[]).sort(byCode);
  return { format: 'network/1', sites: sorted(sites), services: sorted(services), groups: sorted(groups), carriages: sorted(carriages), feeds: sorted(feeds) } as NetworkDocument;
}

describe('the network read', () => {
  for (const seed of [3, 11]) {
    it(`gives the document the models give, field for field and in order (random network, seed ${seed})`, async () => {
      const t = app();
      const doc = decorated(seed);
      const r = await request(t.app).post('/api/network/import').set(t.auth('engineer')).send(doc);
      expect(r.status, JSON.stringify(r.body.errors)).toBe(200);
      expect(r.body.ok).toBe(true);

      const { document, version } = await loadNetworkDocument(t.db.sequelize);
      const reference = await readThroughModels();
      expect(version).toBe(r.body.networkVersion);
      expect(document.feeds.length).toBe(doc.feeds.length);
      expect(document.feeds.some((f) => f.via && f.groups && f.bearingDeg !== undefined)).toBe(true);
      expect(document).toEqual(reference);
      // the same keys in the same order: the export writes the document as it is read
      expect(JSON.stringify(document)).toBe(JSON.stringify(reference));

      // a read of some codes gives those entities as the whole read has them
      const rnd = prng(seed);
      const codes = Object.fromEntries(ENTITY_KINDS.map((kind) => [kind, document[kind].filter(() => rnd() < 0.2).map((e) => e.code)]));
      const { entities } = await loadEntities(t.db.sequelize, { ...codes, sites: [...codes.sites, 'NO-SUCH-SITE'] });
      for (const kind of ENTITY_KINDS) {
        const wanted = new Set(codes[kind]);
        if (wanted.size === 0) continue;
        expect(entities[kind], kind).toEqual((document[kind] as { code: string }[]).filter((e) => wanted.has(e.code)));
      }
      await t.ctx.network.refresh(version);
    });
  }
});

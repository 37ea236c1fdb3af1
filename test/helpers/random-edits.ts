/**
 * Random single edits of a network document, as the inventory API makes them:
 * create, update or delete one site, carriage, feed or group, a delete taking
 * its dependents with it (a site's carriages and their feeds and the feeds
 * routed via it; a carriage's feeds; a group's members leave it). Each edit
 * says which codes it touched, per kind, and what they are now, the way an
 * edit's notification and the read by key do in the server.
 */
import type { Carriage, EntityKind, Feed, Group, NetworkDocument, Site } from '@/shared/schemas/network';
import type { CodesByKind, EntitiesByKind } from '@/server/services/networkLoader';
import { patchDocument } from '@/server/services/documentPatch';

export interface RandomEdit {
  /** the request the API would get */
  method: 'post' | 'patch' | 'delete';
  kind: EntityKind;
  code: string;
  body?: Record<string, unknown>;
  /** every code the edit touched, and their state after it */
  codes: CodesByKind;
  entities: EntitiesByKind;
}

const MEDIA = ['off-air', 'satellite', 'line', 'microwave'] as const;

export class RandomEditor {
  private serial = 0;
  constructor(
    private readonly rnd: () => number,
    private readonly prefix = 'E',
  ) {}

  private pick<T>(items: readonly T[]): T | undefined {
    return items.length === 0 ? undefined : items[Math.floor(this.rnd() * items.length)];
  }

  private some<T>(items: readonly T[], chance: number): T[] {
    return items.filter(() => this.rnd() < chance);
  }

  private newCode(kind: string) {
    return `${this.prefix}${kind}${++this.serial}`;
  }

  /** One random edit of `doc` (null when the drawn kind of edit has nothing to work on; draw again). */
  next(doc: NetworkDocument): RandomEdit | null {
    const r = this.rnd();
    if (r < 0.12) return this.createSite(doc);
    if (r < 0.26) return this.updateSite(doc);
    if (r < 0.32) return this.deleteSite(doc);
    if (r < 0.42) return this.createCarriage(doc);
    if (r < 0.48) return this.updateCarriage(doc);
    if (r < 0.53) return this.deleteCarriage(doc);
    if (r < 0.68) return this.createFeed(doc);
    if (r < 0.8) return this.updateFeed(doc);
    if (r < 0.87) return this.deleteFeed(doc);
    if (r < 0.92) return this.createGroup();
    if (r < 0.95) return this.updateGroup(doc);
    return this.deleteGroup(doc);
  }

  private groupsFor(doc: NetworkDocument) {
    return this.some(doc.groups, 0.2).map((g) => g.code).sort();
  }

  private createSite(doc: NetworkDocument): RandomEdit {
    const site: Site = {
      code: this.newCode('S'),
      name: 'New site',
      role: this.rnd() < 0.2 ? 'origin' : this.rnd() < 0.5 ? 'main' : 'relay',
      lat: 40 + this.rnd(),
      lon: 10 + this.rnd(),
      households: Math.floor(this.rnd() * 1000),
    };
    const groups = this.groupsFor(doc);
    if (groups.length > 0) site.groups = groups;
    return { method: 'post', kind: 'sites', code: site.code, body: { ...site }, codes: { sites: [site.code] }, entities: { sites: [site] } };
  }

  private updateSite(doc: NetworkDocument): RandomEdit | null {
    const old = this.pick(doc.sites);
    if (!old) return null;
    const site: Site = { ...old };
    const body: Record<string, unknown> = {};
    const r = this.rnd();
    if (r < 0.35) body.role = site.role = old.role === 'origin' ? 'relay' : 'origin';
    else if (r < 0.6) body.households = site.households = Math.floor(this.rnd() * 5000);
    else {
      const groups = this.groupsFor(doc);
      body.groups = groups;
      if (groups.length > 0) site.groups = groups;
      else delete site.groups;
    }
    return { method: 'patch', kind: 'sites', code: site.code, body, codes: { sites: [site.code] }, entities: { sites: [site] } };
  }

  private deleteSite(doc: NetworkDocument): RandomEdit | null {
    const site = this.pick(doc.sites);
    if (!site) return null;
    const carriages = doc.carriages.filter((c) => c.site === site.code).map((c) => c.code);
    const gone = new Set(carriages);
    const feeds = doc.feeds.filter((f) => gone.has(f.from) || gone.has(f.to) || (f.via ?? []).includes(site.code)).map((f) => f.code);
    return { method: 'delete', kind: 'sites', code: site.code, codes: { sites: [site.code], carriages, feeds }, entities: {} };
  }

  private createCarriage(doc: NetworkDocument): RandomEdit | null {
    const site = this.pick(doc.sites);
    const service = this.pick(doc.services);
    if (!site || !service || doc.carriages.some((c) => c.site === site.code && c.service === service.code)) return null;
    const carriage: Carriage = { code: this.newCode('C'), site: site.code, service: service.code, erpW: 100 };
    return { method: 'post', kind: 'carriages', code: carriage.code, body: { ...carriage }, codes: { carriages: [carriage.code] }, entities: { carriages: [carriage] } };
  }

  private updateCarriage(doc: NetworkDocument): RandomEdit | null {
    const old = this.pick(doc.carriages);
    if (!old) return null;
    const erpW = Math.round(this.rnd() * 1000) + 1;
    return { method: 'patch', kind: 'carriages', code: old.code, body: { erpW }, codes: { carriages: [old.code] }, entities: { carriages: [{ ...old, erpW }] } };
  }

  private deleteCarriage(doc: NetworkDocument): RandomEdit | null {
    const carriage = this.pick(doc.carriages);
    if (!carriage) return null;
    const feeds = doc.feeds.filter((f) => f.from === carriage.code || f.to === carriage.code).map((f) => f.code);
    return { method: 'delete', kind: 'carriages', code: carriage.code, codes: { carriages: [carriage.code], feeds }, entities: {} };
  }

  private route(doc: NetworkDocument, from: string, to: string): Pick<Feed, 'via' | 'groups'> {
    const ends = new Set([doc.carriages.find((c) => c.code === from)?.site, doc.carriages.find((c) => c.code === to)?.site]);
    const via = this.some(doc.sites, 2 / Math.max(doc.sites.length, 1)).map((s) => s.code).filter((s) => !ends.has(s));
    const groups = this.groupsFor(doc);
    return { ...(via.length > 0 ? { via } : {}), ...(groups.length > 0 ? { groups } : {}) };
  }

  private createFeed(doc: NetworkDocument): RandomEdit | null {
    const from = this.pick(doc.carriages);
    const to = from && this.pick(doc.carriages.filter((c) => c.service === from.service && c.site !== from.site));
    if (!from || !to) return null;
    const feed: Feed = { code: this.newCode('F'), from: from.code, to: to.code, medium: this.pick(MEDIA)!, role: this.rnd() < 0.35 ? 'reserve' : 'main', ...this.route(doc, from.code, to.code) };
    return { method: 'post', kind: 'feeds', code: feed.code, body: { ...feed }, codes: { feeds: [feed.code] }, entities: { feeds: [feed] } };
  }

  private updateFeed(doc: NetworkDocument): RandomEdit | null {
    const old = this.pick(doc.feeds);
    if (!old) return null;
    let feed: Feed;
    let body: Record<string, unknown>;
    if (this.rnd() < 0.5) {
      const role = old.role === 'main' ? 'reserve' : 'main';
      feed = { ...old, role };
      body = { role };
    } else {
      const { via, groups, ...rest } = old;
      void via;
      void groups;
      const route = this.route(doc, old.from, old.to);
      feed = { ...rest, ...route };
      body = { via: route.via ?? [], groups: route.groups ?? [] };
    }
    return { method: 'patch', kind: 'feeds', code: old.code, body, codes: { feeds: [old.code] }, entities: { feeds: [feed] } };
  }

  private deleteFeed(doc: NetworkDocument): RandomEdit | null {
    const feed = this.pick(doc.feeds);
    if (!feed) return null;
    return { method: 'delete', kind: 'feeds', code: feed.code, codes: { feeds: [feed.code] }, entities: {} };
  }

  private createGroup(): RandomEdit {
    const group: Group = { code: this.newCode('G'), name: 'New group' };
    return { method: 'post', kind: 'groups', code: group.code, body: { ...group }, codes: { groups: [group.code] }, entities: { groups: [group] } };
  }

  private updateGroup(doc: NetworkDocument): RandomEdit | null {
    const old = this.pick(doc.groups);
    if (!old) return null;
    return { method: 'patch', kind: 'groups', code: old.code, body: { name: 'Renamed group' }, codes: { groups: [old.code] }, entities: { groups: [{ ...old, name: 'Renamed group' }] } };
  }

  private deleteGroup(doc: NetworkDocument): RandomEdit | null {
    const group = this.pick(doc.groups);
    if (!group) return null;
    const leave = <T extends Site | Feed>(e: T): T => {
      const groups = (e.groups ?? []).filter((g) => g !== group.code);
      const { groups: _, ...rest } = e;
      void _;
      return (groups.length > 0 ? { ...rest, groups } : rest) as T;
    };
    const sites = doc.sites.filter((s) => s.groups?.includes(group.code)).map(leave);
    const feeds = doc.feeds.filter((f) => f.groups?.includes(group.code)).map(leave);
    return {
      method: 'delete',
      kind: 'groups',
      code: group.code,
      codes: { groups: [group.code], sites: sites.map((s) => s.code), feeds: feeds.map((f) => f.code) },
      entities: { sites, feeds },
    };
  }
}

/** The document after the edit. */
export const applyEdit = (doc: NetworkDocument, edit: RandomEdit): NetworkDocument => patchDocument(doc, edit.codes, edit.entities);

/** The document in code order (how the server reads it), for a generated one. */
export function inCodeOrder(doc: NetworkDocument): NetworkDocument {
  const sort = <T extends { code: string }>(items: T[]) => [...items].sort((a, b) => (a.code < b.code ? -1 : a.code > b.code ? 1 : 0));
  return { ...doc, sites: sort(doc.sites), services: sort(doc.services), groups: sort(doc.groups), carriages: sort(doc.carriages), feeds: sort(doc.feeds) };
}

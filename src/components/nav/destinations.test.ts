import { describe, expect, it } from 'vitest';
import { ROLES } from '@/shared/api';
import { DESTINATIONS, destinationsFor, isCurrent, moreIsCurrent, phoneLayout } from './destinations';

const byId = (id: string) => {
  const d = DESTINATIONS.find((x) => x.id === id);
  if (!d) throw new Error(`no destination ${id}`);
  return d;
};

describe('destinations', () => {
  it('have unique ids, labels and hrefs', () => {
    for (const key of ['id', 'label', 'href'] as const) {
      expect(new Set(DESTINATIONS.map((d) => d[key])).size).toBe(DESTINATIONS.length);
    }
  });

  it('show People to admins only', () => {
    expect(destinationsFor('admin').map((d) => d.id)).toContain('people');
    for (const role of ROLES.filter((r) => r !== 'admin')) {
      expect(destinationsFor(role).map((d) => d.id)).not.toContain('people');
    }
    expect(destinationsFor(null).map((d) => d.id)).not.toContain('people');
  });

  it('give a phone 4 tabs plus More (5 in the bar) and put the rest under More', () => {
    const admin = phoneLayout('admin');
    expect(admin.tabs.map((d) => d.label)).toEqual(['Home', 'Fault reach', 'Network', 'Resilience']);
    expect(admin.more.map((d) => d.label)).toEqual(['Inventory', 'Incidents', 'Planned work', 'Availability', 'Checks', 'Calculator', 'My notices', 'Notices sent', 'Audit log', 'People']);
    expect(phoneLayout('viewer').more.map((d) => d.label)).toEqual(['Inventory', 'Incidents', 'Planned work', 'Availability', 'Checks', 'Calculator', 'My notices']);
    // Every entry a role may see is reachable on a phone, once.
    for (const role of ROLES) {
      const { tabs, more } = phoneLayout(role);
      expect([...tabs, ...more].map((d) => d.id).sort()).toEqual(destinationsFor(role).map((d) => d.id).sort());
    }
  });
});

describe('isCurrent', () => {
  it('matches Home only at the root', () => {
    expect(isCurrent(byId('home'), '/')).toBe(true);
    expect(isCurrent(byId('home'), '/reach')).toBe(false);
  });

  it('matches an entry and the pages under it, not a longer name that shares its start', () => {
    expect(isCurrent(byId('reach'), '/reach')).toBe(true);
    expect(isCurrent(byId('reach'), '/reach/saved')).toBe(true);
    expect(isCurrent(byId('reach'), '/reachable')).toBe(false);
  });

  it('treats every inventory list and detail as Inventory', () => {
    for (const p of ['/sites', '/sites/HILL-1', '/feeds', '/carriages/C1', '/groups', '/services']) {
      expect(isCurrent(byId('inventory'), p)).toBe(true);
    }
  });
});

describe('moreIsCurrent', () => {
  it('is current on /more and on places listed under More', () => {
    expect(moreIsCurrent('/more', 'viewer')).toBe(true);
    expect(moreIsCurrent('/checks', 'viewer')).toBe(true);
    expect(moreIsCurrent('/admin/users', 'admin')).toBe(true);
    expect(moreIsCurrent('/reach', 'admin')).toBe(false);
    expect(moreIsCurrent('/', 'admin')).toBe(false);
  });
});

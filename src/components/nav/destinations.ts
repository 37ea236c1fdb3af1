/**
 * Where the navigation can take a person, and which entries a phone shows as
 * bottom tabs. One list drives both the phone tab bar and the wide side
 * navigation, so the two layouts always offer the same places.
 */
import type { Href } from 'expo-router';
import { can, type Role } from '@/shared/api';
import type { IconName } from '../icons/Icon';

export interface Destination {
  id: string;
  label: string;
  href: Href;
  icon: IconName;
  /** Path prefixes that belong to this entry (the detail pages under it). */
  matches: string[];
  /** Only these roles see the entry; absent = everyone signed in. */
  roles?: readonly Role[];
  /** A one-line description shown on the phone's More screen. */
  blurb: string;
}

export const DESTINATIONS: readonly Destination[] = [
  { id: 'home', label: 'Home', href: '/', icon: 'home', matches: [], blurb: 'Network counts and what needs attention now' },
  { id: 'reach', label: 'Fault reach', href: '/reach', icon: 'reach', matches: ['/reach'], blurb: 'Put what has failed in a failure set and see what goes off air' },
  { id: 'network', label: 'Network', href: '/network', icon: 'network', matches: ['/network'], blurb: 'Sites and feeds on a diagram' },
  { id: 'resilience', label: 'Resilience', href: '/resilience', icon: 'resilience', matches: ['/resilience'], blurb: 'Exposure, diversity gaps and unfed carriages' },
  {
    id: 'inventory',
    label: 'Inventory',
    href: '/sites',
    icon: 'inventory',
    matches: ['/sites', '/services', '/carriages', '/feeds', '/groups', '/import', '/export'],
    blurb: 'Sites, services, carriages, feeds and groups; import and export',
  },
  { id: 'incidents', label: 'Incidents', href: '/incidents', icon: 'reach', matches: ['/incidents'], blurb: 'What has failed, step by step, and household-minutes off air' },
  { id: 'works', label: 'Planned work', href: '/works', icon: 'calculator', matches: ['/works'], blurb: 'Work that takes elements out of service, its reach and clashes' },
  { id: 'availability', label: 'Availability', href: '/availability', icon: 'resilience', matches: ['/availability'], blurb: 'Share of a period each carriage and site was on air' },
  { id: 'checks', label: 'Checks', href: '/checks', icon: 'checks', matches: ['/checks'], blurb: 'Warnings from the feed and network checks' },
  { id: 'calculator', label: 'Calculator', href: '/calculator', icon: 'calculator', matches: ['/calculator'], blurb: 'Channel and frequency, distance and bearing, free-space figures' },
  { id: 'my-notices', label: 'My notices', href: '/notices', icon: 'mail', matches: ['/notices'], blurb: 'Mail me when a fault or planned work reaches what I look after' },
  {
    id: 'notices',
    label: 'Notices sent',
    href: '/admin/notices',
    icon: 'mail',
    matches: ['/admin/notices', '/admin/contacts', '/admin/mailbox'],
    roles: can.manageNotices,
    blurb: 'Mail sent, waiting and failed; outside contacts; the local mailbox',
  },
  { id: 'changes', label: 'Audit log', href: '/admin/audit', icon: 'inventory', matches: ['/admin/audit'], roles: can.manageUsers, blurb: 'Who changed what in the network, and when' },
  { id: 'people', label: 'People', href: '/admin/users', icon: 'people', matches: ['/admin/users'], roles: can.manageUsers, blurb: 'Invite people and set their roles' },
];

/** Bottom tabs on a phone, in order; everything else goes under "More". */
export const PHONE_TAB_IDS: readonly string[] = ['home', 'reach', 'network', 'resilience'];
export const MORE_HREF = '/more';

export function destinationsFor(role: Role | null | undefined): Destination[] {
  return DESTINATIONS.filter((d) => !d.roles || (role != null && d.roles.includes(role)));
}

export function phoneLayout(role: Role | null | undefined): { tabs: Destination[]; more: Destination[] } {
  const mine = destinationsFor(role);
  return {
    tabs: mine.filter((d) => PHONE_TAB_IDS.includes(d.id)),
    more: mine.filter((d) => !PHONE_TAB_IDS.includes(d.id)),
  };
}

function underPrefix(pathname: string, prefix: string): boolean {
  return pathname === prefix || pathname.startsWith(`${prefix}/`);
}

/** Whether `pathname` (no query) is this entry's place or a page under it. */
export function isCurrent(destination: Destination, pathname: string): boolean {
  if (destination.href === '/') return pathname === '/' || pathname === '';
  return destination.matches.some((m) => underPrefix(pathname, m));
}

/** The "More" tab is current on the More screen and on any place listed there. */
export function moreIsCurrent(pathname: string, role: Role | null | undefined): boolean {
  if (underPrefix(pathname, MORE_HREF)) return true;
  return phoneLayout(role).more.some((d) => isCurrent(d, pathname));
}

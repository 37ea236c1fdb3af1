/**
 * How long each kind of server answer counts as fresh, in one table so a
 * screen never invents its own timing. Values are SWR options
 * (https://swr.vercel.app/docs/api): `dedupingInterval` is how long an answer
 * is reused without asking again, `refreshInterval` how often a visible screen
 * polls (0 = only on focus, reconnect and after our own edits).
 *
 * The figures are our own choices (common practice, no source): fast where an
 * incident is being worked, slow where data changes only by someone's edit.
 */
import type { SWRConfiguration } from 'swr';

export type FreshnessTier = 'incident' | 'network' | 'account' | 'admin' | 'progress';

export const freshness: Record<FreshnessTier, SWRConfiguration> = {
  /** Faults and reach while something is off air. */
  incident: { dedupingInterval: 5_000, refreshInterval: 15_000, revalidateOnFocus: true },
  /** Inventory, summary and analyses: change only with the network version. */
  network: { dedupingInterval: 30_000, refreshInterval: 120_000, revalidateOnFocus: true },
  /** Who am I: polled so an expired token signs the person out on an idle screen. */
  account: { dedupingInterval: 60_000, refreshInterval: 300_000, revalidateOnFocus: true },
  /** People and audit lists: an admin's own edits revalidate them. */
  admin: { dedupingInterval: 10_000, refreshInterval: 0, revalidateOnFocus: true },
  /** A long job of the person's own that is running now (an import): polled twice a second while shown. */
  progress: { dedupingInterval: 0, refreshInterval: 500, revalidateOnFocus: false, errorRetryInterval: 500, errorRetryCount: 40 },
};

import type { Config } from './config';
import type { Database } from './db';
import type { NetworkStore } from './services/networkStore';
import type { ServedNetwork } from './services/servedNetwork';
import type { OperationsEvents } from './operations/events';
import type { ObjectStore } from './documents/storage';
import type { MailboxStandin } from './standins/mailbox';
import type { NoticeQueue } from './notices/queue';
import type { UserChangeListener } from './auth/userChanges';

/** What route modules are handed: configuration, the database, the live network model. */
export interface AppContext {
  config: Config;
  db: Database;
  network: NetworkStore<ServedNetwork>;
  /** planned-work and incident events, for whoever tells people about them; optional so older wiring still builds */
  events?: OperationsEvents;
  /** documents' object store (S3_ENDPOINT, S3_BUCKET ...) */
  objects?: ObjectStore;
  /** the notice queue and its worker (pg-boss) */
  notices?: NoticeQueue;
  /** the local SMTP stand-in, only when it runs: its mailbox is shown to admins */
  mailbox?: MailboxStandin | null;
  /** hears changes to users for this process's user-row cache; set by createApp, closed with the server */
  userChanges?: UserChangeListener;
  /** set by the sign-in routes; tests use it to start from a clean slate */
  resetLoginLimits?: () => void;
}

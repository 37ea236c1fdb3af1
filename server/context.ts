import type { Config } from './config';
import type { Database } from './db';
import type { NetworkStore } from './services/networkStore';
import type { NetworkModel } from './services/networkModel';
import type { OperationsEvents } from './operations/events';

/** What route modules are handed: configuration, the database, the live network model. */
export interface AppContext {
  config: Config;
  db: Database;
  network: NetworkStore<NetworkModel>;
  /** planned-work and incident events, for whoever tells people about them; optional so older wiring still builds */
  events?: OperationsEvents;
  /** set by the sign-in routes; tests use it to start from a clean slate */
  resetLoginLimits?: () => void;
}

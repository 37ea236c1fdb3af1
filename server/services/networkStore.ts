/**
 * Keeps the in-memory analysis model fresh across processes (docs/architecture.md,
 * "A rebuild"; server/db/README.md, "Surviving a restart of PostgreSQL"): every committed change
 * bumps the network version and sends NOTIFY network_changed; each server
 * process LISTENs on one dedicated connection and rebuilds. Readers always get
 * the last complete model; a rebuild swaps it in only when finished.
 *
 * Faults it survives:
 * - the listening connection drops (PostgreSQL restarts): exactly one new
 *   listener is opened, retrying with back-off until it succeeds, and the
 *   model catches up with whatever changed while nobody listened;
 * - a notification is lost without the connection dropping: a periodic
 *   version check catches it;
 * - a rebuild fails (database gone mid-read, a builder fault): the last model
 *   stays in service, the failure is reported in `status()`, and the rebuild
 *   is retried with back-off. `refresh()` never rejects, so a committed write
 *   is never answered with an error because the rebuild after it failed.
 */
import crypto from 'node:crypto';
import { Client } from 'pg';
import type { Sequelize } from 'sequelize';
import type { NetworkDocument } from '@/shared/schemas/network';
import { loadNetworkDocument } from './networkLoader';
import { Backoff } from './backoff';

export interface Built {
  networkVersion: number;
}

export interface NetworkStoreOptions {
  /** how often the stored version is compared with the model's (catches a lost notification) */
  checkEveryMs?: number;
  /** back-off for reconnecting the listener and retrying a failed rebuild */
  retryMinMs?: number;
  retryMaxMs?: number;
  /** how long opening the listening connection may take */
  connectTimeoutMs?: number;
  log?: (message: string) => void;
}

export interface NetworkStoreStatus {
  modelVersion: number | null;
  listener: 'listening' | 'reconnecting' | 'closed';
  rebuilding: boolean;
  /** the last rebuild failed and a retry is scheduled */
  rebuildFailure: { message: string; at: string } | null;
  /** listening connections this store holds open right now: 1 while healthy, never more */
  openListeners: number;
}

const DEFAULTS = { checkEveryMs: 12_000, retryMinMs: 250, retryMaxMs: 10_000, connectTimeoutMs: 3000 };

export class NetworkStore<T extends Built> {
  private current: T | null = null;
  private building: Promise<void> | null = null;
  private dirty = false;
  private closed = false;
  private listener: Client | null = null;
  private connecting = false;
  private openListeners = 0;
  private failure: { message: string; at: Date } | null = null;
  private readonly timers = { reconnect: null as NodeJS.Timeout | null, retry: null as NodeJS.Timeout | null, check: null as NodeJS.Timeout | null };
  private readonly reconnectBackoff: Backoff;
  private readonly rebuildBackoff: Backoff;
  private readonly opts: Required<Omit<NetworkStoreOptions, 'log'>>;
  private readonly log: (message: string) => void;
  /** the listener's application_name, so its connection can be found in pg_stat_activity */
  readonly listenerName = `headwater-listener-${process.pid}-${crypto.randomBytes(3).toString('hex')}`;
  lastBuildMs = 0;

  constructor(
    private readonly sequelize: Sequelize,
    private readonly databaseUrl: string,
    private readonly build: (doc: NetworkDocument, version: number) => T,
    options: NetworkStoreOptions = {},
  ) {
    this.opts = { ...DEFAULTS, ...Object.fromEntries(Object.entries(options).filter(([k, v]) => k !== 'log' && v !== undefined)) };
    this.log = options.log ?? ((m) => console.error(`[network] ${m}`));
    this.reconnectBackoff = new Backoff(this.opts.retryMinMs, this.opts.retryMaxMs);
    this.rebuildBackoff = new Backoff(this.opts.retryMinMs, this.opts.retryMaxMs);
  }

  /** The last complete model; null only before the first build finished. */
  get model(): T | null {
    return this.current;
  }

  status(): NetworkStoreStatus {
    return {
      modelVersion: this.current?.networkVersion ?? null,
      listener: this.closed ? 'closed' : this.listener ? 'listening' : 'reconnecting',
      rebuilding: this.building !== null,
      rebuildFailure: this.failure ? { message: this.failure.message, at: this.failure.at.toISOString() } : null,
      openListeners: this.openListeners,
    };
  }

  /** First build (it must succeed), then listen and check periodically. */
  async start(): Promise<void> {
    await this.refresh();
    if (!this.current) throw new Error(`the network model could not be built: ${this.failure?.message ?? 'unknown reason'}`);
    try {
      await this.openListener();
    } catch (e) {
      this.log(`could not listen for changes yet (${messageOf(e)}); retrying`);
      this.scheduleReconnect();
    }
    this.timers.check = setInterval(() => void this.check(), this.opts.checkEveryMs) as unknown as NodeJS.Timeout;
    this.timers.check.unref();
  }

  /**
   * Rebuild unless the model is already at `version` or later. Bursts of
   * changes coalesce. Resolves when the rebuild is done or has failed (a
   * failed one is retried in the background); never rejects.
   */
  refresh(version?: number): Promise<void> {
    if (version !== undefined && this.current && this.current.networkVersion >= version) return Promise.resolve();
    if (this.closed) return Promise.resolve();
    this.dirty = true;
    // after a failure the scheduled retry does the work: notifications do not cut the back-off short
    if (this.timers.retry) return Promise.resolve();
    if (!this.building) {
      this.building = this.rebuildLoop().finally(() => {
        this.building = null;
      });
    }
    return this.building;
  }

  /** The version the database is at now (throws when it is unreachable). */
  async databaseVersion(): Promise<number> {
    const [rows] = await this.sequelize.query('SELECT version FROM network_state WHERE id = 1');
    return Number((rows as { version: number }[])[0].version);
  }

  private async rebuildLoop() {
    while (this.dirty && !this.closed) {
      this.dirty = false;
      const t0 = performance.now();
      try {
        const { document, version } = await loadNetworkDocument(this.sequelize);
        if (!this.current || version >= this.current.networkVersion) this.current = this.build(document, version);
        this.lastBuildMs = performance.now() - t0;
        if (this.failure) this.log(`rebuild succeeded again (version ${this.current.networkVersion})`);
        this.failure = null;
        this.rebuildBackoff.reset();
      } catch (e) {
        this.failure = { message: messageOf(e), at: new Date() };
        const delay = this.rebuildBackoff.next();
        this.log(`rebuild failed (${this.failure.message}); the last model stays in service, retrying in ${delay} ms`);
        this.scheduleTimer('retry', delay, () => void this.refresh());
        return;
      }
    }
  }

  /** Rebuild when the database is ahead of the model. */
  private async catchUp() {
    const version = await this.databaseVersion();
    if (!this.current || version > this.current.networkVersion) await this.refresh(version);
  }

  /** The periodic check: is the listener alive, is the model current? Quiet while the database is down. */
  private async check() {
    if (this.closed) return;
    const client = this.listener;
    if (client) {
      try {
        await withTimeout(client.query('SELECT 1'), this.opts.connectTimeoutMs);
      } catch (e) {
        this.dropListener(client, `did not answer (${messageOf(e)})`);
      }
    }
    await this.catchUp().catch(() => undefined);
  }

  private async openListener(): Promise<void> {
    if (this.closed || this.listener || this.connecting) return;
    this.connecting = true;
    const client = new Client({
      connectionString: this.databaseUrl,
      application_name: this.listenerName,
      connectionTimeoutMillis: this.opts.connectTimeoutMs,
      keepAlive: true,
    });
    // errors before the connection is ours are handled by the connect() rejection below
    client.on('error', (e) => this.dropListener(client, messageOf(e)));
    client.on('end', () => this.dropListener(client, 'the connection closed'));
    client.on('notification', (msg) => {
      const v = Number(msg.payload);
      void this.refresh(Number.isFinite(v) ? v : undefined);
    });
    try {
      await client.connect();
      await client.query('LISTEN network_changed');
    } catch (e) {
      this.connecting = false;
      await client.end().catch(() => undefined);
      throw e;
    }
    this.connecting = false;
    if (this.closed) {
      await client.end().catch(() => undefined);
      return;
    }
    this.listener = client;
    this.openListeners += 1;
    this.reconnectBackoff.reset();
    // a change may have landed while nobody listened (before start, or during an outage)
    await this.catchUp().catch((e) => this.log(`catching up after listening failed (${messageOf(e)}); the periodic check will retry`));
  }

  /** Forget a listening connection that failed, close it, and open exactly one new one. */
  private dropListener(client: Client, why: string) {
    if (this.listener !== client) return;
    this.listener = null;
    this.openListeners -= 1;
    client.removeAllListeners('notification');
    void client.end().catch(() => undefined);
    if (this.closed) return;
    this.log(`the change listener lost its connection (${why}); reconnecting`);
    this.scheduleReconnect();
  }

  private scheduleReconnect() {
    if (this.closed || this.timers.reconnect) return;
    this.scheduleTimer('reconnect', this.reconnectBackoff.next(), async () => {
      try {
        await this.openListener();
      } catch (e) {
        this.log(`the change listener could not reconnect yet (${messageOf(e)})`);
        this.scheduleReconnect();
      }
    });
  }

  private scheduleTimer(which: 'reconnect' | 'retry', delayMs: number, run: () => void | Promise<void>) {
    if (this.closed || this.timers[which]) return;
    const t = setTimeout(() => {
      this.timers[which] = null;
      void run();
    }, delayMs) as unknown as NodeJS.Timeout;
    t.unref();
    this.timers[which] = t;
  }

  async close() {
    this.closed = true;
    for (const t of Object.values(this.timers)) if (t) clearTimeout(t);
    await this.building?.catch(() => undefined);
    const client = this.listener;
    this.listener = null;
    if (client) {
      this.openListeners -= 1;
      await client.end().catch(() => undefined);
    }
  }
}

function messageOf(e: unknown): string {
  return e instanceof Error ? e.message : String(e);
}

function withTimeout<R>(p: Promise<R>, ms: number): Promise<R> {
  return new Promise<R>((resolve, reject) => {
    const t = setTimeout(() => reject(new Error(`no answer within ${ms} ms`)), ms);
    p.then(
      (v) => {
        clearTimeout(t);
        resolve(v);
      },
      (e) => {
        clearTimeout(t);
        reject(e);
      },
    );
  });
}

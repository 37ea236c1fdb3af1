/**
 * Keeps the in-memory analysis model fresh across processes (docs/architecture.md,
 * "A rebuild"; server/db/README.md, "Surviving a restart of PostgreSQL"): every committed change
 * bumps the network version and sends NOTIFY network_changed naming the codes
 * it touched (server/db/networkChange.ts); each server process LISTENs on one
 * dedicated connection, reads those rows by code and updates its model
 * (`update`: only the service graphs they touch are rebuilt). A change it
 * cannot update from (an import, a change too large to name, a version it
 * missed) rebuilds the whole model from PostgreSQL. The writing process
 * updates itself the same way (`applyChange`) before it answers the write.
 * Readers always get the last complete model, a new object per version,
 * swapped in only when finished.
 *
 * Faults it survives:
 * - the listening connection drops (PostgreSQL restarts): exactly one new
 *   listener is opened, retrying with back-off until it succeeds, and the
 *   model catches up with whatever changed while nobody listened;
 * - a notification is lost without the connection dropping: a periodic
 *   version check catches it (a model still behind the version the previous
 *   check saw rebuilds: within two check intervals, 16 s by default);
 * - a rebuild fails (database gone mid-read, a builder fault): the last model
 *   stays in service, the failure is reported in `status()`, and the rebuild
 *   is retried with back-off. `refresh()` never rejects, so a committed write
 *   is never answered with an error because the rebuild after it failed.
 */
import crypto from 'node:crypto';
import { Client } from 'pg';
import type { Sequelize } from 'sequelize';
import type { NetworkDocument } from '@/shared/schemas/network';
import { loadEntities, loadNetworkDocument, type EntitiesByKind } from './networkLoader';
import { decodeChange, type CodesByKind } from '../db/networkChange';
import { Backoff } from './backoff';

export interface Built {
  networkVersion: number;
}

export interface NetworkStoreOptions<T = never> {
  /** how often the stored version is compared with the model's (catches a lost notification) */
  checkEveryMs?: number;
  /** back-off for reconnecting the listener and retrying a failed rebuild */
  retryMinMs?: number;
  retryMaxMs?: number;
  /** how long opening the listening connection may take */
  connectTimeoutMs?: number;
  log?: (message: string) => void;
  /** the model after a change that touched `codes` (now `entities`); without it every change rebuilds */
  update?: (prev: T, codes: CodesByKind, entities: EntitiesByKind, version: number) => T;
  /** how long a change may wait for the notification of a version before it (sent by another process, still on its way) */
  gapWaitMs?: number;
}

export interface NetworkStoreStatus {
  modelVersion: number | null;
  listener: 'listening' | 'reconnecting' | 'closed';
  rebuilding: boolean;
  /** the last rebuild failed and a retry is scheduled */
  rebuildFailure: { message: string; at: string } | null;
  /** listening connections this store holds open right now: 1 while healthy, never more */
  openListeners: number;
  /** changes applied by update and full rebuilds since start */
  updates: number;
  rebuilds: number;
}

const DEFAULTS = { checkEveryMs: 8_000, retryMinMs: 250, retryMaxMs: 10_000, connectTimeoutMs: 3000, gapWaitMs: 250 };

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
  private readonly opts: Required<Omit<NetworkStoreOptions<T>, 'log' | 'update'>>;
  private readonly log: (message: string) => void;
  private readonly update: NetworkStoreOptions<T>['update'];
  /** changes heard of and not yet in the model: version -> codes (null: rebuild) */
  private readonly pending = new Map<number, CodesByKind | null>();
  /** when the model first waited for a missing version, and the version the last periodic check saw */
  private gapSince: number | null = null;
  private lastCheckedVersion = 0;
  private counts = { updates: 0, rebuilds: 0 };
  /** the listener's application_name, so its connection can be found in pg_stat_activity */
  readonly listenerName = `headwater-listener-${process.pid}-${crypto.randomBytes(3).toString('hex')}`;
  lastBuildMs = 0;

  constructor(
    private readonly sequelize: Sequelize,
    private readonly databaseUrl: string,
    private readonly build: (doc: NetworkDocument, version: number) => T,
    options: NetworkStoreOptions<T> = {},
  ) {
    this.opts = { ...DEFAULTS, ...Object.fromEntries(Object.entries(options).filter(([k, v]) => k !== 'log' && k !== 'update' && v !== undefined)) };
    this.log = options.log ?? ((m) => console.error(`[network] ${m}`));
    this.update = options.update;
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
      ...this.counts,
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
    return this.kick();
  }

  /**
   * A change committed as `version` that touched `codes` (null: unknown):
   * update the model from those rows, or rebuild when that is not possible.
   * Resolves once the model is at `version` or later (or the work failed and
   * a retry is scheduled); never rejects.
   */
  applyChange(version: number, codes: CodesByKind | null): Promise<void> {
    if (this.closed || (this.current && this.current.networkVersion >= version)) return Promise.resolve();
    if (!this.pending.has(version) || codes) this.pending.set(version, codes);
    return this.kick();
  }

  private kick(): Promise<void> {
    // after a failure the scheduled retry does the work: notifications do not cut the back-off short
    if (this.timers.retry) return Promise.resolve();
    if (!this.building) {
      this.building = this.workLoop().finally(() => {
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

  /** What to do next: a full rebuild, the update to the next version, wait for a version still on its way, or nothing. */
  private nextStep(): { kind: 'rebuild' } | { kind: 'update'; version: number; codes: CodesByKind } | { kind: 'wait' } | null {
    const cur = this.current;
    if (cur) for (const v of [...this.pending.keys()]) if (v <= cur.networkVersion) this.pending.delete(v);
    if (this.dirty || !cur) return { kind: 'rebuild' };
    if (this.pending.size === 0) {
      this.gapSince = null;
      return null;
    }
    const next = cur.networkVersion + 1;
    if (this.pending.has(next)) {
      this.gapSince = null;
      const codes = this.pending.get(next)!;
      return codes && this.update ? { kind: 'update', version: next, codes } : { kind: 'rebuild' };
    }
    // a later version is known but not this one: its notification may still be on its way
    this.gapSince ??= performance.now();
    if (performance.now() - this.gapSince < this.opts.gapWaitMs) return { kind: 'wait' };
    this.gapSince = null;
    return { kind: 'rebuild' };
  }

  private async workLoop() {
    for (let step = this.nextStep(); step && !this.closed; step = this.nextStep()) {
      const t0 = performance.now();
      if (step.kind === 'wait') {
        await new Promise((r) => setTimeout(r, 10));
        continue;
      }
      if (step.kind === 'update') {
        const { version, codes } = step;
        this.pending.delete(version);
        try {
          const { entities } = await loadEntities(this.sequelize, codes);
          const cur = this.current!;
          if (cur.networkVersion === version - 1) {
            this.current = this.update!(cur, codes, entities, version);
            this.counts.updates++;
          }
          this.lastBuildMs = performance.now() - t0;
        } catch (e) {
          this.log(`updating to version ${version} failed (${messageOf(e)}); rebuilding instead`);
          this.dirty = true;
        }
        continue;
      }
      this.dirty = false;
      try {
        const { document, version } = await loadNetworkDocument(this.sequelize);
        if (!this.current || version >= this.current.networkVersion) this.current = this.build(document, version);
        this.counts.rebuilds++;
        this.lastBuildMs = performance.now() - t0;
        if (this.failure) this.log(`rebuild succeeded again (version ${this.current.networkVersion})`);
        this.failure = null;
        this.rebuildBackoff.reset();
      } catch (e) {
        this.failure = { message: messageOf(e), at: new Date() };
        this.dirty = true;
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

  /**
   * The periodic check: is the listener alive, is the model current? A model
   * still behind the version the previous check saw has missed a
   * notification (a change in flight is given one interval). Quiet while the
   * database is down.
   */
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
    try {
      const version = await this.databaseVersion();
      const seen = this.lastCheckedVersion;
      this.lastCheckedVersion = version;
      if (this.current && this.current.networkVersion < Math.min(seen, version)) {
        this.log(`the model is at version ${this.current.networkVersion}, the database at ${version}: a notification was missed; rebuilding`);
        await this.refresh(version);
      }
    } catch {
      // the database is unreachable: the listener's reconnection reports it
    }
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
      const change = decodeChange(msg.payload);
      if (change) void this.applyChange(change.version, change.codes);
      else void this.refresh();
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

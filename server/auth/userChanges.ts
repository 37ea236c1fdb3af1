/**
 * Hears changes to users made by any process (migration 0009: a trigger on
 * users sends NOTIFY user_changed with the id, or '*' for a truncate) and
 * makes this process's user-row cache forget them. While the connection is
 * down nothing is heard, so the cache confirms no row (every request reads
 * its row again, or falls back to a recent one during an outage); each
 * reconnection starts a new epoch, so rows read before it are read again.
 * Reconnects with back-off until closed; exactly one connection at a time.
 */
import crypto from 'node:crypto';
import { Client } from 'pg';
import { Backoff } from '../services/backoff';
import type { ChangeFeed, UserRowCache } from './userRowCache';

export const USER_CHANNEL = 'user_changed';

export class UserChangeListener implements ChangeFeed {
  epoch = 0;
  private client: Client | null = null;
  private closed = false;
  private timer: NodeJS.Timeout | null = null;
  private readonly backoff = new Backoff(250, 10_000);
  readonly applicationName = `headwater-users-${process.pid}-${crypto.randomBytes(3).toString('hex')}`;

  constructor(
    private readonly databaseUrl: string,
    private readonly cache: UserRowCache,
    private readonly log: (message: string) => void = (m) => console.error(`[users] ${m}`),
  ) {
    cache.feed = this;
  }

  get listening(): boolean {
    return this.client !== null;
  }

  /** Connect in the background; never rejects. */
  start() {
    void this.connect();
  }

  private async connect() {
    if (this.closed || this.client) return;
    const client = new Client({ connectionString: this.databaseUrl, application_name: this.applicationName, connectionTimeoutMillis: 3000, keepAlive: true });
    client.on('error', (e) => this.drop(client, e.message));
    client.on('end', () => this.drop(client, 'the connection closed'));
    client.on('notification', (msg) => {
      const id = Number(msg.payload);
      if (Number.isSafeInteger(id) && id > 0) this.cache.forget(id);
      else this.cache.forgetAll();
    });
    try {
      await client.connect();
      await client.query(`LISTEN ${USER_CHANNEL}`);
    } catch (e) {
      await client.end().catch(() => undefined);
      this.log(`could not listen for changes to people yet (${e instanceof Error ? e.message : String(e)}); retrying`);
      this.retry();
      return;
    }
    if (this.closed) {
      await client.end().catch(() => undefined);
      return;
    }
    // anything changed while nobody listened: rows read before now are read again
    this.epoch += 1;
    this.client = client;
    this.backoff.reset();
  }

  private drop(client: Client, why: string) {
    if (this.client !== client) return;
    this.client = null;
    client.removeAllListeners('notification');
    void client.end().catch(() => undefined);
    if (this.closed) return;
    this.log(`the listener for changes to people lost its connection (${why}); reconnecting`);
    this.retry();
  }

  private retry() {
    if (this.closed || this.timer) return;
    const t = setTimeout(() => {
      this.timer = null;
      void this.connect();
    }, this.backoff.next()) as unknown as NodeJS.Timeout;
    t.unref();
    this.timer = t;
  }

  async close() {
    this.closed = true;
    if (this.timer) clearTimeout(this.timer);
    this.cache.detach();
    const client = this.client;
    this.client = null;
    if (client) await client.end().catch(() => undefined);
  }
}

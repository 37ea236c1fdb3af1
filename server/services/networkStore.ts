/**
 * Keeps the in-memory analysis model fresh across processes
 * (docs/architecture.md, "A rebuild"): every committed change bumps the network
 * version and sends NOTIFY network_changed; each server process LISTENs on a
 * dedicated connection and rebuilds. Readers always get the last complete
 * model; a rebuild swaps it in only when finished.
 */
import { Client } from 'pg';
import type { Sequelize } from 'sequelize';
import type { NetworkDocument } from '@/shared/schemas/network';
import { loadNetworkDocument } from './networkLoader';

export interface Built {
  networkVersion: number;
}

export class NetworkStore<T extends Built> {
  private current: T | null = null;
  private building: Promise<void> | null = null;
  private dirty = false;
  private listener: Client | null = null;
  private closed = false;
  lastBuildMs = 0;

  constructor(
    private readonly sequelize: Sequelize,
    private readonly databaseUrl: string,
    private readonly build: (doc: NetworkDocument, version: number) => T,
  ) {}

  /** The last complete model; null only before the first build finished. */
  get model(): T | null {
    return this.current;
  }

  async start(): Promise<void> {
    await this.refresh();
    await this.listen();
  }

  /** Rebuild unless the model is already at `version` or later. Bursts of changes coalesce. */
  refresh(version?: number): Promise<void> {
    if (version !== undefined && this.current && this.current.networkVersion >= version) return Promise.resolve();
    this.dirty = true;
    if (!this.building) {
      this.building = this.rebuildLoop().finally(() => {
        this.building = null;
      });
    }
    return this.building;
  }

  private async rebuildLoop() {
    while (this.dirty && !this.closed) {
      this.dirty = false;
      const t0 = performance.now();
      const { document, version } = await loadNetworkDocument(this.sequelize);
      if (!this.current || version >= this.current.networkVersion) this.current = this.build(document, version);
      this.lastBuildMs = performance.now() - t0;
    }
  }

  private async listen() {
    const client = new Client({ connectionString: this.databaseUrl });
    client.on('notification', (msg) => {
      const v = Number(msg.payload);
      this.refresh(Number.isFinite(v) ? v : undefined).catch((e) => console.error('[network] rebuild failed', e));
    });
    client.on('error', (e) => {
      if (this.closed) return;
      console.error('[network] listener lost its connection; reconnecting', e.message);
      this.listener = null;
      setTimeout(() => void this.listen().catch(() => undefined), 1000);
    });
    await client.connect();
    await client.query('LISTEN network_changed');
    this.listener = client;
    // a change may have landed between the first build and LISTEN: rebuild only if one did
    const [rows] = await this.sequelize.query('SELECT version FROM network_state WHERE id = 1');
    await this.refresh(Number((rows as { version: number }[])[0].version));
  }

  async close() {
    this.closed = true;
    await this.building?.catch(() => undefined);
    await this.listener?.end().catch(() => undefined);
  }
}

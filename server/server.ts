/**
 * Boot: validated configuration, migrations, the admin account, the live
 * network model, then listen. SIGTERM and SIGINT close everything cleanly.
 */
import type { Server } from 'node:http';
import { loadConfig, type Config } from './config';
import { openDatabase } from './db';
import { createApp } from './app';
import type { AppContext } from './context';
import { NetworkStore } from './services/networkStore';
import { buildServedNetwork, updateServedNetwork } from './services/servedNetwork';
import { ensureUser } from './services/users';
import { applyDemoAccounts, listenHost, type DemoAccountsResult } from './services/demoAccounts';
import { warmDrawing } from './services/exportCache';
import { whenIdle } from './http/whenIdle';
import { OperationsEvents } from './operations/events';
import { ObjectStore } from './documents/storage';
import { NoticeQueue, type NoticeQueueOptions } from './notices/queue';
import type { MailboxStandin } from './standins/mailbox';

/** quiet time before the background work of a start (the diagram's columns) */
const WARM_AFTER_IDLE_MS = 1_000;

export interface StartOptions {
  /** the local SMTP stand-in when one runs (its mailbox is shown to admins) */
  mailbox?: MailboxStandin | null;
  notices?: NoticeQueueOptions;
  /** the address to listen on (by default 127.0.0.1 for the demo, else all interfaces; the load run keeps to 127.0.0.1) */
  host?: string;
}

export interface RunningServer {
  server: Server;
  ctx: AppContext;
  url: string;
  /** the address listened on: opts.host, else 127.0.0.1 with DEMO=1 (this machine only), else 0.0.0.0 */
  host: string;
  demoAccounts: DemoAccountsResult;
  close(): Promise<void>;
}

export async function startServer(databaseUrl: string, config: Config = loadConfig(), opts: StartOptions = {}): Promise<RunningServer> {
  const db = openDatabase(databaseUrl);
  await db.migrate();
  if (config.ADMIN_EMAIL && config.ADMIN_PASSWORD) await ensureUser(config.ADMIN_EMAIL, config.ADMIN_PASSWORD, 'admin', 'Administrator');
  // DEMO=1: the demo accounts exist (passwords changed since are kept); DEMO=0: any left over are disabled.
  const demoAccounts = await applyDemoAccounts(config.DEMO);

  const network = new NetworkStore(db.sequelize, databaseUrl, buildServedNetwork, { update: updateServedNetwork });
  await network.start();
  const ctx: AppContext = { config, db, network, events: new OperationsEvents(), objects: ObjectStore.fromConfig(config), mailbox: opts.mailbox ?? null };
  let port = config.PORT;
  const notices = new NoticeQueue(ctx, { baseUrl: () => `http://localhost:${port}`, ...opts.notices });
  await notices.start();
  ctx.notices = notices;
  const { app } = createApp(ctx);

  const host = opts.host ?? listenHost(config.DEMO);
  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(config.PORT, host, () => resolve(s));
    s.on('error', reject);
  });
  // the diagram's columns made ahead of the first request, once the first busy seconds are over
  const stopWarming = whenIdle(server, WARM_AFTER_IDLE_MS, () => warmDrawing(ctx));
  const address = server.address();
  port = typeof address === 'object' && address ? address.port : config.PORT;

  let closing: Promise<void> | null = null;
  const close = () =>
    (closing ??= (async () => {
      stopWarming();
      await new Promise<void>((r) => {
        server.close(() => r());
        server.closeIdleConnections?.();
        (setTimeout(() => server.closeAllConnections?.(), 5000) as unknown as NodeJS.Timeout).unref();
      });
      await notices.stop();
      ctx.objects?.close();
      await network.close();
      await ctx.userChanges?.close();
      await db.close();
    })());

  return { server, ctx, url: `http://${config.DEMO ? '127.0.0.1' : 'localhost'}:${port}`, host, demoAccounts, close };
}

/** Close on SIGTERM/SIGINT, then exit. */
export function closeOnSignals(running: RunningServer, after?: () => Promise<void> | void) {
  const stop = async (signal: string) => {
    console.log(`\n${signal}: closing the server...`);
    await running.close();
    await after?.();
    process.exit(0);
  };
  process.once('SIGTERM', () => void stop('SIGTERM'));
  process.once('SIGINT', () => void stop('SIGINT'));
}

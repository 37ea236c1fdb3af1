/**
 * The notice pipeline. A sink on ctx.events runs inside the transaction of
 * the change that caused an event: it finds the recipients, writes one
 * notices row per address (unique per event key and address, so a repeated
 * event adds nothing) and enqueues one pg-boss job per new row on that same
 * transaction's connection. Rolled back: no row, no job. Committed: a worker
 * sends each with nodemailer; SMTP down -> the job fails and pg-boss retries
 * it with backoff until SMTP is back. A sent row is never sent again.
 */
import PgBoss from 'pg-boss';
import type { Transporter } from 'nodemailer';
import type { Transaction } from 'sequelize';
import type { AppContext } from '../context';
import type { OperationsEvent } from '../operations/events';
import { Notice } from '../db/models/notices';
import { resolveReach } from './reach';
import { eventLink, renderMail } from './render';
import { unsubscribeToken, type Subscriber } from './unsubscribe';
import { recipientsFor } from './recipients';

export const NOTICE_JOB = 'notice-send';

export interface NoticeQueueOptions {
  /** seconds before the first retry; doubled (with jitter) each time */
  retryDelaySeconds?: number;
  retryLimit?: number;
  /** how often an idle worker looks for work */
  pollingSeconds?: number;
  /** the product's address for links in mails, when PUBLIC_URL is unset */
  baseUrl?: () => string;
}

/** pg-boss's database interface, executing on the transaction's own connection. */
function onTransaction(t: Transaction) {
  const connection = (t as unknown as { connection: { query(text: string, values: unknown[]): Promise<{ rows: unknown[] }> } }).connection;
  return { executeSql: async (text: string, values: unknown[]) => ({ rows: (await connection.query(text, values)).rows }) };
}

export class NoticeQueue {
  private boss: PgBoss | null = null;
  private transport: Transporter | null = null;
  private unsubscribeSink: (() => void) | null = null;
  private readonly opts: Required<NoticeQueueOptions>;

  constructor(
    private readonly ctx: AppContext,
    opts: NoticeQueueOptions = {},
  ) {
    // Defaults: 12 retries from 10 s doubling reach about a day, long enough for an SMTP outage.
    this.opts = { retryDelaySeconds: 10, retryLimit: 12, pollingSeconds: 2, baseUrl: () => 'http://localhost:8080', ...opts };
  }

  get base(): string {
    return this.ctx.config.PUBLIC_URL ?? this.opts.baseUrl();
  }

  async start(): Promise<void> {
    const boss = new PgBoss({ connectionString: this.ctx.db.url, schema: 'pgboss', max: 3, application_name: 'headwater-notices' });
    boss.on('error', (e) => console.error('[notices] queue:', e.message));
    await boss.start();
    await boss.createQueue(NOTICE_JOB, { name: NOTICE_JOB, retryLimit: this.opts.retryLimit, retryDelay: this.opts.retryDelaySeconds, retryBackoff: true, expireInSeconds: 120 });
    this.boss = boss;
    if (this.ctx.config.SMTP_URL) {
      const { default: nodemailer } = await import('nodemailer');
      this.transport = nodemailer.createTransport({ url: this.ctx.config.SMTP_URL, connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 30_000 } as never);
      await boss.work<{ notice: number }>(NOTICE_JOB, { batchSize: 1, includeMetadata: true, pollingIntervalSeconds: this.opts.pollingSeconds }, async ([job]) =>
        this.deliver(job.data.notice, job.retryCount >= job.retryLimit),
      );
    } else {
      console.warn('[notices] SMTP_URL is not set: notices are queued but not sent');
    }
    if (this.ctx.events) this.unsubscribeSink = this.ctx.events.subscribe(async (t, event) => {
        await this.enqueue(t, event);
      });
  }

  async stop(): Promise<void> {
    this.unsubscribeSink?.();
    this.unsubscribeSink = null;
    const boss = this.boss;
    this.boss = null;
    if (boss) await boss.stop({ graceful: true, wait: true, timeout: 5000 });
    this.transport?.close();
    this.transport = null;
  }

  /** Within the change's transaction: one row and one job per new (event, address). Returns the new notice ids. */
  async enqueue(t: Transaction, event: OperationsEvent): Promise<number[]> {
    if (!this.boss) throw new Error('the notice queue is not started');
    const reach = resolveReach(event, this.ctx.network.model);
    const recipients = await recipientsFor(this.ctx.db.sequelize, t, reach);
    const ids: number[] = [];
    const link = eventLink(this.base, event);
    for (const who of recipients) {
      const unsubscribe = `${this.base.replace(/\/$/, '')}/api/unsubscribe?token=${unsubscribeToken(who, this.ctx.config.JWT_SECRET)}`;
      const mail = renderMail(event, reach, { event: link, unsubscribe });
      // ON CONFLICT is the idempotency key: the model API cannot say "insert unless present, tell me if you did".
      const [rows] = await this.ctx.db.sequelize.query(
        `INSERT INTO notices (event_key, event_kind, event_code, address, subject, text_body, html_body)
         VALUES ($1, $2, $3, $4, $5, $6, $7)
         ON CONFLICT (event_key, lower(address)) DO NOTHING RETURNING id`,
        { bind: [event.key, event.kind, event.code, who.email, mail.subject, mail.text, mail.html], transaction: t },
      );
      const id = (rows as Array<{ id: number }>)[0]?.id;
      if (id === undefined) continue;
      await this.boss.send(NOTICE_JOB, { notice: Number(id) }, { db: onTransaction(t) });
      ids.push(Number(id));
    }
    return ids;
  }

  /** Send one notice; a failure is recorded on the row and thrown so pg-boss retries. */
  private async deliver(id: number, lastTry: boolean): Promise<void> {
    const notice = await Notice.findByPk(id);
    if (!notice || notice.status === 'sent') return;
    try {
      const info = await this.transport!.sendMail({
        from: this.ctx.config.MAIL_FROM,
        to: notice.address,
        subject: notice.subject,
        text: notice.textBody,
        html: notice.htmlBody,
        messageId: `<notice-${notice.id}.${notice.eventKey.replace(/[^\w.-]/g, '_').slice(0, 60)}@headwater.invalid>`,
        headers: { 'X-Headwater-Event': notice.eventKey, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' },
        list: { unsubscribe: unsubscribeUrl(notice.textBody) },
      });
      await notice.update({ status: 'sent', sentAt: new Date(), attempts: notice.attempts + 1, lastError: null, messageId: info.messageId ?? null });
    } catch (e) {
      const reason = String((e as Error).message ?? e).slice(0, 500);
      await notice.update({ attempts: notice.attempts + 1, lastError: reason, status: lastTry ? 'failed' : 'waiting' });
      throw e;
    }
  }
}

/** The unsubscribe link is the last line of the text body (render.ts). */
function unsubscribeUrl(text: string): string {
  return /Stop these mails: (\S+)\s*$/.exec(text)?.[1] ?? '';
}

export type { Subscriber };

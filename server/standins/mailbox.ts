/**
 * The local SMTP stand-in: an smtp-server on loopback that accepts every
 * message, parses it with mailparser and keeps it as one JSON file in a
 * folder (the "mailbox"), so a person trying the product can read the mail
 * it sent. It never relays anything anywhere.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';

export interface StoredMail {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  headers: Record<string, string>;
}

const MAX_MESSAGE = 10 * 1024 * 1024;

const addresses = (a: AddressObject | AddressObject[] | undefined): string[] =>
  (Array.isArray(a) ? a : a ? [a] : []).flatMap((o) => o.value.map((v) => v.address ?? '')).filter(Boolean);

export class MailboxStandin {
  private server: SMTPServer | null = null;
  port = 0;

  constructor(readonly folder: string) {}

  get url(): string {
    return `smtp://127.0.0.1:${this.port}`;
  }

  /** Listen on loopback: port 0 picks a free one; a given port is reused after stop() (tests take SMTP down and up). */
  async start(port = this.port): Promise<void> {
    fs.mkdirSync(this.folder, { recursive: true });
    const server = new SMTPServer({
      secure: false,
      authOptional: true,
      disabledCommands: ['STARTTLS', 'AUTH'],
      size: MAX_MESSAGE,
      logger: false,
      onData: (stream, _session, callback) => {
        simpleParser(stream)
          .then((mail) => {
            this.store(mail);
            callback();
          })
          .catch((e: Error) => callback(e));
      },
    });
    server.on('error', () => undefined);
    await new Promise<void>((resolve, reject) => {
      server.server.once('error', reject);
      server.listen(port, '127.0.0.1', () => resolve());
    });
    this.port = (server.server.address() as AddressInfo).port;
    this.server = server;
  }

  async stop(): Promise<void> {
    const s = this.server;
    this.server = null;
    if (s) await new Promise<void>((r) => s.close(() => r()));
  }

  private store(mail: Awaited<ReturnType<typeof simpleParser>>) {
    const receivedAt = new Date();
    const id = `${receivedAt.getTime()}-${crypto.randomBytes(4).toString('hex')}`;
    const headers: Record<string, string> = {};
    // the raw lines: mailparser folds List-* headers into one parsed object
    for (const { key, line } of mail.headerLines) {
      if (['message-id', 'list-unsubscribe', 'list-unsubscribe-post', 'x-headwater-event'].includes(key)) headers[key] = line.slice(line.indexOf(':') + 1).trim();
    }
    const stored: StoredMail = {
      id,
      receivedAt: receivedAt.toISOString(),
      from: addresses(mail.from)[0] ?? '',
      to: addresses(mail.to),
      subject: mail.subject ?? '',
      text: mail.text ?? '',
      html: typeof mail.html === 'string' ? mail.html : '',
      headers,
    };
    fs.writeFileSync(path.join(this.folder, `${id}.json`), JSON.stringify(stored, null, 2));
  }

  /** Newest first. */
  list(limit = 200): StoredMail[] {
    if (!fs.existsSync(this.folder)) return [];
    const files = fs.readdirSync(this.folder).filter((f) => f.endsWith('.json')).sort().reverse().slice(0, limit);
    const out: StoredMail[] = [];
    for (const f of files) {
      try {
        out.push(JSON.parse(fs.readFileSync(path.join(this.folder, f), 'utf8')) as StoredMail);
      } catch {
        // a half-written file from a crash: skip it
      }
    }
    return out;
  }

  clear(): void {
    if (fs.existsSync(this.folder)) for (const f of fs.readdirSync(this.folder)) fs.rmSync(path.join(this.folder, f), { force: true });
  }
}

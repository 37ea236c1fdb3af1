/**
 * Local stand-ins for the hosted services, started by `npm start` and the
 * test setup when their variables are unset: an SMTP server (SMTP_URL) and
 * an S3-compatible store (S3_ENDPOINT), both on loopback with their files
 * under DATA_DIR. The server itself never knows: it only sees URLs in its
 * configuration, exactly as in production.
 */
import path from 'node:path';
import type { Config } from '../config';
import { MailboxStandin } from './mailbox';
import { ObjectStoreStandin, STANDIN_KEY } from './objectStore';

export { MailboxStandin } from './mailbox';
export type { StoredMail } from './mailbox';

export interface Standins {
  /** the configuration with the stand-ins' URLs filled in */
  config: Config;
  mailbox: MailboxStandin | null;
  objectStore: ObjectStoreStandin | null;
  close(): Promise<void>;
}

export async function startStandins(config: Config, dataDir = config.DATA_DIR): Promise<Standins> {
  let mailbox: MailboxStandin | null = null;
  let objectStore: ObjectStoreStandin | null = null;
  const next: Config = { ...config };
  try {
    if (!config.SMTP_URL) {
      mailbox = new MailboxStandin(path.join(dataDir, 'mailbox'));
      await mailbox.start(0);
      next.SMTP_URL = mailbox.url;
    }
    if (!config.S3_ENDPOINT) {
      objectStore = new ObjectStoreStandin(path.join(dataDir, 's3'), config.S3_BUCKET);
      await objectStore.start();
      next.S3_ENDPOINT = objectStore.url;
      next.AWS_ACCESS_KEY_ID = STANDIN_KEY;
      next.AWS_SECRET_ACCESS_KEY = STANDIN_KEY;
    }
  } catch (e) {
    await mailbox?.stop();
    await objectStore?.stop();
    throw e;
  }
  return {
    config: next,
    mailbox,
    objectStore,
    close: async () => {
      await mailbox?.stop();
      await objectStore?.stop();
    },
  };
}

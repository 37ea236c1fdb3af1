/**
 * The local object-store stand-in: s3rver on loopback with its files in a
 * folder, speaking enough of the S3 API for the AWS SDK v3 client the
 * documents service uses against any S3-compatible store.
 */
import fs from 'node:fs';
import S3rver from 's3rver';

/** s3rver's fixed development credentials: it accepts no others. */
export const STANDIN_KEY = 'S3RVER';

export class ObjectStoreStandin {
  private server: S3rver | null = null;
  port = 0;

  constructor(
    readonly folder: string,
    readonly bucket: string,
  ) {}

  get url(): string {
    return `http://127.0.0.1:${this.port}`;
  }

  async start(): Promise<void> {
    fs.mkdirSync(this.folder, { recursive: true });
    const server = new S3rver({ address: '127.0.0.1', port: 0, directory: this.folder, silent: true, configureBuckets: [{ name: this.bucket, configs: [] }] });
    const info = (await server.run()) as { port: number };
    this.port = info.port;
    this.server = server;
  }

  async stop(): Promise<void> {
    const s = this.server;
    this.server = null;
    if (s) await s.close();
  }
}

/**
 * The object store through the AWS SDK v3: any S3-compatible endpoint
 * (S3_ENDPOINT, S3_BUCKET, S3_REGION and the usual credential variables);
 * the local stand-in is one of them. Downloads are short-lived presigned links.
 * The SDK is loaded on first use: it is large, and a server that never
 * touches a document should not pay for it at boot.
 */
import type { S3Client } from '@aws-sdk/client-s3';
import type { Config } from '../config';

/** How long a download link stays valid, in seconds. */
export const LINK_SECONDS = 300;

type Settings = Pick<Config, 'S3_ENDPOINT' | 'S3_REGION' | 'AWS_ACCESS_KEY_ID' | 'AWS_SECRET_ACCESS_KEY'>;
type Sdk = typeof import('@aws-sdk/client-s3');

export class ObjectStore {
  private loaded: Promise<{ sdk: Sdk; client: S3Client }> | null = null;
  private client: S3Client | null = null;

  constructor(
    readonly bucket: string,
    private readonly settings: Settings,
  ) {}

  static fromConfig(config: Config): ObjectStore {
    return new ObjectStore(config.S3_BUCKET, config);
  }

  private s3() {
    return (this.loaded ??= import('@aws-sdk/client-s3').then((sdk) => {
      const c = this.settings;
      this.client = new sdk.S3Client({
        region: c.S3_REGION,
        ...(c.S3_ENDPOINT ? { endpoint: c.S3_ENDPOINT, forcePathStyle: true } : {}),
        ...(c.AWS_ACCESS_KEY_ID && c.AWS_SECRET_ACCESS_KEY ? { credentials: { accessKeyId: c.AWS_ACCESS_KEY_ID, secretAccessKey: c.AWS_SECRET_ACCESS_KEY } } : {}),
        // Checksums only where S3 requires them: several S3-compatible stores reject the newer optional headers.
        requestChecksumCalculation: 'WHEN_REQUIRED',
        responseChecksumValidation: 'WHEN_REQUIRED',
        maxAttempts: 2,
      });
      return { sdk, client: this.client };
    }));
  }

  async put(key: string, body: Buffer, type: string): Promise<void> {
    const { sdk, client } = await this.s3();
    await client.send(new sdk.PutObjectCommand({ Bucket: this.bucket, Key: key, Body: body, ContentType: type, ContentLength: body.length }));
  }

  /** The object's bytes, or null when it is not there. */
  async get(key: string): Promise<Buffer | null> {
    const { sdk, client } = await this.s3();
    try {
      const out = await client.send(new sdk.GetObjectCommand({ Bucket: this.bucket, Key: key }));
      return out.Body ? Buffer.from(await out.Body.transformToByteArray()) : Buffer.alloc(0);
    } catch (e) {
      if (e instanceof sdk.NoSuchKey || (e as { name?: string }).name === 'NoSuchKey') return null;
      throw e;
    }
  }

  async remove(key: string): Promise<void> {
    const { sdk, client } = await this.s3();
    await client.send(new sdk.DeleteObjectCommand({ Bucket: this.bucket, Key: key }));
  }

  /** A link that downloads the object under `name` for LINK_SECONDS. */
  async link(key: string, name: string, type: string): Promise<string> {
    const { sdk, client } = await this.s3();
    const { getSignedUrl } = await import('@aws-sdk/s3-request-presigner');
    const disposition = `attachment; filename="${name.replace(/[^\w. -]/g, '_')}"; filename*=UTF-8''${encodeURIComponent(name)}`;
    return getSignedUrl(client, new sdk.GetObjectCommand({ Bucket: this.bucket, Key: key, ResponseContentDisposition: disposition, ResponseContentType: type }), {
      expiresIn: LINK_SECONDS,
    });
  }

  /** Keys under a prefix (tests and repair scripts). */
  async keys(prefix = ''): Promise<string[]> {
    const { sdk, client } = await this.s3();
    const out = await client.send(new sdk.ListObjectsV2Command({ Bucket: this.bucket, Prefix: prefix }));
    return (out.Contents ?? []).map((o) => o.Key ?? '').filter(Boolean);
  }

  close(): void {
    this.client?.destroy();
  }
}

/**
 * The object store through the AWS SDK v3: any S3-compatible endpoint
 * (S3_ENDPOINT, S3_BUCKET, S3_REGION and the usual credential variables);
 * the local stand-in is one of them. Downloads are short-lived presigned links.
 */
import { DeleteObjectCommand, GetObjectCommand, ListObjectsV2Command, PutObjectCommand, S3Client, NoSuchKey } from '@aws-sdk/client-s3';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import type { Config } from '../config';

/** How long a download link stays valid, in seconds. */
export const LINK_SECONDS = 300;

export class ObjectStore {
  readonly client: S3Client;
  constructor(readonly bucket: string, config: Pick<Config, 'S3_ENDPOINT' | 'S3_REGION' | 'AWS_ACCESS_KEY_ID' | 'AWS_SECRET_ACCESS_KEY'>) {
    this.client = new S3Client({
      region: config.S3_REGION,
      ...(config.S3_ENDPOINT ? { endpoint: config.S3_ENDPOINT, forcePathStyle: true } : {}),
      ...(config.AWS_ACCESS_KEY_ID && config.AWS_SECRET_ACCESS_KEY
        ? { credentials: { accessKeyId: config.AWS_ACCESS_KEY_ID, secretAccessKey: config.AWS_SECRET_ACCESS_KEY } }
        : {}),
      // Checksums only where S3 requires them: several S3-compatible stores reject the newer optional headers.
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
      maxAttempts: 2,
    });
  }

  static fromConfig(config: Config): ObjectStore {
    return new ObjectStore(config.S3_BUCKET, config);
  }

  async put(key: string, body: Buffer, type: string): Promise<void> {
    await this.client.send(new PutObjectCommand({ Bucket: this.bucket, Key: key, Body: body, ContentType: type, ContentLength: body.length }));
  }

  /** The object's bytes, or null when it is not there. */
  async get(key: string): Promise<Buffer | null> {
    try {
      const out = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: key }));
      return out.Body ? Buffer.from(await out.Body.transformToByteArray()) : Buffer.alloc(0);
    } catch (e) {
      if (e instanceof NoSuchKey || (e as { name?: string }).name === 'NoSuchKey') return null;
      throw e;
    }
  }

  async remove(key: string): Promise<void> {
    await this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: key }));
  }

  /** A link that downloads the object under `name` for LINK_SECONDS. */
  link(key: string, name: string, type: string): Promise<string> {
    const disposition = `attachment; filename="${name.replace(/[^\w. -]/g, '_')}"; filename*=UTF-8''${encodeURIComponent(name)}`;
    return getSignedUrl(this.client, new GetObjectCommand({ Bucket: this.bucket, Key: key, ResponseContentDisposition: disposition, ResponseContentType: type }), {
      expiresIn: LINK_SECONDS,
    });
  }

  /** Keys under a prefix (tests and repair scripts). */
  async keys(prefix = ''): Promise<string[]> {
    const out = await this.client.send(new ListObjectsV2Command({ Bucket: this.bucket, Prefix: prefix }));
    return (out.Contents ?? []).map((o) => o.Key ?? '').filter(Boolean);
  }

  close(): void {
    this.client.destroy();
  }
}

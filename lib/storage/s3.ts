import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  NoSuchKey,
  NotFound,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import { assertValidKey, type Storage } from './keys';

export interface S3Settings {
  bucket: string;
  /** An S3-compatible endpoint (MinIO, Ceph, a cloud's); empty for AWS itself. */
  endpoint?: string;
  region: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  /** Path-style URLs (endpoint/bucket/key), which most S3-compatible stores need. */
  forcePathStyle: boolean;
}

/**
 * Files in an S3-compatible object store (docs/deployment.md), so every app process and machine
 * sees the same PDFs. A put is one PutObject: the store makes the object visible whole or not at
 * all, as the local disk's rename does. Keys are the same as on the local disk.
 */
export class S3Storage implements Storage {
  private readonly client: S3Client;

  constructor(readonly settings: S3Settings) {
    this.client = new S3Client({
      region: settings.region,
      endpoint: settings.endpoint || undefined,
      forcePathStyle: settings.forcePathStyle,
      credentials:
        settings.accessKeyId && settings.secretAccessKey
          ? { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey }
          : undefined,
    });
  }

  async put(key: string, data: Uint8Array): Promise<void> {
    assertValidKey(key);
    await this.client.send(
      new PutObjectCommand({ Bucket: this.settings.bucket, Key: key, Body: data, ContentLength: data.byteLength }),
    );
  }

  async get(key: string): Promise<{ stream: ReadableStream<Uint8Array>; size: number } | null> {
    assertValidKey(key);
    try {
      const object = await this.client.send(new GetObjectCommand({ Bucket: this.settings.bucket, Key: key }));
      if (!object.Body) return null;
      return { stream: object.Body.transformToWebStream(), size: Number(object.ContentLength ?? 0) };
    } catch (error) {
      if (isMissing(error)) return null;
      throw error;
    }
  }

  async delete(key: string): Promise<void> {
    assertValidKey(key);
    // S3 answers a delete of a missing key with success, as the contract wants.
    await this.client.send(new DeleteObjectCommand({ Bucket: this.settings.bucket, Key: key }));
  }

  async exists(key: string): Promise<boolean> {
    assertValidKey(key);
    try {
      await this.client.send(new HeadObjectCommand({ Bucket: this.settings.bucket, Key: key }));
      return true;
    } catch (error) {
      if (isMissing(error)) return false;
      throw error;
    }
  }
}

function isMissing(error: unknown): boolean {
  if (error instanceof NoSuchKey || error instanceof NotFound) return true;
  const status = (error as { $metadata?: { httpStatusCode?: number } })?.$metadata?.httpStatusCode;
  return status === 404;
}

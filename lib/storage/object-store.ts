import { createHash } from "node:crypto";
import {
  CreateBucketCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
} from "@aws-sdk/client-s3";
import type { StorageSettings } from "@/lib/settings/storage";

/*
 * The one module over the S3 SDK. Path-style addressing (bucket in the path, not the host name)
 * because the local fake and most self-hosted S3 services are reached by IP address. No
 * "server-only" marker: the seed script and tests run it under plain Node.
 */

export interface StoredObject {
  bytes: Uint8Array;
  contentType: string;
}

export interface ObjectStore {
  readonly bucket: string;
  /** Stores the bytes and checks that the service received exactly them (MD5 of the body). */
  put(options: { key: string; bytes: Uint8Array; contentType: string }): Promise<void>;
  get(key: string): Promise<StoredObject | null>;
  delete(key: string): Promise<void>;
  /** Keys under a prefix (tests and maintenance; at most 1000 per call). */
  list(prefix: string): Promise<string[]>;
  /** Creates the bucket when missing (idempotent). */
  ensureBucket(): Promise<void>;
}

export class StorageError extends Error {
  constructor(message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = "StorageError";
  }
}

const isMissing = (error: unknown) => {
  const name = (error as { name?: string } | null)?.name;
  const status = (error as { $metadata?: { httpStatusCode?: number } } | null)?.$metadata?.httpStatusCode;
  return name === "NoSuchKey" || name === "NotFound" || status === 404;
};

export function createObjectStore(settings: StorageSettings): ObjectStore {
  const client = new S3Client({
    endpoint: settings.endpoint,
    region: settings.region,
    forcePathStyle: true,
    credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey },
    // A storage fault should fail the import quickly, not hang it; the SDK's own retries cover blips.
    maxAttempts: 2,
  });
  const bucket = settings.bucket;
  const wrap = async <T>(what: string, run: () => Promise<T>): Promise<T> => {
    try {
      return await run();
    } catch (error) {
      throw new StorageError(`object storage: ${what} failed: ${error instanceof Error ? error.message : String(error)}`, { cause: error });
    }
  };

  return {
    bucket,
    put: ({ key, bytes, contentType }) =>
      wrap(`storing ${key}`, async () => {
        await client.send(
          new PutObjectCommand({
            Bucket: bucket,
            Key: key,
            Body: bytes,
            ContentType: contentType,
            ContentLength: bytes.byteLength,
            // The service rejects the body when its MD5 differs: a truncated upload cannot be stored.
            ContentMD5: createHash("md5").update(bytes).digest("base64"),
          }),
        );
      }),
    get: (key) =>
      wrap(`reading ${key}`, async () => {
        try {
          const out = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
          if (!out.Body) return null;
          return { bytes: await out.Body.transformToByteArray(), contentType: out.ContentType ?? "application/octet-stream" };
        } catch (error) {
          if (isMissing(error)) return null;
          throw error;
        }
      }),
    delete: (key) =>
      wrap(`deleting ${key}`, async () => {
        await client.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
      }),
    list: (prefix) =>
      wrap(`listing ${prefix}`, async () => {
        const out = await client.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: prefix }));
        return (out.Contents ?? []).flatMap((o) => (o.Key ? [o.Key] : []));
      }),
    ensureBucket: () =>
      wrap(`creating bucket ${bucket}`, async () => {
        try {
          await client.send(new HeadBucketCommand({ Bucket: bucket }));
        } catch (error) {
          if (!isMissing(error)) throw error;
          await client.send(new CreateBucketCommand({ Bucket: bucket }));
        }
      }),
  };
}

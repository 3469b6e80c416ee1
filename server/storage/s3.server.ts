// The S3 client (any S3 API: s3rver locally, a hosted bucket in production), configured from the
// S3_* variables. Path-style addressing and checksums only when required keep S3-compatible stores
// happy; short timeouts make "S3 is down" a quick, clear answer instead of a hanging upload.
import { DeleteObjectsCommand, GetObjectCommand, HeadObjectCommand, ListObjectsV2Command, PutObjectCommand, S3Client, S3ServiceException, type GetObjectCommandOutput } from "@aws-sdk/client-s3";
import { env } from "../env.server.ts";

/** S3 could not be reached or refused the request: the user sees a "try again" message, nothing is kept. */
export class StorageUnavailableError extends Error {
  constructor(cause: unknown) {
    super("The image store is not reachable right now, so nothing was saved. Try again in a minute.", { cause });
    this.name = "StorageUnavailableError";
  }
}

interface Storage {
  client: S3Client;
  bucket: string;
}

let cached: { signature: string; storage: Storage } | undefined;

export interface StorageConfig {
  endpoint?: string;
  region: string;
  bucket: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  forcePathStyle: boolean;
}

export function storageConfigFromEnv(): StorageConfig {
  const e = env();
  if (!e.S3_BUCKET) throw new Error("S3 is not configured: set S3_BUCKET (and S3_ENDPOINT, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY).");
  return { endpoint: e.S3_ENDPOINT, region: e.S3_REGION, bucket: e.S3_BUCKET, accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY, forcePathStyle: e.S3_FORCE_PATH_STYLE === "true" };
}

export function createStorage(config: StorageConfig): Storage {
  const client = new S3Client({
    endpoint: config.endpoint,
    region: config.region,
    forcePathStyle: config.forcePathStyle,
    credentials: config.accessKeyId && config.secretAccessKey ? { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey } : undefined,
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
    maxAttempts: 2,
    requestHandler: { connectionTimeout: 3_000, requestTimeout: 60_000 },
  });
  return { client, bucket: config.bucket };
}

/** The process's S3 client (rebuilt if the S3_* settings changed, as tests do). */
export function storage(): Storage {
  const config = storageConfigFromEnv();
  const signature = JSON.stringify(config);
  if (cached?.signature !== signature) {
    cached?.storage.client.destroy();
    cached = { signature, storage: createStorage(config) };
  }
  return cached.storage;
}

function isNotFound(error: unknown): boolean {
  return error instanceof S3ServiceException && (error.name === "NoSuchKey" || error.name === "NotFound" || error.$metadata.httpStatusCode === 404);
}

/** Wraps network and service failures in StorageUnavailableError; "not found" is left to the caller. */
async function call<T>(run: () => Promise<T>): Promise<T> {
  try {
    return await run();
  } catch (error) {
    if (isNotFound(error)) throw error;
    throw new StorageUnavailableError(error);
  }
}

/** Cache headers of the files made from an original: their keys are content-hashed, so they never change. */
export const IMMUTABLE = "public, max-age=31536000, immutable";

export async function putObject(key: string, body: Uint8Array, contentType: string, cacheControl = "private, no-store", s = storage()) {
  return call(() => s.client.send(new PutObjectCommand({ Bucket: s.bucket, Key: key, Body: body, ContentType: contentType, ContentLength: body.byteLength, CacheControl: cacheControl })));
}

export async function getObjectBytes(key: string, s = storage()): Promise<Uint8Array> {
  const out = await call(() => s.client.send(new GetObjectCommand({ Bucket: s.bucket, Key: key })));
  return call(() => out.Body!.transformToByteArray());
}

/** The object as a stream (null when it does not exist). */
export async function getObjectStream(key: string, s = storage()): Promise<GetObjectCommandOutput | null> {
  try {
    return await call(() => s.client.send(new GetObjectCommand({ Bucket: s.bucket, Key: key })));
  } catch (error) {
    if (isNotFound(error)) return null;
    throw error;
  }
}

export async function objectExists(key: string, s = storage()): Promise<boolean> {
  try {
    await call(() => s.client.send(new HeadObjectCommand({ Bucket: s.bucket, Key: key })));
    return true;
  } catch (error) {
    if (isNotFound(error)) return false;
    throw error;
  }
}

export async function deleteObjects(keys: readonly string[], s = storage()) {
  for (let i = 0; i < keys.length; i += 1000) {
    const batch = keys.slice(i, i + 1000);
    if (batch.length) await call(() => s.client.send(new DeleteObjectsCommand({ Bucket: s.bucket, Delete: { Objects: batch.map((Key) => ({ Key })), Quiet: true } })));
  }
}

/** Every object under a prefix, with its age. */
export async function listObjects(prefix: string, s = storage()): Promise<{ key: string; lastModified: Date }[]> {
  const out: { key: string; lastModified: Date }[] = [];
  let token: string | undefined;
  do {
    const page = await call(() => s.client.send(new ListObjectsV2Command({ Bucket: s.bucket, Prefix: prefix, ContinuationToken: token })));
    for (const o of page.Contents ?? []) if (o.Key) out.push({ key: o.Key, lastModified: o.LastModified ?? new Date(0) });
    token = page.IsTruncated ? page.NextContinuationToken : undefined;
  } while (token);
  return out;
}

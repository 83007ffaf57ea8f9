import "server-only";
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  PutObjectCommand,
  S3Client,
} from "@aws-sdk/client-s3";
import { assertStorageKey } from "./keys";
import type { FileStorage, StoredFile, StoredFileInfo } from "./types";

export type S3StorageConfig = {
  endpoint: string;
  bucket: string;
  region: string;
  accessKeyId?: string;
  secretAccessKey?: string;
};

function isNotFound(error: unknown): boolean {
  const e = error as { name?: string; Code?: string; $metadata?: { httpStatusCode?: number } };
  return e?.name === "NotFound" || e?.name === "NoSuchKey" || e?.Code === "NoSuchKey" || e?.$metadata?.httpStatusCode === 404;
}

/**
 * Any S3-compatible object store. Path-style addressing (most self-hosted stores want it), and
 * checksums only where the operation requires them: with the SDK's default, PutObject sends an
 * aws-chunked body with trailing checksums, which some stores keep as the object's bytes.
 */
export function s3Storage(config: S3StorageConfig): FileStorage {
  const client = new S3Client({
    endpoint: config.endpoint,
    region: config.region,
    forcePathStyle: true,
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
    ...(config.accessKeyId && config.secretAccessKey
      ? { credentials: { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey } }
      : {}),
  });
  const Bucket = config.bucket;

  return {
    driver: "s3",
    async put(key, bytes, contentType) {
      assertStorageKey(key);
      await client.send(
        new PutObjectCommand({ Bucket, Key: key, Body: bytes, ContentType: contentType, ContentLength: bytes.byteLength }),
      );
      return { key, sizeBytes: bytes.byteLength, contentType };
    },
    async get(key): Promise<StoredFile | null> {
      assertStorageKey(key);
      try {
        const out = await client.send(new GetObjectCommand({ Bucket, Key: key }));
        const bytes = Buffer.from(out.Body ? await out.Body.transformToByteArray() : new Uint8Array());
        return { key, bytes, sizeBytes: bytes.byteLength, contentType: out.ContentType ?? "application/octet-stream" };
      } catch (error) {
        if (isNotFound(error)) return null;
        throw error;
      }
    },
    async head(key): Promise<StoredFileInfo | null> {
      assertStorageKey(key);
      try {
        const out = await client.send(new HeadObjectCommand({ Bucket, Key: key }));
        return { key, sizeBytes: out.ContentLength ?? 0, contentType: out.ContentType ?? "application/octet-stream" };
      } catch (error) {
        if (isNotFound(error)) return null;
        throw error;
      }
    },
    async delete(key) {
      assertStorageKey(key);
      await client.send(new DeleteObjectCommand({ Bucket, Key: key }));
    },
  };
}

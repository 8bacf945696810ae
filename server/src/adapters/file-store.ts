import type { Readable } from 'node:stream';
import {
  DeleteObjectCommand,
  GetObjectCommand,
  NoSuchKey,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import type { FileStoreConfig } from '../config/env';
import { AppError } from '../lib/app-error';

/** Where uploaded documents' bytes live: objects by key, written once, read back as a stream. */
export interface FileStore {
  put(key: string, body: Buffer, contentType: string): Promise<void>;
  /** The object's bytes; an AppError 404 when there is no such object. */
  get(key: string): Promise<Readable>;
  delete(key: string): Promise<void>;
}

/** The S3 API (any S3-compatible store; in development and tests the local stand-in). */
export function createS3FileStore(config: FileStoreConfig): FileStore {
  const client = new S3Client({
    endpoint: config.endpoint,
    region: config.region,
    credentials: { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey },
    // Path-style addressing and checksums only where required: what s3rver (and most
    // S3-compatible stores) understand; the default checksums corrupt streamed uploads there.
    forcePathStyle: true,
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
  const Bucket = config.bucket;
  return {
    async put(key, body, contentType) {
      await client.send(
        new PutObjectCommand({ Bucket, Key: key, Body: body, ContentType: contentType }),
      );
    },
    async get(key) {
      try {
        const out = await client.send(new GetObjectCommand({ Bucket, Key: key }));
        return out.Body as Readable;
      } catch (err) {
        if (err instanceof NoSuchKey) throw new AppError(404, 'not_found', 'Document not found');
        throw err;
      }
    },
    async delete(key) {
      await client.send(new DeleteObjectCommand({ Bucket, Key: key }));
    },
  };
}

/** Stands in when no store is configured (production without S3_URL): documents are refused. */
export const unavailableFileStore: FileStore = {
  put: () => Promise.reject(unavailable()),
  get: () => Promise.reject(unavailable()),
  delete: () => Promise.resolve(),
};

const unavailable = () =>
  new AppError(503, 'file_store_unavailable', 'Document storage is not configured on this server');

export function fileStoreFor(config: FileStoreConfig | null): FileStore {
  return config ? createS3FileStore(config) : unavailableFileStore;
}

// Raw files in S3-compatible object storage through @aws-sdk/client-s3. Path-style addressing (bucket in the path)
// so any S3-compatible service or the local fake answers on one host name. Uploads stream the spool file with its known
// length, so memory stays bounded whatever the file size.
import { createReadStream } from 'node:fs';
import type { Readable } from 'node:stream';
import {
  CreateBucketCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import { assertSafeKey, StorageNotFoundError, type RawFileStore, type S3StoreConfig } from './types';

export type { S3StoreConfig };

function isNotFound(error: unknown): boolean {
  const e = error as { name?: string; $metadata?: { httpStatusCode?: number } };
  return e?.name === 'NoSuchKey' || e?.name === 'NotFound' || e?.$metadata?.httpStatusCode === 404;
}

export function createS3Store(config: S3StoreConfig): RawFileStore {
  const client = new S3Client({
    region: config.region,
    endpoint: config.endpoint,
    forcePathStyle: true,
    // Checksums only where S3 requires them: the SDK's default trailing checksums (aws-chunked bodies) are not
    // understood by every S3-compatible server.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    credentials:
      config.accessKeyId && config.secretAccessKey
        ? { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey }
        : undefined,
  });
  const Bucket = config.bucket;
  let bucketReady: Promise<void> | null = null;
  const ensureBucket = () => {
    bucketReady ??= (async () => {
      if (!config.createBucket) return;
      try {
        await client.send(new HeadBucketCommand({ Bucket }));
      } catch (error) {
        if (!isNotFound(error)) throw error;
        await client.send(new CreateBucketCommand({ Bucket }));
      }
    })().catch((error: unknown) => {
      bucketReady = null; // try again on the next call
      throw error;
    });
    return bucketReady;
  };

  return {
    description: `s3:${Bucket}${config.endpoint ? ` at ${config.endpoint}` : ''}`,
    config: { kind: 's3', ...config },
    async putFile(key, localPath, byteSize) {
      assertSafeKey(key);
      await ensureBucket();
      await client.send(
        new PutObjectCommand({
          Bucket,
          Key: key,
          Body: createReadStream(localPath, { highWaterMark: 1 << 20 }),
          ContentLength: byteSize,
          ContentType: 'application/octet-stream',
        }),
      );
    },
    async read(key, range): Promise<Readable> {
      assertSafeKey(key);
      try {
        const out = await client.send(new GetObjectCommand({ Bucket, Key: key, ...(range ? { Range: `bytes=${range.start}-${range.end}` } : {}) }));
        return out.Body as Readable;
      } catch (error) {
        if (isNotFound(error)) throw new StorageNotFoundError(key);
        throw error;
      }
    },
    async exists(key) {
      assertSafeKey(key);
      try {
        await client.send(new HeadObjectCommand({ Bucket, Key: key }));
        return true;
      } catch (error) {
        if (isNotFound(error)) return false;
        throw error;
      }
    },
    async remove(key) {
      assertSafeKey(key);
      await client.send(new DeleteObjectCommand({ Bucket, Key: key }));
    },
  };
}

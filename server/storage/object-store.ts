import { CreateBucketCommand, GetObjectCommand, HeadBucketCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';

import type { Config } from '../config.ts';
import { HttpError } from '../http/http-error.ts';

/** The error a request gets while object storage is down. */
const unavailable = (err: unknown) =>
  new HttpError(503, 'storage_unavailable', `File storage is not answering (${err instanceof Error ? err.name || err.message : 'error'}); nothing was saved. Try the upload again in a minute.`, 'file');

/** Raw files (uploads) kept in S3-compatible object storage. */
export interface ObjectStore {
  put(key: string, body: Buffer, contentType: string): Promise<void>;
  get(key: string): Promise<Buffer>;
}

/** An S3 client from configuration; path-style addressing so the local fake works on loopback. */
export function createObjectStore(config: Config): ObjectStore {
  // The pinned SDK supports this machine's Node 20; its notice about future releases is noise in logs.
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true';
  const client = new S3Client({
    endpoint: config.S3_ENDPOINT,
    region: config.S3_REGION,
    forcePathStyle: true,
    credentials: { accessKeyId: config.S3_ACCESS_KEY_ID, secretAccessKey: config.S3_SECRET_ACCESS_KEY },
  });
  const Bucket = config.S3_BUCKET;
  let bucketReady: Promise<void> | null = null;
  const ensureBucket = () =>
    (bucketReady ??= client
      .send(new HeadBucketCommand({ Bucket }))
      .then(() => undefined)
      .catch(async () => {
        await client.send(new CreateBucketCommand({ Bucket }));
      })
      .catch((err) => {
        bucketReady = null;
        throw err;
      }));
  return {
    // A storage failure is a 503 naming the service (never mistaken for the database's), and the
    // bucket is checked again next time: the service may have come back empty.
    async put(key, body, contentType) {
      try {
        await ensureBucket();
        await client.send(new PutObjectCommand({ Bucket, Key: key, Body: body, ContentType: contentType }));
      } catch (err) {
        bucketReady = null;
        throw unavailable(err);
      }
    },
    async get(key) {
      try {
        await ensureBucket();
        const out = await client.send(new GetObjectCommand({ Bucket, Key: key }));
        return Buffer.from(await out.Body!.transformToByteArray());
      } catch (err) {
        bucketReady = null;
        if ((err as { name?: string }).name === 'NoSuchKey') throw new HttpError(404, 'not_found', 'The stored file is missing.');
        throw unavailable(err);
      }
    },
  };
}

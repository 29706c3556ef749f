import path from 'node:path';
import { Readable } from 'node:stream';
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { developmentTools } from '@/server/development-tools';
import { AppError } from '@/server/http/errors';

/**
 * Attachment bytes in an S3-compatible object store, through the AWS SDK. Configured by
 * S3_ENDPOINT / S3_BUCKET / S3_ACCESS_KEY / S3_SECRET_KEY / S3_REGION; in development and tests,
 * without S3_ENDPOINT, the local fake S3 of server/dev is started instead (never in production). The bucket is private: files
 * leave only through the API, with the member's rights.
 */

export interface ObjectStorage {
  put(key: string, body: Buffer, contentType: string): Promise<void>;
  get(key: string): Promise<Readable>;
  remove(key: string): Promise<void>;
  describe(): string;
  close(): Promise<void>;
}

export interface S3Settings {
  endpoint: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
  region?: string;
}

// The SDK warns once per process that Node 20 support ends; the platform pins Node 20 on purpose.
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true';

const unavailable = (error: unknown) => {
  console.error('[attachments] object store error:', (error as Error).message);
  return new AppError('UNAVAILABLE', 'The file store is not reachable right now. Try again in a moment.');
};

export function createS3Storage(settings: S3Settings, onClose: () => Promise<void> = async () => {}): ObjectStorage {
  const client = new S3Client({
    endpoint: settings.endpoint,
    region: settings.region ?? 'us-east-1',
    credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey },
    // PLATFORM trap 13: with the default checksums, uploads reach S3-compatible fakes in
    // aws-chunked framing and are stored corrupted; path-style URLs work without DNS per bucket.
    forcePathStyle: true,
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
  return {
    async put(key, body, contentType) {
      try {
        await client.send(new PutObjectCommand({ Bucket: settings.bucket, Key: key, Body: body, ContentType: contentType, ContentLength: body.length }));
      } catch (error) {
        throw unavailable(error);
      }
    },
    async get(key) {
      try {
        const object = await client.send(new GetObjectCommand({ Bucket: settings.bucket, Key: key }));
        if (!(object.Body instanceof Readable)) throw new Error('object body is not a stream');
        return object.Body;
      } catch (error) {
        if ((error as { name?: string }).name === 'NoSuchKey') throw new AppError('NOT_FOUND', 'The file of that attachment is missing from the store.');
        throw unavailable(error);
      }
    },
    async remove(key) {
      try {
        await client.send(new DeleteObjectCommand({ Bucket: settings.bucket, Key: key }));
      } catch (error) {
        throw unavailable(error);
      }
    },
    describe: () => `S3 bucket "${settings.bucket}" at ${settings.endpoint}`,
    async close() {
      client.destroy();
      await onClose();
    },
  };
}

/**
 * S3 from the environment, else (outside production, when the development tools are loaded) the
 * fake, started on first use, with the configured key pair when there is one.
 */
export function lazyStorage(
  settings: S3Settings | null,
  nodeEnv: string,
  dataDir?: string,
  fake: { bucket?: string; credentials?: { accessKeyId: string; secretAccessKey: string } } = {},
): ObjectStorage {
  let started: Promise<ObjectStorage> | null = null;
  const storage = () => {
    started ??= (async () => {
      if (settings) return createS3Storage(settings);
      const dev = developmentTools(nodeEnv);
      if (!dev) {
        throw new AppError('UNAVAILABLE', 'Attachments are not configured on this server (S3_ENDPOINT and S3_BUCKET).');
      }
      const store = await dev.startFakeS3({ directory: dataDir ? path.join(dataDir, 's3') : undefined, ...fake });
      return createS3Storage(store.settings, store.close);
    })();
    started.catch(() => {
      started = null;
    });
    return started;
  };
  return {
    put: async (key, body, type) => (await storage()).put(key, body, type),
    get: async (key) => (await storage()).get(key),
    remove: async (key) => (await storage()).remove(key),
    describe: () => (settings ? `S3 bucket "${settings.bucket}" at ${settings.endpoint}` : 'local fake S3 (started on first use)'),
    close: async () => {
      if (started) await (await started.catch(() => null))?.close();
    },
  };
}

import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import S3rver from 's3rver';
import { AppError } from '@/server/http/errors';

/**
 * Attachment bytes in an S3-compatible object store, through the AWS SDK. Configured by
 * S3_ENDPOINT / S3_BUCKET / S3_ACCESS_KEY / S3_SECRET_KEY / S3_REGION; in development and tests a
 * local fake S3 server is started instead (never in production). The bucket is private: files
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

/** The local fake S3 (development and tests): its own folder, a free port on 127.0.0.1, one bucket. */
export async function startFakeS3(options: { directory?: string; bucket?: string } = {}): Promise<{ settings: S3Settings; close: () => Promise<void> }> {
  const bucket = options.bucket ?? 'sphereline-attachments';
  const throwaway = !options.directory;
  const directory = options.directory ?? fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-s3-'));
  fs.mkdirSync(directory, { recursive: true });
  const server = new S3rver({ address: '127.0.0.1', port: 0, silent: true, directory, configureBuckets: [{ name: bucket }] });
  const { port } = await server.run();
  return {
    // s3rver accepts any key pair; these name the fake so nobody mistakes them for real ones.
    settings: { endpoint: `http://127.0.0.1:${port}`, bucket, accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
    close: async () => {
      await server.close();
      if (throwaway) fs.rmSync(directory, { recursive: true, force: true });
    },
  };
}

/** S3 from the environment, else (outside production) the fake, started on first use. */
export function lazyStorage(settings: S3Settings | null, nodeEnv: string, dataDir?: string): ObjectStorage {
  let started: Promise<ObjectStorage> | null = null;
  const storage = () => {
    started ??= (async () => {
      if (settings) return createS3Storage(settings);
      if (nodeEnv === 'production') {
        throw new AppError('UNAVAILABLE', 'Attachments are not configured on this server (S3_ENDPOINT and S3_BUCKET).');
      }
      const fake = await startFakeS3({ directory: dataDir ? path.join(dataDir, 's3') : undefined });
      return createS3Storage(fake.settings, fake.close);
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

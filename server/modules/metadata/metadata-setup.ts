import { developmentTools } from '@/server/development-tools';
import type { Env } from '@/server/env';
import { createMetadataClient, type MetadataClient } from './metadata-client';

export type { MetadataClient };

let sharedFake: Promise<string> | null = null;

/**
 * METADATA_URL when set; otherwise, outside production, the local fake service of server/dev
 * (started once per process, on first use). In production without METADATA_URL (or without the
 * development tools) the look-up answers 503 and the citation form is filled by hand.
 */
export function metadataClientFor(env: Pick<Env, 'METADATA_URL' | 'NODE_ENV'>): () => Promise<MetadataClient> {
  if (env.METADATA_URL) {
    const client = createMetadataClient(env.METADATA_URL);
    return async () => client;
  }
  const dev = developmentTools(env.NODE_ENV);
  if (!dev) {
    const client = createMetadataClient(null);
    return async () => client;
  }
  return async () => {
    sharedFake ??= dev.startFakeMetadataService().then((fake) => fake.url);
    sharedFake.catch(() => {
      sharedFake = null;
    });
    return createMetadataClient(await sharedFake);
  };
}

import type { Env } from '@/server/env';
import { createMetadataClient, type MetadataClient } from './metadata-client';
import { startFakeMetadataService } from './fake-metadata-service';

export type { MetadataClient };

let sharedFake: Promise<string> | null = null;

/**
 * METADATA_URL when set; otherwise, outside production, the local fake service (started once per
 * process, on first use). In production without METADATA_URL the look-up answers 503 and the
 * citation form is filled by hand.
 */
export function metadataClientFor(env: Pick<Env, 'METADATA_URL' | 'NODE_ENV'>): () => Promise<MetadataClient> {
  if (env.METADATA_URL) {
    const client = createMetadataClient(env.METADATA_URL);
    return async () => client;
  }
  if (env.NODE_ENV === 'production') {
    const client = createMetadataClient(null);
    return async () => client;
  }
  return async () => {
    sharedFake ??= startFakeMetadataService().then((fake) => fake.url);
    return createMetadataClient(await sharedFake);
  };
}

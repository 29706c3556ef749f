import type { DevelopmentTools } from '@/server/development-tools';
import { startFakeMetadataService } from './fake-metadata-service';
import { startFakeS3 } from './fake-s3';
import { startMailSink } from './mail-sink';
import { devOutboxRoutes } from './outbox.routes';

/** The development stand-ins (see server/development-tools.ts); never loaded in production. */
export const developmentTools: DevelopmentTools = {
  startMailSink,
  startFakeS3,
  startFakeMetadataService: (): Promise<{ url: string }> => startFakeMetadataService(),
  outboxRoutes: devOutboxRoutes,
};

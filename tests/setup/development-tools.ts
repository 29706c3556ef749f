// The server tests run outside production with the development stand-ins, as `npm start` does in
// development: the mail sink and outbox, the fake S3 and the fake DOI service (server/dev).
import { developmentTools } from '@/server/dev';
import { registerDevelopmentTools } from '@/server/development-tools';

registerDevelopmentTools(developmentTools);

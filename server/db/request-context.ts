import { RequestContext } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { RequestHandler } from 'express';
import type { Orm } from './orm';

/**
 * One entity manager per HTTP request, as MikroORM documents it for Express: the middleware forks
 * the ORM's manager for the request (its own identity map and unit of work) and keeps it in an
 * AsyncLocalStorage for everything the request runs. Registered before the API routes.
 */
export function requestContext(orm: Orm): RequestHandler {
  return (_req, _res, next) => RequestContext.create(orm.em, next);
}

/**
 * The current request's entity manager. Outside a request (background jobs, the mail sink, the CLI)
 * there is none: those fork the ORM's manager themselves, and calling this there is a programming
 * error, reported as such rather than falling back to the global manager.
 */
export function requestEm(): EntityManager {
  const em = RequestContext.getEntityManager();
  if (!em) throw new Error('No request context: requestEm() is for code that runs inside an API request.');
  return em as EntityManager;
}

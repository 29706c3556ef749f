import { Router, type Request } from 'express';
import {
  complexSearchQuerySchema,
  createCitationInputSchema,
  createComplexInputSchema,
  createLigandInputSchema,
  diffQuerySchema,
  duplicatesQuerySchema,
  measuredQuerySchema,
  measurementInputSchema,
  reviewInputSchema,
  saveComplexInputSchema,
  transitionInputSchema,
  updateComplexInputSchema,
  updateMeasurementInputSchema,
  type ComplexListResponse,
} from '@/lib/schemas/library';
import { z } from 'zod';
import { complexFacetsQuerySchema, type ComplexFacets } from '@/lib/schemas/library-facets';
import { FeedCache, type ChangeFeed } from '@/server/db/change-feed';
import type { Orm } from '@/server/db/orm';
import { requestEm } from '@/server/db/request-context';
import { getAuth, getMembership, isUuid, requireAuth, requireGroupRole } from '@/server/http/auth-middleware';
import { AppError } from '@/server/http/errors';
import { idempotent } from '@/server/http/idempotency';
import { optionalJsonBody, parseWith } from '@/server/http/validate';
import { findOrCreateCitation } from './citation.service';
import * as complexes from './complex.service';
import { reviewQueue, searchComplexes } from './complex-search';
import { complexFacets } from './complex-facets';
import { classifyOrExplain, deriveColumns } from './derive';
import { existingSpecies, speciesOf } from './duplicates';
import { membershipIn, resolveGroup } from './library-access';
import { citationVisibleTo, listVisibleCitations, ownFieldsView } from './library-visibility';
import { addLigand, listLigands } from './ligand.service';
import { findLibraryMeasurements } from './measured.service';

/** Path ids that are not UUIDs name nothing: 404, the same as an unknown id. */
function pathId(req: Request, param: string, what: string): string {
  const value = req.params[param];
  if (!isUuid(value)) throw new AppError('NOT_FOUND', `${what} was not found.`);
  return value;
}

const versionQuerySchema = z.object({ version: z.coerce.number().int().min(1).optional() }).strict();
const groupQuerySchema = z.object({ groupId: z.uuid('groupId must be a group id.').optional() }).strict();

/**
 * The curated library. Every route needs a session; the group comes from the entry
 * (or `groupId`, defaulting to the person's only group) and membership + role are checked by the
 * services (library-access.ts) or by requireGroupRole for /groups/:groupId/… routes.
 */
/** Searches per person, filters and page; emptied whenever anything in a library changes. */
function searchCache(feed: ChangeFeed | undefined) {
  return feed ? new FeedCache<ComplexListResponse>(feed, ['library'], { maxEntries: 2000, ttlMs: 30_000 }) : null;
}

export function libraryRoutes(orm: Orm, changeFeed?: ChangeFeed): Router {
  const router = Router();
  const searches = searchCache(changeFeed);
  const facetCache = changeFeed ? new FeedCache<ComplexFacets>(changeFeed, ['library'], { maxEntries: 500, ttlMs: 30_000 }) : null;
  const em = requestEm;
  const actor = (res: Parameters<typeof getAuth>[0]) => ({ userId: getAuth(res).user.id });
  // Writes accept an Idempotency-Key; a retry gets the first result (or the entry as it is now).
  const once = (status: number) => idempotent(orm, status, (_req, res, id) => complexes.getComplex(em(), actor(res), id));
  const reviewOnce = idempotent(orm, 201, (_req, res, id) => complexes.reviewResponse(em(), actor(res), id));

  router.get('/complexes', requireAuth, async (req, res) => {
    const query = parseWith(complexSearchQuerySchema, req.query, 'query');
    const { user } = getAuth(res);
    const run = () => searchComplexes(em(), user.id, query, { memberships: user.memberships });
    // What a person may see depends on who they are and their roles: both are in the key.
    const key = JSON.stringify([user.id, user.memberships, query]);
    const cached = searches ? await searches.through(key, run) : undefined;
    res.json(cached ?? (await run()));
  });

  // Before /complexes/:id, which would take "facets" for an id.
  router.get('/complexes/facets', requireAuth, async (req, res) => {
    const query = parseWith(complexFacetsQuerySchema, req.query, 'query');
    const { user } = getAuth(res);
    const run = () => complexFacets(em(), user.id, query, { memberships: user.memberships });
    const key = JSON.stringify(['facets', user.id, user.memberships, query]);
    const cached = facetCache ? await facetCache.through(key, run) : undefined;
    res.json(cached ?? (await run()));
  });

  router.post('/complexes', requireAuth, once(201), async (req, res) => {
    const input = parseWith(createComplexInputSchema, req.body);
    res.status(201).json(await complexes.createComplex(em(), actor(res), input));
  });

  // Entries of the same species already in the group (the form offers them before a second one is made).
  router.get('/complexes/duplicates', requireAuth, async (req, res) => {
    const { formula, groupId, exceptId } = parseWith(duplicatesQuerySchema, req.query, 'query');
    const manager = em();
    const membership = await resolveGroup(manager, actor(res).userId, groupId);
    const derived = deriveColumns(formula, formula);
    const found = await existingSpecies(manager, membership.groupId, { userId: actor(res).userId, role: membership.role }, [speciesOf(formula, derived)], exceptId);
    res.json({ duplicates: [...found.values()] });
  });

  router.get('/complexes/:id', requireAuth, async (req, res) => {
    res.json(await complexes.getComplex(em(), actor(res), pathId(req, 'id', 'That library entry')));
  });

  // The whole entry, based on a version: the one way the app saves an edit.
  router.put('/complexes/:id', requireAuth, once(200), async (req, res) => {
    const id = pathId(req, 'id', 'That library entry');
    res.json(await complexes.saveComplex(em(), actor(res), id, parseWith(saveComplexInputSchema, req.body)));
  });

  router.patch('/complexes/:id', requireAuth, once(200), async (req, res) => {
    const id = pathId(req, 'id', 'That library entry');
    const input = parseWith(updateComplexInputSchema, req.body);
    res.json(await complexes.updateComplex(em(), actor(res), id, input));
  });

  router.post('/complexes/:id/submit', requireAuth, once(200), async (req, res) => {
    const id = pathId(req, 'id', 'That library entry');
    res.json(await complexes.submitComplex(em(), actor(res), id, parseWith(transitionInputSchema, optionalJsonBody(req))));
  });

  router.post('/complexes/:id/reviews', requireAuth, reviewOnce, async (req, res) => {
    const id = pathId(req, 'id', 'That library entry');
    res.status(201).json(await complexes.reviewComplex(em(), actor(res), id, parseWith(reviewInputSchema, req.body)));
  });

  router.post('/complexes/:id/retire', requireAuth, once(200), async (req, res) => {
    const id = pathId(req, 'id', 'That library entry');
    res.json(await complexes.retireComplex(em(), actor(res), id, parseWith(transitionInputSchema, optionalJsonBody(req))));
  });

  router.get('/complexes/:id/revisions', requireAuth, async (req, res) => {
    const id = pathId(req, 'id', 'That library entry');
    res.json({ revisions: await complexes.listRevisions(em(), actor(res), id) });
  });

  router.get('/complexes/:id/revisions/diff', requireAuth, async (req, res) => {
    const id = pathId(req, 'id', 'That library entry');
    const { from, to } = parseWith(diffQuerySchema, req.query, 'query');
    res.json(await complexes.diffRevisions(em(), actor(res), id, from, to));
  });

  router.get('/complexes/:id/revisions/:number', requireAuth, async (req, res) => {
    const id = pathId(req, 'id', 'That library entry');
    const number = Number(req.params.number);
    if (!Number.isInteger(number) || number < 1) throw new AppError('NOT_FOUND', 'That revision was not found.');
    res.json(await complexes.getRevision(em(), actor(res), id, number));
  });

  router.post('/complexes/:id/measurements', requireAuth, once(201), async (req, res) => {
    const id = pathId(req, 'id', 'That library entry');
    res.status(201).json(await complexes.addMeasurement(em(), actor(res), id, parseWith(measurementInputSchema, req.body)));
  });

  router.patch('/complexes/:id/measurements/:mid', requireAuth, once(200), async (req, res) => {
    const id = pathId(req, 'id', 'That library entry');
    const mid = pathId(req, 'mid', 'That measurement');
    res.json(await complexes.updateMeasurement(em(), actor(res), id, mid, parseWith(updateMeasurementInputSchema, req.body)));
  });

  router.delete('/complexes/:id/measurements/:mid', requireAuth, once(200), async (req, res) => {
    const id = pathId(req, 'id', 'That library entry');
    const mid = pathId(req, 'mid', 'That measurement');
    const { version } = parseWith(versionQuerySchema, req.query, 'query');
    res.json(await complexes.deleteMeasurement(em(), actor(res), id, mid, version));
  });

  router.get('/review-queue', requireAuth, async (_req, res) => {
    res.json(await reviewQueue(em(), actor(res).userId));
  });

  router.get('/citations', requireAuth, async (req, res) => {
    const { groupId } = parseWith(groupQuerySchema, req.query, 'query');
    const membership = await resolveGroup(em(), actor(res).userId, groupId);
    res.json({ citations: await listVisibleCitations(em(), membership, actor(res).userId) });
  });

  router.post('/citations', requireAuth, async (req, res) => {
    const { groupId, ...citation } = parseWith(createCitationInputSchema, req.body);
    const manager = em();
    const membership = await resolveGroup(manager, actor(res).userId, groupId);
    if (membership.role === 'viewer') throw new AppError('FORBIDDEN', 'Viewers cannot add citations; contributors and curators can.');
    const result = await findOrCreateCitation(manager, membership.groupId, citation, actor(res).userId);
    if (result.created || (await citationVisibleTo(manager, membership, actor(res).userId, result.citation.id))) {
      res.status(result.created ? 201 : 200).json(result.citation);
    } else {
      res.status(200).json(ownFieldsView(result.citation, citation));
    }
  });

  router.get('/ligands', requireAuth, async (req, res) => {
    const { groupId } = parseWith(groupQuerySchema, req.query, 'query');
    if (groupId && !(await membershipIn(em(), actor(res).userId, groupId))) {
      throw new AppError('NOT_FOUND', 'That group was not found.');
    }
    res.json({ ligands: await listLigands(em(), groupId ?? null) });
  });

  router.post('/groups/:groupId/ligands', requireGroupRole('curator'), async (req, res) => {
    const input = parseWith(createLigandInputSchema, req.body);
    res.status(201).json(await addLigand(em(), getMembership(res).groupId, getAuth(res).user.id, input));
  });

  // Measured meets predicted: GET rather than a change to POST /api/classify, which stays public and stateless.
  router.get('/groups/:groupId/measured', requireGroupRole('viewer'), async (req, res) => {
    const { formula } = parseWith(measuredQuerySchema, req.query, 'query');
    const classification = classifyOrExplain(formula);
    const libraryMeasurements = await findLibraryMeasurements(em(), classification, getMembership(res).groupId);
    res.json({ formula, classification, libraryMeasurements });
  });

  return router;
}

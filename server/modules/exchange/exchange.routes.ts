import { Router, type Response } from 'express';
import { exportQuerySchema, IMPORT_MAX_BYTES, importQuerySchema } from '@/lib/schemas/exchange';
import type { Orm } from '@/server/db/orm';
import { requestEm } from '@/server/db/request-context';
import { getAuth, isUuid, requireAuth } from '@/server/http/auth-middleware';
import { AppError } from '@/server/http/errors';
import { parseWith } from '@/server/http/validate';
import { readRawBody } from '@/server/modules/attachments/raw-body';
import { citationsAsBibtex, citationsAsRis } from './citation-formats';
import { citationsOf, snapshotsAsCsv, visibleSnapshots } from './export.service';
import { getImportJob, startImport } from './import.service';
import { importTemplateCsv } from './import-template';

/**
 * CSV import (POST /api/imports, GET /api/imports/:id) and export (GET /api/exports/…).
 * Every route needs a session; group membership and role are checked by the services.
 */
export function exchangeRoutes(orm: Orm): Router {
  const router = Router();
  const userId = (res: Response) => getAuth(res).user.id;

  router.post('/imports', requireAuth, async (req, res) => {
    const query = parseWith(importQuerySchema, req.query, 'query');
    const bytes = await readRawBody(req, res, IMPORT_MAX_BYTES, 'CSV file');
    const { job, done } = await startImport(
      orm,
      {
        userId: userId(res),
        groupId: query.groupId,
        fileName: query.fileName,
        dryRun: query.dryRun,
        mapping: query.mapping,
        duplicates: query.duplicates,
        duplicateChoices: query.duplicateChoices,
      },
      bytes,
    );
    if (query.wait) {
      const finished = await done;
      res.status(200).json(finished);
      return;
    }
    res.status(202).location(`/api/imports/${job.id}`).json(job);
  });

  // A file to start from: the header line the importer reads and one example entry.
  router.get('/imports/template.csv', (_req, res) => {
    res.type('text/csv; charset=utf-8').attachment('sphereline-import-template.csv').send(importTemplateCsv());
  });

  router.get('/imports/:id', requireAuth, async (req, res) => {
    const id = req.params.id;
    if (!isUuid(id)) throw new AppError('NOT_FOUND', 'That import was not found.');
    res.setHeader('Cache-Control', 'no-store');
    res.json(await getImportJob(requestEm(), userId(res), id));
  });

  const stamp = () => new Date().toISOString().slice(0, 10);

  router.get('/exports/library.csv', requireAuth, async (req, res) => {
    const query = parseWith(exportQuerySchema, req.query, 'query');
    const snapshots = await visibleSnapshots(requestEm(), userId(res), query);
    res.setHeader('Content-Disposition', `attachment; filename="sphereline-library-${stamp()}.csv"`);
    res.type('text/csv; charset=utf-8').send(snapshotsAsCsv(snapshots));
  });

  router.get('/exports/citations.bib', requireAuth, async (req, res) => {
    const query = parseWith(exportQuerySchema, req.query, 'query');
    const citations = citationsOf(await visibleSnapshots(requestEm(), userId(res), query));
    res.setHeader('Content-Disposition', `attachment; filename="sphereline-citations-${stamp()}.bib"`);
    res.type('application/x-bibtex; charset=utf-8').send(citationsAsBibtex(citations));
  });

  router.get('/exports/citations.ris', requireAuth, async (req, res) => {
    const query = parseWith(exportQuerySchema, req.query, 'query');
    const citations = citationsOf(await visibleSnapshots(requestEm(), userId(res), query));
    res.setHeader('Content-Disposition', `attachment; filename="sphereline-citations-${stamp()}.ris"`);
    res.type('application/x-research-info-systems; charset=utf-8').send(citationsAsRis(citations));
  });

  return router;
}

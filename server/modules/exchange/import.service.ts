import { randomUUID } from 'node:crypto';
import type { InferEntity } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import { roleAtLeast } from '@/lib/schemas/groups';
import type { CsvMapping, DuplicateChoice, ImportCreatedEntry, ImportDuplicate, ImportIssue, ImportJob as ImportJobDto } from '@/lib/schemas/exchange';
import type { Citation as CitationDto, CitationInput, ComplexSnapshot, Measurement as MeasurementDto } from '@/lib/schemas/library';
import type { Orm } from '@/server/db/orm';
import { AppError, notFound } from '@/server/http/errors';
import { AuditEvent } from '@/server/modules/audit/audit-event.entity';
import { Citation } from '@/server/modules/library/citation.entity';
import { Complex } from '@/server/modules/library/complex.entity';
import { toCitationDto, toSnapshot } from '@/server/modules/library/complex.mapper';
import { membershipIn, resolveGroup, type MembershipInfo } from '@/server/modules/library/library-access';
import { existingSpecies, speciesKeyOf, speciesOf } from '@/server/modules/library/duplicates';
import { entryRow, measurementRow } from '@/server/modules/library/entry-rows';
import { asEntryInput, getComplex, measurementsOf, saveComplex } from '@/server/modules/library/complex.service';
import { Measurement } from '@/server/modules/library/measurement.entity';
import { mapColumns, readCsvTable } from './csv-file';
import { ImportJob } from './import-job.entity';
import { validateRows, type PlannedEntry } from './import-validate';

/**
 * CSV import jobs. The POST reads and checks the file (4xx for a file that cannot be read), creates
 * an import_job row and works on it in the background; the client polls GET /api/imports/:id.
 * The write is ONE transaction with multi-row INSERTs: it commits whole or not at all, so a killed
 * server leaves nothing half-written; its job row is later marked failed (heartbeat too old).
 */

type ImportJobEntity = InferEntity<typeof ImportJob>;

/** A running job touches heartbeat_at at least this often; older means its process is gone. */
export const HEARTBEAT_MS = 5_000;
export const ABANDONED_AFTER_MS = 30_000;
const MAX_STORED_ISSUES = 1000;
const CHUNK = 500;

export interface ImportRequest {
  userId: string;
  groupId?: string;
  fileName?: string;
  dryRun: boolean;
  mapping?: CsvMapping;
  /** For every duplicate row; `duplicateChoices` (by row) overrides it. Default: skip. */
  duplicates?: DuplicateChoice;
  duplicateChoices?: Record<string, DuplicateChoice>;
}

/**
 * The file's entries whose species is already in the library (that the person may see) or earlier
 * in the file, each with the choice that applies to it.
 */
async function findDuplicates(
  em: EntityManager,
  groupId: string,
  reader: { userId: string; role: MembershipInfo['role'] },
  entries: readonly PlannedEntry[],
  request: ImportRequest,
): Promise<ImportDuplicate[]> {
  const existing = await existingSpecies(em, groupId, reader, entries.map((e) => speciesOf(e.formula, e.derived)));
  const firstInFile = new Map<string, number>();
  const duplicates: ImportDuplicate[] = [];
  for (const entry of entries) {
    const key = speciesKeyOf(speciesOf(entry.formula, entry.derived));
    const inLibrary = existing.get(key) ?? null;
    const earlier = firstInFile.get(key) ?? null;
    if (earlier === null) firstInFile.set(key, entry.firstRow);
    if (!inLibrary && earlier === null) continue;
    duplicates.push({
      row: entry.firstRow,
      formula: entry.formula,
      name: entry.name,
      existing: inLibrary,
      sameAsRow: earlier,
      choice: request.duplicateChoices?.[String(entry.firstRow)] ?? request.duplicates ?? 'skip',
    });
  }
  return duplicates;
}

/**
 * Applies the choices: skipped entries are dropped; merged ones give their measurements to the
 * library entry (merges) or to the file's earlier entry of the same species; the rest are written.
 */
function applyDuplicateChoices(entries: readonly PlannedEntry[], duplicates: readonly ImportDuplicate[]) {
  const byRow = new Map(duplicates.map((d) => [d.row, d]));
  const byFirstRow = new Map(entries.map((e) => [e.firstRow, e]));
  const write: PlannedEntry[] = [];
  const merges = new Map<string, PlannedEntry[]>();
  const extraMeasurements = new Map<number, PlannedEntry['measurements']>();
  let skipped = 0;
  for (const entry of entries) {
    const duplicate = byRow.get(entry.firstRow);
    if (!duplicate || duplicate.choice === 'import') {
      write.push(entry);
      continue;
    }
    if (duplicate.choice === 'skip') {
      skipped += 1;
      continue;
    }
    if (duplicate.existing) {
      merges.set(duplicate.existing.id, [...(merges.get(duplicate.existing.id) ?? []), entry]);
    } else if (duplicate.sameAsRow !== null && byFirstRow.has(duplicate.sameAsRow)) {
      extraMeasurements.set(duplicate.sameAsRow, [...(extraMeasurements.get(duplicate.sameAsRow) ?? []), ...entry.measurements]);
    }
  }
  const written = write.map((entry) => {
    const extra = extraMeasurements.get(entry.firstRow);
    return extra ? { ...entry, measurements: [...entry.measurements, ...extra] } : entry;
  });
  return { write: written, merges, skipped };
}

export function toImportJobDto(job: ImportJobEntity): ImportJobDto {
  const abandoned = isAbandoned(job);
  return {
    id: job.id,
    groupId: job.groupId,
    fileName: job.fileName ?? null,
    dryRun: job.dryRun,
    state: abandoned ? 'failed' : job.state,
    processed: job.processed,
    total: job.total,
    columns: job.columns,
    errorCount: job.errorCount,
    errors: job.errors,
    entryCount: job.entryCount,
    measurementCount: job.measurementCount,
    complexIds: job.complexIds,
    created: job.created ?? [],
    suggestedNames: job.suggestedNames ?? [],
    duplicates: job.duplicates ?? [],
    message: abandoned ? abandonedMessage : job.message ?? null,
    createdAt: job.createdAt.toISOString(),
    updatedAt: job.updatedAt.toISOString(),
    finishedAt: job.finishedAt ? job.finishedAt.toISOString() : null,
  };
}

const abandonedMessage = 'The server stopped while this import was running; nothing was written. Upload the file again.';
const running = (state: string) => state === 'queued' || state === 'validating' || state === 'importing';
const isAbandoned = (job: ImportJobEntity) => running(job.state) && Date.now() - job.heartbeatAt.getTime() > ABANDONED_AFTER_MS;

/** At start-up (and any time): jobs whose process stopped beating are failed for good. */
export async function failAbandonedImports(orm: Orm, olderThanMs = ABANDONED_AFTER_MS): Promise<number> {
  return orm.em.fork().nativeUpdate(
    ImportJob,
    { state: { $in: ['queued', 'validating', 'importing'] }, heartbeatAt: { $lt: new Date(Date.now() - olderThanMs) } },
    { state: 'failed', message: abandonedMessage, updatedAt: new Date(), finishedAt: new Date() },
  );
}

async function groupFor(em: EntityManager, userId: string, groupId: string | undefined): Promise<MembershipInfo> {
  const membership = await resolveGroup(em, userId, groupId);
  if (!roleAtLeast(membership.role, 'contributor')) {
    throw new AppError('FORBIDDEN', 'Viewers can read the library but not import into it; ask an admin for the contributor role.');
  }
  return membership;
}

/**
 * Checks the file and creates the job; `done` settles when the job has finished (the route awaits
 * it only with ?wait=true). Throws 4xx for a file that cannot be read at all.
 */
export async function startImport(orm: Orm, request: ImportRequest, bytes: Buffer): Promise<{ job: ImportJobDto; done: Promise<ImportJobDto> }> {
  // The job outlives the request (it runs on after the 202): the runner forks its own managers.
  const em = orm.em.fork();
  const membership = await groupFor(em, request.userId, request.groupId);
  const table = readCsvTable(bytes);
  const map = mapColumns(table.headers, request.mapping);
  const now = new Date();
  const id = randomUUID();
  await em.insert(ImportJob, {
    id,
    groupId: membership.groupId,
    createdById: request.userId,
    fileName: request.fileName ?? null,
    dryRun: request.dryRun,
    state: 'queued',
    processed: 0,
    total: table.rows.length,
    columns: map.columns,
    errorCount: 0,
    errors: [],
    entryCount: 0,
    measurementCount: 0,
    complexIds: [],
    created: [],
    suggestedNames: [],
    message: null,
    heartbeatAt: now,
    createdAt: now,
    updatedAt: now,
    finishedAt: null,
  });
  const job = await em.findOneOrFail(ImportJob, { id });
  const done = runJob(orm, job, request, () => validateRows(table, map, (processed) => progress(processed)));

  let lastWrite = 0;
  // Progress goes through its own connection, outside the import transaction, so pollers see it.
  function progress(processed: number, state?: ImportJobEntity['state']) {
    const nowMs = Date.now();
    if (!state && nowMs - lastWrite < 250) return;
    lastWrite = nowMs;
    void orm.em
      .fork()
      .nativeUpdate(ImportJob, { id }, { processed, ...(state ? { state } : {}), heartbeatAt: new Date(), updatedAt: new Date() })
      .catch(() => {});
  }
  return { job: toImportJobDto(job), done };
}

async function runJob(
  orm: Orm,
  job: ImportJobEntity,
  request: ImportRequest,
  validate: () => ReturnType<typeof validateRows>,
): Promise<ImportJobDto> {
  const em = orm.em.fork();
  const beat = setInterval(() => {
    void orm.em.fork().nativeUpdate(ImportJob, { id: job.id }, { heartbeatAt: new Date() }).catch(() => {});
  }, HEARTBEAT_MS) as unknown as NodeJS.Timeout;
  beat.unref();
  const finish = async (values: Partial<ImportJobEntity>) => {
    await em.nativeUpdate(ImportJob, { id: job.id }, { ...values, heartbeatAt: new Date(), updatedAt: new Date(), finishedAt: new Date() });
    return toImportJobDto(await em.findOneOrFail(ImportJob, { id: job.id }, { refresh: true }));
  };
  try {
    // Let the POST answer first; the work starts on the next turn of the event loop.
    await new Promise((resolve) => setImmediate(resolve));
    await em.nativeUpdate(ImportJob, { id: job.id }, { state: 'validating', heartbeatAt: new Date(), updatedAt: new Date() });
    const started = performance.now();
    const result = validate();
    const counts = { entryCount: result.entries.length, measurementCount: result.measurementCount, processed: job.total, suggestedNames: result.suggestedNames.slice(0, MAX_STORED_ISSUES) };
    if (result.issues.length > 0) {
      return await finish({
        ...counts,
        state: 'failed',
        errorCount: result.issues.length,
        errors: result.issues.slice(0, MAX_STORED_ISSUES),
        message: `${result.issues.length} problem(s) in ${new Set(result.issues.map((i) => i.row)).size} row(s); nothing was ${request.dryRun ? 'checked further' : 'imported'}. Fix them and upload the file again.`,
      });
    }
    const membership = await membershipIn(em, request.userId, job.groupId);
    const duplicates = membership
      ? await findDuplicates(em, job.groupId, { userId: request.userId, role: membership.role }, result.entries, request)
      : [];
    const duplicateNote = duplicates.length
      ? ` ${duplicates.length} of them name a species already in the library or earlier in the file (${describeChoices(duplicates)}).`
      : '';
    const namedNote = result.suggestedNames.length
      ? ` ${result.suggestedNames.length} ${result.suggestedNames.length === 1 ? 'entry has' : 'entries have'} no name and ${result.suggestedNames.length === 1 ? 'takes' : 'take'} the one suggested from the formula (row ${result.suggestedNames.map((n) => n.row).slice(0, 20).join(', ')}${result.suggestedNames.length > 20 ? ', …' : ''}).`
      : '';
    if (request.dryRun) {
      return await finish({
        ...counts,
        duplicates: duplicates.slice(0, MAX_STORED_ISSUES),
        state: 'succeeded',
        message: `Dry run: all ${job.total} rows are valid (${counts.entryCount} entries, ${counts.measurementCount} measurements; checked in ${Math.round(performance.now() - started)} ms).${duplicateNote}${namedNote} Nothing was written.`,
      });
    }
    await em.nativeUpdate(ImportJob, { id: job.id }, { state: 'importing', processed: 0, heartbeatAt: new Date(), updatedAt: new Date() });
    const plan = applyDuplicateChoices(result.entries, duplicates);
    const created = await writeEntries(orm, job, request.userId, plan.write, plan.merges);
    const written = { entryCount: plan.write.length, measurementCount: plan.write.reduce((n, e) => n + e.measurements.length, 0) };
    const mergedInto = plan.merges.size ? ` Measurements of ${[...plan.merges.values()].flat().length} row(s) were added to ${plan.merges.size} existing entr${plan.merges.size === 1 ? 'y' : 'ies'}.` : '';
    const skippedNote = plan.skipped ? ` ${plan.skipped} duplicate entr${plan.skipped === 1 ? 'y was' : 'ies were'} skipped.` : '';
    return await finish({
      ...counts,
      ...written,
      duplicates: duplicates.slice(0, MAX_STORED_ISSUES),
      state: 'succeeded',
      complexIds: created.slice(0, 10_000).map((entry) => entry.id),
      created: created.slice(0, 10_000),
      message: `Imported ${written.entryCount} entries with ${written.measurementCount} measurements in ${Math.round(performance.now() - started)} ms; they wait for review (status "in-review").${namedNote}${skippedNote}${mergedInto}`,
    });
  } catch (error) {
    const message =
      error instanceof AppError ? error.message : 'The import failed on the server and nothing was written. It has been logged; try again.';
    if (!(error instanceof AppError)) console.error(`[import] job ${job.id} failed:`, error);
    return finish({ state: 'failed', message }).catch(() => toImportJobDto({ ...job, state: 'failed', message }));
  } finally {
    clearInterval(beat);
  }
}

function describeChoices(duplicates: readonly ImportDuplicate[]): string {
  const words: Record<DuplicateChoice, string> = { skip: 'skipped', merge: 'merged', import: 'imported anyway' };
  const counts = new Map<DuplicateChoice, number>();
  for (const d of duplicates) counts.set(d.choice, (counts.get(d.choice) ?? 0) + 1);
  return [...counts.entries()].map(([choice, n]) => `${n} ${words[choice]}`).join(', ');
}

const citationKey = (c: CitationInput) =>
  c.doi ? `doi:${c.doi.toLowerCase()}` : `ref:${[c.authors, c.journal, c.year ?? '', c.volume ?? '', c.pages ?? ''].join('\u0000')}`;

function chunks<T>(items: readonly T[], size = CHUNK): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < items.length; i += size) out.push(items.slice(i, i + size));
  return out;
}

/** The citations the file names, found (by DOI, or identical fields) or created — in bulk. */
async function resolveCitations(tem: EntityManager, groupId: string, userId: string, entries: readonly PlannedEntry[]): Promise<Map<string, CitationDto>> {
  const wanted = new Map<string, CitationInput>();
  for (const entry of entries) for (const m of entry.measurements) if (m.citation) wanted.set(citationKey(m.citation), m.citation);
  const resolved = new Map<string, CitationDto>();
  if (wanted.size === 0) return resolved;
  const now = new Date();
  const withDoi = [...wanted.values()].filter((c) => c.doi);
  for (const part of chunks(withDoi)) {
    const values = part.map(() => '(?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)').join(', ');
    const params = part.flatMap((c) => [randomUUID(), groupId, c.doi, c.authors, c.title ?? null, c.journal, c.year ?? null, c.volume ?? null, c.pages ?? null, userId, now]);
    await tem.execute(
      `insert into citation (id, group_id, doi, authors, title, journal, year, volume, pages, created_by_id, created_at)
       values ${values} on conflict (group_id, lower(doi)) where doi is not null do nothing`,
      params,
    );
  }
  if (withDoi.length > 0) {
    const rows = await tem.find(Citation, { groupId, doi: { $ne: null } });
    for (const row of rows) if (row.doi) resolved.set(`doi:${row.doi.toLowerCase()}`, toCitationDto(row));
  }
  const withoutDoi = [...wanted.entries()].filter(([, c]) => !c.doi);
  if (withoutDoi.length > 0) {
    const existing = await tem.find(Citation, { groupId, doi: null });
    for (const row of existing) {
      const key = citationKey({ authors: row.authors, journal: row.journal, year: row.year ?? null, volume: row.volume ?? null, pages: row.pages ?? null });
      if (!resolved.has(key)) resolved.set(key, toCitationDto(row));
    }
    const fresh = withoutDoi.filter(([key]) => !resolved.has(key));
    const rows = fresh.map(([key, c]) => {
      const row = { id: randomUUID(), groupId, doi: null, authors: c.authors, title: c.title ?? null, journal: c.journal, year: c.year ?? null, volume: c.volume ?? null, pages: c.pages ?? null, createdById: userId, createdAt: now };
      resolved.set(key, toCitationDto(row));
      return row;
    });
    for (const part of chunks(rows)) await tem.insertMany(Citation, part);
  }
  return resolved;
}

/** The whole write: citations, entries, measurements, one revision and one audit event per entry. */
/**
 * Merged duplicates: their measurements join the existing entry through the library's own save
 * (one revision per entry, reopened for review if it was accepted), inside the import transaction.
 */
async function mergeIntoExisting(tem: EntityManager, userId: string, merges: ReadonlyMap<string, PlannedEntry[]>) {
  for (const [complexId, planned] of merges) {
    const rows = planned.map((p) => p.firstRow).join(', ');
    try {
      const current = await getComplex(tem, { userId }, complexId);
      await saveComplex(tem, { userId }, complexId, {
        version: current.version,
        formula: current.formula,
        name: current.name,
        notes: current.notes,
        measurements: [
          ...(await measurementsOf(tem, complexId)).map((m) => ({ ...asEntryInput(m) })),
          ...planned.flatMap((p) => p.measurements.map((m) => ({ ...m.input, citation: m.citation }))),
        ],
        message: `Merged from a CSV import (row ${rows})`,
      });
    } catch (error) {
      if (!(error instanceof AppError)) throw error;
      throw new AppError(
        'FORBIDDEN',
        `Row ${rows}: the measurements cannot be merged into the existing entry (${error.message}) Choose skip or import for ${planned.length > 1 ? 'these rows' : 'this row'}.`,
      );
    }
  }
}

async function writeEntries(
  orm: Orm,
  job: ImportJobEntity,
  userId: string,
  entries: readonly PlannedEntry[],
  merges: ReadonlyMap<string, PlannedEntry[]> = new Map(),
): Promise<ImportCreatedEntry[]> {
  const em = orm.em.fork();
  const created: ImportCreatedEntry[] = [];
  await em.transactional(async (tem) => {
    // The job's group may have lost this person between the POST and now.
    const membership = await membershipIn(tem, userId, job.groupId);
    if (!membership || !roleAtLeast(membership.role, 'contributor')) throw new AppError('FORBIDDEN', 'You are no longer a contributor of this group.');
    const citations = await resolveCitations(tem, job.groupId, userId, entries);
    const now = new Date();
    const complexRows: Record<string, unknown>[] = [];
    const measurementRows: Record<string, unknown>[] = [];
    const revisionRows: { id: string; complexId: string; number: number; kind: string; status: string; message: string; snapshot: ComplexSnapshot; authorId: string; createdAt: Date }[] = [];
    const auditRows: { id: string; actorId: string; groupId: string; action: string; subjectType: string; subjectId: string; details: Record<string, unknown>; createdAt: Date }[] = [];
    for (const entry of entries) {
      const id = randomUUID();
      created.push({ id, row: entry.firstRow, formula: entry.formula, name: entry.name, status: 'in-review' });
      const measurements: MeasurementDto[] = entry.measurements.map((m, order) => {
        // File order survives: the library lists measurements by created_at.
        const createdAt = new Date(now.getTime() + order);
        const citation = m.citation ? citations.get(citationKey(m.citation)) ?? null : null;
        const row = measurementRow(id, m.input, citation?.id ?? null, createdAt);
        measurementRows.push(row);
        const { complex: _complex, citation: _citationId, ...fields } = row;
        return { ...fields, citation, createdAt: createdAt.toISOString(), updatedAt: createdAt.toISOString() };
      });
      const snapshot: ComplexSnapshot = toSnapshot(
        { formula: entry.formula, name: entry.name, notes: entry.notes, status: 'in-review', ...entry.derived },
        measurements,
      );
      complexRows.push(
        entryRow({
          id,
          groupId: job.groupId,
          formula: entry.formula,
          name: entry.name,
          notes: entry.notes,
          derived: entry.derived,
          authorId: userId,
          submitted: true,
          measurementKinds: entry.measurements.map((m) => m.input.kind),
          hasCitation: measurements.some((m) => m.citation !== null),
          at: now,
        }),
      );
      revisionRows.push({
        id: randomUUID(),
        complexId: id,
        number: 1,
        kind: 'create',
        status: 'in-review',
        message: `Imported from ${job.fileName ?? 'a CSV file'} (row ${entry.firstRow}) and submitted for review`.slice(0, 500),
        snapshot,
        authorId: userId,
        createdAt: now,
      });
      auditRows.push({
        id: randomUUID(),
        actorId: userId,
        groupId: job.groupId,
        action: 'library.entry.imported',
        subjectType: 'complex',
        subjectId: id,
        details: { to: 'in-review', version: 1, formula: entry.formula, importJobId: job.id, row: entry.firstRow },
        createdAt: now,
      });
    }
    let written = 0;
    const report = () =>
      orm.em.fork().nativeUpdate(ImportJob, { id: job.id }, { processed: Math.min(written, job.total), heartbeatAt: new Date(), updatedAt: new Date() }).catch(() => 0);
    for (const part of chunks(complexRows)) await tem.insertMany(Complex, part as never[]);
    for (const part of chunks(measurementRows, 1000)) {
      await tem.insertMany(Measurement, part as never[]);
      written += part.length;
      await report();
    }
    // Snapshots are large JSON documents: one statement per chunk, the rows travelling as one JSON
    // parameter that PostgreSQL unpacks (jsonb_to_recordset), is ~4x faster than the ORM's insert here.
    for (const part of chunks(revisionRows, 1000)) {
      await tem.execute(
        `insert into complex_revision (id, complex_id, number, kind, status, message, snapshot, author_id, created_at)
         select id, complex_id, number, kind, status, message, snapshot, author_id, created_at
           from jsonb_to_recordset(?::jsonb) as x(id uuid, complex_id uuid, number int, kind text, status text, message text,
                                                  snapshot jsonb, author_id uuid, created_at timestamptz)`,
        [JSON.stringify(part.map((r) => ({ id: r.id, complex_id: r.complexId, number: r.number, kind: r.kind, status: r.status, message: r.message, snapshot: r.snapshot, author_id: r.authorId, created_at: r.createdAt })))],
      );
    }
    for (const part of chunks(auditRows, 1000)) {
      await tem.execute(
        `insert into audit_event (id, actor_id, group_id, action, subject_type, subject_id, details, created_at)
         select id, actor_id, group_id, action, subject_type, subject_id, details, created_at
           from jsonb_to_recordset(?::jsonb) as x(id uuid, actor_id uuid, group_id uuid, action text, subject_type text, subject_id text,
                                                  details jsonb, created_at timestamptz)`,
        [JSON.stringify(part.map((r) => ({ id: r.id, actor_id: r.actorId, group_id: r.groupId, action: r.action, subject_type: r.subjectType, subject_id: r.subjectId, details: r.details, created_at: r.createdAt })))],
      );
    }
    await tem.insertMany(AuditEvent, [
      {
        id: randomUUID(),
        actorId: userId,
        groupId: job.groupId,
        action: 'library.import.completed',
        subjectType: 'import-job',
        subjectId: job.id,
        details: { entries: entries.length, measurements: measurementRows.length, fileName: job.fileName },
        createdAt: now,
      },
    ]);
    await mergeIntoExisting(tem, userId, merges);
    written = job.total;
    await report();
  });
  return created;
}

/** The job, for its creator and the group's curators; 404 for everyone else. */
export async function getImportJob(em: EntityManager, userId: string, id: string): Promise<ImportJobDto> {
  const job = await em.findOne(ImportJob, { id }, { refresh: true });
  if (!job) throw notFound('That import');
  const membership = await membershipIn(em, userId, job.groupId);
  if (!membership || (job.createdById !== userId && !roleAtLeast(membership.role, 'curator'))) throw notFound('That import');
  return toImportJobDto(job);
}

export type { ImportIssue };

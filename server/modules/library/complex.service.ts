import { randomUUID } from 'node:crypto';
import { LockMode, OptimisticLockError, type InferEntity } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import { roleAtLeast } from '@/lib/schemas/groups';
import {
  measurementCheckSchema,
  type Citation as CitationDto,
  type ComplexDetail,
  type ComplexSnapshot,
  type ComplexStatus,
  type CreateComplexInput,
  type EntryMeasurementInput,
  type SaveComplexInput,
  type Measurement as MeasurementDto,
  type MeasurementInput,
  type ReviewInput,
  type ReviewResponse,
  type RevisionDetail,
  type RevisionDiff,
  type Revision as RevisionDto,
  type TransitionInput,
  type UpdateComplexInput,
  type UpdateMeasurementInput,
} from '@/lib/schemas/library';
import { AppError, notFound } from '@/server/http/errors';
import { claimIdempotencyKey } from '@/server/http/idempotency';
import { parseWith } from '@/server/http/validate';
import { recordAudit } from '@/server/modules/audit/audit.service';
import { User } from '@/server/modules/auth/user.entity';
import { Citation } from './citation.entity';
import { citationOfGroup, findOrCreateCitation } from './citation.service';
import { Complex } from './complex.entity';
import { personRef, toCitationDto, toMeasurementDto, toSnapshot } from './complex.mapper';
import { classifyOrExplain, deriveColumns, type DerivedColumns } from './derive';
import {
  membershipIn,
  permissionsFor,
  refusal,
  resolveGroup,
  reviewerCount,
  viewFor,
  type Action,
  type MembershipInfo,
  type Reader,
} from './library-access';
import { Measurement } from './measurement.entity';
import { ComplexReview } from './review.entity';
import { ComplexRevision, type RevisionKind } from './revision.entity';
import { diffSnapshots } from './revision-diff';
import { entryRow, measurementRow } from './entry-rows';
import { noChanges, summariseChanges, summariseCreation, type EntryChanges } from './change-summary';
import { emitLibraryEvent } from './library-events';
import { acceptedRevisionNumbers } from './library-visibility';

/**
 * Library entries: create, read, edit (optimistic locking), the review workflow, measurements,
 * revisions and diffs. Every change is one unit of work on the entry's aggregate (the complex and
 * its measurements): one transaction locks the entry's row, checks the version the change is based
 * on, changes the managed entities, and one flush writes them with the revision and the audit
 * event. Of many concurrent changes based on the same version exactly one is made, the others get
 * 409 with the entry as it is (the row lock orders them; the version column, MikroORM's optimistic
 * lock, guards the update as well).
 */

export interface Actor {
  userId: string;
}

type ComplexEntity = InferEntity<typeof Complex>;
type MeasurementEntity = InferEntity<typeof Measurement>;

interface LoadedEntry {
  complex: ComplexEntity;
  membership: MembershipInfo;
  reader: Reader;
}

class StaleVersion extends Error {}

const facts = (c: ComplexEntity) => ({
  status: c.status,
  createdById: c.createdById ?? null,
  submittedById: c.submittedById ?? null,
  hasAccepted: c.acceptedSnapshot != null,
});

/** The entry if the person may see it; otherwise 404 (non-members and hidden drafts alike). */
async function loadEntry(em: EntityManager, actor: Actor, id: string): Promise<LoadedEntry> {
  const complex = await em.findOne(Complex, { id }, { refresh: true });
  if (!complex) throw notFound('That library entry');
  const membership = await membershipIn(em, actor.userId, complex.groupId);
  if (!membership) throw notFound('That library entry');
  const reader: Reader = { userId: actor.userId, role: membership.role };
  if (!viewFor(reader, facts(complex))) throw notFound('That library entry');
  return { complex, membership, reader };
}

function ensureAllowed(entry: LoadedEntry, action: Action) {
  const problem = refusal(entry.reader, facts(entry.complex), action);
  if (problem) throw problem;
}

async function peopleNames(em: EntityManager, ids: (string | null | undefined)[]): Promise<Map<string, string>> {
  const wanted = [...new Set(ids.filter((id): id is string => typeof id === 'string'))];
  if (wanted.length === 0) return new Map();
  const users = await em.find(User, { id: { $in: wanted } }, { fields: ['id', 'displayName'] });
  return new Map(users.map((u) => [u.id, u.displayName]));
}

export async function measurementsOf(em: EntityManager, complexId: string): Promise<MeasurementDto[]> {
  const rows = await em.find(Measurement, { complex: complexId }, { populate: ['citation'], orderBy: { createdAt: 'asc', id: 'asc' }, refresh: true });
  return rows.map((m) => toMeasurementDto(m, m.citation ? toCitationDto(m.citation) : null));
}

async function workingSnapshot(em: EntityManager, complex: ComplexEntity): Promise<ComplexSnapshot> {
  return toSnapshot(complex, await measurementsOf(em, complex.id));
}

/**
 * Four eyes: did this person submit the revision in review, or write any change since the last
 * accepted version (creation included)? Editing someone's draft counts as writing it.
 */
async function wroteRevisionInReview(em: EntityManager, complex: ComplexEntity, userId: string): Promise<boolean> {
  if (complex.submittedById === userId) return true;
  const since = complex.acceptedVersion ?? 0;
  const written = await em.count(ComplexRevision, { complex: complex.id, authorId: userId, kind: { $in: ['create', 'edit'] }, number: { $gt: since } });
  return written > 0;
}

/** The entry as this reader may see it (working copy or accepted snapshot), with what they may do. */
export async function detailFor(em: EntityManager, complex: ComplexEntity, reader: Reader): Promise<ComplexDetail> {
  const view = viewFor(reader, facts(complex)) ?? 'published';
  const accepted = complex.acceptedSnapshot ?? null;
  const content: ComplexSnapshot = view === 'published' && accepted ? accepted : await workingSnapshot(em, complex);
  const latest = await em.findOne(ComplexReview, { complex: complex.id }, { orderBy: { createdAt: 'desc', id: 'desc' } });
  const people = await peopleNames(em, [complex.createdById, complex.submittedById, latest?.reviewerId]);
  const ownContent = complex.status === 'in-review' && roleAtLeast(reader.role, 'curator') && (await wroteRevisionInReview(em, complex, reader.userId));
  const curators = ownContent ? await reviewerCount(em, complex.groupId) : 2;
  const pending = accepted != null && complex.status !== 'accepted' && complex.status !== 'retired';
  const working = view === 'working';
  return {
    ...content,
    id: complex.id,
    groupId: complex.groupId,
    version: complex.version,
    view,
    hasPendingRevision: pending,
    accepted: working && pending ? accepted : null,
    acceptedAt: complex.acceptedAt ? complex.acceptedAt.toISOString() : null,
    createdBy: personRef(people, complex.createdById),
    submittedBy: working ? personRef(people, complex.submittedById) : null,
    submittedAt: working && complex.submittedAt ? complex.submittedAt.toISOString() : null,
    createdAt: complex.createdAt.toISOString(),
    updatedAt: complex.updatedAt.toISOString(),
    myRole: reader.role,
    permissions: permissionsFor(reader, facts(complex), curators, ownContent),
    latestReview:
      working && latest
        ? {
            decision: latest.decision,
            comment: latest.comment,
            reviewer: personRef(people, latest.reviewerId),
            createdAt: latest.createdAt.toISOString(),
          }
        : null,
  };
}

async function staleError(em: EntityManager, actor: Actor, id: string, basedOn: number): Promise<AppError> {
  const entry = await loadEntry(em, actor, id);
  const current = await detailFor(em, entry.complex, entry.reader);
  return new AppError(
    'CONFLICT',
    `This entry was changed by someone else: you edited version ${basedOn}, it is now version ${current.version}. ` +
      'Reload it, re-apply your change and save again.',
    undefined,
    { currentVersion: current.version, current },
  );
}

type ColumnChanges = Partial<{
  formula: string;
  name: string;
  notes: string | null;
  status: ComplexStatus;
  submittedById: string | null;
  submittedAt: Date | null;
}> &
  Partial<Omit<DerivedColumns, 'spinState'> & { spinState: 'high' | 'low' | null }>;

/** The entry inside a change: locked, with its measurements and their citations loaded. */
interface Work {
  entity: ComplexEntity;
  /** Citations as snapshots show them, by id: the loaded ones and those a change resolves. */
  citations: Map<string, CitationDto>;
}

interface ChangePlan {
  set: ColumnChanges;
  /** Measurement and other changes, on the managed entities, after the version guard. */
  apply?: (tem: EntityManager, work: Work, newVersion: number) => Promise<void>;
  /** The history line; a function when it depends on what `apply` found. */
  revision: { kind: RevisionKind; message: string | (() => string) };
  audit?: { action: string; details: Record<string, unknown> };
  /** Runs with the new snapshot (e.g. acceptance stores it as the accepted snapshot). */
  withSnapshot?: (work: Work, snapshot: ComplexSnapshot, newVersion: number) => void;
  /** Runs with the new revision, before the flush (a review decision belongs to it). */
  withRevision?: (tem: EntityManager, work: Work, revision: InferEntity<typeof ComplexRevision>) => void;
}

/** The measurements in the order the entry lists them (as measurementsOf reads them). */
function orderedMeasurements(entity: ComplexEntity): MeasurementEntity[] {
  return entity.measurements
    .getItems()
    .slice()
    .sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime() || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
}

/**
 * The denormalised measurement summary the search filters use (kinds, has-citation), kept in step
 * with the collection, and the snapshot of the entry as it now stands — both built in memory, without another read.
 */
function settle(work: Work): ComplexSnapshot {
  const { entity, citations } = work;
  const measurements = orderedMeasurements(entity);
  entity.measurementKinds = [...new Set(measurements.map((m) => m.kind))].sort();
  entity.hasCitation = measurements.some((m) => m.citation != null);
  return toSnapshot(
    entity,
    measurements.map((m) => toMeasurementDto(m, m.citation ? citations.get(m.citation.id) ?? null : null)),
  );
}

/** One change of an entry: version guard, entity changes, revision snapshot, audit — one flush, all or nothing. */
async function commit(em: EntityManager, actor: Actor, complex: ComplexEntity, basedOn: number, plan: ChangePlan): Promise<number> {
  const newVersion = basedOn + 1;
  try {
    await em.transactional(async (tem) => {
      // The row lock orders concurrent changes of one entry; the version says whether this one still applies.
      const entity = await tem.findOneOrFail(Complex, { id: complex.id }, { lockMode: LockMode.PESSIMISTIC_WRITE, refresh: true });
      if (entity.version !== basedOn) throw new StaleVersion();
      await claimIdempotencyKey(tem, complex.id);
      await tem.populate(entity, ['measurements.citation'], { refresh: true });
      const work: Work = { entity, citations: new Map() };
      for (const m of entity.measurements) if (m.citation) work.citations.set(m.citation.id, toCitationDto(m.citation));
      tem.assign(entity, { ...plan.set, updatedAt: new Date() });
      await plan.apply?.(tem, work, newVersion);
      const snapshot = settle(work);
      plan.withSnapshot?.(work, snapshot, newVersion);
      const revision = tem.create(ComplexRevision, {
        id: randomUUID(),
        complex: entity,
        number: newVersion,
        kind: plan.revision.kind,
        status: snapshot.status,
        message: typeof plan.revision.message === 'function' ? plan.revision.message() : plan.revision.message,
        snapshot,
        authorId: actor.userId,
        createdAt: new Date(),
      });
      plan.withRevision?.(tem, work, revision);
      if (plan.audit) {
        recordAudit(tem, {
          actorId: actor.userId,
          groupId: complex.groupId,
          action: plan.audit.action,
          subjectType: 'complex',
          subjectId: complex.id,
          details: { version: newVersion, formula: entity.formula, ...plan.audit.details },
        });
      }
      await tem.flush();
    });
  } catch (error) {
    // The transaction rolled back, but the entities it changed are the request's too: forget them,
    // so that no later flush in this request writes what was rolled back.
    em.clear();
    if (error instanceof StaleVersion || error instanceof OptimisticLockError) throw await staleError(em, actor, complex.id, basedOn);
    throw error;
  }
  return newVersion;
}

async function respond(em: EntityManager, actor: Actor, id: string): Promise<ComplexDetail> {
  const entry = await loadEntry(em, actor, id);
  return detailFor(em, entry.complex, entry.reader);
}

/** The version a change is based on: the one the client sent (checked now, and again atomically). */
async function basedOnVersion(em: EntityManager, actor: Actor, entry: LoadedEntry, sent: number | undefined): Promise<number> {
  if (sent !== undefined && sent !== entry.complex.version) throw await staleError(em, actor, entry.complex.id, sent);
  return sent ?? entry.complex.version;
}

/** An edit of an accepted entry re-opens it as a draft; the accepted snapshot stays published. */
function reopenIfApproved(entry: LoadedEntry): { set: ColumnChanges; audit?: ChangePlan['audit'] } {
  if (entry.complex.status !== 'accepted') return { set: {} };
  return {
    set: { status: 'draft', submittedById: null, submittedAt: null },
    audit: { action: 'library.entry.reopened', details: { from: 'accepted', to: 'draft' } },
  };
}

// ───────────────────────────── measurements (shared by create and the nested routes) ─────────────────────────────

function checkPartner(partnerFormula: string | null | undefined, field: string) {
  if (partnerFormula) classifyOrExplain(partnerFormula, field);
}

/** The citation a measurement input names (an id of the group's, or one to find or add); undefined when it says nothing. */
async function citationFor(
  tem: EntityManager,
  work: Work,
  actor: Actor,
  input: Pick<MeasurementInput, 'citationId' | 'citation'>,
  fieldPrefix: string,
): Promise<CitationDto | null | undefined> {
  const groupId = work.entity.groupId;
  let found: CitationDto | undefined;
  if (input.citationId) found = await citationOfGroup(tem, groupId, input.citationId, `${fieldPrefix}citationId`);
  else if (input.citation) found = (await findOrCreateCitation(tem, groupId, input.citation, actor.userId)).citation;
  if (found) {
    work.citations.set(found.id, found);
    return found;
  }
  if (input.citationId === null || input.citation === null) return null;
  return undefined;
}

/** A new measurement of the entry, added to its collection (written by the change's flush). */
async function addMeasurementTo(tem: EntityManager, work: Work, actor: Actor, input: MeasurementInput, fieldPrefix: string, at: Date) {
  const citation = await citationFor(tem, work, actor, input, fieldPrefix);
  const { complex: _complex, citation: _citation, ...row } = measurementRow(work.entity.id, input, citation?.id ?? null, at);
  work.entity.measurements.add(
    tem.create(Measurement, { ...row, complex: work.entity, citation: citation ? tem.getReference(Citation, citation.id) : null }),
  );
}

// ───────────────────────────── entries ─────────────────────────────

export async function createComplex(em: EntityManager, actor: Actor, input: CreateComplexInput): Promise<ComplexDetail> {
  const membership = await resolveGroup(em, actor.userId, input.groupId);
  if (!roleAtLeast(membership.role, 'contributor')) {
    throw new AppError('FORBIDDEN', 'Viewers can read the library but not add to it; ask an admin for the contributor role.');
  }
  const derived = deriveColumns(input.formula, input.name);
  (input.measurements ?? []).forEach((m, i) => checkPartner(m.partnerFormula, `measurements.${i}.partnerFormula`));
  const id = randomUUID();
  try {
    await em.transactional(async (tem) => {
      const now = new Date();
      await claimIdempotencyKey(tem, id);
      const entity = tem.create(
        Complex,
        entryRow({
          id,
          groupId: membership.groupId,
          formula: input.formula,
          name: input.name,
          notes: input.notes,
          derived,
          authorId: actor.userId,
          submitted: false,
          // Set from the measurements by settle() below.
          measurementKinds: [],
          hasCitation: false,
          at: now,
        }),
      );
      const work: Work = { entity, citations: new Map() };
      for (const [i, m] of (input.measurements ?? []).entries()) {
        // A millisecond apart, so the entry lists them in the order they were given.
        await addMeasurementTo(tem, work, actor, m, `measurements.${i}.`, new Date(now.getTime() + i));
      }
      const snapshot = settle(work);
      tem.create(ComplexRevision, {
        id: randomUUID(),
        complex: entity,
        number: 1,
        kind: 'create',
        status: 'draft',
        message: summariseCreation((input.measurements ?? []).map((m) => m.kind)),
        snapshot,
        authorId: actor.userId,
        createdAt: now,
      });
      recordAudit(tem, {
        actorId: actor.userId,
        groupId: membership.groupId,
        action: 'library.entry.created',
        subjectType: 'complex',
        subjectId: id,
        details: { to: 'draft', formula: input.formula, version: 1 },
      });
      await tem.flush();
    });
  } catch (error) {
    // As in commit(): nothing of a rolled-back creation stays managed.
    em.clear();
    throw error;
  }
  return respond(em, actor, id);
}

export async function getComplex(em: EntityManager, actor: Actor, id: string): Promise<ComplexDetail> {
  return respond(em, actor, id);
}

/** A stored measurement as a whole-entry save states it (used by the single-change routes below). */
export function asEntryInput(m: MeasurementDto): EntryMeasurementInput {
  return {
    id: m.id,
    kind: m.kind,
    value: m.value,
    unit: m.unit,
    temperatureK: m.temperatureK,
    ionicStrengthM: m.ionicStrengthM,
    medium: m.medium,
    method: m.method,
    partnerFormula: m.partnerFormula,
    citationId: m.citation?.id ?? null,
    notes: m.notes,
  };
}

const sameValue = (a: unknown, b: unknown) => (a ?? null) === (b ?? null);

class NothingChanged extends Error {}

/**
 * Saves the whole entry as the person wants it (PUT /api/complexes/:id): one transaction, guarded
 * by the version the edit is based on, that writes only what differs — the entry's columns, and
 * measurements added, changed or removed — then one revision with a one-line summary in words and
 * at most one audit event. A save that changes nothing writes nothing and returns the entry.
 */
export async function saveComplex(em: EntityManager, actor: Actor, id: string, input: SaveComplexInput): Promise<ComplexDetail> {
  const entry = await loadEntry(em, actor, id);
  ensureAllowed(entry, 'edit');
  input.measurements.forEach((m, i) => checkPartner(m.partnerFormula, `measurements.${i}.partnerFormula`));
  const basedOn = await basedOnVersion(em, actor, entry, input.version);
  const { complex } = entry;
  const notes = input.notes ?? null;
  const changes: EntryChanges = {
    formula: input.formula !== complex.formula,
    name: input.name !== complex.name,
    notes: !sameValue(notes, complex.notes),
    added: [],
    changed: [],
    removed: [],
  };
  const set: ColumnChanges = {};
  if (changes.formula) set.formula = input.formula;
  if (changes.name) set.name = input.name;
  if (changes.notes) set.notes = notes;
  if (changes.formula || changes.name) Object.assign(set, deriveColumns(input.formula, input.name));
  const reopen = reopenIfApproved(entry);
  try {
    await commit(em, actor, complex, basedOn, {
      set: { ...set, ...reopen.set },
      apply: async (tem, work) => {
        const stored = work.entity.measurements.getItems();
        const storedById = new Map(stored.map((m) => [m.id, m]));
        const kept = new Set<string>();
        const now = new Date();
        for (const [i, m] of input.measurements.entries()) {
          const prefix = `measurements.${i}.`;
          const existing = m.id ? storedById.get(m.id) : undefined;
          if (m.id && (!existing || kept.has(m.id))) {
            throw new AppError('VALIDATION_FAILED', 'A measurement names an id that is not one of this entry’s measurements.', {
              [`${prefix}id`]: 'Not a measurement of this entry (leave the id out to add a new one).',
            });
          }
          if (!existing) {
            await addMeasurementTo(tem, work, actor, m, prefix, new Date(now.getTime() + i));
            changes.added.push(m.kind);
            continue;
          }
          kept.add(existing.id);
          const citation = (await citationFor(tem, work, actor, m, prefix)) ?? null;
          const { id: _id, complex: _complex, citation: citationId, createdAt: _createdAt, updatedAt: _updatedAt, ...next } = measurementRow(id, m, citation?.id ?? null, now);
          const differs =
            (existing.citation?.id ?? null) !== citationId ||
            (Object.keys(next) as (keyof typeof next)[]).some((key) => (key === 'value' ? Number(existing.value) !== next.value : !sameValue(existing[key], next[key])));
          if (!differs) continue;
          tem.assign(existing, { ...next, citation: citationId ? tem.getReference(Citation, citationId) : null, updatedAt: now });
          changes.changed.push(m.kind);
        }
        const removed = stored.filter((m) => !kept.has(m.id));
        // Orphan removal: taken out of the collection, deleted by the flush.
        work.entity.measurements.remove(removed);
        changes.removed.push(...removed.map((m) => m.kind));
        // Nothing flushed yet: a save with no differences writes nothing (the claim is rolled back too).
        if (noChanges(changes)) throw new NothingChanged();
      },
      revision: {
        kind: 'edit',
        message: () => [summariseChanges(changes), input.message?.trim()].filter(Boolean).join(' — ').slice(0, 500),
      },
      audit: reopen.audit,
    });
  } catch (error) {
    if (!(error instanceof NothingChanged)) throw error;
  }
  return respond(em, actor, id);
}

/**
 * A change of the entry outside its fields (a file attached): one revision with `message`, the
 * accepted entry re-opened for review like any edit; `apply` writes the rows in the same transaction.
 */
export async function recordEntryChange(em: EntityManager, actor: Actor, id: string, message: string, apply: (tem: EntityManager, newVersion: number) => Promise<void>) {
  const entry = await loadEntry(em, actor, id);
  ensureAllowed(entry, 'edit');
  const reopen = reopenIfApproved(entry);
  await commit(em, actor, entry.complex, entry.complex.version, {
    set: reopen.set,
    apply: (tem, _work, newVersion) => apply(tem, newVersion),
    revision: { kind: 'edit', message },
    audit: reopen.audit,
  });
}

/** The entry's stored content as a whole-entry save, for the single-change routes below. */
async function storedAsSave(em: EntityManager, entry: LoadedEntry, version: number | undefined): Promise<SaveComplexInput> {
  const { complex } = entry;
  return {
    version: version ?? complex.version,
    formula: complex.formula,
    name: complex.name,
    notes: complex.notes ?? null,
    measurements: (await measurementsOf(em, complex.id)).map(asEntryInput),
  };
}

/** PATCH /api/complexes/:id — some fields of the entry; saved as a whole entry. */
export async function updateComplex(em: EntityManager, actor: Actor, id: string, input: UpdateComplexInput): Promise<ComplexDetail> {
  const entry = await loadEntry(em, actor, id);
  const base = await storedAsSave(em, entry, input.version);
  return saveComplex(em, actor, id, {
    ...base,
    formula: input.formula ?? base.formula,
    name: input.name ?? base.name,
    notes: input.notes !== undefined ? input.notes ?? null : base.notes,
    ...(input.message ? { message: input.message } : {}),
  });
}

/** POST /api/complexes/:id/measurements — one more measurement; saved as a whole entry. */
export async function addMeasurement(em: EntityManager, actor: Actor, id: string, input: MeasurementInput): Promise<ComplexDetail> {
  const entry = await loadEntry(em, actor, id);
  const { version, ...measurement } = input;
  const base = await storedAsSave(em, entry, version);
  return saveComplex(em, actor, id, { ...base, measurements: [...base.measurements, measurement] });
}

/** PATCH /api/complexes/:id/measurements/:mid — some fields of one measurement; saved as a whole entry. */
export async function updateMeasurement(
  em: EntityManager,
  actor: Actor,
  id: string,
  measurementId: string,
  input: UpdateMeasurementInput,
): Promise<ComplexDetail> {
  const entry = await loadEntry(em, actor, id);
  const { version, ...patch } = input;
  const base = await storedAsSave(em, entry, version);
  const existing = base.measurements.find((m) => m.id === measurementId);
  if (!existing) throw notFound('That measurement');
  const merged = Object.fromEntries(Object.entries({ ...existing, ...patch }).filter(([, v]) => v !== undefined)) as EntryMeasurementInput;
  // A new citation replaces the stored link.
  if (patch.citation !== undefined) delete merged.citationId;
  parseWith(measurementCheckSchema, merged);
  return saveComplex(em, actor, id, { ...base, measurements: base.measurements.map((m) => (m.id === measurementId ? merged : m)) });
}

/** DELETE /api/complexes/:id/measurements/:mid — saved as a whole entry without it. */
export async function deleteMeasurement(
  em: EntityManager,
  actor: Actor,
  id: string,
  measurementId: string,
  version: number | undefined,
): Promise<ComplexDetail> {
  const entry = await loadEntry(em, actor, id);
  const base = await storedAsSave(em, entry, version);
  if (!base.measurements.some((m) => m.id === measurementId)) throw notFound('That measurement');
  return saveComplex(em, actor, id, { ...base, measurements: base.measurements.filter((m) => m.id !== measurementId) });
}

// ───────────────────────────── workflow ─────────────────────────────

export async function submitComplex(em: EntityManager, actor: Actor, id: string, input: TransitionInput): Promise<ComplexDetail> {
  const entry = await loadEntry(em, actor, id);
  ensureAllowed(entry, 'submit');
  const basedOn = await basedOnVersion(em, actor, entry, input.version);
  await commit(em, actor, entry.complex, basedOn, {
    set: { status: 'in-review', submittedById: actor.userId, submittedAt: new Date() },
    revision: { kind: 'submit', message: input.message ?? 'Submitted for review' },
    audit: { action: 'library.entry.submitted', details: { from: entry.complex.status, to: 'in-review' } },
  });
  const submitted = await respond(em, actor, id);
  emitLibraryEvent(em, { type: 'in-review', complexId: id, groupId: submitted.groupId, formula: submitted.formula, name: submitted.name, actorId: actor.userId });
  return submitted;
}

/**
 * Puts the working copy back to the accepted snapshot (after a declined edit of an accepted entry):
 * measurements of the snapshot come back as they were (same ids and times), later ones go.
 */
async function restoreAccepted(tem: EntityManager, work: Work, accepted: ComplexSnapshot) {
  const { entity } = work;
  const wanted = new Map(accepted.measurements.map((m) => [m.id, m]));
  entity.measurements.remove(entity.measurements.getItems().filter((m) => !wanted.has(m.id)));
  // The citation may have been deleted with its group only; keep the link when it still exists.
  const citationIds = [...new Set(accepted.measurements.map((m) => m.citation?.id).filter((c): c is string => !!c))];
  const existing = citationIds.length ? await tem.find(Citation, { id: { $in: citationIds } }) : [];
  for (const c of existing) work.citations.set(c.id, toCitationDto(c));
  const byId = new Map(entity.measurements.getItems().map((m) => [m.id, m]));
  for (const m of accepted.measurements) {
    const citationId = m.citation && work.citations.has(m.citation.id) ? m.citation.id : null;
    const { complex: _complex, citation: _citation, ...row } = measurementRow(entity.id, m, citationId, new Date(m.createdAt));
    const values = { ...row, id: m.id, citation: citationId ? tem.getReference(Citation, citationId) : null, updatedAt: new Date(m.updatedAt) };
    const current = byId.get(m.id);
    if (current) tem.assign(current, values);
    else entity.measurements.add(tem.create(Measurement, { ...values, complex: entity }));
  }
}

export async function reviewComplex(em: EntityManager, actor: Actor, id: string, input: ReviewInput): Promise<ReviewResponse> {
  const entry = await loadEntry(em, actor, id);
  ensureAllowed(entry, 'review');
  const { complex } = entry;
  let selfAccepted = false;
  if (input.decision === 'accept' && (await wroteRevisionInReview(em, complex, actor.userId))) {
    const reviewers = await reviewerCount(em, complex.groupId);
    if (reviewers > 1) {
      throw new AppError(
        'CONFLICT',
        'You cannot accept a revision you submitted or helped write: another curator of this group must review it (you may still return it for revision or decline it).',
      );
    }
    selfAccepted = true;
  }
  const basedOn = await basedOnVersion(em, actor, entry, input.version);
  const accepted = complex.acceptedSnapshot ?? null;
  const restore = input.decision === 'decline' && accepted != null;
  const to: ComplexStatus =
    input.decision === 'accept' ? 'accepted' : input.decision === 'return' ? 'returned' : restore ? 'accepted' : 'declined';
  const set: ColumnChanges = { status: to };
  if (restore && accepted) {
    Object.assign(set, { formula: accepted.formula, name: accepted.name, notes: accepted.notes }, deriveColumns(accepted.formula, accepted.name));
  }
  const reviewId = randomUUID();
  const auditAction =
    input.decision === 'accept' ? 'library.entry.accepted' : input.decision === 'return' ? 'library.entry.returned' : 'library.entry.declined';
  const messages: Record<ReviewInput['decision'], string> = {
    accept: selfAccepted ? 'Accepted (by the submitter, the group’s only curator)' : 'Accepted',
    return: `Returned: ${input.comment}`,
    decline: restore ? `Declined: ${input.comment} — the accepted version was restored` : `Declined: ${input.comment}`,
  };
  await commit(em, actor, complex, basedOn, {
    set,
    apply: async (tem, work) => {
      if (restore && accepted) await restoreAccepted(tem, work, accepted);
    },
    withRevision: (tem, work, revision) => {
      tem.create(ComplexReview, {
        id: reviewId,
        complex: work.entity,
        revision,
        revisionNumber: revision.number,
        decision: input.decision,
        comment: input.comment,
        reviewerId: actor.userId,
        selfAccepted,
        createdAt: new Date(),
      });
    },
    withSnapshot: ({ entity }, snapshot, newVersion) => {
      if (input.decision !== 'accept') return;
      Object.assign(entity, { acceptedSnapshot: snapshot, acceptedVersion: newVersion, acceptedAt: new Date() });
    },
    revision: { kind: 'review', message: messages[input.decision].slice(0, 500) },
    audit: {
      action: auditAction,
      details: {
        from: 'in-review',
        to,
        decision: input.decision,
        comment: input.comment,
        ...(selfAccepted ? { selfAccepted: true, reason: 'the submitter is the group’s only curator' } : {}),
        ...(restore ? { restoredAcceptedVersion: complex.acceptedVersion } : {}),
      },
    },
  });
  emitLibraryEvent(em, {
    type: 'reviewed',
    complexId: complex.id,
    groupId: complex.groupId,
    formula: complex.formula,
    name: complex.name,
    actorId: actor.userId,
    decision: input.decision,
    comment: input.comment,
    submitterId: complex.submittedById ?? null,
  });
  return reviewResponse(em, actor, id, reviewId);
}

/** A review with the entry after it; the latest review when no id is given (replayed retries). */
export async function reviewResponse(em: EntityManager, actor: Actor, id: string, reviewId?: string): Promise<ReviewResponse> {
  const review = reviewId
    ? await em.findOneOrFail(ComplexReview, { id: reviewId })
    : await em.findOneOrFail(ComplexReview, { complex: id }, { orderBy: { createdAt: 'desc', id: 'desc' } });
  const people = await peopleNames(em, [review.reviewerId]);
  return {
    review: {
      id: review.id,
      complexId: review.complex.id,
      revisionNumber: review.revisionNumber,
      decision: review.decision,
      comment: review.comment,
      reviewer: personRef(people, review.reviewerId),
      selfAccepted: review.selfAccepted,
      createdAt: review.createdAt.toISOString(),
    },
    complex: await respond(em, actor, id),
  };
}

export async function retireComplex(em: EntityManager, actor: Actor, id: string, input: TransitionInput): Promise<ComplexDetail> {
  const entry = await loadEntry(em, actor, id);
  ensureAllowed(entry, 'retire');
  const basedOn = await basedOnVersion(em, actor, entry, input.version);
  await commit(em, actor, entry.complex, basedOn, {
    set: { status: 'retired' },
    revision: { kind: 'retire', message: input.message ?? 'Retired' },
    audit: { action: 'library.entry.retired', details: { from: entry.complex.status, to: 'retired' } },
  });
  return respond(em, actor, id);
}

// ───────────────────────────── revisions ─────────────────────────────

/** Readers of the published view see the history up to the accepted version only. */
async function visibleRevisions(em: EntityManager, entry: LoadedEntry) {
  const view = viewFor(entry.reader, facts(entry.complex));
  const where =
    view === 'published'
      ? { complex: entry.complex.id, number: { $in: await acceptedRevisionNumbers(em, entry.complex.id) } }
      : { complex: entry.complex.id };
  return em.find(ComplexRevision, where, { orderBy: { number: 'desc' } });
}

function toRevisionDto(row: InferEntity<typeof ComplexRevision>, people: Map<string, string>): RevisionDto {
  return {
    id: row.id,
    number: row.number,
    kind: row.kind,
    status: row.status,
    message: row.message,
    author: personRef(people, row.authorId),
    createdAt: row.createdAt.toISOString(),
  };
}

export async function listRevisions(em: EntityManager, actor: Actor, id: string): Promise<RevisionDto[]> {
  const entry = await loadEntry(em, actor, id);
  const rows = await visibleRevisions(em, entry);
  const people = await peopleNames(em, rows.map((r) => r.authorId));
  return rows.map((row) => toRevisionDto(row, people));
}

export async function getRevision(em: EntityManager, actor: Actor, id: string, number: number): Promise<RevisionDetail> {
  const entry = await loadEntry(em, actor, id);
  const row = (await visibleRevisions(em, entry)).find((r) => r.number === number);
  if (!row) throw notFound(`Revision ${number} of this entry`);
  const people = await peopleNames(em, [row.authorId]);
  return { ...toRevisionDto(row, people), snapshot: row.snapshot };
}

export async function diffRevisions(em: EntityManager, actor: Actor, id: string, from: number, to: number): Promise<RevisionDiff> {
  const entry = await loadEntry(em, actor, id);
  const rows = await visibleRevisions(em, entry);
  const before = rows.find((r) => r.number === from);
  const after = rows.find((r) => r.number === to);
  if (!before) throw notFound(`Revision ${from} of this entry`);
  if (!after) throw notFound(`Revision ${to} of this entry`);
  return diffSnapshots(from, to, before.snapshot, after.snapshot);
}

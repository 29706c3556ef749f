import type { EntityManager as CoreEntityManager, InferEntity, RequiredEntityData } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import demoLibrary from '@/data/demo-library.json';
import {
  citationInputSchema,
  measurementInputSchema,
  type CitationInput,
  type ComplexSnapshot,
  type ComplexStatus,
  type Measurement as MeasurementDto,
  type MeasurementInput,
} from '@/lib/schemas/library';
import { User } from '@/server/modules/auth/user.entity';
import { DEMO_GROUPS, demoAccounts } from '@/server/modules/auth/demo-accounts';
import { ResearchGroup } from '@/server/modules/groups/group.entity';
import { Complex } from './complex.entity';
import { randomUUID } from 'node:crypto';
import { AuditEvent } from '@/server/modules/audit/audit-event.entity';
import { Citation } from './citation.entity';
import { toCitationDto, toMeasurementDto, toSnapshot } from './complex.mapper';
import { deriveColumns } from './derive';
import { Measurement } from './measurement.entity';
import { ComplexReview } from './review.entity';
import { ComplexRevision, type RevisionKind } from './revision.entity';

/**
 * Seeds the invented Larkspur Coordination Lab's library from data/demo-library.json: contributors
 * create and submit, the lab manager (curator) reviews; every step leaves the revision, review and
 * audit rows the services would write. Published values keep their citation;
 * invented in-house values say so in their notes. Runs once (the caller's marker), and skips when
 * the lab or its people are missing or the library already has entries.
 */

type Rows<Schema> = RequiredEntityData<InferEntity<Schema>>[];

type Author = 'contributor' | 'contributor2' | 'curator' | 'admin';

interface DemoMeasurement extends Omit<MeasurementInput, 'citation' | 'citationId' | 'version'> {
  citation: string | null;
  source: string;
  /** How well the value was checked against its citation (kept in the data file; not user text). */
  checked?: 'primary' | 'review' | 'secondary' | 'recalled' | null;
  /** Curators' note on the value's provenance: never seeded as user text. */
  note?: string;
}

interface DemoComplex {
  formula: string;
  name: string;
  status: ComplexStatus;
  author: Author;
  notes: string | null;
  measurements: DemoMeasurement[];
  pendingEdit?: { author: Author; notes: string; addMeasurements: DemoMeasurement[] };
}

interface DemoCitation extends CitationInput {
  key: string;
  source: string;
  /** Curators' note: never seeded. */
  note?: string;
}

const emailOf: Record<Author, string> = {
  admin: 'admin@larkspur.example.org',
  curator: 'curator@larkspur.example.org',
  contributor: 'contributor@larkspur.example.org',
  contributor2: 'contributor2@larkspur.example.org',
};

export interface DemoLibraryResult {
  complexes: number;
  measurements: number;
}

export async function seedDemoLibrary(coreEm: CoreEntityManager): Promise<DemoLibraryResult> {
  // Seeding runs at start-up, outside any request.
  const em = (coreEm as EntityManager).fork();
  const group = await em.findOne(ResearchGroup, { name: DEMO_GROUPS.larkspur });
  if (!group) return { complexes: 0, measurements: 0 };
  if ((await em.count(Complex, { groupId: group.id })) > 0) return { complexes: 0, measurements: 0 };
  const people = new Map<Author, string>();
  for (const [author, email] of Object.entries(emailOf) as [Author, string][]) {
    if (!demoAccounts.some((a) => a.email === email)) continue;
    const user = await em.findOne(User, { email });
    if (user) people.set(author, user.id);
  }
  const actor = (author: Author) => {
    const userId = people.get(author);
    if (!userId) throw new Error(`demo library: no demo account for ${author}`);
    return { userId };
  };

  const citations = new Map<string, CitationInput>(
    (demoLibrary.citations as DemoCitation[]).map(({ key, source: _source, note: _note, ...rest }) => [key, citationInputSchema.parse(rest)]),
  );
  const toInput = (m: DemoMeasurement): MeasurementInput => {
    const { citation, source: _source, checked: _checked, note: _note, ...rest } = m;
    const cited = citation ? citations.get(citation) : undefined;
    if (citation && !cited) throw new Error(`demo library: unknown citation key ${citation}`);
    return measurementInputSchema.parse({ ...rest, ...(cited ? { citation: cited } : {}) });
  };

  // One transaction of bulk inserts (the seed runs on every first start and in tests: it must be
  // quick). The rows are what the services would have written: revisions with full snapshots,
  // reviews, audit events for every status change, the accepted snapshot beside a pending edit.
  const citationIds = new Map<string, string>();
  const citationRows: Rows<typeof Citation> = [];
  const complexRows: Rows<typeof Complex> = [];
  const measurementRows: Rows<typeof Measurement> = [];
  const revisionRows: Rows<typeof ComplexRevision> = [];
  const reviewRows: Rows<typeof ComplexReview> = [];
  const auditRows: Rows<typeof AuditEvent> = [];
  const list = demoLibrary.complexes as DemoComplex[];
  const startMs = Date.now() - list.length * 6 * 3_600_000;
  let clock = 0;
  const tick = () => new Date(startMs + (clock += 1) * 600_000);

  const citationDto = (key: string) => {
    const input = citations.get(key);
    if (!input) throw new Error(`demo library: unknown citation key ${key}`);
    let id = citationIds.get(key);
    if (!id) {
      id = randomUUID();
      citationIds.set(key, id);
      citationRows.push({ id, groupId: group.id, doi: input.doi ?? null, authors: input.authors, title: input.title ?? null, journal: input.journal, year: input.year ?? null, volume: input.volume ?? null, pages: input.pages ?? null, kind: input.kind ?? 'article', publisher: input.publisher ?? null, place: input.place ?? null, url: input.url ?? null, createdById: people.get('curator') ?? null, createdAt: new Date(startMs) });
    }
    return toCitationDto({ id, groupId: group.id, ...input });
  };
  const measurementDto = (m: DemoMeasurement, at: Date): MeasurementDto => {
    const input = toInput(m);
    return toMeasurementDto(
      { id: randomUUID(), kind: input.kind, value: input.value, unit: input.unit, temperatureK: input.temperatureK ?? null, ionicStrengthM: input.ionicStrengthM ?? null, medium: input.medium ?? null, method: input.method ?? null, partnerFormula: input.partnerFormula ?? null, notes: input.notes ?? null, createdAt: at, updatedAt: at },
      m.citation ? citationDto(m.citation) : null,
    );
  };

  let measurements = 0;
  for (const entry of list) {
    const id = randomUUID();
    const derived = deriveColumns(entry.formula, entry.name);
    const author = actor(entry.author).userId;
    const curator = actor('curator').userId;
    const createdAt = tick();
    let working = entry.measurements.map((m) => measurementDto(m, createdAt));
    const base = { formula: entry.formula, name: entry.name, notes: entry.notes, ...derived };
    let version = 0;
    let acceptedSnapshot: ComplexSnapshot | null = null;
    let acceptedVersion: number | null = null;
    let acceptedAt: Date | null = null;
    let submittedAt: Date | null = null;
    let submittedById: string | null = null;
    let status: ComplexStatus = 'draft';
    let notes = entry.notes;
    const record = (kind: RevisionKind, authorId: string, message: string, at: Date, audit?: { action: string; from?: ComplexStatus }) => {
      version += 1;
      const snapshot = toSnapshot({ ...base, notes, status }, working);
      revisionRows.push({ id: randomUUID(), complex: id, number: version, kind, status, message, snapshot, authorId, createdAt: at });
      if (audit) {
        auditRows.push({ id: randomUUID(), actorId: authorId, groupId: group.id, action: audit.action, subjectType: 'complex', subjectId: id, details: { version, formula: entry.formula, ...(audit.from ? { from: audit.from } : {}), to: status, demo: true }, createdAt: at });
      }
      return snapshot;
    };
    record('create', author, 'Created', createdAt, { action: 'library.entry.created' });
    if (entry.status !== 'draft') {
      submittedAt = tick();
      submittedById = author;
      status = 'in-review';
      record('submit', author, 'Submitted for review', submittedAt, { action: 'library.entry.submitted', from: 'draft' });
    }
    if (['accepted', 'returned', 'declined', 'retired'].includes(entry.status)) {
      const decision = entry.status === 'returned' ? 'return' : entry.status === 'declined' ? 'decline' : 'accept';
      const comment =
        decision === 'return'
          ? 'Please add the primary citation for k11 (the compilation alone is not enough).'
          : decision === 'decline'
            ? 'Duplicate of an entry we already hold.'
            : 'Checked against the cited source.';
      const at = tick();
      status = decision === 'accept' ? 'accepted' : decision === 'decline' ? 'declined' : 'returned';
      const action = decision === 'accept' ? 'library.entry.accepted' : decision === 'decline' ? 'library.entry.declined' : 'library.entry.returned';
      const snapshot = record('review', curator, decision === 'accept' ? 'Accepted' : `${decision === 'decline' ? 'Declined' : 'Returned'}: ${comment}`, at, { action, from: 'in-review' });
      reviewRows.push({ id: randomUUID(), complex: id, revisionNumber: version, revision: revisionRows[revisionRows.length - 1]!.id, decision, comment, reviewerId: curator, selfAccepted: false, createdAt: at });
      if (decision === 'accept') {
        acceptedSnapshot = snapshot;
        acceptedVersion = version;
        acceptedAt = at;
      }
    }
    if (entry.status === 'retired') {
      status = 'retired';
      record('retire', curator, 'Split into separate studies', tick(), { action: 'library.entry.retired', from: 'accepted' });
    }
    if (entry.pendingEdit) {
      const editor = actor(entry.pendingEdit.author).userId;
      const at = tick();
      working = [...working, ...entry.pendingEdit.addMeasurements.map((m) => measurementDto(m, at))];
      notes = entry.pendingEdit.notes;
      status = 'draft';
      record('edit', editor, 'Added an in-house measurement', at, { action: 'library.entry.reopened', from: 'accepted' });
      submittedAt = tick();
      submittedById = editor;
      status = 'in-review';
      record('submit', editor, 'Submitted for review', submittedAt, { action: 'library.entry.submitted', from: 'draft' });
    }
    measurements += working.length;
    for (const m of working) {
      measurementRows.push({ id: m.id, complex: id, kind: m.kind, value: m.value, unit: m.unit, temperatureK: m.temperatureK, ionicStrengthM: m.ionicStrengthM, medium: m.medium, method: m.method, partnerFormula: m.partnerFormula, citation: m.citation?.id ?? null, notes: m.notes, createdAt: new Date(m.createdAt), updatedAt: new Date(m.updatedAt) });
    }
    complexRows.push({
      id, groupId: group.id, ...base, notes, status,
      measurementKinds: [...new Set(working.map((m) => m.kind))].sort(),
      hasCitation: working.some((m) => m.citation !== null),
      version, createdById: author, submittedById, submittedAt, acceptedSnapshot, acceptedVersion, acceptedAt,
      createdAt, updatedAt: new Date(startMs + clock * 600_000),
    });
  }
  await em.transactional(async (tem) => {
    if (citationRows.length) await tem.insertMany<InferEntity<typeof Citation>>(Citation, citationRows);
    await tem.insertMany<InferEntity<typeof Complex>>(Complex, complexRows);
    if (measurementRows.length) await tem.insertMany<InferEntity<typeof Measurement>>(Measurement, measurementRows);
    await tem.insertMany<InferEntity<typeof ComplexRevision>>(ComplexRevision, revisionRows);
    if (reviewRows.length) await tem.insertMany<InferEntity<typeof ComplexReview>>(ComplexReview, reviewRows);
    await tem.insertMany<InferEntity<typeof AuditEvent>>(AuditEvent, auditRows);
  });
  return { complexes: list.length, measurements };
}

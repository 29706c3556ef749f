import type { EntityManager as CoreEntityManager } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import demoLibrary from '@/data/demo-library.json';
import {
  citationInputSchema,
  measurementInputSchema,
  type CitationInput,
  type ComplexStatus,
  type MeasurementInput,
} from '@/lib/schemas/library';
import { User } from '@/server/modules/auth/user.entity';
import { DEMO_GROUPS, demoAccounts } from '@/server/modules/auth/demo-accounts';
import { ResearchGroup } from '@/server/modules/groups/group.entity';
import { Complex } from './complex.entity';
import * as complexes from './complex.service';

/**
 * Seeds the invented Larkspur Coordination Lab's library from data/demo-library.json through the
 * same services the API uses (so revisions, reviews and audit events are real): contributors
 * create and submit, the lab manager (curator) reviews. Published values keep their citation;
 * invented in-house values say so in their notes. Runs once (the caller's marker), and skips when
 * the lab or its people are missing or the library already has entries.
 */

type Author = 'contributor' | 'contributor2' | 'curator' | 'admin';

interface DemoMeasurement extends Omit<MeasurementInput, 'citation' | 'citationId' | 'version'> {
  citation: string | null;
  source: string;
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
    (demoLibrary.citations as DemoCitation[]).map(({ key, source: _source, ...rest }) => [key, citationInputSchema.parse(rest)]),
  );
  const toInput = (m: DemoMeasurement): MeasurementInput => {
    const { citation, source: _source, ...rest } = m;
    const cited = citation ? citations.get(citation) : undefined;
    if (citation && !cited) throw new Error(`demo library: unknown citation key ${citation}`);
    return measurementInputSchema.parse({ ...rest, ...(cited ? { citation: cited } : {}) });
  };

  let measurements = 0;
  const list = demoLibrary.complexes as DemoComplex[];
  for (const entry of list) {
    const created = await complexes.createComplex(em.fork(), actor(entry.author), {
      groupId: group.id,
      formula: entry.formula,
      name: entry.name,
      notes: entry.notes,
      measurements: entry.measurements.map(toInput),
    });
    measurements += entry.measurements.length;
    if (entry.status === 'draft') continue;
    await complexes.submitComplex(em.fork(), actor(entry.author), created.id, {});
    if (entry.status === 'submitted') continue;
    const decision = entry.status === 'changes-requested' ? 'request-changes' : entry.status === 'rejected' ? 'reject' : 'approve';
    const comment =
      decision === 'request-changes'
        ? 'Please add the primary citation for k11 (the compilation alone is not enough).'
        : decision === 'reject'
          ? 'Duplicate of an entry we already hold.'
          : 'Checked against the cited source.';
    await complexes.reviewComplex(em.fork(), actor('curator'), created.id, { decision, comment });
    if (entry.status === 'retired') {
      await complexes.retireComplex(em.fork(), actor('curator'), created.id, { message: 'Split into separate studies' });
    }
    if (entry.pendingEdit) {
      const editor = actor(entry.pendingEdit.author);
      for (const m of entry.pendingEdit.addMeasurements) {
        await complexes.addMeasurement(em.fork(), editor, created.id, toInput(m));
        measurements += 1;
      }
      const current = await complexes.getComplex(em.fork(), editor, created.id);
      await complexes.updateComplex(em.fork(), editor, created.id, {
        version: current.version,
        notes: entry.pendingEdit.notes,
        message: 'Added an in-house measurement',
      });
      await complexes.submitComplex(em.fork(), editor, created.id, {});
    }
  }
  return { complexes: list.length, measurements };
}

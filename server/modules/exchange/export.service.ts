import type { EntityManager } from '@mikro-orm/postgresql';
import { stringify } from 'csv-stringify/sync';
import { exportCsvColumns, type ExportCsvColumn, type ExportQuery } from '@/lib/schemas/exchange';
import { spreadsheetSafe } from './spreadsheet-safety';
import type { Citation as CitationDto, ComplexSnapshot } from '@/lib/schemas/library';
import { Complex } from '@/server/modules/library/complex.entity';
import { searchComplexes } from '@/server/modules/library/complex-search';
import { toCitationDto, toMeasurementDto, toSnapshot } from '@/server/modules/library/complex.mapper';
import { membershipsOf, viewFor } from '@/server/modules/library/library-access';
import { Measurement } from '@/server/modules/library/measurement.entity';

/**
 * The library as the reader sees it (the library search decides which entries and which copy:
 * restricted readers match and get accepted snapshots, authors and curators the working copy),
 * written as CSV in the importer's columns plus `status`, so that export → import gives the same
 * library back.
 */

export const EXPORT_MAX_ENTRIES = 20_000;

export async function visibleSnapshots(em: EntityManager, userId: string, query: ExportQuery): Promise<ComplexSnapshot[]> {
  const ids: string[] = [];
  for (let page = 1; ids.length < EXPORT_MAX_ENTRIES; page += 1) {
    const result = await searchComplexes(em, userId, { ...query, page, pageSize: 100 });
    ids.push(...result.items.map((item) => item.id));
    if (result.items.length < 100) break;
  }
  if (ids.length === 0) return [];
  const memberships = await membershipsOf(em, userId);
  const snapshots = new Map<string, ComplexSnapshot>();
  for (let i = 0; i < ids.length; i += 1000) {
    const part = ids.slice(i, i + 1000);
    const complexes = await em.find(Complex, { id: { $in: part } });
    const working = complexes.filter((c) => {
      const role = memberships.get(c.groupId)?.role;
      if (!role) return false;
      const view = viewFor(
        { userId, role },
        { status: c.status, createdById: c.createdById ?? null, submittedById: c.submittedById ?? null, hasAccepted: c.acceptedSnapshot != null },
      );
      if (view === 'published' && c.acceptedSnapshot) snapshots.set(c.id, c.acceptedSnapshot);
      return view === 'working';
    });
    if (working.length === 0) continue;
    const measurements = await em.find(
      Measurement,
      { complex: { $in: working.map((c) => c.id) } },
      { populate: ['citation'], orderBy: { createdAt: 'asc', id: 'asc' } },
    );
    for (const complex of working) {
      const own = measurements
        .filter((m) => m.complex.id === complex.id)
        .map((m) => toMeasurementDto(m, m.citation ? toCitationDto(m.citation) : null));
      snapshots.set(complex.id, toSnapshot(complex, own));
    }
  }
  return ids.map((id) => snapshots.get(id)).filter((s): s is ComplexSnapshot => !!s);
}

const cell = (value: string | number | null | undefined) => (value === null || value === undefined ? '' : String(value));

export function snapshotsAsCsv(snapshots: readonly ComplexSnapshot[]): string {
  const rows: string[][] = [];
  snapshots.forEach((snapshot, index) => {
    const entry: Partial<Record<ExportCsvColumn, string>> = {
      entry: String(index + 1),
      formula: snapshot.formula,
      name: snapshot.name,
      status: snapshot.status,
      notes: cell(snapshot.notes),
    };
    const measured = snapshot.measurements.length > 0 ? snapshot.measurements : [null];
    for (const m of measured) {
      const values: Partial<Record<ExportCsvColumn, string>> = { ...entry };
      if (m) {
        // String(number) is the shortest text that reads back as the same double (ECMA-262 Number::toString).
        Object.assign(values, {
          kind: m.kind,
          value: String(m.value),
          unit: m.unit,
          temperature_K: cell(m.temperatureK),
          ionic_strength_M: cell(m.ionicStrengthM),
          medium: cell(m.medium),
          method: cell(m.method),
          partner_formula: cell(m.partnerFormula),
          measurement_notes: cell(m.notes),
        });
        if (m.citation) {
          Object.assign(values, {
            doi: cell(m.citation.doi),
            authors: m.citation.authors,
            title: cell(m.citation.title),
            journal: m.citation.journal,
            year: cell(m.citation.year),
            volume: cell(m.citation.volume),
            pages: cell(m.citation.pages),
          });
        }
      }
      rows.push(exportCsvColumns.map((column) => spreadsheetSafe(values[column] ?? '')));
    }
  });
  // Cells a spreadsheet would run as formulas carry a leading apostrophe (spreadsheet-safety.ts);
  // the importer takes it off again, so an export still imports back unchanged.
  return stringify([exportCsvColumns as unknown as string[], ...rows], { record_delimiter: '\r\n' });
}

/** The distinct citations of the exported entries, in first-seen order. */
export function citationsOf(snapshots: readonly ComplexSnapshot[]): CitationDto[] {
  const seen = new Map<string, CitationDto>();
  for (const snapshot of snapshots) for (const m of snapshot.measurements) if (m.citation && !seen.has(m.citation.id)) seen.set(m.citation.id, m.citation);
  return [...seen.values()];
}

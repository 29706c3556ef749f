import { citationKindOf } from '@/lib/schemas/library';
import type { Citation as CitationDto, ComplexSnapshot, Measurement as MeasurementDto, MeasurementUnit, PersonRef } from '@/lib/schemas/library';

/** Entities never leave server/: these turn rows into the shared DTOs. */

export interface CitationRow {
  id: string;
  groupId: string;
  doi?: string | null;
  authors: string;
  title?: string | null;
  journal: string;
  year?: number | null;
  volume?: string | null;
  pages?: string | null;
  kind?: string | null;
  publisher?: string | null;
  place?: string | null;
  url?: string | null;
}

export function toCitationDto(row: CitationRow): CitationDto {
  return {
    id: row.id,
    groupId: row.groupId,
    doi: row.doi ?? null,
    authors: row.authors,
    title: row.title ?? null,
    journal: row.journal,
    year: row.year ?? null,
    volume: row.volume ?? null,
    pages: row.pages ?? null,
    kind: citationKindOf(row.kind),
    publisher: row.publisher ?? null,
    place: row.place ?? null,
    url: row.url ?? null,
  };
}

export interface MeasurementRow {
  id: string;
  kind: MeasurementDto['kind'];
  value: number | string;
  unit: string;
  temperatureK?: number | string | null;
  ionicStrengthM?: number | string | null;
  medium?: string | null;
  method?: string | null;
  partnerFormula?: string | null;
  citationId?: string | null;
  notes?: string | null;
  createdAt: Date;
  updatedAt: Date;
}

const num = (value: number | string | null | undefined): number | null =>
  value === null || value === undefined ? null : Number(value);

export function toMeasurementDto(row: MeasurementRow, citation: CitationDto | null): MeasurementDto {
  return {
    id: row.id,
    kind: row.kind,
    value: Number(row.value),
    unit: row.unit as MeasurementUnit,
    temperatureK: num(row.temperatureK),
    ionicStrengthM: num(row.ionicStrengthM),
    medium: row.medium ?? null,
    method: row.method ?? null,
    partnerFormula: row.partnerFormula ?? null,
    citation,
    notes: row.notes ?? null,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

export interface ComplexRowForSnapshot {
  formula: string;
  name: string;
  notes?: string | null;
  status: ComplexSnapshot['status'];
  metal: string;
  oxidationState: number;
  dElectrons: number;
  spinState?: 'high' | 'low' | null;
  verdict: ComplexSnapshot['verdict'];
  ligandIds: string[];
}

export function toSnapshot(row: ComplexRowForSnapshot, measurements: MeasurementDto[]): ComplexSnapshot {
  return {
    formula: row.formula,
    name: row.name,
    notes: row.notes ?? null,
    status: row.status,
    metal: row.metal,
    oxidationState: row.oxidationState,
    dElectrons: row.dElectrons,
    spinState: row.spinState ?? null,
    verdict: row.verdict,
    ligandIds: [...row.ligandIds],
    measurements,
  };
}

export function personRef(people: ReadonlyMap<string, string>, id: string | null | undefined): PersonRef | null {
  if (!id) return null;
  return { id, displayName: people.get(id) ?? 'former member' };
}

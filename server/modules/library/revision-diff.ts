import type { ComplexSnapshot, FieldChange, Measurement, RevisionDiff } from '@/lib/schemas/library';

/** A readable, field-level diff between two snapshots of an entry (pure). */

type Scalar = string | number | boolean | null | string[];

const entryFields: (keyof Omit<ComplexSnapshot, 'measurements'>)[] = [
  'formula', 'name', 'notes', 'status', 'metal', 'oxidationState', 'dElectrons', 'spinState', 'verdict', 'ligandIds',
];

const measurementFields: (keyof Measurement)[] = [
  'kind', 'value', 'unit', 'temperatureK', 'ionicStrengthM', 'medium', 'method', 'partnerFormula', 'notes', 'citation',
];

function comparable(field: keyof Measurement, value: Measurement[keyof Measurement]): Scalar {
  if (field === 'citation') {
    const citation = value as Measurement['citation'];
    if (!citation) return null;
    return citation.doi ? `doi:${citation.doi}` : `${citation.authors}, ${citation.journal}${citation.year ? ` ${citation.year}` : ''}`;
  }
  return value as Scalar;
}

const same = (a: Scalar, b: Scalar) => JSON.stringify(a) === JSON.stringify(b);
const show = (value: Scalar) => (value === null ? '—' : Array.isArray(value) ? value.join(', ') : typeof value === 'string' ? `"${value}"` : String(value));

export function describeMeasurement(m: Measurement): string {
  const at = m.temperatureK !== null ? ` at ${m.temperatureK} K` : '';
  const partner = m.partnerFormula ? ` with ${m.partnerFormula}` : '';
  return `${m.kind} ${m.value} ${m.unit}${partner}${at}`;
}

export function diffSnapshots(from: number, to: number, before: ComplexSnapshot, after: ComplexSnapshot): RevisionDiff {
  const fields: FieldChange[] = [];
  const summary: string[] = [];
  for (const field of entryFields) {
    const a = before[field] as Scalar;
    const b = after[field] as Scalar;
    if (!same(a, b)) {
      fields.push({ field, before: a, after: b });
      summary.push(`${field}: ${show(a)} → ${show(b)}`);
    }
  }
  const beforeById = new Map(before.measurements.map((m) => [m.id, m]));
  const afterById = new Map(after.measurements.map((m) => [m.id, m]));
  const added = after.measurements.filter((m) => !beforeById.has(m.id));
  const removed = before.measurements.filter((m) => !afterById.has(m.id));
  const changed: RevisionDiff['measurements']['changed'] = [];
  for (const m of after.measurements) {
    const old = beforeById.get(m.id);
    if (!old) continue;
    const changes: FieldChange[] = [];
    for (const field of measurementFields) {
      const a = comparable(field, old[field]);
      const b = comparable(field, m[field]);
      if (!same(a, b)) changes.push({ field, before: a, after: b });
    }
    if (changes.length > 0) {
      changed.push({ id: m.id, kind: m.kind, fields: changes });
      summary.push(`~ ${m.kind}: ${changes.map((c) => `${c.field} ${show(c.before)} → ${show(c.after)}`).join('; ')}`);
    }
  }
  for (const m of added) summary.push(`+ ${describeMeasurement(m)}`);
  for (const m of removed) summary.push(`− ${describeMeasurement(m)}`);
  return { from, to, fields, measurements: { added, removed, changed }, summary };
}

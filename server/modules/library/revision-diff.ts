import { formatCelsiusFromKelvin, formatRecorded, unitText, withUnit } from '@/lib/chem/number-format';
import { measurementKindRules, type ComplexSnapshot, type ComplexStatus, type FieldChange, type Measurement, type RevisionDiff } from '@/lib/schemas/library';

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

/** The summary speaks the app's words: field labels, status words, numbers as a × 10ⁿ with units. */
const FIELD_LABELS: Record<string, string> = {
  formula: 'Formula',
  name: 'Name',
  notes: 'Notes',
  status: 'Status',
  metal: 'Metal',
  oxidationState: 'Oxidation state',
  dElectrons: 'd count',
  spinState: 'Spin',
  verdict: 'Verdict',
  ligandIds: 'Ligands',
  kind: 'kind',
  value: 'value',
  unit: 'unit',
  temperatureK: 'temperature',
  ionicStrengthM: 'ionic strength',
  medium: 'medium',
  method: 'method',
  partnerFormula: 'partner',
  citation: 'source',
};
const STATUS_WORDS: Record<ComplexStatus, string> = {
  draft: 'draft',
  'in-review': 'in review',
  accepted: 'accepted',
  returned: 'returned for revision',
  declined: 'declined',
  retired: 'retired',
};

function show(field: string, value: Scalar, unit?: string): string {
  if (value === null) return '—';
  if (Array.isArray(value)) return value.join(', ');
  if (field === 'status') return STATUS_WORDS[value as ComplexStatus] ?? String(value);
  if (field === 'kind') return measurementKindRules[value as Measurement['kind']]?.label.toLowerCase() ?? String(value);
  if (field === 'unit') return unitText(String(value));
  if (field === 'temperatureK' && typeof value === 'number') return `${formatCelsiusFromKelvin(value)} (${value} K)`;
  if (field === 'ionicStrengthM' && typeof value === 'number') return withUnit(formatRecorded(value), 'M');
  if (field === 'value' && typeof value === 'number') return unit ? withUnit(formatRecorded(value), unitText(unit)) : formatRecorded(value);
  if (field === 'oxidationState' && typeof value === 'number') return value > 0 ? `+${value}` : String(value);
  if (typeof value === 'string') return `“${value}”`;
  return String(value);
}

/** "Water exchange 2.4 × 10⁻⁶ s⁻¹ at 25 °C (298.15 K)". */
export function describeMeasurement(m: Measurement): string {
  const at = m.temperatureK !== null ? ` at ${show('temperatureK', m.temperatureK)}` : '';
  const partner = m.partnerFormula ? ` with ${m.partnerFormula}` : '';
  return `${measurementKindRules[m.kind].label} ${show('value', m.value, m.unit)}${partner}${at}`;
}

export function diffSnapshots(from: number, to: number, before: ComplexSnapshot, after: ComplexSnapshot): RevisionDiff {
  const fields: FieldChange[] = [];
  const summary: string[] = [];
  for (const field of entryFields) {
    const a = before[field] as Scalar;
    const b = after[field] as Scalar;
    if (!same(a, b)) {
      fields.push({ field, before: a, after: b });
      summary.push(`${FIELD_LABELS[field] ?? field}: ${show(field, a)} → ${show(field, b)}`);
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
      const label = measurementKindRules[m.kind].label;
      summary.push(`Changed ${label.toLowerCase()}: ${changes.map((c) => `${FIELD_LABELS[c.field] ?? c.field} ${show(c.field, c.before, m.unit)} → ${show(c.field, c.after, m.unit)}`).join('; ')}`);
    }
  }
  for (const m of added) summary.push(`Added ${describeMeasurement(m)}`);
  for (const m of removed) summary.push(`Removed ${describeMeasurement(m)}`);
  return { from, to, fields, measurements: { added, removed, changed }, summary };
}

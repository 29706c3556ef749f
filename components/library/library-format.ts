import { formatDate, formatDateTime } from '@/lib/chem/number-format';
import { duration, roman, scientific } from '@/components/ui/format';
import {
  measurementKindRules,
  type Citation,
  type Measurement,
  type MeasurementKind,
  type MeasurementUnit,
} from '@/lib/schemas/library';

/** How library values read on screen: units with real superscripts, conditions in one line. */

const UNIT_DISPLAY: Record<MeasurementUnit, string> = {
  's-1': 's⁻¹',
  'M-1 s-1': 'M⁻¹ s⁻¹',
  V: 'V',
  'cm-1': 'cm⁻¹',
  'kJ/mol': 'kJ mol⁻¹',
  'J/(mol K)': 'J K⁻¹ mol⁻¹',
  'cm3/mol': 'cm³ mol⁻¹',
  s: 's',
};

export function unitDisplay(unit: string): string {
  return UNIT_DISPLAY[unit as MeasurementUnit] ?? unit;
}

export function kindLabel(kind: MeasurementKind): string {
  const rule = measurementKindRules[kind];
  return `${rule.label} (${rule.symbol})`;
}

export function measurementValueText(measurement: Pick<Measurement, 'kind' | 'value' | 'unit'>): string {
  const value = measurement.kind === 'half-life' ? `${scientific(measurement.value)} s (${duration(measurement.value)})` : scientific(measurement.value);
  return measurement.kind === 'half-life' ? value : `${value} ${unitDisplay(measurement.unit)}`;
}

/** "25 °C (298.15 K) · I = 0.1 M · 1 M HClO4 · 17O NMR" — only what was recorded. */
export function conditionsText(measurement: Pick<Measurement, 'temperatureK' | 'ionicStrengthM' | 'medium' | 'method'>): string {
  const parts: string[] = [];
  if (measurement.temperatureK !== null) {
    parts.push(`${Number((measurement.temperatureK - 273.15).toFixed(1))} °C (${measurement.temperatureK} K)`);
  }
  if (measurement.ionicStrengthM !== null) parts.push(`I = ${measurement.ionicStrengthM} M`);
  if (measurement.medium) parts.push(measurement.medium);
  if (measurement.method) parts.push(measurement.method);
  return parts.length > 0 ? parts.join(' · ') : 'conditions not recorded';
}

/**
 * A clean reference: "L. Helm, A. E. Merbach, Chem. Rev., 2005, 105, 1923–1960"; a book
 * "A. J. Bard, R. Parsons, J. Jordan, Standard Potentials in Aqueous Solution, Marcel Dekker, New York, 1985";
 * a chapter "…, title, in Book, Publisher, 2026, 11–40"; a web page without its address.
 */
export function citationText(citation: Citation): string {
  const pages = citation.pages?.replace('-', '–');
  const kind = citation.kind ?? 'article';
  const parts =
    kind === 'book'
      ? [citation.title ?? citation.journal, citation.publisher, citation.place, citation.year]
      : kind === 'chapter'
        ? [citation.title, citation.journal ? `in ${citation.journal}` : null, citation.publisher, citation.year, pages]
        : kind === 'web-page'
          ? [citation.title, citation.journal, citation.year]
          : [citation.journal, citation.year, citation.volume, pages];
  const where = parts.filter((part) => part !== null && part !== undefined && part !== '').join(', ');
  return `${citation.authors}, ${where}`;
}

export function metalLabel(metal: string, oxidationState: number): string {
  return `${metal}(${roman(oxidationState)})`;
}

/** "just now", "5 min ago", "3 h ago", "2 days ago", then the date. */
export function relativeAge(iso: string, now: Date = new Date()): string {
  const seconds = Math.max(0, (now.getTime() - new Date(iso).getTime()) / 1000);
  if (seconds < 60) return 'just now';
  if (seconds < 3600) return `${Math.floor(seconds / 60)} min ago`;
  if (seconds < 86400) return `${Math.floor(seconds / 3600)} h ago`;
  const days = Math.floor(seconds / 86400);
  if (days < 30) return days === 1 ? '1 day ago' : `${days} days ago`;
  return formatDate(iso);
}

/** A moment in the reader's own time and locale, as every screen writes it (lib/chem/number-format.ts). */
export function dateTimeText(iso: string): string {
  return formatDateTime(iso);
}

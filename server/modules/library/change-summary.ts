import { measurementKindRules, type MeasurementKind } from '@/lib/schemas/library';

/** What one save changed, as the history line states it. */
export interface EntryChanges {
  formula: boolean;
  name: boolean;
  notes: boolean;
  added: MeasurementKind[];
  changed: MeasurementKind[];
  removed: MeasurementKind[];
}

export const noChanges = (changes: EntryChanges) =>
  !changes.formula && !changes.name && !changes.notes && changes.added.length + changes.changed.length + changes.removed.length === 0;

const kindWord = (kind: MeasurementKind) => measurementKindRules[kind].label.toLowerCase();
const article = (word: string) => (/^[aeiou]/i.test(word) ? 'an' : 'a');

/** "a water-exchange measurement", "two self-exchange measurements", "a water-exchange and an activation-volume measurement". */
function measurementsPhrase(kinds: readonly MeasurementKind[]): string {
  const counts = new Map<MeasurementKind, number>();
  for (const kind of kinds) counts.set(kind, (counts.get(kind) ?? 0) + 1);
  const numbers = ['', 'one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine'];
  const parts = [...counts.entries()].map(([kind, n]) => {
    const word = kindWord(kind);
    return n === 1 ? `${article(word)} ${word}` : `${numbers[n] ?? String(n)} ${word}`;
  });
  const plural = kinds.length > 1;
  const list = parts.length === 1 ? parts[0]! : `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
  return `${list} ${plural ? 'measurements' : 'measurement'}`;
}

/** One line in words: "Renamed; added a water-exchange measurement". Empty when nothing changed. */
export function summariseChanges(changes: EntryChanges): string {
  const parts: string[] = [];
  if (changes.formula) parts.push('changed the formula');
  if (changes.name) parts.push('renamed');
  if (changes.notes) parts.push('edited the notes');
  if (changes.added.length) parts.push(`added ${measurementsPhrase(changes.added)}`);
  if (changes.changed.length) parts.push(`changed ${measurementsPhrase(changes.changed)}`);
  if (changes.removed.length) parts.push(`removed ${measurementsPhrase(changes.removed)}`);
  const line = parts.join('; ');
  return line.charAt(0).toUpperCase() + line.slice(1);
}

/** The first revision's line: "Created", or "Created with a water-exchange measurement". */
export function summariseCreation(kinds: readonly MeasurementKind[]): string {
  return kinds.length === 0 ? 'Created' : `Created with ${measurementsPhrase(kinds)}`;
}

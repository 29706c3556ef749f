import { revisionLine } from '@/components/library/revision-history';

/** History lines say each change once, in words (common practice for a change log). */
describe('revisionLine', () => {
  it.each([
    [{ kind: 'create', message: 'Created' }, 'Created'],
    [{ kind: 'create', message: 'Created with a water exchange measurement' }, 'Created with a water exchange measurement'],
    [{ kind: 'edit', message: 'Renamed; added an activation volume measurement' }, 'Renamed; added an activation volume measurement'],
    [{ kind: 'submit', message: 'Submitted for review' }, 'Submitted for review'],
    [{ kind: 'review', message: 'Returned: give the temperature' }, 'Returned: give the temperature'],
    [{ kind: 'retire', message: 'Split into separate studies' }, 'Retired · Split into separate studies'],
  ] as const)('%j → %s', (revision, line) => {
    expect(revisionLine(revision)).toBe(line);
  });
});

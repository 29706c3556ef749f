import { fireEvent, screen, waitFor } from '@testing-library/react-native';
import { effectiveGroup, readChosenGroup } from '@/components/check/chosen-group';
import { LibraryMeasuredCard, type LibraryDecision } from '@/components/check/library-measured-card';
import { classifyFormula } from '@/lib/chem/classify';
import { mockFetch, renderWithQueries } from '../account/test-kit';

jest.mock('expo-router', () => require('../account/expo-router-mock').expoRouterMock);

/**
 * Measured decides with the group the person chose: a member of several groups picks which group's
 * library decides on Check; the last choice is kept; the default is the last-joined group.
 */

const me = {
  user: { id: 'u-7', email: 'rowan@larkspur.example.org', displayName: 'Rowan Vetch' },
  memberships: [
    { groupId: 'g-old', groupName: 'Larkspur Teaching Lab', role: 'viewer' },
    { groupId: 'g-new', groupName: 'Larkspur Coordination Lab', role: 'contributor' },
  ],
};

// k = 2.4 × 10⁻⁶ s⁻¹ for [Cr(H2O)6]3+ at 298 K (Xu, Krouse & Swaddle, Inorg. Chem. 1985, 24, 267).
function measuredAnswer(groupId: string, withValue: boolean) {
  const now = '2026-12-01T10:00:00.000Z';
  return {
    status: 200,
    body: {
      formula: '[Cr(H2O)6]3+',
      classification: classifyFormula('[Cr(H2O)6]3+'),
      libraryMeasurements: withValue
        ? [
            {
              id: `m-${groupId}`,
              kind: 'water-exchange',
              value: 2.4e-6,
              unit: 's-1',
              temperatureK: 298.15,
              ionicStrengthM: null,
              medium: null,
              method: null,
              partnerFormula: null,
              citation: null,
              notes: null,
              createdAt: now,
              updatedAt: now,
              complexId: `c-${groupId}`,
              complexFormula: '[Cr(H2O)6]3+',
              complexName: 'hexaaquachromium(III)',
            },
          ]
        : [],
    },
  };
}

beforeEach(() => globalThis.localStorage?.clear());

describe('the group whose measurements decide on Check', () => {
  it('defaults to the last-joined group, and a stored choice that is no longer one of theirs is ignored', () => {
    expect(effectiveGroup(me.memberships as never, null)?.groupId).toBe('g-new');
    expect(effectiveGroup(me.memberships as never, 'g-old')?.groupId).toBe('g-old');
    expect(effectiveGroup(me.memberships as never, 'g-gone')?.groupId).toBe('g-new');
    expect(effectiveGroup([], null)).toBeNull();
  });

  it('offers a choice when the person has several groups, asks the chosen group, and keeps the choice', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/me': { status: 200, body: me },
      'GET /api/groups/g-new/measured': measuredAnswer('g-new', false),
      'GET /api/groups/g-old/measured': measuredAnswer('g-old', true),
    });
    const decisions: LibraryDecision[] = [];
    renderWithQueries(<LibraryMeasuredCard formula="[Cr(H2O)6]3+" onDecision={(d) => decisions.push(d)} />);
    // The default group has no measurement of it: the card says so and keeps the choice in reach.
    expect(await screen.findByTestId('library-group-picker')).toBeTruthy();
    expect(await screen.findByText('No accepted measurement of this complex in Larkspur Coordination Lab.')).toBeTruthy();
    expect(calls.some((call) => call.url.includes('/groups/g-new/measured'))).toBe(true);
    expect(calls.some((call) => call.url.includes('/groups/g-old/measured'))).toBe(false);

    fireEvent.press(screen.getByTestId('library-group-g-old'));
    expect(await screen.findByText(/Open the library entry \(hexaaquachromium\(III\)\)/)).toBeTruthy();
    expect(calls.some((call) => call.url.includes('/groups/g-old/measured'))).toBe(true);
    await waitFor(() => expect(decisions.at(-1)?.measurement?.entryId).toBe('c-g-old'));
    expect(decisions.at(-1)?.measurement?.kPerSecond).toBe(2.4e-6);
    if (globalThis.localStorage) expect(readChosenGroup('u-7')).toBe('g-old');
  });

  it('shows no picker to a member of one group', async () => {
    mockFetch({
      'GET /api/auth/me': { status: 200, body: { ...me, memberships: [me.memberships[1]] } },
      'GET /api/groups/g-new/measured': measuredAnswer('g-new', true),
    });
    renderWithQueries(<LibraryMeasuredCard formula="[Cr(H2O)6]3+" />);
    expect(await screen.findByText(/Open the library entry/)).toBeTruthy();
    expect(screen.queryByTestId('library-group-picker')).toBeNull();
  });
});

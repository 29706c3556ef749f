import { fireEvent, screen, waitFor } from '@testing-library/react-native';
import { LandingActivity } from '@/components/home/landing-activity';
import { LandingScreen } from '@/components/home/landing-screen';
import { sections } from '@/components/shell/app-shell';
import { reviewQueueResponseSchema } from '@/lib/schemas/library';
import { mockFetch, renderWithQueries } from '../account/test-kit';
import { routerCalls } from '../account/expo-router-mock';
import { contributorMe, curatorMe, listItem, listResponse, viewerMe } from '../library/library-fixtures';

jest.mock('expo-router', () => require('../account/expo-router-mock').expoRouterMock);
// The deferred chunk stands in as a marker: the signed-in lists are tested on LandingActivity itself.
jest.mock('@/components/deferred/load-screens', () => ({
  loadScreens: jest.fn(async () => {
    const { Text: Marker } = jest.requireActual<typeof import('react-native')>('react-native');
    return { LandingActivity: () => <Marker testID="activity-loaded">activity</Marker> };
  }),
}));

beforeEach(() => {
  routerCalls.push.mockClear();
});

describe('LandingScreen', () => {
  it('does not repeat the navigation: no tile per section, no section hints', async () => {
    mockFetch({ 'GET /api/auth/me': { status: 401 } });
    renderWithQueries(<LandingScreen />);
    await screen.findByTestId('landing-visitor');
    for (const section of sections) {
      expect(screen.queryByText(section.hint)).toBeNull();
    }
    // What it offers instead: start a Check or a Route from here.
    expect(screen.getByTestId('landing-check')).toBeTruthy();
    expect(screen.getByTestId('landing-route')).toBeTruthy();
  });

  it('starts a Check with the formula typed here, and an empty field opens Check as it is', async () => {
    mockFetch({ 'GET /api/auth/me': { status: 401 } });
    renderWithQueries(<LandingScreen />);
    fireEvent.press(screen.getByTestId('landing-check-submit'));
    expect(routerCalls.push).toHaveBeenLastCalledWith('/check');
    fireEvent.changeText(screen.getByTestId('landing-formula'), '  [Ni(NH3)6]2+ ');
    fireEvent.press(screen.getByTestId('landing-check-submit'));
    expect(routerCalls.push).toHaveBeenLastCalledWith({ pathname: '/check', params: { formula: '[Ni(NH3)6]2+' } });
  });

  it('offers a visitor the way in, and a signed-in person their own lists instead', async () => {
    mockFetch({ 'GET /api/auth/me': { status: 401 } });
    const visitor = renderWithQueries(<LandingScreen />);
    expect(await screen.findByTestId('landing-sign-in')).toBeTruthy();
    expect(screen.queryByTestId('activity-loaded')).toBeNull();
    visitor.unmount();

    mockFetch({ 'GET /api/auth/me': { status: 200, body: viewerMe } });
    renderWithQueries(<LandingScreen />);
    expect(await screen.findByTestId('activity-loaded')).toBeTruthy();
    expect(screen.queryByTestId('landing-sign-in')).toBeNull();
  });
});

const queue = reviewQueueResponseSchema.parse({
  total: 1,
  items: [
    {
      ...listItem({ id: 'c-waiting', formula: '[Co(NH3)5(OH2)]3+', name: 'pentaammineaquacobalt(III)', status: 'in-review' }),
      groupName: 'Larkspur Coordination Lab',
      submittedBy: { id: 'u-student', displayName: 'Ada Fenwick' },
      submittedAt: '2026-01-04T08:00:00.000Z',
      isEditOfApproved: false,
    },
  ],
});

describe('LandingActivity', () => {
  it('shows a curator what waits for review, and only their own drafts', async () => {
    const mineDraft = listItem({ id: 'c-mine', formula: '[V(H2O)6]2+', name: 'hexaaquavanadium(II)', status: 'draft', createdBy: { id: 'u-curator', displayName: 'Milo Reed' } });
    const theirDraft = listItem({ id: 'c-theirs', formula: '[Ni(H2O)6]2+', name: 'hexaaquanickel(II)', status: 'draft' });
    // Answers by status: drafts for status=draft, nothing returned, and the whole library otherwise.
    const byStatus = (url: string) =>
      url.includes('status=draft') ? listResponse([mineDraft, theirDraft]) : url.includes('status=returned') ? listResponse([]) : listResponse([listItem()], 64);
    const fetched = mockFetch({
      'GET /api/auth/me': { status: 200, body: curatorMe },
      'GET /api/review-queue': { status: 200, body: queue },
      'GET /api/complexes': () => ({ status: 200, body: byStatus(fetched.calls.at(-1)?.url ?? '') }),
    });
    renderWithQueries(<LandingActivity />);
    expect(await screen.findByTestId('landing-mine-list')).toBeTruthy();
    expect(screen.getByTestId('landing-entry-c-mine')).toBeTruthy();
    expect(screen.queryByTestId('landing-entry-c-theirs')).toBeNull();
    expect(await screen.findByTestId('landing-entry-c-waiting')).toBeTruthy();
    expect(screen.getByTestId('landing-review-count')).toHaveTextContent('One entry waits, oldest first.');
    await waitFor(() => expect(screen.getByTestId('landing-library-size')).toHaveTextContent(/64 entries in Larkspur Coordination Lab/));
    // The library's latest changes come from the server's newest-first order.
    const recent = fetched.calls.find((call) => call.url.startsWith('/api/complexes?') && !call.url.includes('status='));
    expect(recent?.url).toContain('sort=updated');
    expect(recent?.url).toContain('dir=desc');
    expect(screen.getByTestId('landing-recent-list')).toBeTruthy();
  });

  it('has no review list and no drafts for a viewer, who cannot write or review', async () => {
    mockFetch({
      'GET /api/auth/me': { status: 200, body: viewerMe },
      'GET /api/complexes': { status: 200, body: listResponse([listItem()], 1) },
    });
    renderWithQueries(<LandingActivity />);
    await waitFor(() => expect(screen.getByTestId('landing-library-size')).toHaveTextContent(/One entry in Larkspur Coordination Lab/));
    expect(screen.queryByTestId('landing-review')).toBeNull();
    expect(screen.queryByTestId('landing-mine')).toBeNull();
  });

  it('tells a contributor with nothing in progress how a draft starts', async () => {
    mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/complexes': { status: 200, body: listResponse([], 0) },
    });
    renderWithQueries(<LandingActivity />);
    expect(await screen.findByTestId('landing-mine-empty')).toBeTruthy();
    expect(screen.queryByTestId('landing-review')).toBeNull();
  });
});

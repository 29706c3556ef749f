import { act, fireEvent, screen, waitFor } from '@testing-library/react-native';
import { LibraryScreen } from '@/components/library/library-screen';
import { apiError, mockFetch, renderWithQueries, type CannedResponse } from '../account/test-kit';
import { contributorMe, listItem, listResponse, viewerMe } from './library-fixtures';

jest.mock('expo-router', () => require('../account/expo-router-mock').expoRouterMock);
// FlashList measures real layout; a FlatList renders the same rows in a test renderer.
jest.mock('@shopify/flash-list', () => ({ FlashList: require('react-native').FlatList }));

const chromium = listItem();
const cobalt = listItem({
  id: 'c-co-ammine',
  formula: '[Co(NH3)6]3+',
  name: 'hexaamminecobalt(III)',
  metal: 'Co',
  dElectrons: 6,
  spinState: 'low',
  ligandIds: ['NH3'],
  status: 'in-review',
});

function renderLibrary(onSelect = jest.fn()) {
  return renderWithQueries(<LibraryScreen onSelect={onSelect} />);
}

describe('LibraryScreen', () => {
  it('asks signed-out people to sign in, with the way back to the library', async () => {
    mockFetch({ 'GET /api/auth/me': apiError(401, 'UNAUTHENTICATED', 'Sign in first.') });
    renderLibrary();
    expect(await screen.findByTestId('library-signed-out')).toHaveTextContent(/Sign in to see your group’s library/);
    expect(screen.getByTestId('library-sign-in')).toHaveTextContent('Sign in to see your group’s library');
  });

  it('lists entries with formula sub/superscripts, verdict and status, and opens one', async () => {
    mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/complexes': { status: 200, body: listResponse([chromium, cobalt]) },
    });
    const onSelect = jest.fn();
    renderLibrary(onSelect);
    expect(await screen.findByTestId('library-item-1')).toBeTruthy();
    expect(screen.getByTestId('library-item-0-formula')).toHaveTextContent('[Cr(H₂O)₆]³⁺');
    expect(screen.getByTestId('library-item-1')).toHaveTextContent(/Co\(III\) · d6 low-spin/);
    expect(screen.getByTestId('library-count')).toHaveTextContent('2 of 2 entries');
    expect(screen.getAllByTestId('status-pill-in-review')).toHaveLength(1);
    fireEvent.press(screen.getByTestId('library-item-1'));
    expect(onSelect).toHaveBeenCalledWith('c-co-ammine');
  });

  it('past the server’s count cap the heading says "1,000+ entries" and more can be loaded', async () => {
    // Server pages of one entry; the server stopped counting at 1 000.
    const page1 = listResponse([chromium], 1000, 1, 1, true);
    const page2 = listResponse([cobalt], 1000, 2, 1, true);
    mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/complexes': (() => {
        let n = 0;
        return () => ({ status: 200, body: n++ === 0 ? page1 : page2 });
      })(),
    });
    renderLibrary();
    const loadMore = await screen.findByTestId('library-load-more');
    expect(screen.getByTestId('library-count')).toHaveTextContent('1 of 1,000+ entries');
    expect(loadMore).toHaveTextContent('Load more (1 of 1,000+)');
    fireEvent.press(loadMore);
    expect(await screen.findByTestId('library-item-1')).toHaveTextContent(/hexaamminecobalt/);
    expect(screen.getByTestId('library-count')).toHaveTextContent('2 of 1,000+ entries');
  });

  it('an exact total of a thousand or more is written with a separator and no plus', async () => {
    mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/complexes': { status: 200, body: listResponse([chromium, cobalt], 1001, 51, 20) },
    });
    renderLibrary();
    expect(await screen.findByTestId('library-item-1')).toBeTruthy();
    expect(screen.getByTestId('library-count')).toHaveTextContent('2 of 1,001 entries');
    expect(screen.queryByTestId('library-load-more')).toBeNull();
  });

  it('narrows the loaded page at once while the server search is still pending', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/complexes': { status: 200, body: listResponse([chromium, cobalt]) },
    });
    renderLibrary();
    await screen.findByTestId('library-item-1');
    fireEvent.changeText(screen.getByTestId('library-search'), 'cobalt');
    // No new request yet (debounced), but the list already shows only the match.
    expect(calls.filter((c) => c.url.startsWith('/api/complexes?'))).toHaveLength(1);
    expect(screen.getByTestId('library-item-0')).toHaveTextContent(/hexaamminecobalt/);
    expect(screen.queryByTestId('library-item-1')).toBeNull();
    await waitFor(() => expect(calls.some((c) => c.url.includes('q=cobalt'))).toBe(true));
  });

  it('sends filters to the server search', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/complexes': { status: 200, body: listResponse([chromium]) },
    });
    renderLibrary();
    await screen.findByTestId('library-item-0');
    fireEvent.press(screen.getByTestId('library-filters-toggle'));
    fireEvent.press(screen.getByTestId('library-filter-verdict-inert'));
    fireEvent.press(screen.getByTestId('library-filter-d-3'));
    await waitFor(() => expect(calls.some((c) => c.url.includes('verdict=inert') && c.url.includes('dCount=3'))).toBe(true));
  });

  it('offers the filter options the server lists for what the person may see, not those of the loaded page', async () => {
    // The page holds only the chromium entry; the server says the library also holds nickel.
    const facets = {
      metals: [{ value: 'Cr', count: 1 }, { value: 'Ni', count: 2 }],
      oxidationStates: [{ value: 2, count: 2 }, { value: 3, count: 1 }],
      dCounts: [{ value: 3, count: 1 }, { value: 8, count: 2 }],
      ligands: [{ value: 'H2O', count: 1 }, { value: 'NH3', count: 2 }],
      measurementKinds: [{ value: 'water-exchange', count: 1 }],
      statuses: [{ value: 'accepted', count: 3 }],
    };
    const { calls } = mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/complexes': { status: 200, body: listResponse([chromium]) },
      'GET /api/complexes/facets': { status: 200, body: facets },
    });
    renderLibrary();
    await screen.findByTestId('library-item-0');
    fireEvent.press(screen.getByTestId('library-filters-toggle'));
    expect(await screen.findByTestId('library-filter-metal-Ni')).toBeTruthy();
    expect(screen.queryByTestId('library-filter-metal-Pt')).toBeNull();
    expect(screen.getByTestId('library-filter-d-8')).toBeTruthy();
    expect(screen.queryByTestId('library-filter-d-6')).toBeNull();
    expect(screen.queryByTestId('library-filter-ox-4')).toBeNull();
    expect(screen.queryByTestId('library-filter-kind-ligand-exchange')).toBeNull();
    expect(screen.getByTestId('library-filter-status-accepted')).toBeTruthy();
    expect(screen.queryByTestId('library-filter-status-draft')).toBeNull();
    fireEvent.press(screen.getByTestId('library-filter-ligand-NH3'));
    await waitFor(() => expect(calls.some((c) => c.url.startsWith('/api/complexes?') && c.url.includes('ligand=NH3'))).toBe(true));
    expect(screen.getByTestId('library-filter-active-ligand')).toHaveTextContent(/ligand NH3/);
  });

  it('invites contributors to add the first complex when the library is empty', async () => {
    mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/complexes': { status: 200, body: listResponse([]) },
    });
    renderLibrary();
    expect(await screen.findByTestId('library-empty')).toHaveTextContent(/No entries yet — add the first complex/);
    expect(screen.getByTestId('library-add-first')).toBeTruthy();
  });

  it('tells viewers how entries arrive, without an add button', async () => {
    mockFetch({
      'GET /api/auth/me': { status: 200, body: viewerMe },
      'GET /api/complexes': { status: 200, body: listResponse([]) },
    });
    renderLibrary();
    expect(await screen.findByTestId('library-empty')).toHaveTextContent(/No accepted entries yet/);
    expect(screen.queryByTestId('library-add-first')).toBeNull();
    expect(screen.queryByTestId('library-new')).toBeNull();
  });

  it('loads the next page on request', async () => {
    // A server page of one entry (pageSize 1) out of two.
    const page1 = listResponse([chromium], 2, 1, 1);
    const page2 = listResponse([cobalt], 2, 2, 1);
    mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/complexes': (() => {
        let n = 0;
        return () => ({ status: 200, body: n++ === 0 ? page1 : page2 });
      })(),
    });
    renderLibrary();
    fireEvent.press(await screen.findByTestId('library-load-more'));
    expect(await screen.findByTestId('library-item-1')).toHaveTextContent(/hexaamminecobalt/);
    expect(screen.getByTestId('library-count')).toHaveTextContent('2 of 2 entries');
  });

  it('keeps the loaded entries on screen when a refresh fails', async () => {
    let answer: CannedResponse = { status: 200, body: listResponse([chromium]) };
    mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/complexes': () => answer,
    });
    const { client } = renderLibrary();
    await screen.findByTestId('library-item-0');
    answer = apiError(503, 'UNAVAILABLE', 'The database is not answering.');
    await act(async () => {
      await client.refetchQueries({ queryKey: ['complexes'] });
    });
    expect(await screen.findByTestId('library-stale')).toHaveTextContent(/Could not refresh/);
    expect(screen.getByTestId('library-item-0')).toHaveTextContent(/hexaaquachromium/);
  });

  it('on a phone the order is chosen in the filters panel and asked of the server', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/complexes': { status: 200, body: listResponse([chromium, cobalt]) },
    });
    renderLibrary();
    await screen.findByTestId('library-item-1');
    expect(screen.queryByTestId('library-table')).toBeNull();
    fireEvent.press(screen.getByTestId('library-filters-toggle'));
    fireEvent.press(screen.getByTestId('library-order-updated'));
    await waitFor(() => expect(calls.some((c) => c.url.includes('sort=updated') && c.url.includes('dir=desc'))).toBe(true));
    expect(screen.getByTestId('library-order-updated')).toBeSelected();
  });
});

import { fireEvent, render, screen, waitFor } from '@testing-library/react-native';
import { LibraryTable, type LibraryTableProps } from '@/components/library/library-table';
import { shownColumns } from '@/components/library/library-table-columns';
import { libraryUrlParams, readLibraryUrl } from '@/components/library/library-url-state';
import { LibraryScreen } from '@/components/library/library-screen';
import { libraryColumnKeys } from '@/lib/schemas/library';
import { mockFetch, renderWithQueries } from '../account/test-kit';
import { contributorMe, listItem, listResponse } from './library-fixtures';

jest.mock('expo-router', () => require('../account/expo-router-mock').expoRouterMock);
jest.mock('@shopify/flash-list', () => ({ FlashList: require('react-native').FlatList }));
// The table is the wide layout.
jest.mock('@/components/ui/use-wide-layout', () => ({ useWideLayout: () => true }));

// [Cr(H2O)6]3+ k_ex = 2.4 × 10⁻⁶ s⁻¹ (Xu, Krouse & Swaddle, Inorg. Chem. 1985, 24, 267).
const chromium = listItem({ headlineRate: { kind: 'water-exchange', kPerSecond: 2.4e-6, temperatureK: 298.15 } });
// A half-life of 2 h recorded as the only rate: k = ln 2 / 7200 s.
const cobalt = listItem({
  id: 'c-co-ammine',
  formula: '[Co(NH3)6]3+',
  name: 'hexaamminecobalt(III)',
  metal: 'Co',
  oxidationState: 3,
  dElectrons: 6,
  status: 'in-review',
  measurementCount: 3,
  headlineRate: { kind: 'half-life', kPerSecond: Math.LN2 / 7200, temperatureK: 298.15 },
});
const nickel = listItem({ id: 'c-ni', formula: '[Ni(NH3)6]2+', name: 'hexaamminenickel(II)', metal: 'Ni', oxidationState: 2, dElectrons: 8, verdict: 'labile', measurementCount: 0, headlineRate: null });

function table(overrides: Partial<LibraryTableProps> = {}) {
  const props: LibraryTableProps = {
    items: [chromium, cobalt, nickel],
    columns: [...libraryColumnKeys],
    sort: undefined,
    dir: undefined,
    searching: false,
    onSort: jest.fn(),
    selected: new Set(),
    onToggle: jest.fn(),
    onToggleAll: jest.fn(),
    onOpen: jest.fn(),
    total: 3,
    ...overrides,
  };
  render(<LibraryTable {...props} />);
  return props;
}

describe('LibraryTable', () => {
  it('is a table of rows and cells with every column’s header, one row per entry', () => {
    table();
    expect(screen.getByTestId('library-table').props.role).toBe('table');
    expect(screen.getByTestId('library-row-0').props.role).toBe('row');
    for (const column of libraryColumnKeys) expect(screen.getByTestId(`library-column-${column}`).props.role).toBe('columnheader');
    const cobaltRow = screen.getByTestId('library-row-1');
    expect(cobaltRow).toHaveTextContent(/\[Co\(NH₃\)₆\]³⁺/);
    expect(cobaltRow).toHaveTextContent(/hexaamminecobalt\(III\)/);
    expect(cobaltRow).toHaveTextContent(/Co\(III\)/);
    expect(cobaltRow).toHaveTextContent(/d6/);
    expect(cobaltRow).toHaveTextContent(/In review/);
    // The half-life decided: t½ = 2 h.
    expect(cobaltRow).toHaveTextContent(/t½ 2\.0 h/);
    // k_ex as a × 10ⁿ with its unit.
    expect(screen.getByTestId('library-row-0')).toHaveTextContent(/2\.4 × 10⁻⁶ s⁻¹/);
    expect(screen.getByTestId('library-row-2')).toHaveTextContent(/—/);
  });

  it('shows only the chosen columns', () => {
    table({ columns: ['formula', 'verdict'] });
    expect(screen.getByTestId('library-column-verdict')).toBeTruthy();
    expect(screen.queryByTestId('library-column-name')).toBeNull();
    expect(screen.getByTestId('library-row-1')).not.toHaveTextContent(/hexaamminecobalt/);
  });

  it('marks the order with aria-sort: name ascending by default, nothing while ranked by relevance, the chosen column otherwise', () => {
    table();
    expect(screen.getByTestId('library-column-name').props['aria-sort']).toBe('ascending');
    expect(screen.getByTestId('library-column-updated').props['aria-sort']).toBe('none');
    // The rate column cannot be ordered by the server: no aria-sort, no button.
    expect(screen.getByTestId('library-column-rate').props['aria-sort']).toBeUndefined();
    expect(screen.queryByTestId('library-sort-rate')).toBeNull();
  });

  it('says descending for a descending order and asks for the other direction when pressed again', () => {
    const props = table({ sort: 'updated', dir: 'desc' });
    expect(screen.getByTestId('library-column-updated').props['aria-sort']).toBe('descending');
    expect(screen.getByTestId('library-column-name').props['aria-sort']).toBe('none');
    fireEvent.press(screen.getByTestId('library-sort-updated'));
    expect(props.onSort).toHaveBeenLastCalledWith('updated', 'asc');
    fireEvent.press(screen.getByTestId('library-sort-verdict'));
    expect(props.onSort).toHaveBeenLastCalledWith('verdict', 'asc');
  });

  it('while searching without a chosen order, no header claims an order', () => {
    table({ searching: true });
    expect(screen.getByTestId('library-column-name').props['aria-sort']).toBe('none');
  });

  it('ticks a row without opening it, opens it when the row is pressed, and selects the whole page', () => {
    const props = table({ selected: new Set([cobalt.id]) });
    expect(screen.getByTestId('library-select-1')).toBeChecked();
    expect(screen.getByTestId('library-select-0')).not.toBeChecked();
    expect(screen.getByTestId('library-select-all')).toBePartiallyChecked();
    fireEvent.press(screen.getByTestId('library-select-0'));
    expect(props.onToggle).toHaveBeenCalledWith(chromium.id);
    expect(props.onOpen).not.toHaveBeenCalled();
    fireEvent.press(screen.getByTestId('library-row-2'));
    expect(props.onOpen).toHaveBeenCalledWith(nickel.id);
    fireEvent.press(screen.getByTestId('library-select-all'));
    expect(props.onToggleAll).toHaveBeenCalledWith(true);
  });
});

describe('the list’s state in the address', () => {
  it('reads search, filters, order and pages, and drops what the list query would refuse', () => {
    const state = readLibraryUrl({ q: 'cobalt', metal: 'Co', dCount: '6', verdict: 'sticky', sort: 'updated', dir: 'desc', pages: '3', hasCitation: 'true' });
    expect(state).toEqual({ filters: { q: 'cobalt', metal: 'Co', dCount: 6, hasCitation: true }, sort: 'updated', dir: 'desc', pages: 3 });
    expect(readLibraryUrl({ sort: 'colour', dir: 'desc', pages: '-2' })).toEqual({ filters: {}, sort: undefined, dir: undefined, pages: 1 });
    expect(readLibraryUrl({ pages: '500' }).pages).toBe(10);
  });

  it('writes every key (absent ones as undefined, so they leave the address) and reads back the same state', () => {
    const params = libraryUrlParams({ filters: { q: 'amm', oxidationState: 3 }, sort: 'name', dir: 'desc', pages: 2 });
    expect(params).toMatchObject({ q: 'amm', oxidationState: '3', sort: 'name', dir: 'desc', pages: '2', metal: undefined, verdict: undefined });
    expect(Object.keys(params)).toContain('metal');
    const back = readLibraryUrl(params);
    expect(back).toEqual({ filters: { q: 'amm', oxidationState: 3 }, sort: 'name', dir: 'desc', pages: 2 });
    expect(libraryUrlParams({ filters: {}, pages: 1 }).pages).toBeUndefined();
  });

  it('shown columns: every column without a choice, the formula always', () => {
    expect(shownColumns(null)).toEqual([...libraryColumnKeys]);
    expect(shownColumns(['updated', 'name'])).toEqual(['formula', 'name', 'updated']);
  });
});

describe('LibraryScreen on a wide screen', () => {
  it('"Load more" asks for exactly the next page, once, even when pressed twice', async () => {
    const pages = [listResponse([chromium], 3, 1, 1), listResponse([cobalt], 3, 2, 1), listResponse([nickel], 3, 3, 1)];
    const { calls } = mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/auth/me/preferences': { status: 200, body: { reviewSubmissions: true, reviewDecisions: true, libraryColumns: null } },
      'GET /api/complexes/facets': { status: 404, body: { error: { code: 'NOT_FOUND', message: 'none' } } },
      'GET /api/complexes': () => {
        const page = Number(new URL(calls.at(-1)!.url, 'http://x').searchParams.get('page'));
        return { status: 200, body: pages[page - 1]! };
      },
    });
    renderWithQueries(<LibraryScreen onSelect={jest.fn()} />);
    await screen.findByTestId('library-row-0');
    const listCalls = () => calls.filter((c) => c.url.startsWith('/api/complexes?')).map((c) => new URL(c.url, 'http://x').searchParams.get('page'));
    expect(listCalls()).toEqual(['1']);
    const more = screen.getByTestId('library-load-more');
    fireEvent.press(more);
    fireEvent.press(more);
    await screen.findByTestId('library-row-1');
    await waitFor(() => expect(screen.getByTestId('library-count')).toHaveTextContent('2 of 3 entries'));
    expect(listCalls()).toEqual(['1', '2']);
    fireEvent.press(screen.getByTestId('library-load-more'));
    await screen.findByTestId('library-row-2');
    expect(listCalls()).toEqual(['1', '2', '3']);
    expect(screen.queryByTestId('library-load-more')).toBeNull();
  });

  it('sorting from a header asks the server for that order, and ticked rows are what the export sends', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/auth/me/preferences': { status: 200, body: { reviewSubmissions: true, reviewDecisions: true, libraryColumns: null } },
      'GET /api/complexes': { status: 200, body: listResponse([chromium, cobalt]) },
    });
    renderWithQueries(<LibraryScreen onSelect={jest.fn()} />);
    await screen.findByTestId('library-row-1');
    fireEvent.press(screen.getByTestId('library-sort-updated'));
    await waitFor(() => expect(calls.some((c) => c.url.includes('sort=updated') && c.url.includes('dir=asc'))).toBe(true));
    expect(screen.getByTestId('library-column-updated').props['aria-sort']).toBe('ascending');
    fireEvent.press(screen.getByTestId('library-select-1'));
    expect(screen.getByTestId('library-count')).toHaveTextContent(/1 selected/);
    fireEvent.press(screen.getByTestId('library-export'));
    const csv = screen.getByTestId('library-export-csv');
    expect(csv.props.href).toMatch(new RegExp(`ids=${cobalt.id}$`));
  });
});

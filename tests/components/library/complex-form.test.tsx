import { fireEvent, screen, waitFor } from '@testing-library/react-native';
import { ComplexFormScreen } from '@/components/library/complex-form';
import { apiError, mockFetch, renderWithQueries } from '../account/test-kit';
import { routerCalls } from '../account/expo-router-mock';
import { contributorMe, detail } from './library-fixtures';

jest.mock('expo-router', () => require('../account/expo-router-mock').expoRouterMock);

beforeEach(() => jest.clearAllMocks());

describe('ComplexFormScreen (new entry)', () => {
  it('checks the formula live and points at the character the engine cannot read', async () => {
    mockFetch({ 'GET /api/auth/me': { status: 200, body: contributorMe } });
    renderWithQueries(<ComplexFormScreen mode="create" />);
    fireEvent.changeText(await screen.findByTestId('complex-form-formula'), '[Co(NH3)6]3+');
    // Co(III) with six ammines is low-spin d6 and inert (common practice: Taube's classification).
    expect(await screen.findByTestId('complex-form-preview')).toHaveTextContent(/Co\(III\) · d6 low-spin/);
    expect(screen.getByTestId('complex-form-preview')).toHaveTextContent(/inert/);
    fireEvent.changeText(screen.getByTestId('complex-form-formula'), '[Co(NH3)6');
    expect(await screen.findByTestId('complex-form-formula-problem')).toHaveTextContent(/character \d+/);
    expect(screen.queryByTestId('complex-form-preview')).toBeNull();
  });

  it('suggests an IUPAC-style name from the formula, never over what is typed, and fills it in one tap', async () => {
    mockFetch({ 'GET /api/auth/me': { status: 200, body: contributorMe } });
    renderWithQueries(<ComplexFormScreen mode="create" />);
    const name = await screen.findByTestId('complex-form-name');
    fireEvent.changeText(name, 'cobalt sample B');
    fireEvent.changeText(screen.getByTestId('complex-form-formula'), '[Co(NH3)5Cl]2+');
    // IUPAC 2005 Recommendations, IR-9 (from memory): pentaamminechloridocobalt(III).
    expect(await screen.findByTestId('complex-form-name-suggestion')).toHaveTextContent(/^Suggested from the formula: pentaamminechloridocobalt\(III\)Use this name$/);
    expect(screen.getByTestId('complex-form-name')).toHaveProp('value', 'cobalt sample B');
    expect(screen.getByTestId('complex-form-use-name')).toHaveProp('accessibilityLabel', 'Use this name: pentaamminechloridocobalt(III)');
    fireEvent.press(screen.getByTestId('complex-form-use-name'));
    expect(screen.getByTestId('complex-form-name')).toHaveProp('value', 'pentaamminechloridocobalt(III)');
    expect(screen.queryByTestId('complex-form-name-suggestion')).toBeNull();
    // Still editable after the tap.
    fireEvent.changeText(screen.getByTestId('complex-form-name'), 'pentaamminechloridocobalt(III) chloride');
    expect(screen.getByTestId('complex-form-name')).toHaveProp('value', 'pentaamminechloridocobalt(III) chloride');
    // A ligand the naming does not know: no suggestion rather than a doubtful one.
    fireEvent.changeText(screen.getByTestId('complex-form-formula'), '[Fe(Cp)2]');
    await waitFor(() => expect(screen.getByTestId('complex-form-preview')).toHaveTextContent(/Fe/));
    expect(screen.queryByTestId('complex-form-name-suggestion')).toBeNull();
  });

  it('shows examples as hints under the fields, never as placeholders that look like values', async () => {
    mockFetch({ 'GET /api/auth/me': { status: 200, body: contributorMe } });
    renderWithQueries(<ComplexFormScreen mode="create" />);
    await screen.findByTestId('complex-form-formula');
    fireEvent.press(screen.getByTestId('complex-form-add-measurement'));
    for (const id of ['complex-form-formula', 'complex-form-name', 'complex-form-notes', 'complex-form-m-0-value', 'complex-form-m-0-medium', 'complex-form-m-0-doi', 'complex-form-m-0-notes']) {
      expect(screen.getByTestId(id).props.placeholder).toBeUndefined();
    }
    expect(screen.getByTestId('complex-form-formula-hint')).toHaveTextContent(/Example: \[Cr\(H2O\)6\]3\+/);
    expect(screen.getByTestId('complex-form-m-0-notes')).toHaveProp('multiline', true);
  });

  it('applies the shared measurement rules per kind before sending anything', async () => {
    const { fetchMock } = mockFetch({ 'GET /api/auth/me': { status: 200, body: contributorMe } });
    renderWithQueries(<ComplexFormScreen mode="create" />);
    fireEvent.changeText(await screen.findByTestId('complex-form-formula'), '[Cr(H2O)6]3+');
    fireEvent.changeText(screen.getByTestId('complex-form-name'), 'hexaaquachromium(III)');
    fireEvent.press(screen.getByTestId('complex-form-add-measurement'));
    // The unit shown follows the kind: water exchange is first order.
    expect(screen.getByTestId('complex-form-m-0-unit-s-1')).toBeTruthy();
    fireEvent.changeText(screen.getByTestId('complex-form-m-0-value'), '-2');
    fireEvent.press(screen.getByTestId('complex-form-save'));
    // Wording from measurementKindRules / checkMeasurement in lib/schemas/library.ts.
    expect(await screen.findByTestId('complex-form-m-0-value-error')).toHaveTextContent('Water exchange (kₑₓ) must be greater than zero.');
    // Cross reactions need their partner.
    fireEvent.press(screen.getByTestId('complex-form-m-0-kind-cross-reaction'));
    expect(screen.getByTestId('complex-form-m-0-unit-M-1 s-1')).toBeTruthy();
    fireEvent.changeText(screen.getByTestId('complex-form-m-0-value'), '3e3');
    fireEvent.press(screen.getByTestId('complex-form-save'));
    expect(await screen.findByTestId('complex-form-m-0-partner-error')).toHaveTextContent('A cross reaction (k12) needs the formula of its partner.');
    // Nothing is written: only the read-only lookup of the same species may have gone out.
    expect(fetchMock.mock.calls.filter(([url, init]) => String(url).startsWith('/api/complexes') && ((init as { method?: string } | undefined)?.method ?? 'GET') !== 'GET')).toHaveLength(0);
  });

  it('sends the entry with its measurement and cited source, and puts server field problems on their fields', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'POST /api/complexes': apiError(400, 'VALIDATION_FAILED', 'The request body is not valid.', {
        'measurements.0.citation.journal': 'Give the journal or book.',
      }),
    });
    renderWithQueries(<ComplexFormScreen mode="create" />);
    fireEvent.changeText(await screen.findByTestId('complex-form-formula'), '[Cr(H2O)6]3+');
    fireEvent.changeText(screen.getByTestId('complex-form-name'), 'hexaaquachromium(III)');
    fireEvent.press(screen.getByTestId('complex-form-add-measurement'));
    // [Cr(H2O)6]3+ water exchange 2.4e-6 s-1 at 298 K (Xu, Krouse & Swaddle, Inorg. Chem. 1985, 24, 267).
    fireEvent.changeText(screen.getByTestId('complex-form-m-0-value'), '2.4e-6');
    fireEvent.changeText(screen.getByTestId('complex-form-m-0-authors'), 'F.-C. Xu, H. R. Krouse, T. W. Swaddle');
    fireEvent.changeText(screen.getByTestId('complex-form-m-0-journal'), 'Inorg. Chem.');
    fireEvent.changeText(screen.getByTestId('complex-form-m-0-year'), '1985');
    fireEvent.press(screen.getByTestId('complex-form-save'));
    expect(await screen.findByTestId('complex-form-m-0-journal-error')).toHaveTextContent('Give the journal or book.');
    const sent = calls.find((c) => c.method === 'POST')?.body as { groupId: string; measurements: { value: number; unit: string; temperatureK: number; citation: { year: number } }[] };
    expect(sent.groupId).toBe(contributorMe.memberships[0]?.groupId);
    expect(sent.measurements[0]).toMatchObject({ value: 2.4e-6, unit: 's-1', temperatureK: 298.15, citation: { year: 1985 } });
    expect(screen.queryByTestId('complex-form-error')).toBeNull();
  });
});

describe('ComplexFormScreen (same species)', () => {
  it('offers the entry of the same species already in the group, and still lets the person save', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/complexes/duplicates': {
        status: 200,
        body: { duplicates: [{ id: 'c-cr-aqua', name: 'hexaaquachromium(III)', formula: '[Cr(H2O)6]3+', status: 'accepted' }] },
      },
    });
    renderWithQueries(<ComplexFormScreen mode="create" />);
    fireEvent.changeText(await screen.findByTestId('complex-form-formula'), '[Cr(OH2)6](ClO4)3');
    const notice = await screen.findByTestId('complex-form-duplicates');
    expect(notice).toHaveTextContent(/This species is already in the library/);
    expect(notice).toHaveTextContent(/hexaaquachromium\(III\)/);
    expect(screen.getByTestId('complex-form-duplicate-c-cr-aqua')).toBeTruthy();
    const asked = calls.find((c) => c.url.startsWith('/api/complexes/duplicates'));
    expect(new URLSearchParams(asked!.url.split('?')[1]).get('formula')).toBe('[Cr(OH2)6](ClO4)3');
    expect(screen.getByTestId('complex-form-save')).toBeTruthy();
  });
});

describe('ComplexFormScreen (kind of source)', () => {
  it('sends a book with its publisher and place and no journal (Bard, Parsons & Jordan, Standard Potentials in Aqueous Solution, Marcel Dekker, New York, 1985)', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'POST /api/complexes': apiError(400, 'VALIDATION_FAILED', 'The request body is not valid.', { formula: 'stop here' }),
    });
    renderWithQueries(<ComplexFormScreen mode="create" />);
    fireEvent.changeText(await screen.findByTestId('complex-form-formula'), '[Fe(H2O)6]3+');
    fireEvent.changeText(screen.getByTestId('complex-form-name'), 'hexaaquairon(III)');
    fireEvent.press(screen.getByTestId('complex-form-add-measurement'));
    fireEvent.press(screen.getByTestId('complex-form-m-0-kind-reduction-potential'));
    // E°(Fe3+/Fe2+) = 0.771 V (Bard, Parsons & Jordan 1985).
    fireEvent.changeText(screen.getByTestId('complex-form-m-0-value'), '0.771');
    fireEvent.press(screen.getByTestId('complex-form-m-0-source-book'));
    expect(screen.queryByTestId('complex-form-m-0-journal')).toBeNull();
    fireEvent.changeText(screen.getByTestId('complex-form-m-0-authors'), 'A. J. Bard, R. Parsons, J. Jordan');
    fireEvent.changeText(screen.getByTestId('complex-form-m-0-title'), 'Standard Potentials in Aqueous Solution');
    fireEvent.changeText(screen.getByTestId('complex-form-m-0-publisher'), 'Marcel Dekker');
    fireEvent.changeText(screen.getByTestId('complex-form-m-0-place'), 'New York');
    fireEvent.changeText(screen.getByTestId('complex-form-m-0-year'), '1985');
    fireEvent.press(screen.getByTestId('complex-form-save'));
    await waitFor(() => expect(calls.find((c) => c.method === 'POST')).toBeTruthy());
    const sent = calls.find((c) => c.method === 'POST')?.body as { measurements: { citation: Record<string, unknown> }[] };
    expect(sent.measurements[0]?.citation).toMatchObject({ kind: 'book', title: 'Standard Potentials in Aqueous Solution', publisher: 'Marcel Dekker', place: 'New York', journal: '', year: 1985 });
  });
});

describe('ComplexFormScreen (edit)', () => {
  it('on a stale version shows the entry as it is now and re-applies the change on top of it', async () => {
    const opened = detail({ version: 3 });
    const current = detail({ version: 4, name: 'hexaaquachromium(III) ion', updatedAt: '2026-01-06T09:30:00.000Z' });
    const saved = detail({ version: 5, name: 'chromium(III) hexahydrate' });
    let saves = 0;
    const { calls } = mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/complexes/c-cr-aqua': { status: 200, body: opened },
      'PUT /api/complexes/c-cr-aqua': () =>
        saves++ === 0
          ? { status: 409, body: { error: { code: 'CONFLICT', message: 'This entry was changed by someone else.', currentVersion: 4, current } } }
          : { status: 200, body: saved },
    });
    renderWithQueries(<ComplexFormScreen mode="edit" complexId="c-cr-aqua" />);
    fireEvent.changeText(await screen.findByTestId('complex-form-name'), 'chromium(III) hexahydrate');
    fireEvent.press(screen.getByTestId('complex-form-save'));
    const conflict = await screen.findByTestId('complex-conflict');
    expect(conflict).toHaveTextContent(/Someone else saved this entry since you opened it/);
    expect(screen.getByTestId('complex-conflict-name')).toHaveTextContent('hexaaquachromium(III) ion');
    expect(routerCalls.replace).not.toHaveBeenCalled();
    // What was typed is still in the form.
    expect(screen.getByTestId('complex-form-name').props.value).toBe('chromium(III) hexahydrate');

    fireEvent.press(screen.getByTestId('complex-conflict-reapply'));
    fireEvent.press(screen.getByTestId('complex-form-save'));
    await waitFor(() => expect(routerCalls.replace).toHaveBeenCalledWith('/library/c-cr-aqua'));
    // One request per save, each the whole entry on top of the version it is based on.
    const saveBodies = calls.filter((c) => c.method === 'PUT').map((c) => c.body as { name: string; version: number });
    expect(saveBodies.map((b) => [b.name, b.version])).toEqual([
      ['chromium(III) hexahydrate', 3],
      ['chromium(III) hexahydrate', 4],
    ]);
    expect(calls.filter((c) => c.method !== 'GET' && c.method !== 'PUT')).toEqual([]);
  });

  it('can drop the change and load the current version instead', async () => {
    const current = detail({ version: 4, name: 'hexaaquachromium(III) ion' });
    mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/complexes/c-cr-aqua': { status: 200, body: detail({ version: 3 }) },
      'PUT /api/complexes/c-cr-aqua': { status: 409, body: { error: { code: 'CONFLICT', message: 'Stale.', currentVersion: 4, current } } },
    });
    renderWithQueries(<ComplexFormScreen mode="edit" complexId="c-cr-aqua" />);
    fireEvent.changeText(await screen.findByTestId('complex-form-name'), 'my name');
    fireEvent.press(screen.getByTestId('complex-form-save'));
    fireEvent.press(await screen.findByTestId('complex-conflict-discard'));
    expect(screen.getByTestId('complex-form-name').props.value).toBe('hexaaquachromium(III) ion');
    expect(screen.queryByTestId('complex-conflict')).toBeNull();
  });

  it('saves a removed measurement as the whole entry without it, in one request', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/complexes/c-cr-aqua': { status: 200, body: detail({ version: 3 }) },
      'PUT /api/complexes/c-cr-aqua': { status: 200, body: detail({ version: 4, measurements: [] }) },
    });
    renderWithQueries(<ComplexFormScreen mode="edit" complexId="c-cr-aqua" />);
    fireEvent.press(await screen.findByTestId('complex-form-m-0-remove'));
    fireEvent.press(screen.getByTestId('complex-form-save'));
    await waitFor(() => expect(routerCalls.replace).toHaveBeenCalledWith('/library/c-cr-aqua'));
    const writes = calls.filter((c) => c.method !== 'GET');
    expect(writes).toHaveLength(1);
    expect(writes[0]!.body).toMatchObject({ version: 3, measurements: [] });
  });
});

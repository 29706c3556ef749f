import { fireEvent, screen, waitFor } from '@testing-library/react-native';
import { ImportScreen, csvHeaderLine, groupIssues, mappingFromChoices, rowRanges } from '@/components/exchange/import-screen';
import { importJobSchema, type ImportJob } from '@/lib/schemas/exchange';
import { renderWithQueries } from '../account/test-kit';
import { contributorMe, curatorMe, GROUP_ID } from '../library/library-fixtures';

// The shared stand-in, with links that keep their target so the success list can be checked.
jest.mock('expo-router', () => {
  const { Text } = require('react-native');
  return {
    ...require('../account/expo-router-mock').expoRouterMock,
    Link: ({ children, testID, href }: { children: unknown; testID?: string; href: string }) => <Text testID={testID} href={href}>{children}</Text>,
  };
});

/**
 * The web file input cannot run in a native test renderer: a button hands the screen a file instead.
 * The file is the invented Larkspur Coordination Lab's rate sheet.
 */
const CSV_TEXT = 'Complex,name,k,unit\n[Cr(H2O)6]3+,hexaaquachromium(III),2.4e-6,s-1\n';
/** The text the picked file holds (a test may swap it before picking). */
let mockCsvText = CSV_TEXT;
beforeEach(() => {
  mockCsvText = CSV_TEXT;
});
jest.mock('@/components/exchange/file-picker', () => {
  const { Pressable, Text } = require('react-native');
  return {
    FilePickButton: ({ onPick, testID, label }: { onPick: (file: unknown) => void; testID?: string; label: string }) => (
      <Pressable
        testID={testID}
        onPress={() =>
          onPick({
            name: 'larkspur-rates.csv',
            sizeBytes: 2048,
            contentType: 'text/csv',
            body: { slice: () => ({ text: async () => mockCsvText }) },
          })
        }
      >
        <Text>{label}</Text>
      </Pressable>
    ),
  };
});

type Canned = { status: number; body?: unknown };
type RawCall = { url: string; method: string; headers: Record<string, string>; body: unknown };

/** fetch stand-in that keeps raw bodies (the shared test kit parses every body as JSON). */
function rawFetch(routes: Record<string, Canned | (() => Canned)>) {
  const calls: RawCall[] = [];
  global.fetch = jest.fn(async (input: string, init?: { method?: string; body?: unknown; headers?: Record<string, string> }) => {
    const method = init?.method ?? 'GET';
    calls.push({ url: String(input), method, headers: init?.headers ?? {}, body: init?.body });
    const route = routes[`${method} ${String(input).split('?')[0]}`];
    const answer = route === undefined ? { status: 404, body: { error: { code: 'NOT_FOUND', message: 'No such route.' } } } : typeof route === 'function' ? route() : route;
    return { ok: answer.status < 300, status: answer.status, json: async () => answer.body };
  }) as unknown as typeof fetch;
  return calls;
}

const T0 = '2026-01-05T10:00:00.000Z';
function job(overrides: Partial<ImportJob>): ImportJob {
  return importJobSchema.parse({
    id: 'job-1',
    groupId: GROUP_ID,
    fileName: 'larkspur-rates.csv',
    dryRun: true,
    state: 'queued',
    processed: 0,
    total: 2,
    columns: [
      { header: 'Complex', column: 'formula' },
      { header: 'name', column: 'name' },
      { header: 'k', column: 'value' },
      { header: 'unit', column: 'unit' },
    ],
    errorCount: 0,
    errors: [],
    entryCount: 0,
    measurementCount: 0,
    complexIds: [],
    created: [],
    suggestedNames: [],
    duplicates: [],
    message: null,
    createdAt: T0,
    updatedAt: T0,
    finishedAt: null,
    ...overrides,
  });
}

describe('import helpers', () => {
  it('reads the header line with quotes, a BOM and CRLF', () => {
    expect(csvHeaderLine('\uFEFF"Complex, formula",name,"say ""k"""\r\nx,y,z')).toEqual(['Complex, formula', 'name', 'say "k"']);
  });
  it('turns header choices into the server mapping (our column → their header)', () => {
    expect(mappingFromChoices({ k: 'value', Temp: null, Complex: 'formula' })).toEqual({ value: 'k', formula: 'Complex' });
  });
});

describe('ImportScreen', () => {
  it('dry-runs the file and lists each problem with row, column and character position', async () => {
    const calls = rawFetch({
      'GET /api/auth/session': { status: 200, body: { me: contributorMe } },
      'POST /api/imports': { status: 202, body: job({}) },
      'GET /api/imports/job-1': {
        status: 200,
        body: job({
          state: 'failed',
          processed: 2,
          errorCount: 2,
          errors: [
            { row: 2, column: 'Complex', message: 'The formula has an unmatched bracket.', position: 12 },
            { row: 3, column: null, message: 'The row has 3 cells; the header has 4.' },
          ],
          message: '2 problem(s) in 2 row(s); nothing was checked further.',
          finishedAt: T0,
        }),
      },
    });
    renderWithQueries(<ImportScreen />);
    fireEvent.press(await screen.findByTestId('import-pick'));
    expect(screen.getByTestId('import-file-name')).toHaveTextContent('larkspur-rates.csv · 2.0 KB');
    fireEvent.press(screen.getByTestId('import-dry-run'));

    const first = await screen.findByTestId('import-report-row-0');
    expect(first).toHaveTextContent(/^2Complex/);
    expect(first).toHaveTextContent(/unmatched bracket\. \(at character 12\)/);
    expect(screen.getByTestId('import-report-row-1')).toHaveTextContent(/3whole row/);
    expect(screen.getByTestId('import-report')).toHaveTextContent(/2 problems in 2 rows\. Nothing was written/);
    expect(screen.queryByTestId('import-run')).toBeNull();

    const post = calls.find((c) => c.method === 'POST');
    const params = new URLSearchParams(post?.url.split('?')[1]);
    expect(params.get('dryRun')).toBe('true');
    expect(params.get('fileName')).toBe('larkspur-rates.csv');
    expect(params.has('mapping')).toBe(false);
    expect(post?.headers['Content-Type']).toBe('text/csv');
    expect(await (post?.body as { slice: () => { text: () => Promise<string> } }).slice().text()).toBe(CSV_TEXT);

    // Map the "k" header (detected as value) to notes, and check again: the mapping goes along.
    expect(screen.getByTestId('import-mapping')).toHaveTextContent(/Complex→formula/);
    fireEvent.press(screen.getByTestId('import-mapping-2-current'));
    fireEvent.press(screen.getByTestId('import-mapping-2-notes'));
    expect(screen.getByTestId('import-run-waiting')).toHaveTextContent(/columns changed/);
    fireEvent.press(screen.getByTestId('import-dry-run'));
    await waitFor(() => expect(calls.filter((c) => c.method === 'POST')).toHaveLength(2));
    const again = new URLSearchParams(calls.filter((c) => c.method === 'POST')[1]?.url.split('?')[1]);
    expect(JSON.parse(again.get('mapping') ?? '{}')).toEqual({ notes: 'k' });
  });

  it('shows each file column and the field it fills as soon as the file is chosen, before any dry run', async () => {
    mockCsvText = 'Species,k,Units,Notebook page\n[Cr(H2O)6]3+,2.4e-6,s-1,L-14\n';
    const calls = rawFetch({ 'GET /api/auth/session': { status: 200, body: { me: contributorMe } } });
    renderWithQueries(<ImportScreen />);
    fireEvent.press(await screen.findByTestId('import-pick'));
    const mapping = await screen.findByTestId('import-mapping');
    expect(screen.getByTestId('import-mapping-0')).toHaveTextContent(/^Species→formula/);
    expect(screen.getByTestId('import-mapping-1')).toHaveTextContent(/^k→value/);
    expect(screen.getByTestId('import-mapping-2')).toHaveTextContent(/^Units→unit/);
    expect(screen.getByTestId('import-mapping-3')).toHaveTextContent(/^Notebook page→not used/);
    expect(mapping).not.toHaveTextContent(/not read/);
    expect(screen.getByTestId('import-mapping-missing')).toHaveTextContent(/Missing: name\./);
    expect(calls.some((c) => c.method === 'POST')).toBe(false);

    // Choosing the unused column for the name settles what was missing, still without a request.
    fireEvent.press(screen.getByTestId('import-mapping-3-current'));
    fireEvent.press(screen.getByTestId('import-mapping-3-name'));
    expect(screen.getByTestId('import-mapping-3')).toHaveTextContent(/^Notebook page→namechanged/);
    expect(screen.queryByTestId('import-mapping-missing')).toBeNull();
    expect(screen.getByTestId('import-mapping-complete')).toBeTruthy();
    expect(calls.some((c) => c.method === 'POST')).toBe(false);
  });

  it('says a refused file wrote nothing (415)', async () => {
    rawFetch({
      'GET /api/auth/session': { status: 200, body: { me: contributorMe } },
      'POST /api/imports': { status: 415, body: { error: { code: 'UNSUPPORTED_MEDIA', message: 'The file is not UTF-8 text (byte 3).' } } },
    });
    renderWithQueries(<ImportScreen />);
    fireEvent.press(await screen.findByTestId('import-pick'));
    fireEvent.press(screen.getByTestId('import-dry-run'));
    const error = await screen.findByTestId('import-error');
    expect(error).toHaveTextContent(/cannot be read as CSV text: The file is not UTF-8 text \(byte 3\)\. Nothing was written\./);
  });

  it('lists the issues of a 400 refusal (ragged rows)', async () => {
    rawFetch({
      'GET /api/auth/session': { status: 200, body: { me: contributorMe } },
      'POST /api/imports': {
        status: 400,
        body: { error: { code: 'VALIDATION_FAILED', message: 'Rows have the wrong number of cells.', issues: [{ row: 5, column: null, message: 'The row has 2 cells; the header has 4.' }] } },
      },
    });
    renderWithQueries(<ImportScreen />);
    fireEvent.press(await screen.findByTestId('import-pick'));
    fireEvent.press(screen.getByTestId('import-dry-run'));
    expect(await screen.findByTestId('import-error')).toHaveTextContent(/Nothing was written/);
    expect(screen.getByTestId('import-report-row-0')).toHaveTextContent(/5whole rowThe row has 2 cells/);
  });

  it('imports after a clean dry run, shows progress, then the summary', async () => {
    let polls = 0;
    const calls = rawFetch({
      'GET /api/auth/session': { status: 200, body: { me: contributorMe } },
      'POST /api/imports': () => {
        const real = calls.filter((c) => c.method === 'POST').length === 2;
        return { status: 202, body: job({ id: real ? 'job-2' : 'job-1', dryRun: !real }) };
      },
      'GET /api/imports/job-1': {
        status: 200,
        body: job({
          state: 'succeeded',
          processed: 2,
          entryCount: 1,
          measurementCount: 2,
          suggestedNames: [{ row: 2, name: 'hexaaquachromium(III)' }],
          message: 'Dry run: all 2 rows are valid.',
          finishedAt: T0,
        }),
      },
      'GET /api/imports/job-2': () => {
        polls += 1;
        return polls === 1
          ? { status: 200, body: job({ id: 'job-2', dryRun: false, state: 'importing', processed: 1 }) }
          : {
              status: 200,
              body: job({
                id: 'job-2',
                dryRun: false,
                state: 'succeeded',
                processed: 2,
                entryCount: 1,
                measurementCount: 2,
                complexIds: ['c-cr-new'],
                created: [{ id: 'c-cr-new', row: 2, formula: '[Cr(H2O)6]3+', name: 'hexaaquachromium(III)', status: 'in-review' }],
                finishedAt: T0,
              }),
            };
      },
    });
    renderWithQueries(<ImportScreen />);
    fireEvent.press(await screen.findByTestId('import-pick'));
    fireEvent.press(screen.getByTestId('import-dry-run'));
    expect(await screen.findByTestId('import-report-clean')).toHaveTextContent(/All 2 rows are valid: 1 entry with 2 measurements/);
    // The entry without a name in the file takes the one suggested from its formula, said before importing.
    expect(screen.getByTestId('import-report-named')).toHaveTextContent(/One entry has no name in the file and will take the name suggested from the formula/);
    expect(screen.getByTestId('import-report-named-2')).toHaveTextContent('Row 2: hexaaquachromium(III)');
    fireEvent.press(screen.getByTestId('import-run'));
    expect(screen.getByTestId('import-run')).toHaveTextContent('Import 1 entry (submitted for review)');
    expect(await screen.findByTestId('import-progress')).toHaveTextContent(/1 of 2 rows/);
    expect(await screen.findByTestId('import-done', {}, { timeout: 4000 })).toHaveTextContent(/1 entry with 2 measurements were added and submitted for review/);
    // The created entry: formula typeset, name linking to its page, status.
    const created = screen.getByTestId('import-created-0');
    expect(created).toHaveTextContent(/^\[Cr\(H₂O\)₆\]³⁺hexaaquachromium\(III\)/);
    expect(screen.getByTestId('import-created-0-link')).toHaveProp('href', '/library/c-cr-new');
    expect(screen.getByTestId('status-pill-in-review')).toBeTruthy();
    // A contributor is not sent to the review queue, which is the curators' page.
    expect(screen.queryByTestId('import-to-review')).toBeNull();
    expect(screen.getByTestId('import-to-library')).toHaveProp('href', '/library');
    expect(screen.getByTestId('import-review-note')).toHaveTextContent(/curators review the new entries/);
    const real = new URLSearchParams(calls.filter((c) => c.method === 'POST')[1]?.url.split('?')[1]);
    expect(real.get('dryRun')).toBe('false');
  });

  it('lists repeated species after the dry run and sends the choices, for all and per row', async () => {
    const duplicates = [
      { row: 2, formula: '[Cr(OH2)6]3+', name: 'chromium again', existing: { id: 'c-cr', name: 'hexaaquachromium(III)', formula: '[Cr(H2O)6]3+', status: 'accepted' }, sameAsRow: null, choice: 'skip' as const },
      { row: 4, formula: '[Ni(NH3)6]2+', name: 'nickel twice', existing: null, sameAsRow: 3, choice: 'skip' as const },
    ];
    const calls = rawFetch({
      'GET /api/auth/session': { status: 200, body: { me: contributorMe } },
      'POST /api/imports': () => ({ status: 202, body: job({ id: calls.filter((c) => c.method === 'POST').length === 2 ? 'job-2' : 'job-1' }) }),
      'GET /api/imports/job-1': { status: 200, body: job({ state: 'succeeded', processed: 2, entryCount: 3, measurementCount: 2, duplicates, finishedAt: T0 }) },
      'GET /api/imports/job-2': { status: 200, body: job({ id: 'job-2', dryRun: false, state: 'succeeded', processed: 2, entryCount: 2, measurementCount: 2, finishedAt: T0 }) },
    });
    renderWithQueries(<ImportScreen />);
    fireEvent.press(await screen.findByTestId('import-pick'));
    fireEvent.press(screen.getByTestId('import-dry-run'));
    expect(await screen.findByTestId('import-duplicate-2')).toHaveTextContent(/already in the library as “hexaaquachromium\(III\)”/);
    expect(screen.getByTestId('import-duplicate-4')).toHaveTextContent(/same species as row 3/);
    fireEvent.press(screen.getByTestId('import-duplicates-all-import'));
    fireEvent.press(screen.getByTestId('import-duplicate-2-merge'));
    fireEvent.press(screen.getByTestId('import-run'));
    await waitFor(() => expect(calls.filter((c) => c.method === 'POST')).toHaveLength(2));
    const real = new URLSearchParams(calls.filter((c) => c.method === 'POST')[1]?.url.split('?')[1]);
    expect(real.get('duplicates')).toBe('import');
    expect(JSON.parse(real.get('duplicateChoices') ?? '{}')).toEqual({ 2: 'merge' });
  });

  it('after a curator’s import: the review queue is offered, merged and skipped rows are listed with their targets', async () => {
    const duplicates = [
      { row: 3, formula: '[Cr(OH2)6]3+', name: 'chromium again', existing: { id: 'c-cr', name: 'hexaaquachromium(III)', formula: '[Cr(H2O)6]3+', status: 'accepted' }, sameAsRow: null, choice: 'merge' as const },
      { row: 5, formula: '[Ni(NH3)6]2+', name: 'nickel twice', existing: null, sameAsRow: 4, choice: 'skip' as const },
    ];
    const calls = rawFetch({
      'GET /api/auth/session': { status: 200, body: { me: curatorMe } },
      'POST /api/imports': () => ({ status: 202, body: job({ id: calls.filter((c) => c.method === 'POST').length === 2 ? 'job-2' : 'job-1' }) }),
      'GET /api/imports/job-1': { status: 200, body: job({ state: 'succeeded', processed: 4, entryCount: 2, measurementCount: 2, duplicates, finishedAt: T0 }) },
      'GET /api/imports/job-2': {
        status: 200,
        body: job({
          id: 'job-2',
          dryRun: false,
          state: 'succeeded',
          processed: 4,
          entryCount: 1,
          measurementCount: 1,
          complexIds: ['c-ni'],
          created: [{ id: 'c-ni', row: 4, formula: '[Ni(NH3)6]2+', name: 'hexaamminenickel(II)', status: 'in-review' }],
          duplicates,
          finishedAt: T0,
        }),
      },
    });
    renderWithQueries(<ImportScreen />);
    fireEvent.press(await screen.findByTestId('import-pick'));
    fireEvent.press(screen.getByTestId('import-dry-run'));
    fireEvent.press(await screen.findByTestId('import-run'));
    await screen.findByTestId('import-done');
    expect(screen.getByTestId('import-to-review')).toHaveProp('href', '/review');
    expect(screen.queryByTestId('import-review-note')).toBeNull();
    expect(screen.getByTestId('import-merged-3')).toHaveTextContent(/Row 3: the measurements of\[Cr\(OH₂\)₆\]³⁺went tohexaaquachromium\(III\)/);
    expect(screen.getByTestId('import-skipped-5')).toHaveTextContent(/Row 5:\[Ni\(NH₃\)₆\]²⁺the same species as row 4/);

    // Another file starts from scratch.
    fireEvent.press(screen.getByTestId('import-another'));
    expect(screen.queryByTestId('import-done')).toBeNull();
    expect(screen.queryByTestId('import-file-name')).toBeNull();
  });

  it('tells viewers that importing needs the contributor role', async () => {
    rawFetch({
      'GET /api/auth/session': { status: 200, body: { me: { ...contributorMe, memberships: [{ groupId: GROUP_ID, groupName: 'Larkspur Coordination Lab', role: 'viewer' }] } } },
    });
    renderWithQueries(<ImportScreen />);
    expect(await screen.findByTestId('import-not-allowed')).toHaveTextContent(/contributor role/);
  });
});

describe('grouped import problems', () => {
  it('writes rows as ranges (common practice)', () => {
    expect(rowRanges([7, 2, 3, 4, 4, 9])).toBe('2–4, 7, 9');
    expect(rowRanges([5])).toBe('5');
  });

  it('gives one line per kind of problem with its rows; a problem at a character stays with its cell', () => {
    const groups = groupIssues([
      { row: 2, column: 'unit', message: 'Water exchange is given in s⁻¹.' },
      { row: 3, column: 'unit', message: 'Water exchange is given in s⁻¹.' },
      { row: 4, column: 'formula', message: 'Unknown ligand "xx".', position: 5 },
      { row: 5, column: 'formula', message: 'Unknown ligand "xx".', position: 5 },
      { row: 6, column: 'unit', message: 'Water exchange is given in s⁻¹.' },
    ]);
    expect(groups.map((g) => [rowRanges(g.rows), g.column])).toEqual([
      ['2–3, 6', 'unit'],
      ['4', 'formula'],
      ['5', 'formula'],
    ]);
  });
});

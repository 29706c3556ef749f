import { fireEvent, screen, waitFor } from '@testing-library/react-native';
import { AttachmentsPanel } from '@/components/exchange/attachments-panel';
import { ExportMenu } from '@/components/exchange/export-menu';
import { MailPreferencesCard } from '@/components/exchange/mail-preferences-card';
import { ComplexFormScreen } from '@/components/library/complex-form';
import { apiError, mockFetch, renderWithQueries } from '../account/test-kit';
import { contributorMe, curatorMe, GROUP_ID } from '../library/library-fixtures';

jest.mock('expo-router', () => require('../account/expo-router-mock').expoRouterMock);
jest.mock('@/components/exchange/file-picker', () => {
  const { Pressable, Text } = require('react-native');
  return {
    FilePickButton: ({ onPick, testID, label }: { onPick: (file: unknown) => void; testID?: string; label: string }) => (
      <Pressable testID={testID} onPress={() => onPick({ name: 'cr-aqua-uv.pdf', sizeBytes: 1536, contentType: 'application/pdf', body: 'not really a pdf' })}>
        <Text>{label}</Text>
      </Pressable>
    ),
  };
});

/**
 * Laurenczy, Rapaport, Zbinden & Merbach, Magn. Reson. Chem. 1991, 29, S45-S51, DOI 10.1002/mrc.1260291311
 * (the record as given in data/measured-rates.json, also in server/dev/fake-works.json).
 */
const laurenczyRecord = {
  doi: '10.1002/mrc.1260291311',
  authors: 'G. Laurenczy, I. Rapaport, D. Zbinden, A. E. Merbach',
  title: 'Variable-pressure oxygen-17 NMR study of water exchange on hexaaquarhodium(III)',
  journal: 'Magn. Reson. Chem.',
  year: 1991,
  volume: '29',
  pages: 'S45-S51',
};

describe('Fill from DOI', () => {
  async function openForm() {
    renderWithQueries(<ComplexFormScreen mode="create" />);
    fireEvent.changeText(await screen.findByTestId('complex-form-formula'), '[Rh(H2O)6]3+');
    fireEvent.press(screen.getByTestId('complex-form-add-measurement'));
    fireEvent.changeText(screen.getByTestId('complex-form-m-0-doi'), ' 10.1002/mrc.1260291311 ');
  }

  it('fills the citation fields from the record for the person to check', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/citations/lookup': { status: 200, body: laurenczyRecord },
    });
    await openForm();
    fireEvent.press(screen.getByTestId('complex-form-m-0-doi-fill'));
    await waitFor(() => expect(screen.getByTestId('complex-form-m-0-authors').props.value).toBe('G. Laurenczy, I. Rapaport, D. Zbinden, A. E. Merbach'));
    expect(screen.getByTestId('complex-form-m-0-journal').props.value).toBe('Magn. Reson. Chem.');
    expect(screen.getByTestId('complex-form-m-0-year').props.value).toBe('1991');
    expect(screen.getByTestId('complex-form-m-0-volume').props.value).toBe('29');
    expect(screen.getByTestId('complex-form-m-0-pages').props.value).toBe('S45-S51');
    expect(screen.getByTestId('complex-form-m-0-title').props.value).toMatch(/hexaaquarhodium\(III\)/);
    expect(screen.getByTestId('complex-form-m-0-doi-fill-done')).toHaveTextContent(/check the fields/);
    expect(calls.find((c) => c.url.startsWith('/api/citations/lookup'))?.url).toBe('/api/citations/lookup?doi=10.1002%2Fmrc.1260291311');
  });

  it('says when no record exists and leaves the fields for typing by hand', async () => {
    mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/citations/lookup': apiError(404, 'NOT_FOUND', 'No record for that DOI.'),
    });
    await openForm();
    fireEvent.press(screen.getByTestId('complex-form-m-0-doi-fill'));
    expect(await screen.findByTestId('complex-form-m-0-doi-fill-error')).toHaveTextContent('No record was found for this DOI. Check it, or type the citation in by hand.');
    expect(screen.getByTestId('complex-form-m-0-authors').props.value).toBe('');
    fireEvent.changeText(screen.getByTestId('complex-form-m-0-authors'), 'G. Laurenczy');
    expect(screen.getByTestId('complex-form-m-0-authors').props.value).toBe('G. Laurenczy');
  });

  it('says when the service is slow (503)', async () => {
    mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      'GET /api/citations/lookup': apiError(503, 'UNAVAILABLE', 'The DOI service did not answer in time.'),
    });
    await openForm();
    fireEvent.press(screen.getByTestId('complex-form-m-0-doi-fill'));
    expect(await screen.findByTestId('complex-form-m-0-doi-fill-error')).toHaveTextContent(/slow or unreachable/);
  });
});

describe('ExportMenu', () => {
  it('links each format to its export with the active filters and no paging', () => {
    renderWithQueries(<ExportMenu filters={{ q: ' chromium ', metal: 'Cr', status: 'accepted', verdict: undefined, groupId: GROUP_ID }} />);
    expect(screen.queryByTestId('library-export-csv')).toBeNull();
    fireEvent.press(screen.getByTestId('library-export'));
    const expected = `q=chromium&metal=Cr&status=accepted&groupId=${GROUP_ID}`;
    expect(screen.getByTestId('library-export-csv').props.href).toBe(`/api/exports/library.csv?${expected}`);
    expect(screen.getByTestId('library-export-bib').props.href).toBe(`/api/exports/citations.bib?${expected}`);
    expect(screen.getByTestId('library-export-ris').props.href).toBe(`/api/exports/citations.ris?${expected}`);
    expect(screen.getByTestId('library-export-ris').props.hrefAttrs).toEqual({ download: true });
  });

  it('exports everything when no filter is set', () => {
    renderWithQueries(<ExportMenu filters={{ q: '' }} />);
    fireEvent.press(screen.getByTestId('library-export'));
    expect(screen.getByTestId('library-export-csv').props.href).toBe('/api/exports/library.csv');
  });
});

const ENTRY_ID = 'c-cr-aqua';
const SHA = 'ab12cd34ef56'.padEnd(64, '0');
const attachment = {
  id: 'at-1',
  complexId: ENTRY_ID,
  fileName: 'cr-aqua-17O.jdx',
  kind: 'jcamp-dx',
  contentType: 'chemical/x-jcamp-dx',
  sizeBytes: 48_128,
  sha256: SHA,
  description: '17O NMR line widths, 298 K',
  uploadedBy: { id: 'u-student', displayName: 'Ada Fenwick' },
  createdAt: '2026-01-05T10:00:00.000Z',
  downloadPath: `/api/complexes/${ENTRY_ID}/attachments/at-1`,
  state: 'accepted',
};
const entryBy = (role: 'contributor' | 'curator') => ({
  id: ENTRY_ID,
  myRole: role,
  createdBy: { id: 'u-student', displayName: 'Ada Fenwick' },
  status: 'draft' as const,
});

describe('AttachmentsPanel', () => {
  it('lists files with kind, size, short fingerprint, who and when, and a download link', async () => {
    mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      [`GET /api/complexes/${ENTRY_ID}/attachments`]: { status: 200, body: { attachments: [attachment] } },
    });
    renderWithQueries(<AttachmentsPanel entry={entryBy('contributor')} />);
    const row = await screen.findByTestId('attachment-row-0');
    expect(row).toHaveTextContent(/cr-aqua-17O\.jdx/);
    expect(row).toHaveTextContent(/Spectrum \(JCAMP-DX\) · 47 KB · SHA-256 ab12cd34ef56…/);
    // The date in the reader's own locale and time zone (so not asserted digit by digit), never as ISO text.
    expect(row).toHaveTextContent(/Added by Ada Fenwick · \S.*2026/);
    expect(row).not.toHaveTextContent(/2026-01-05|UTC/);
    expect(screen.getByTestId('attachment-download-0').props.href).toBe(`/api/complexes/${ENTRY_ID}/attachments/at-1`);
    // The author may upload; only curators delete.
    expect(screen.getByTestId('attachments-upload')).toBeTruthy();
    expect(screen.queryByTestId('attachment-delete-0')).toBeNull();
  });

  it('says which files wait for review and which were declined; accepted ones carry no note', async () => {
    mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      [`GET /api/complexes/${ENTRY_ID}/attachments`]: {
        status: 200,
        body: { attachments: [attachment, { ...attachment, id: 'at-2', state: 'pending' }, { ...attachment, id: 'at-3', state: 'declined' }] },
      },
    });
    renderWithQueries(<AttachmentsPanel entry={entryBy('contributor')} />);
    await screen.findByTestId('attachment-row-2');
    expect(screen.queryByTestId('attachment-state-0')).toBeNull();
    expect(screen.getByTestId('attachment-state-1')).toHaveTextContent(/Waits for review/);
    expect(screen.getByTestId('attachment-state-2')).toHaveTextContent(/Declined with its revision/);
  });

  it('shows why an upload was refused (415: content and name disagree)', async () => {
    mockFetch({
      'GET /api/auth/me': { status: 200, body: contributorMe },
      [`GET /api/complexes/${ENTRY_ID}/attachments`]: { status: 200, body: { attachments: [] } },
      [`POST /api/complexes/${ENTRY_ID}/attachments`]: apiError(415, 'UNSUPPORTED_MEDIA', '"cr-aqua-uv.pdf" is named like a .pdf file but its content is plain text.'),
    });
    // The raw body is not JSON: keep the shared kit from parsing it.
    const kitFetch = global.fetch;
    const sent: { url: string; body: unknown; headers: unknown }[] = [];
    global.fetch = (async (url: string, init?: { method?: string; body?: unknown; headers?: unknown }) => {
      if (init?.method === 'POST') sent.push({ url, body: init.body, headers: init.headers });
      return kitFetch(url, init?.method === 'POST' ? { method: 'POST' } : (init as RequestInit));
    }) as unknown as typeof fetch;
    renderWithQueries(<AttachmentsPanel entry={entryBy('contributor')} />);
    expect(await screen.findByTestId('attachments-empty')).toBeTruthy();
    fireEvent.press(screen.getByTestId('attachments-pick'));
    expect(screen.getByTestId('attachments-file-name')).toHaveTextContent('cr-aqua-uv.pdf · 1.5 KB');
    fireEvent.changeText(screen.getByTestId('attachments-description'), 'UV-vis in 1 M HClO4');
    fireEvent.press(screen.getByTestId('attachments-upload-send'));
    expect(await screen.findByTestId('attachments-upload-error')).toHaveTextContent(/This file was not attached: "cr-aqua-uv\.pdf" is named like a \.pdf file/);
    expect(sent[0]?.url).toBe(`/api/complexes/${ENTRY_ID}/attachments?fileName=cr-aqua-uv.pdf&description=UV-vis+in+1+M+HClO4`);
    expect(sent[0]?.body).toBe('not really a pdf');
    expect(sent[0]?.headers).toEqual({ 'Content-Type': 'application/pdf' });
  });

  it('says when a file is over 20 MB (413)', async () => {
    mockFetch({
      'GET /api/auth/me': { status: 200, body: curatorMe },
      [`GET /api/complexes/${ENTRY_ID}/attachments`]: { status: 200, body: { attachments: [] } },
      [`POST /api/complexes/${ENTRY_ID}/attachments`]: apiError(413, 'PAYLOAD_TOO_LARGE', 'The file is larger than 20 MB, the most this endpoint accepts.'),
    });
    const kitFetch = global.fetch;
    global.fetch = ((url: string, init?: { method?: string }) => kitFetch(url, init?.method === 'POST' ? { method: 'POST' } : (init as RequestInit))) as typeof fetch;
    renderWithQueries(<AttachmentsPanel entry={entryBy('curator')} />);
    fireEvent.press(await screen.findByTestId('attachments-pick'));
    fireEvent.press(screen.getByTestId('attachments-upload-send'));
    expect(await screen.findByTestId('attachments-upload-error')).toHaveTextContent(/larger than 20 MB.*up to 20 MB can be attached/);
  });

  it('lets curators delete after confirming', async () => {
    let listed = [attachment];
    const { calls } = mockFetch({
      'GET /api/auth/me': { status: 200, body: curatorMe },
      [`GET /api/complexes/${ENTRY_ID}/attachments`]: () => ({ status: 200, body: { attachments: listed } }),
      [`DELETE /api/complexes/${ENTRY_ID}/attachments/at-1`]: () => {
        listed = [];
        return { status: 204 };
      },
    });
    renderWithQueries(<AttachmentsPanel entry={entryBy('curator')} />);
    fireEvent.press(await screen.findByTestId('attachment-delete-0'));
    expect(calls.some((c) => c.method === 'DELETE')).toBe(false);
    fireEvent.press(screen.getByTestId('attachment-delete-0-confirm'));
    expect(await screen.findByTestId('attachments-empty')).toBeTruthy();
    expect(calls.filter((c) => c.method === 'DELETE')).toHaveLength(1);
  });
});

describe('MailPreferencesCard', () => {
  it('shows both switches and saves a change', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/me/preferences': { status: 200, body: { reviewSubmissions: true, reviewDecisions: true } },
      'PATCH /api/auth/me/preferences': { status: 200, body: { reviewSubmissions: true, reviewDecisions: false } },
    });
    renderWithQueries(<MailPreferencesCard me={curatorMe as never} />);
    const decisions = await screen.findByTestId('mail-pref-decisions');
    expect(screen.getByTestId('mail-pref-submissions').props.accessibilityState).toMatchObject({ checked: true });
    fireEvent.press(decisions);
    await waitFor(() => expect(calls.find((c) => c.method === 'PATCH')?.body).toEqual({ reviewDecisions: false }));
    await waitFor(() => expect(screen.getByTestId('mail-pref-decisions').props.accessibilityState).toMatchObject({ checked: false }));
  });

  it('puts the switch back when saving fails', async () => {
    mockFetch({
      'GET /api/auth/me/preferences': { status: 200, body: { reviewSubmissions: false, reviewDecisions: true } },
      'PATCH /api/auth/me/preferences': apiError(500, 'INTERNAL', 'Boom.'),
    });
    renderWithQueries(<MailPreferencesCard me={contributorMe as never} />);
    fireEvent.press(await screen.findByTestId('mail-pref-decisions'));
    expect(await screen.findByTestId('mail-pref-error')).toHaveTextContent(/Not saved/);
    expect(screen.getByTestId('mail-pref-decisions').props.accessibilityState).toMatchObject({ checked: true });
    // Not a curator anywhere: the submissions switch is there but cannot be turned on.
    expect(screen.getByTestId('mail-pref-submissions').props.accessibilityState).toMatchObject({ disabled: true });
  });
});

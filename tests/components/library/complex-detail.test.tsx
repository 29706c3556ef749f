import { fireEvent, screen, waitFor } from '@testing-library/react-native';
import { ComplexDetailView } from '@/components/library/complex-detail';
import { mockFetch, renderWithQueries } from '../account/test-kit';
import { curatorMe, detail } from './library-fixtures';

jest.mock('expo-router', () => require('../account/expo-router-mock').expoRouterMock);

const revisions = {
  revisions: [
    { id: 'rv-3', number: 3, kind: 'submit', status: 'in-review', message: 'Submitted for review', author: { id: 'u-student', displayName: 'Ada Fenwick' }, createdAt: '2026-01-05T10:00:00.000Z' },
    { id: 'rv-2', number: 2, kind: 'edit', status: 'draft', message: 'Corrected the temperature', author: { id: 'u-student', displayName: 'Ada Fenwick' }, createdAt: '2026-01-04T10:00:00.000Z' },
    { id: 'rv-1', number: 1, kind: 'create', status: 'draft', message: 'Created', author: { id: 'u-student', displayName: 'Ada Fenwick' }, createdAt: '2026-01-03T10:00:00.000Z' },
  ],
};
const diff = (from: number, to: number) => ({
  from,
  to,
  fields: [],
  measurements: { added: [], removed: [], changed: [] },
  summary: [`temperatureK: 295 → 298.15 (v${from}→v${to})`],
});

describe('ComplexDetailView', () => {
  it('shows measurements with conditions and citation, history with a diff, and the submit action', async () => {
    const { calls } = mockFetch({
      'GET /api/complexes/c-cr-aqua': { status: 200, body: detail() },
      'GET /api/complexes/c-cr-aqua/revisions': { status: 200, body: revisions },
      'GET /api/complexes/c-cr-aqua/revisions/diff': () => {
        const url = calls.at(-1)?.url ?? '';
        const params = new URLSearchParams(url.split('?')[1]);
        return { status: 200, body: diff(Number(params.get('from')), Number(params.get('to'))) };
      },
      'POST /api/complexes/c-cr-aqua/submit': { status: 200, body: detail({ status: 'in-review', version: 4, permissions: { canEdit: false, canSubmit: false, canReview: false, canRetire: false } }) },
    });
    renderWithQueries(<ComplexDetailView id="c-cr-aqua" />);
    const row = await screen.findByTestId('complex-measurements-row-0');
    // 2.4e-6 s-1 at 298.15 K, 17O NMR (Xu, Krouse & Swaddle, Inorg. Chem. 1985, 24, 267).
    expect(screen.getByTestId('complex-measurements-row-0-value')).toHaveTextContent('2.4 × 10⁻⁶ s⁻¹');
    expect(row).toHaveTextContent(/25 °C \(298.15 K\) · aqueous HClO4 · 17O NMR/);
    expect(row).toHaveTextContent(/F\.-C\. Xu, H\. R\. Krouse, T\. W\. Swaddle, Inorg\. Chem\., 1985, 24, 267–270/);
    expect(await screen.findByTestId('complex-diff')).toHaveTextContent(/v2→v3/);
    fireEvent.press(screen.getByTestId('revision-from-1'));
    expect(await screen.findByText(/v1→v3/)).toBeTruthy();
    expect(screen.getByTestId('complex-review-thread')).toHaveTextContent(/Submitted for review/);

    fireEvent.press(screen.getByTestId('complex-submit'));
    await waitFor(() => expect(calls.find((c) => c.method === 'POST')?.body).toEqual({ version: 3 }));
    expect(await screen.findByTestId('complex-action-done')).toHaveTextContent(/Submitted/);
  });

  it('says when the accepted version is shown and a newer revision waits', async () => {
    mockFetch({
      'GET /api/complexes/c-cr-aqua': {
        status: 200,
        body: detail({ view: 'published', status: 'accepted', hasPendingRevision: true, permissions: { canEdit: false, canSubmit: false, canReview: false, canRetire: false } }),
      },
      'GET /api/complexes/c-cr-aqua/revisions': { status: 200, body: { revisions: revisions.revisions.slice(2) } },
    });
    renderWithQueries(<ComplexDetailView id="c-cr-aqua" />);
    expect(await screen.findByTestId('complex-pending-banner')).toHaveTextContent('Accepted version shown; a newer revision awaits review.');
    expect(screen.queryByTestId('complex-actions')).toBeNull();
  });

  it('gives curators the review panel on someone else’s submission', async () => {
    mockFetch({
      'GET /api/auth/me': { status: 200, body: curatorMe },
      'GET /api/complexes/c-cr-aqua': {
        status: 200,
        body: detail({ status: 'in-review', myRole: 'curator', permissions: { canEdit: false, canSubmit: false, canReview: true, canRetire: true } }),
      },
      'GET /api/complexes/c-cr-aqua/revisions': { status: 200, body: revisions },
    });
    renderWithQueries(<ComplexDetailView id="c-cr-aqua" />);
    expect(await screen.findByTestId('review-panel')).toBeTruthy();
    expect(screen.getByTestId('complex-retire')).toBeTruthy();
    expect(screen.queryByTestId('complex-edit')).toBeNull();
  });
});

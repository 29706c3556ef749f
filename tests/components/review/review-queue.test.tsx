import { fireEvent, screen, waitFor } from '@testing-library/react-native';
import { ReviewQueueScreen } from '@/components/review/review-queue-screen';
import { reviewQueueResponseSchema } from '@/lib/schemas/library';
import { apiError, mockFetch, renderWithQueries } from '../account/test-kit';
import { contributorMe, curatorMe, detail, listItem } from '../library/library-fixtures';

jest.mock('expo-router', () => require('../account/expo-router-mock').expoRouterMock);

const queue = reviewQueueResponseSchema.parse({
  total: 1,
  items: [
    {
      ...listItem({ status: 'in-review', version: 2 }),
      groupName: 'Larkspur Coordination Lab',
      submittedBy: { id: 'u-student', displayName: 'Ada Fenwick' },
      submittedAt: '2026-01-04T08:00:00.000Z',
      isEditOfApproved: false,
    },
  ],
});

const reviewed = (decision: string, comment: string) => ({
  status: 201,
  body: {
    review: {
      id: 'r-1',
      complexId: 'c-cr-aqua',
      revisionNumber: 3,
      decision,
      comment,
      reviewer: { id: 'u-curator', displayName: 'Milo Reed' },
      selfAccepted: false,
      createdAt: '2026-01-06T10:00:00.000Z',
    },
    complex: detail({ status: decision === 'accept' ? 'accepted' : 'returned', version: 3 }),
  },
});

describe('ReviewQueueScreen', () => {
  it('explains the queue to people who are not curators, without loading it', async () => {
    const { calls } = mockFetch({ 'GET /api/auth/me': { status: 200, body: contributorMe } });
    renderWithQueries(<ReviewQueueScreen />);
    expect(await screen.findByTestId('review-not-curator')).toHaveTextContent(/for curators/);
    expect(calls.some((c) => c.url === '/api/review-queue')).toBe(false);
  });

  it('shows formula, submitter and group, and requires a comment to return an entry', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/me': { status: 200, body: curatorMe },
      'GET /api/review-queue': { status: 200, body: queue },
      'POST /api/complexes/c-cr-aqua/reviews': reviewed('return', 'Give the ionic strength.'),
    });
    renderWithQueries(<ReviewQueueScreen />);
    expect(await screen.findByTestId('review-item-0-meta')).toHaveTextContent(/Ada Fenwick · submitted .* · Larkspur Coordination Lab/);
    expect(screen.getByTestId('review-item-0')).toHaveTextContent(/\[Cr\(H₂O\)₆\]³⁺/);
    fireEvent.press(screen.getByTestId('review-return'));
    fireEvent.press(screen.getByTestId('review-decision-submit'));
    expect(await screen.findByTestId('review-comment-error')).toHaveTextContent(/a comment is required unless you accept/);
    expect(calls.some((c) => c.method === 'POST')).toBe(false);

    fireEvent.changeText(screen.getByTestId('review-comment'), 'Give the ionic strength.');
    fireEvent.press(screen.getByTestId('review-decision-submit'));
    await waitFor(() => expect(calls.find((c) => c.method === 'POST')?.body).toEqual({ decision: 'return', comment: 'Give the ionic strength.', version: 2 }));
    expect(await screen.findByTestId('review-queue-done')).toHaveTextContent(/\[Cr\(H₂O\)₆\]³⁺ — Returned/);
  });

  it('accepts without a comment and reports a refused self-acceptance in the server’s words', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/me': { status: 200, body: curatorMe },
      'GET /api/review-queue': { status: 200, body: queue },
      'POST /api/complexes/c-cr-aqua/reviews': apiError(409, 'CONFLICT', 'You cannot accept your own submission: another curator of this group must review it.'),
    });
    renderWithQueries(<ReviewQueueScreen />);
    fireEvent.press(await screen.findByTestId('review-accept'));
    fireEvent.press(screen.getByTestId('review-decision-submit'));
    expect(await screen.findByTestId('review-error')).toHaveTextContent(/another curator of this group must review it/);
    expect(calls.find((c) => c.method === 'POST')?.body).toEqual({ decision: 'accept', comment: '', version: 2 });
  });

  it('says so when nothing waits', async () => {
    mockFetch({
      'GET /api/auth/me': { status: 200, body: curatorMe },
      'GET /api/review-queue': { status: 200, body: { items: [], total: 0 } },
    });
    renderWithQueries(<ReviewQueueScreen />);
    expect(await screen.findByTestId('review-queue-empty')).toHaveTextContent('Nothing waits for review.');
  });
});

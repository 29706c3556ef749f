import { fireEvent, screen, waitFor } from '@testing-library/react-native';
import { AccountScreen } from '@/components/account/account-screen';
import { MembersCard } from '@/components/account/members-card';
import type { GroupDetail } from '@/lib/schemas/groups';
import { apiError, demoMe, mockFetch, renderWithQueries } from './test-kit';

// jest.mock factories run before imports, so the stand-in is required inside.
 
jest.mock('expo-router', () => require('./expo-router-mock').expoRouterMock);
jest.setTimeout(20_000);

const at = '2026-12-01T09:00:00.000Z';

describe('AccountScreen', () => {
  it('invites a signed-out visitor to sign in, and says Check and Route need no account', async () => {
    mockFetch({ 'GET /api/auth/me': apiError(401, 'UNAUTHENTICATED', 'Sign in to continue.') });
    renderWithQueries(<AccountScreen />);
    expect(await screen.findByTestId('account-signed-out')).toHaveTextContent(/No account is needed/);
    expect(screen.getByTestId('account-sign-in')).toBeTruthy();
  });

  it('shows the signed-in person with groups and sessions', async () => {
    mockFetch({
      'GET /api/auth/me': { status: 200, body: demoMe },
      'GET /api/groups': {
        status: 200,
        body: { groups: [{ id: 'g-1', name: 'Larkspur Coordination Lab', role: 'admin', memberCount: 5, createdAt: at }] },
      },
      'GET /api/auth/sessions': {
        status: 200,
        body: {
          sessions: [
            { id: 's-other', createdAt: at, expiresAt: '2027-01-01T09:00:00.000Z', userAgent: 'Mozilla/5.0 (X11; Linux x86_64) Firefox/140.0', ip: '10.0.0.7', current: false },
            { id: 's-here', createdAt: at, expiresAt: '2027-01-01T09:00:00.000Z', userAgent: null, ip: null, current: true },
          ],
        },
      },
    });
    renderWithQueries(<AccountScreen />);
    expect(await screen.findByTestId('account-signed-in')).toHaveTextContent(/Dr Iris Larkspur/);
    expect(await screen.findByTestId('group-row-g-1')).toHaveTextContent(/Larkspur Coordination Lab/);
    expect(screen.getByTestId('group-role-g-1')).toHaveTextContent('Admin');
    expect(await screen.findByTestId('session-row-s-here')).toHaveTextContent(/This device/);
    // The current session cannot be revoked from the list; the other one can.
    expect(screen.queryByTestId('session-revoke-s-here')).toBeNull();
    expect(screen.getByTestId('session-revoke-s-other')).toBeTruthy();
  });

  it('keeps an error apart from being signed out', async () => {
    mockFetch({ 'GET /api/auth/me': apiError(503, 'UNAVAILABLE', 'down') });
    renderWithQueries(<AccountScreen />);
    expect(await screen.findByTestId('account-error')).toBeTruthy();
    expect(screen.queryByTestId('account-signed-out')).toBeNull();
  });
});

describe('MembersCard', () => {
  const detail: GroupDetail = {
    id: 'g-1',
    name: 'Larkspur Coordination Lab',
    createdAt: at,
    myRole: 'admin',
    members: [
      { userId: 'u-admin', email: 'admin@larkspur.example.org', displayName: 'Dr Iris Larkspur', role: 'admin', joinedAt: at },
      { userId: 'u-viewer', email: 'viewer@larkspur.example.org', displayName: 'K. Visiting', role: 'viewer', joinedAt: at },
    ],
  };

  it('shows the server’s refusal when the last admin would leave', async () => {
    const refusal = 'A group must keep at least one admin: make someone else an admin first.';
    mockFetch({ 'DELETE /api/groups/g-1/members/u-admin': apiError(409, 'CONFLICT', refusal) });
    const onLeft = jest.fn();
    renderWithQueries(<MembersCard detail={detail} myUserId="u-admin" onLeft={onLeft} />);
    fireEvent.press(screen.getByTestId('member-remove-u-admin'));
    fireEvent.press(screen.getByTestId('member-remove-yes-u-admin'));
    expect(await screen.findByTestId('members-error')).toHaveTextContent(refusal);
    expect(onLeft).not.toHaveBeenCalled();
  });

  it('changes a role with one tap on the picker', async () => {
    const { calls } = mockFetch({
      'PATCH /api/groups/g-1/members/u-viewer': {
        status: 200,
        body: { ...detail, members: detail.members.map((m) => (m.userId === 'u-viewer' ? { ...m, role: 'contributor' } : m)) },
      },
    });
    renderWithQueries(<MembersCard detail={detail} myUserId="u-admin" onLeft={jest.fn()} />);
    fireEvent.press(screen.getByTestId('member-role-u-viewer-contributor'));
    await waitFor(() => expect(calls.some((call) => call.method === 'PATCH')).toBe(true));
    expect(calls.find((call) => call.method === 'PATCH')?.body).toEqual({ role: 'contributor' });
  });
});

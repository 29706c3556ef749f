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

  it('changes a role only after a confirmation that says what changes', async () => {
    const { calls } = mockFetch({
      'PATCH /api/groups/g-1/members/u-viewer': {
        status: 200,
        body: { ...detail, members: detail.members.map((m) => (m.userId === 'u-viewer' ? { ...m, role: 'contributor' } : m)) },
      },
    });
    renderWithQueries(<MembersCard detail={detail} myUserId="u-admin" onLeft={jest.fn()} />);
    fireEvent.press(screen.getByTestId('member-role-u-viewer-contributor'));
    expect(screen.getByTestId('member-role-confirm-u-viewer')).toHaveTextContent(/Make K\. Visiting a contributor instead of a viewer\?/);
    expect(calls.some((call) => call.method === 'PATCH')).toBe(false);
    fireEvent.press(screen.getByTestId('member-role-yes-u-viewer'));
    await waitFor(() => expect(calls.some((call) => call.method === 'PATCH')).toBe(true));
    expect(calls.find((call) => call.method === 'PATCH')?.body).toEqual({ role: 'contributor' });
  });
});

describe('MembersCard feedback', () => {
  const detail: GroupDetail = {
    id: 'g-2',
    name: 'Larkspur Coordination Lab',
    createdAt: '2026-11-02T09:00:00.000Z',
    myRole: 'admin',
    members: [
      { userId: 'u-b', email: 'b@larkspur.example.org', displayName: 'Bram Osei', role: 'viewer', joinedAt: '2026-11-02T09:00:00.000Z' },
      { userId: 'u-a', email: 'a@larkspur.example.org', displayName: 'Ama Lindqvist', role: 'admin', joinedAt: '2026-11-02T09:00:00.000Z' },
    ],
  };

  it('keeps rows in name order whatever the roles, so a role change does not move the row', () => {
    mockFetch({});
    renderWithQueries(<MembersCard detail={detail} myUserId="u-a" onLeft={jest.fn()} />);
    const ids = screen.getAllByTestId(/^member-row-/).map((row) => row.props.testID);
    expect(ids).toEqual(['member-row-u-a', 'member-row-u-b']);
  });

  it('cancelling the confirmation sends nothing and puts the picker back', () => {
    const { calls } = mockFetch({});
    renderWithQueries(<MembersCard detail={detail} myUserId="u-a" onLeft={jest.fn()} />);
    fireEvent.press(screen.getByTestId('member-role-u-b-curator'));
    fireEvent.press(screen.getByTestId('member-role-no-u-b'));
    expect(screen.queryByTestId('member-role-confirm-u-b')).toBeNull();
    expect(calls).toEqual([]);
  });
});

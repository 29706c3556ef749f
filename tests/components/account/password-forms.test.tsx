import { fireEvent, screen, waitFor } from '@testing-library/react-native';
import { ForgotPasswordScreen } from '@/components/account/forgot-password-screen';
import { PasswordCard } from '@/components/account/password-card';
import { ResetPasswordScreen } from '@/components/account/reset-password-screen';
import { SignUpScreen } from '@/components/account/sign-up-screen';
import { apiError, mockFetch, renderWithQueries } from './test-kit';

// jest.mock factories run before imports, so the stand-in is required inside.
 
jest.mock('expo-router', () => require('./expo-router-mock').expoRouterMock);
jest.setTimeout(20_000);

/** Every string in a rendered tree, in order (what a reader would see). */
function textOf(node: unknown): string {
  if (typeof node === 'string') return node;
  if (Array.isArray(node)) return node.map(textOf).join('');
  if (node && typeof node === 'object' && 'children' in node) return textOf((node as { children: unknown }).children);
  return '';
}

const TOKEN = 'a-reset-token-of-enough-length-0123456789';

describe('ResetPasswordScreen', () => {
  it('asks for the same password twice before sending anything', async () => {
    const { fetchMock } = mockFetch({});
    renderWithQueries(<ResetPasswordScreen token={TOKEN} />);
    fireEvent.changeText(screen.getByTestId('reset-password'), 'violet cobalt ammine');
    fireEvent.changeText(screen.getByTestId('reset-password-confirm'), 'violet cobalt amine');
    fireEvent.press(screen.getByTestId('reset-submit'));
    expect(await screen.findByTestId('reset-password-confirm-error')).toHaveTextContent(/The two passwords differ/);
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('shows the server’s weak-password reason on the password field and sends only token and password', async () => {
    const { calls } = mockFetch({
      'POST /api/auth/password-reset/confirm': apiError(400, 'VALIDATION_FAILED', 'The password is too weak: This password is on a list of commonly used passwords: choose another.', {
        password: 'This password is on a list of commonly used passwords: choose another.',
      }),
    });
    renderWithQueries(<ResetPasswordScreen token={TOKEN} />);
    fireEvent.changeText(screen.getByTestId('reset-password'), 'password1234');
    fireEvent.changeText(screen.getByTestId('reset-password-confirm'), 'password1234');
    fireEvent.press(screen.getByTestId('reset-submit'));
    expect(await screen.findByTestId('reset-password-error')).toHaveTextContent(/commonly used passwords/);
    expect(calls[0]?.body).toEqual({ token: TOKEN, password: 'password1234' });
  });

  it('explains a spent link and offers a new one', async () => {
    mockFetch({
      'POST /api/auth/password-reset/confirm': apiError(400, 'VALIDATION_FAILED', 'This link is not valid any more.', { token: 'invalid, used or expired' }),
    });
    renderWithQueries(<ResetPasswordScreen token={TOKEN} />);
    fireEvent.changeText(screen.getByTestId('reset-password'), 'teal paper ligand field');
    fireEvent.changeText(screen.getByTestId('reset-password-confirm'), 'teal paper ligand field');
    fireEvent.press(screen.getByTestId('reset-submit'));
    expect(await screen.findByTestId('reset-form-error')).toHaveTextContent(/no longer works/);
    expect(screen.getByTestId('reset-request-new')).toBeTruthy();
  });

  it('says the link is needed when there is no token', () => {
    mockFetch({});
    renderWithQueries(<ResetPasswordScreen token="" />);
    expect(screen.getByTestId('reset-missing-token')).toBeTruthy();
    expect(screen.queryByTestId('reset-submit')).toBeNull();
  });
});

describe('PasswordCard (signed in)', () => {
  const fill = (current: string, next: string, again: string) => {
    fireEvent.changeText(screen.getByTestId('password-current'), current);
    fireEvent.changeText(screen.getByTestId('password-new'), next);
    fireEvent.changeText(screen.getByTestId('password-new-confirm'), again);
    fireEvent.press(screen.getByTestId('password-submit'));
  };

  it('checks the two new passwords agree before sending anything', async () => {
    const { fetchMock } = mockFetch({});
    renderWithQueries(<PasswordCard />);
    fill('the current one', 'labile aqua complex', 'labile aqua complx');
    expect(await screen.findByTestId('password-new-confirm-error')).toHaveTextContent(/The two passwords differ/);
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('puts a wrong current password on its field and sends only current and new', async () => {
    const { calls } = mockFetch({
      'POST /api/auth/password': apiError(400, 'VALIDATION_FAILED', 'The current password is not right.', { currentPassword: 'That is not your current password.' }),
    });
    renderWithQueries(<PasswordCard />);
    fill('not my password', 'inert chromium ammine', 'inert chromium ammine');
    expect(await screen.findByTestId('password-current-error')).toHaveTextContent('That is not your current password.');
    expect(calls[0]?.body).toEqual({ currentPassword: 'not my password', newPassword: 'inert chromium ammine' });
  });

  it('says what happened and empties the fields after a change', async () => {
    mockFetch({ 'POST /api/auth/password': { status: 200, body: { message: 'Your password is changed. Other devices where you were signed in have been signed out.' } } });
    renderWithQueries(<PasswordCard />);
    fill('the current one', 'inert chromium ammine', 'inert chromium ammine');
    expect(await screen.findByTestId('password-done')).toHaveTextContent(/Other devices .* signed out/);
    expect(screen.getByTestId('password-current').props.value).toBe('');
    expect(screen.getByTestId('password-new').props.value).toBe('');
  });
});

describe('ForgotPasswordScreen', () => {
  it('confirms in the same words whatever the address', async () => {
    mockFetch({ 'POST /api/auth/password-reset/request': { status: 202, body: { message: 'queued' } } });
    const confirmationFor = async (email: string) => {
      const view = renderWithQueries(<ForgotPasswordScreen />);
      fireEvent.changeText(screen.getByTestId('forgot-email'), email);
      fireEvent.press(screen.getByTestId('forgot-submit'));
      await screen.findByTestId('forgot-done');
      const words = textOf(view.toJSON()).replaceAll(email, '<address>');
      view.unmount();
      return words;
    };
    const known = await confirmationFor('admin@larkspur.example.org');
    const unknown = await confirmationFor('nobody-here@example.org');
    expect(known).toContain('If <address> belongs to a Sphereline account, a link to choose a new password is on its way.');
    expect(unknown).toBe(known);
  });
});

describe('SignUpScreen', () => {
  it('explains the password rules, then switches to a check-your-e-mail state', async () => {
    const { calls } = mockFetch({ 'POST /api/auth/sign-up': { status: 202, body: { message: 'sent' } } });
    renderWithQueries(<SignUpScreen email="viewer@larkspur.example.org" />);
    expect(screen.getByTestId('sign-up-password-hint')).toHaveTextContent(/At least 12 characters/);
    expect(screen.getByTestId('sign-up-email').props.value).toBe('viewer@larkspur.example.org');
    fireEvent.changeText(screen.getByTestId('sign-up-display-name'), 'K. Visiting');
    fireEvent.changeText(screen.getByTestId('sign-up-password'), 'outer sphere bridge');
    fireEvent.press(screen.getByTestId('sign-up-submit'));
    expect(await screen.findByTestId('sign-up-done')).toHaveTextContent(/viewer@larkspur\.example\.org/);
    await waitFor(() => expect(calls.some((call) => call.url === '/api/auth/sign-up')).toBe(true));
    expect(calls.find((call) => call.url === '/api/auth/sign-up')?.body).toEqual({
      displayName: 'K. Visiting',
      email: 'viewer@larkspur.example.org',
      password: 'outer sphere bridge',
    });
  });
});

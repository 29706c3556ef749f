import { act, fireEvent, screen, waitFor } from '@testing-library/react-native';
import { SignInForm } from '@/components/account/sign-in-form';
import { apiError, demoMe, mockFetch, renderWithQueries, type CannedResponse } from './test-kit';

// jest.mock factories run before imports, so the stand-in is required inside.
 
jest.mock('expo-router', () => require('./expo-router-mock').expoRouterMock);
jest.setTimeout(20_000);

function fillAndSubmit(email: string, password: string) {
  fireEvent.changeText(screen.getByTestId('sign-in-email'), email);
  fireEvent.changeText(screen.getByTestId('sign-in-password'), password);
  fireEvent.press(screen.getByTestId('sign-in-submit'));
}

describe('SignInForm', () => {
  it('checks the fields itself before asking the server', async () => {
    const { fetchMock } = mockFetch({});
    renderWithQueries(<SignInForm onSignedIn={jest.fn()} />);
    fillAndSubmit('not-an-address', '');
    // Wording from the shared zod rules in lib/schemas/auth.ts.
    expect(await screen.findByTestId('sign-in-email-error')).toHaveTextContent('Enter a valid e-mail address, like name@example.org.');
    expect(screen.getByTestId('sign-in-password-error')).toHaveTextContent('Enter your password.');
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('puts a server field problem under the field it concerns', async () => {
    mockFetch({
      'POST /api/auth/sign-in': apiError(400, 'VALIDATION_FAILED', 'The request body is not valid (email: That address is not allowed here.).', {
        email: 'That address is not allowed here.',
      }),
    });
    renderWithQueries(<SignInForm onSignedIn={jest.fn()} />);
    fillAndSubmit('curator@larkspur.example.org', 'a password');
    expect(await screen.findByTestId('sign-in-email-error')).toHaveTextContent('That address is not allowed here.');
    expect(screen.queryByTestId('sign-in-password-error')).toBeNull();
    expect(screen.queryByTestId('sign-in-form-error')).toBeNull();
  });

  it('answers a refused sign-in with one fixed sentence, not the server’s reason', async () => {
    mockFetch({ 'POST /api/auth/sign-in': apiError(401, 'UNAUTHENTICATED', 'no account with this address') });
    const onSignedIn = jest.fn();
    renderWithQueries(<SignInForm onSignedIn={onSignedIn} />);
    fillAndSubmit('nobody@example.org', 'whatever-it-is');
    const box = await screen.findByTestId('sign-in-form-error');
    expect(box).toHaveTextContent('We could not sign you in with that e-mail address and password. Check both and try again.');
    expect(box).not.toHaveTextContent('no account with this address');
    expect(onSignedIn).not.toHaveBeenCalled();
  });

  it('shows how long to wait when attempts are rate limited', async () => {
    mockFetch({ 'POST /api/auth/sign-in': apiError(429, 'RATE_LIMITED', 'Too many attempts. Try again in 15 minute(s).') });
    renderWithQueries(<SignInForm onSignedIn={jest.fn()} />);
    fillAndSubmit('viewer@larkspur.example.org', 'guess-number-six');
    expect(await screen.findByTestId('sign-in-form-error')).toHaveTextContent(/Try again in 15 minute/);
  });

  it('disables the submit button while the request is in flight, then hands over the person', async () => {
    let answer: (response: CannedResponse) => void = () => undefined;
    const pending = new Promise<CannedResponse>((resolve) => {
      answer = resolve;
    });
    const { calls } = mockFetch({ 'POST /api/auth/sign-in': () => pending });
    const onSignedIn = jest.fn();
    renderWithQueries(<SignInForm onSignedIn={onSignedIn} />);
    fillAndSubmit('  Admin@Larkspur.example.org ', 'sphereline-demo');
    await waitFor(() => expect(screen.getByTestId('sign-in-submit')).toBeDisabled());
    expect(screen.getByTestId('sign-in-submit')).toHaveTextContent('Signing in…');
    // The shared schema trims and lower-cases the address before it is sent.
    expect(calls[0]?.body).toEqual({ email: 'admin@larkspur.example.org', password: 'sphereline-demo' });
    await act(async () => answer({ status: 200, body: demoMe }));
    await waitFor(() => expect(onSignedIn).toHaveBeenCalledWith(demoMe));
    expect(screen.getByTestId('sign-in-submit')).not.toBeDisabled();
  });

  it('fills the form from the demo lab panel', async () => {
    const { calls } = mockFetch({ 'POST /api/auth/sign-in': { status: 200, body: demoMe } });
    renderWithQueries(<SignInForm onSignedIn={jest.fn()} />);
    expect(screen.getByTestId('demo-lab')).toHaveTextContent(/demonstration servers only/);
    fireEvent.press(screen.getByTestId('demo-sign-in-curator'));
    expect(screen.getByTestId('sign-in-email').props.value).toBe('curator@larkspur.example.org');
    fireEvent.press(screen.getByTestId('sign-in-submit'));
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0]?.body).toEqual({ email: 'curator@larkspur.example.org', password: 'sphereline-demo' });
  });
});

import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render } from '@testing-library/react-native';
import type { ReactElement } from 'react';

/** A canned HTTP answer for the mocked fetch. */
export interface CannedResponse {
  status: number;
  body?: unknown;
}

export type FetchCall = { url: string; method: string; body: unknown };

/**
 * Replaces global fetch with a router of canned answers: `routes` maps "METHOD /api/path" to an answer
 * (or a function returning one, or a promise for answers that should stay pending).
 */
type Route = CannedResponse | (() => CannedResponse | Promise<CannedResponse>);
const resolveRoute = async (route: Route): Promise<CannedResponse> => (typeof route === 'function' ? route() : route);

const ME_KEY = 'GET /api/auth/me';
const SESSION_KEY = 'GET /api/auth/session';

/**
 * The app asks GET /api/auth/session (200 with `me`, or `me: null` for a visitor) where tests describe
 * the person as GET /api/auth/me answers: the same person, and the 401 of a visitor becomes `me: null`.
 */
function sessionFromMe(answer: CannedResponse): CannedResponse {
  if (answer.status >= 200 && answer.status < 300) return { status: 200, body: { me: answer.body } };
  if (answer.status === 401) return { status: 200, body: { me: null } };
  return answer;
}

export function mockFetch(routes: Record<string, CannedResponse | (() => CannedResponse | Promise<CannedResponse>)>) {
  const calls: FetchCall[] = [];
  const fetchMock = jest.fn(async (input: string, init?: { method?: string; body?: string }) => {
    const method = init?.method ?? 'GET';
    const url = String(input);
    calls.push({ url, method, body: init?.body ? JSON.parse(init.body) : undefined });
    const key = `${method} ${url.split('?')[0]}`;
    const route = routes[key];
    const answer =
      route === undefined && key === SESSION_KEY && routes[ME_KEY] !== undefined
        ? sessionFromMe(await resolveRoute(routes[ME_KEY]))
        : route === undefined
          ? { status: 404, body: { error: { code: 'NOT_FOUND', message: `No route ${key}` } } }
          : await resolveRoute(route);
    return {
      ok: answer.status >= 200 && answer.status < 300,
      status: answer.status,
      json: async () => {
        if (answer.body === undefined) throw new SyntaxError('no body');
        return answer.body;
      },
    };
  });
  global.fetch = fetchMock as unknown as typeof fetch;
  return { calls, fetchMock };
}

export function apiError(status: number, code: string, message: string, fields?: Record<string, string>): CannedResponse {
  return { status, body: { error: { code, message, ...(fields ? { fields } : {}) } } };
}

const openClients: QueryClient[] = [];
afterEach(() => {
  for (const client of openClients.splice(0)) client.clear();
});

export function renderWithQueries(ui: ReactElement) {
  const client = new QueryClient({
    // Infinite gcTime: no garbage-collection timers left running after a test ends.
    defaultOptions: { queries: { retry: false, gcTime: Infinity }, mutations: { retry: false, gcTime: Infinity } },
  });
  openClients.push(client);
  return { client, ...render(<QueryClientProvider client={client}>{ui}</QueryClientProvider>) };
}

/** A person of the invented demo lab, as GET /api/auth/me answers. */
export const demoMe = {
  user: { id: 'u-admin', email: 'admin@larkspur.example.org', displayName: 'Dr Iris Larkspur' },
  memberships: [{ groupId: 'g-1', groupName: 'Larkspur Coordination Lab', role: 'admin' }],
};

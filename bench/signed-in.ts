/**
 * Section 2b: what a signed-in person costs. The bench server's database gets a group with a viewer
 * and a curator, a library of 1 000 generated accepted entries, and a session for each (rows written
 * as the server writes them: the SHA-256 of the cookie's secret). autocannon then drives, in
 * interleaved rounds so noise falls alike, the bare `GET /api/health/live`, `GET /api/auth/me` and a
 * library search as the viewer and as the curator (the typical searches of bench/search.ts in turn),
 * at 50 connections; then the searches alone at 200 connections for p50 and p99.
 */
import { randomBytes } from 'node:crypto';
import { openOrm } from '@/server/db/orm';
import { hashSecret } from '@/server/modules/auth/tokens';
import { User } from '@/server/modules/auth/user.entity';
import { UserSession } from '@/server/modules/auth/user-session.entity';
import { ResearchGroup } from '@/server/modules/groups/group.entity';
import { GroupMembership } from '@/server/modules/groups/membership.entity';
import { generateSyntheticEntries } from '@/server/modules/library/generate';
import { SESSION_COOKIE_NAME } from '@/server/modules/auth/lucia';
import { measure, type EndpointFigures, type RequestSpec } from './http';
import { typicalSearches } from './search';
import { median } from './stats';

export const ME_TARGET_RATIO = 0.5;
export const SEARCH_TARGET_RATIO_TO_LIVE = 0.3;
export const SEARCH_TARGET_P99_MS = 250;
export const SIGNED_IN_LIBRARY_SIZE = 1000;

export interface SignedInOptions {
  rounds: number;
  secondsPerRun: number;
  loadConnections: number;
}

export const defaultSignedInOptions: SignedInOptions = { rounds: 3, secondsPerRun: 3, loadConnections: 200 };

type Name = 'live' | 'me' | 'searchViewer' | 'searchCurator';

export interface SignedInResult {
  entries: number;
  at50: Record<Name, { requestsPerSecond: number; latencyP50Ms: number; latencyP99Ms: number; non2xx: number; errors: number }>;
  meVsLive: number;
  searchViewerVsLive: number;
  searchCuratorVsLive: number;
  underLoad: Record<'viewer' | 'curator', { connections: number; requestsPerSecond: number; latencyP50Ms: number; latencyP99Ms: number; non2xx: number; errors: number }>;
}

async function seedSignedInWorld(databaseUrl: string) {
  const orm = await openOrm(databaseUrl);
  try {
    const em = orm.em.fork();
    const viewer = em.create(User, { email: 'bench.viewer@larkspur.example.org', displayName: 'Bench viewer', passwordHash: 'x', emailVerifiedAt: new Date() });
    const curator = em.create(User, { email: 'bench.curator@larkspur.example.org', displayName: 'Bench curator', passwordHash: 'x', emailVerifiedAt: new Date() });
    const group = em.create(ResearchGroup, { name: 'Larkspur Coordination Lab (bench)' });
    await em.flush();
    em.create(GroupMembership, { groupId: group.id, userId: viewer.id, role: 'viewer' });
    em.create(GroupMembership, { groupId: group.id, userId: curator.id, role: 'curator' });
    const cookies: Record<'viewer' | 'curator', string> = { viewer: '', curator: '' };
    for (const [who, user] of [['viewer', viewer], ['curator', curator]] as const) {
      const secret = randomBytes(20).toString('hex');
      em.create(UserSession, {
        id: hashSecret(secret),
        userId: user.id,
        expiresAt: new Date(Date.now() + 14 * 86_400_000),
        createdAt: new Date(),
        userAgent: 'bench',
        ip: '127.0.0.1',
      });
      cookies[who] = `${SESSION_COOKIE_NAME}=${secret}`;
    }
    await em.flush();
    await generateSyntheticEntries(orm.em.fork(), { groupId: group.id, count: SIGNED_IN_LIBRARY_SIZE, createdById: curator.id });
    return { groupId: group.id, cookies };
  } finally {
    await orm.close(true);
  }
}

function searchPaths(groupId: string): string[] {
  return Object.values(typicalSearches).flatMap((query) =>
    [1, 2].map((page) => `/api/complexes?${new URLSearchParams({ ...query, groupId, page: String(page), pageSize: '20' }).toString()}`),
  );
}

export async function runSignedInBench(
  baseUrl: string,
  databaseUrl: string,
  options: SignedInOptions = defaultSignedInOptions,
  log: (line: string) => void = () => {},
): Promise<SignedInResult> {
  log(`signed-in: a group, a viewer, a curator and ${SIGNED_IN_LIBRARY_SIZE} entries …`);
  const { groupId, cookies } = await seedSignedInWorld(databaseUrl);
  const paths = searchPaths(groupId);
  const specs: Record<Name, RequestSpec> = {
    live: { method: 'GET', path: '/api/health/live' },
    me: { method: 'GET', path: '/api/auth/me', headers: { cookie: cookies.viewer } },
    searchViewer: { method: 'GET', path: paths[0] ?? '/', paths, headers: { cookie: cookies.viewer } },
    searchCurator: { method: 'GET', path: paths[0] ?? '/', paths, headers: { cookie: cookies.curator } },
  };
  const names = Object.keys(specs) as Name[];
  for (const name of names) await measure(baseUrl, { spec: specs[name] }, 10, 1); // warm-up

  const runs = new Map<Name, EndpointFigures[]>();
  for (let round = 0; round < options.rounds; round += 1) {
    for (const name of names) {
      const figures = await measure(baseUrl, { spec: specs[name] }, 50, options.secondsPerRun);
      runs.set(name, [...(runs.get(name) ?? []), figures]);
      log(`  signed-in 50 conn, round ${round + 1}: ${name} ${Math.round(figures.requestsPerSecond)} req/s, p99 ${figures.latencyP99Ms} ms`);
    }
  }
  const ratio = (name: Name) =>
    median((runs.get(name) ?? []).map((f, i) => f.requestsPerSecond / (runs.get('live')?.[i]?.requestsPerSecond ?? Number.NaN)));
  const summary = (name: Name) => {
    const figures = runs.get(name) ?? [];
    return {
      requestsPerSecond: median(figures.map((f) => f.requestsPerSecond)),
      latencyP50Ms: median(figures.map((f) => f.latencyP50Ms)),
      latencyP99Ms: median(figures.map((f) => f.latencyP99Ms)),
      non2xx: figures.reduce((sum, f) => sum + f.non2xx, 0),
      errors: figures.reduce((sum, f) => sum + f.errors, 0),
    };
  };

  const underLoad = {} as SignedInResult['underLoad'];
  for (const who of ['viewer', 'curator'] as const) {
    const figures = await measure(baseUrl, { spec: who === 'viewer' ? specs.searchViewer : specs.searchCurator }, options.loadConnections, options.secondsPerRun * 2);
    underLoad[who] = { connections: options.loadConnections, ...figures };
    log(`  search as ${who} at ${options.loadConnections} conn: ${Math.round(figures.requestsPerSecond)} req/s, p50 ${figures.latencyP50Ms} ms, p99 ${figures.latencyP99Ms} ms`);
  }
  return {
    entries: SIGNED_IN_LIBRARY_SIZE,
    at50: { live: summary('live'), me: summary('me'), searchViewer: summary('searchViewer'), searchCurator: summary('searchCurator') },
    meVsLive: ratio('me'),
    searchViewerVsLive: ratio('searchViewer'),
    searchCuratorVsLive: ratio('searchCurator'),
    underLoad,
  };
}

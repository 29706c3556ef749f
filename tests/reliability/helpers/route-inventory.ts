import type { Express } from 'express';

export interface ApiRoute {
  method: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  /** Express path under /api, e.g. "/api/complexes/:id". */
  path: string;
}

interface LayerLike {
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: LayerLike[] };
  matchers?: ((path: string) => unknown)[];
}

/**
 * Every route the app answers under /api, read from Express's own router (so a route added later is
 * covered without touching the tests). Routers are mounted without a path inside the /api router,
 * which is the convention of server/app.ts; the /api mount itself is found by matching "/api/health".
 */
export function listApiRoutes(app: Express): ApiRoute[] {
  const top = (app as unknown as { router: { stack: LayerLike[] } }).router.stack;
  const apiLayer = top.find((layer) => layer.handle?.stack && layer.matchers?.some((match) => Boolean(match('/api/health'))));
  if (!apiLayer?.handle?.stack) throw new Error('The /api router was not found in the app.');
  const routes: ApiRoute[] = [];
  const walk = (stack: LayerLike[]) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const [method, on] of Object.entries(layer.route.methods)) {
          if (on && method !== '_all') routes.push({ method: method.toUpperCase() as ApiRoute['method'], path: `/api${layer.route.path}` });
        }
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack);
      }
    }
  };
  walk(apiLayer.handle.stack);
  return routes;
}

export const isWriteRoute = (route: ApiRoute) => route.method !== 'GET';

/**
 * The write routes as of this suite's writing: the fallback (and a check that introspection still
 * works: every one of these must be found by listApiRoutes).
 */
export const KNOWN_WRITE_ROUTES: readonly string[] = [
  'POST /api/classify',
  'POST /api/route',
  'POST /api/marcus',
  'POST /api/auth/sign-up',
  'POST /api/auth/verify',
  'POST /api/auth/sign-in',
  'POST /api/auth/sign-out',
  'POST /api/auth/sign-out-everywhere',
  'PATCH /api/auth/me',
  'POST /api/auth/password-reset/request',
  'POST /api/auth/password-reset/confirm',
  'POST /api/auth/password',
  'DELETE /api/auth/sessions/:id',
  'POST /api/groups',
  'POST /api/groups/:groupId/invitations',
  'DELETE /api/groups/:groupId/invitations/:id',
  'PATCH /api/groups/:groupId/members/:userId',
  'DELETE /api/groups/:groupId/members/:userId',
  'POST /api/invitations/accept',
  'PATCH /api/auth/me/preferences',
  'POST /api/imports',
  'POST /api/complexes/:id/attachments',
  'DELETE /api/complexes/:id/attachments/:attachmentId',
  'POST /api/complexes',
  'PATCH /api/complexes/:id',
  'POST /api/complexes/:id/submit',
  'POST /api/complexes/:id/reviews',
  'POST /api/complexes/:id/retire',
  'POST /api/complexes/:id/measurements',
  'PATCH /api/complexes/:id/measurements/:mid',
  'DELETE /api/complexes/:id/measurements/:mid',
  'POST /api/citations',
  'POST /api/groups/:groupId/ligands',
];

export const routeKey = (route: ApiRoute) => `${route.method} ${route.path}`;

import type { Browser, BrowserContext, Page } from 'playwright-core';
import { baseUrl, collectPageErrors, viewports, type ViewportName } from './browser';
import { DEMO_PASSWORD } from './session';

/**
 * Every screen of the app, as the demo person it is meant for would open it (the invented Larkspur
 * lab of the demo seed). Shared by the accessibility spec and the screenshot spec, so both walk the
 * same list.
 */
export interface DemoScreen {
  /** File-name friendly: the screenshot is <name>-<phone|wide>.png. */
  name: string;
  /** The route file it exercises, as expo-router names it ("/library/[complexId]", "+not-found"). */
  route: string;
  path: string;
  /** Test id of an element that is there once the screen's content is in. */
  ready: string;
  /** Demo person signed in, if any. */
  as?: DemoPerson;
  /** What the page title must say (the product name comes last). */
  title: RegExp;
}

const PEOPLE = {
  admin: 'admin@larkspur.example.org',
  curator: 'curator@larkspur.example.org',
  contributor: 'contributor@larkspur.example.org',
  viewer: 'viewer@larkspur.example.org',
} as const;
export type DemoPerson = keyof typeof PEOPLE;

const q = encodeURIComponent;

/** One signed-in session per person, kept as cookies so each screen opens in a fresh context quickly. */
const sessions = new Map<DemoPerson, Awaited<ReturnType<BrowserContext['storageState']>>>();

async function sessionOf(browser: Browser, person: DemoPerson) {
  const known = sessions.get(person);
  if (known) return known;
  const context = await browser.newContext();
  const response = await context.request.post(`${baseUrl()}/api/auth/sign-in`, {
    data: { email: PEOPLE[person], password: DEMO_PASSWORD },
    headers: { Origin: baseUrl() },
  });
  if (!response.ok()) throw new Error(`sign-in of ${person}: ${response.status()} ${await response.text()}`);
  const state = await context.storageState();
  await context.close();
  sessions.set(person, state);
  return state;
}

async function contextFor(browser: Browser, size: ViewportName, person?: DemoPerson): Promise<BrowserContext> {
  return browser.newContext({ viewport: viewports[size], storageState: person ? await sessionOf(browser, person) : undefined });
}

async function apiAs<T>(browser: Browser, person: DemoPerson, path: string, body?: unknown): Promise<T> {
  const context = await contextFor(browser, 'wide', person);
  try {
    const response = body === undefined
      ? await context.request.get(`${baseUrl()}${path}`)
      : await context.request.post(`${baseUrl()}${path}`, { data: body, headers: { Origin: baseUrl() } });
    if (!response.ok()) throw new Error(`${path} as ${person}: ${response.status()} ${await response.text()}`);
    return (await response.json()) as T;
  } finally {
    await context.close();
  }
}

interface ListAnswer {
  items: { id: string; formula: string; status: string; createdBy: { displayName: string } | null }[];
}

/** A fresh invitation to the lab (one per call, to an address nobody has) and its link's token. */
async function invitationToken(browser: Browser, groupId: string, size: ViewportName): Promise<string> {
  // Short, as a real address would be (the screen writes it on its button), and new on every call.
  const email = `ines${Date.now() % 100_000}.${size}@larkspur.example.org`;
  await apiAs(browser, 'admin', `/api/groups/${groupId}/invitations`, { email, role: 'contributor' });
  const outbox = await fetch(`${baseUrl()}/api/dev/outbox?to=${q(email)}`, { headers: { Accept: 'application/json' } });
  const { messages } = (await outbox.json()) as { messages: { links: string[] }[] };
  for (const message of messages) {
    for (const link of message.links) {
      const token = new URL(link).searchParams.get('token');
      if (token && link.includes('/invitations/accept')) return token;
    }
  }
  throw new Error(`no invitation link in the mail to ${email}`);
}

function need<T>(value: T | undefined, what: string): T {
  if (value === undefined) throw new Error(`The demo library has no ${what}.`);
  return value;
}

/** The screens, with the ids of demo entries and the group looked up in the running server. */
export async function demoScreens(browser: Browser, size: ViewportName): Promise<DemoScreen[]> {
  const me = await apiAs<{ memberships: { groupId: string }[] }>(browser, 'admin', '/api/auth/me');
  const groupId = need(me.memberships[0], 'a group of the admin').groupId;
  const found = await apiAs<ListAnswer>(browser, 'viewer', `/api/complexes?q=${q('[Cr(H2O)6]3+')}&pageSize=20`);
  const accepted = need(found.items.find((item) => item.formula === '[Cr(H2O)6]3+') ?? found.items[0], 'an accepted entry');
  const inReview = await apiAs<ListAnswer>(browser, 'curator', '/api/complexes?status=in-review&pageSize=1');
  const drafts = await apiAs<ListAnswer>(browser, 'contributor', '/api/complexes?status=draft&pageSize=20');
  const ownDraft = need(drafts.items.find((item) => item.createdBy?.displayName === 'Priya Ashcombe') ?? drafts.items[0], 'a draft of the contributor');
  const waiting = need(inReview.items[0], 'an entry in review');
  const token = await invitationToken(browser, groupId, size).catch((error: Error) => {
    if (process.env.SCREENS_LENIENT === '1') return 'no-invitation';
    throw error;
  });
  const entryId = accepted.id;
  return [
    { name: 'landing', route: '/', path: '/', ready: 'landing-visitor', title: /^Labile or inert, bridged or not — Sphereline$/ },
    { name: 'landing-curator', route: '/', path: '/', ready: 'landing-review', as: 'curator', title: /^Labile or inert, bridged or not — Sphereline$/ },
    { name: 'landing-contributor', route: '/', path: '/', ready: 'landing-mine', as: 'contributor', title: /^Labile or inert, bridged or not — Sphereline$/ },
    { name: 'check-empty', route: '/check', path: '/check', ready: 'check-empty', title: /^Check — Sphereline$/ },
    { name: 'check', route: '/check', path: `/check?formula=${q('[Co(NH3)5Cl]Cl2')}`, ready: 'verdict-card', title: /^\[Co\(NH3\)5Cl\]Cl2 — Check — Sphereline$/ },
    { name: 'check-signed-in', route: '/check', path: `/check?formula=${q('[Cr(H2O)6]3+')}`, ready: 'verdict-card', as: 'viewer', title: /— Check — Sphereline$/ },
    { name: 'route-empty', route: '/route', path: '/route', ready: 'oxidant-input', title: /^Route — Sphereline$/ },
    { name: 'route', route: '/route', path: `/route?oxidant=${q('[Co(NH3)5Cl]2+')}&reductant=${q('[Cr(H2O)6]2+')}`, ready: 'route-result', title: /Route — Sphereline$/ },
    { name: 'planner', route: '/planner', path: `/planner?start=${q('[PtCl4]2-')}&ligands=${q('NH3 NH3')}`, ready: 'planner-result', title: /Order of addition — Sphereline$/ },
    { name: 'library-visitor', route: '/library', path: '/library', ready: 'library-signed-out', title: /^Library — Sphereline$/ },
    { name: 'library-viewer', route: '/library', path: '/library', ready: 'library-list', as: 'viewer', title: /^Library — Sphereline$/ },
    { name: 'library-curator', route: '/library', path: '/library', ready: 'library-list', as: 'curator', title: /^Library — Sphereline$/ },
    { name: 'library-entry', route: '/library/[complexId]', path: `/library/${entryId}`, ready: 'complex-formula', as: 'viewer', title: /Library — Sphereline$/ },
    { name: 'library-entry-in-review', route: '/library/[complexId]', path: `/library/${waiting.id}`, ready: 'complex-formula', as: 'curator', title: /Library — Sphereline$/ },
    { name: 'library-edit', route: '/library/[complexId]/edit', path: `/library/${ownDraft.id}/edit`, ready: 'complex-form-formula', as: 'contributor', title: /Library — Sphereline$/ },
    { name: 'library-new', route: '/library/new', path: '/library/new', ready: 'complex-form-formula', as: 'contributor', title: /^New entry — Library — Sphereline$/ },
    { name: 'library-import', route: '/library/import', path: '/library/import', ready: 'import-pick', as: 'contributor', title: /^Import — Library — Sphereline$/ },
    { name: 'review', route: '/review', path: '/review', ready: 'review-queue', as: 'curator', title: /^Review — Sphereline$/ },
    { name: 'review-not-curator', route: '/review', path: '/review', ready: 'review-not-curator', as: 'contributor', title: /^Review — Sphereline$/ },
    { name: 'account-visitor', route: '/account', path: '/account', ready: 'account-signed-out', title: /^Account — Sphereline$/ },
    { name: 'account-admin', route: '/account', path: '/account', ready: 'groups-list', as: 'admin', title: /^Account — Sphereline$/ },
    { name: 'group', route: '/account/groups/[groupId]', path: `/account/groups/${groupId}`, ready: 'group-name', as: 'admin', title: /Account — Sphereline$/ },
    { name: 'sign-in', route: '/sign-in', path: '/sign-in', ready: 'sign-in-email', title: /^Sign in — Sphereline$/ },
    { name: 'sign-up', route: '/sign-up', path: '/sign-up', ready: 'sign-up-screen', title: /— Sphereline$/ },
    { name: 'forgot-password', route: '/forgot-password', path: '/forgot-password', ready: 'forgot-email', title: /^Forgot password — Sphereline$/ },
    { name: 'reset-password', route: '/reset-password', path: '/reset-password?token=a-link-token-from-the-mail', ready: 'reset-password', title: /^Choose a new password — Sphereline$/ },
    { name: 'reset-password-no-token', route: '/reset-password', path: '/reset-password', ready: 'reset-missing-token', title: /^Choose a new password — Sphereline$/ },
    { name: 'verify-no-token', route: '/verify', path: '/verify', ready: 'verify-missing-token', title: /^Confirm your e-mail — Sphereline$/ },
    { name: 'invitation', route: '/invitations/accept', path: `/invitations/accept?token=${q(token)}`, ready: 'invitation-group-name', title: /^Invitation — Sphereline$/ },
    { name: 'invitation-no-token', route: '/invitations/accept', path: '/invitations/accept', ready: 'invitation-missing-token', title: /^Invitation — Sphereline$/ },
    { name: 'not-found', route: '+not-found', path: '/no-such-page', ready: 'not-found', title: /^Page not found — Sphereline$/ },
  ];
}

/** Opens a screen in a fresh context (signed in as its person) and waits until its content is in. */
export async function openScreen(
  browser: Browser,
  screen: DemoScreen,
  size: ViewportName,
  { lenient = false }: { lenient?: boolean } = {},
): Promise<{ page: Page; errors: string[]; close: () => Promise<void> }> {
  const context = await contextFor(browser, size, screen.as);
  const page = await context.newPage();
  const errors = collectPageErrors(page);
  await page.goto(`${baseUrl()}${screen.path}`);
  const ready = page.getByTestId(screen.ready).first().waitFor({ timeout: lenient ? 8_000 : 20_000 });
  // Lenient (an older build with other markers): go on with whatever the screen shows.
  await (lenient ? ready.catch(() => undefined) : ready);
  // Deferred cards and the session question answer after the first paint.
  await page.waitForLoadState('networkidle');
  await page.evaluate(() => document.fonts.ready);
  return { page, errors, close: () => context.close() };
}

import { sectionTitleParts } from '@/components/shell/section-title';
import { pageTitle } from '@/components/ui/page-title';

describe('page titles', () => {
  it('put the most specific part first and the product last, joined by em dashes', () => {
    expect(pageTitle('[Co(NH3)6]3+', 'Check')).toBe('[Co(NH3)6]3+ — Check — Sphereline');
    expect(pageTitle('Library')).toBe('Library — Sphereline');
    expect(pageTitle('', 'Check')).toBe('Check — Sphereline');
    expect(pageTitle(undefined, null, 'Route')).toBe('Route — Sphereline');
  });

  it.each([
    ['/', 'Labile or inert, bridged or not — Sphereline'],
    ['/check', 'Check — Sphereline'],
    ['/route', 'Route — Sphereline'],
    ['/library', 'Library — Sphereline'],
    ['/library/new', 'New entry — Library — Sphereline'],
    ['/library/import', 'Import — Library — Sphereline'],
    ['/library/2b7c1a5e-0000-4000-8000-000000000001', 'Entry — Library — Sphereline'],
    ['/library/2b7c1a5e-0000-4000-8000-000000000001/edit', 'Edit entry — Library — Sphereline'],
    ['/review', 'Review — Sphereline'],
    ['/account', 'Account — Sphereline'],
    ['/account/groups/2b7c1a5e-0000-4000-8000-000000000002', 'Group — Account — Sphereline'],
    ['/no-such-place', 'Page not found — Sphereline'],
  ])('%s is titled "%s"', (pathname, title) => {
    expect(pageTitle(...sectionTitleParts(pathname))).toBe(title);
  });
});

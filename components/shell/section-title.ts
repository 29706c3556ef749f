/**
 * The shell's page title for an address, most specific part first: "/library/new" → ["New entry",
 * "Library"]. Screens that know more (Check's formula, a route pair) set a title of their own.
 */
export function sectionTitleParts(pathname: string): string[] {
  const segments = pathname.split('/').filter(Boolean);
  const [section, second, third] = segments;
  switch (section) {
    case undefined:
      return ['Labile or inert, bridged or not'];
    case 'check':
      return ['Check'];
    case 'route':
      return ['Route'];
    case 'planner':
      return ['Order of addition'];
    case 'review':
      return ['Review'];
    case 'library':
      if (second === undefined) return ['Library'];
      if (second === 'new') return ['New entry', 'Library'];
      if (second === 'import') return ['Import', 'Library'];
      return [third === 'edit' ? 'Edit entry' : 'Entry', 'Library'];
    case 'account':
      return second === 'groups' ? ['Group', 'Account'] : ['Account'];
    default:
      return ['Page not found'];
  }
}

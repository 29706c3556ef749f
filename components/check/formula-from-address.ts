/**
 * The formula in a Check deep link (/check?formula=…), read so that a raw '+' survives.
 * Form decoding (what the router applies to the query) turns '+' into a space, and a charge such
 * as "[Co(NH3)6]3+" typed into the address bar arrives as "[Co(NH3)6]3 ". On the web the raw query
 * is read and only percent-escapes are decoded; elsewhere the router's value is used as it is.
 */
export function formulaFromQuery(search: string, name = 'formula'): string | null {
  const query = search.startsWith('?') ? search.slice(1) : search;
  for (const part of query.split('&')) {
    const equals = part.indexOf('=');
    const key = equals < 0 ? part : part.slice(0, equals);
    if (key !== name) continue;
    const raw = equals < 0 ? '' : part.slice(equals + 1);
    try {
      return decodeURIComponent(raw);
    } catch {
      return raw;
    }
  }
  return null;
}

export function formulaFromAddress(routerValue: string | undefined): string {
  const location = typeof window === 'undefined' ? undefined : (window as { location?: { search?: string } }).location;
  const fromQuery = typeof location?.search === 'string' ? formulaFromQuery(location.search) : null;
  return fromQuery ?? routerValue ?? '';
}

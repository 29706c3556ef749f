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

/** Form decoding as the router applies it: '+' is a space, then percent-escapes. */
function formDecoded(raw: string): string {
  try {
    return decodeURIComponent(raw.replace(/\+/g, ' '));
  } catch {
    return raw;
  }
}

function currentSearch(): string | null {
  const location = typeof window === 'undefined' ? undefined : (window as { location?: { search?: string } }).location;
  return typeof location?.search === 'string' ? location.search : null;
}

// The address as the page was opened: the router may rewrite it (form-decoded and re-encoded, the
// '+' lost) before the Check screen first renders, so it is read once, when this module loads.
const searchAtLoad = currentSearch();

function rawFormula(search: string | null): string | null {
  if (search === null) return null;
  const query = search.startsWith('?') ? search.slice(1) : search;
  for (const part of query.split('&')) {
    if (part.startsWith('formula=')) return part.slice('formula='.length);
  }
  return null;
}

/**
 * The Check screen's formula from the address: the raw query (now or as the page was opened) when it
 * is the same link the router read, so a '+' that the router turned into a space is restored.
 */
export function formulaFromAddress(routerValue: string | undefined): string {
  for (const search of [searchAtLoad, currentSearch()]) {
    const raw = rawFormula(search);
    if (raw === null) continue;
    if (routerValue === undefined || formDecoded(raw) === routerValue || formDecoded(raw).trim() === routerValue.trim()) {
      return formulaFromQuery(`formula=${raw}`) ?? routerValue ?? '';
    }
  }
  return routerValue ?? '';
}

import { Cite, type CslItem, type CslName } from '@citation-js/core';
import '@citation-js/plugin-bibtex';
import '@citation-js/plugin-ris';
import type { Citation } from '@/lib/schemas/library';

/**
 * Citations as BibTeX and RIS, written by a maintained citation library through CSL-JSON (its
 * common data model) rather than by hand-made string templates.
 */

const particles = new Set(['van', 'von', 'de', 'der', 'den', 'da', 'del', 'di', 'du', 'la', 'le', 'dos', 'ten', 'ter']);

/** Words that make a name a body rather than a person (common practice in reference managers). */
const corporateWords = /\b(union|society|commission|committee|council|institute|institution|agency|association|organi[sz]ation|office|laboratory|lab|department|academy|bureau|consortium|foundation|university|group|federation)\b/i;

/**
 * A corporate author kept whole: an acronym ("IUPAC", "NIST"), a body's name ("International Union
 * of Pure and Applied Chemistry"), or a name the person wrapped in braces ("{Larkspur Lab}").
 */
export function isCorporateAuthor(part: string): boolean {
  if (/^\{.*\}$/.test(part)) return true;
  if (/^[A-Z][A-Z0-9&-]{1,}$/.test(part)) return true;
  return corporateWords.test(part) && !/\b[A-Z]\./.test(part);
}

/**
 * The library stores authors as typed: "F.-C. Xu, H. R. Krouse, T. W. Swaddle", "L. Helm & A. E.
 * Merbach" or "Xu, F.-C.; Krouse, H. R.". Names are split on ";" when present (then "Family, Given"),
 * else on ",", "&" and "and" (then "Given Family", the family name being the last word plus any
 * particle before it). A known limit: "Family, Given" lists separated by commas are ambiguous.
 */
export function splitAuthors(authors: string): CslName[] {
  const text = authors.trim();
  if (!text) return [];
  if (text.includes(';')) {
    return text
      .split(';')
      .map((part) => part.trim())
      .filter(Boolean)
      .map((part) => {
        if (isCorporateAuthor(part)) return { literal: part.replace(/^\{(.*)\}$/, '$1') };
        const [family, given] = part.split(',').map((s) => s.trim());
        return given ? { family: family ?? part, given } : { literal: part };
      });
  }
  // A whole-name body ("International Union of Pure and Applied Chemistry") holds "and": keep it in one piece.
  if (isCorporateAuthor(text) && !text.includes(',')) return [{ literal: text.replace(/^\{(.*)\}$/, '$1') }];
  return text
    .split(/\s*(?:,|&|\band\b)\s*/)
    .map((part) => part.trim())
    .filter(Boolean)
    .map((part) => {
      if (isCorporateAuthor(part)) return { literal: part.replace(/^\{(.*)\}$/, '$1') };
      const words = part.split(/\s+/);
      if (words.length === 1) return { family: part };
      let start = words.length - 1;
      while (start > 1 && particles.has((words[start - 1] as string).toLowerCase())) start -= 1;
      return { given: words.slice(0, start).join(' '), family: words.slice(start).join(' ') };
    });
}

/** "Given Family, Given Family" — how the library's forms write authors. */
export function joinAuthors(names: readonly { given?: string; family?: string; literal?: string }[]): string {
  return names
    .map((n) => n.literal ?? [n.given, n.family].filter(Boolean).join(' '))
    .filter(Boolean)
    .join(', ');
}

/** CSL types per kind: BibTeX @article/@book/@inbook/@misc(url), RIS JOUR/BOOK/CHAP/ELEC (citation-js mappings). */
const CSL_TYPES = { article: 'article-journal', book: 'book', chapter: 'chapter', 'web-page': 'webpage' } as const;

/**
 * Line breaks, tabs and other control characters in any field become one space: in RIS a line break
 * starts a new tag (a forged record), and no bibliographic field needs one.
 */
export function oneLine(value: string): string {
   
  return value.replace(/[\u0000-\u001f\u007f\u2028\u2029]+/g, ' ').replace(/ {2,}/g, ' ').trim();
}

const TEX_SPECIALS: Record<string, string> = {
  '\\': '\\textbackslash{}',
  '{': '\\textbraceleft{}',
  '}': '\\textbraceright{}',
  '%': '\\%',
  '&': '\\&',
  '#': '\\#',
  '$': '\\$',
  '_': '\\_',
};

/** TeX's special characters written as text (for the names the citation library writes unescaped). */
export function texEscape(value: string): string {
  return value.replace(/[\\{}%&#$_]/g, (ch) => TEX_SPECIALS[ch] ?? ch);
}

export function toCslItem(citation: Citation): CslItem {
  const kind = citation.kind ?? 'article';
  const item: CslItem = { id: citation.id, type: CSL_TYPES[kind], author: splitAuthors(oneLine(citation.authors)) };
  if (kind === 'book') {
    // A book's title is the work itself; what older records kept in "journal" is its title when none was given.
    const title = citation.title ?? (citation.journal || undefined);
    if (title) item.title = title;
  } else {
    if (citation.title) item.title = citation.title;
    // The journal, the book a chapter is in, or the site a web page belongs to.
    if (citation.journal) item['container-title'] = citation.journal;
  }
  if (citation.publisher && kind !== 'article') item.publisher = citation.publisher;
  if (citation.place && kind !== 'article') item['publisher-place'] = citation.place;
  if (citation.url && kind === 'web-page') item.URL = citation.url;
  if (citation.year !== null) item.issued = { 'date-parts': [[citation.year]] };
  if (citation.volume) item.volume = citation.volume;
  if (citation.pages) item.page = citation.pages;
  if (citation.doi) item.DOI = citation.doi;
  for (const key of Object.keys(item) as (keyof CslItem)[]) {
    const value = item[key];
    if (typeof value === 'string') (item as Record<string, unknown>)[key] = oneLine(value);
  }
  return item;
}

/**
 * The citation library escapes the names it splits into given and family parts, but writes a
 * single-word or corporate name as it is, inside braces: "\\input{…}" or a "}" would pass into the
 * file. Those names are escaped here first.
 */
function forBibtex(item: CslItem): CslItem {
  const author = (item.author ?? []).map((name) => {
    if (name.literal !== undefined) return { ...name, literal: texEscape(name.literal) };
    if (name.given === undefined && name.family !== undefined) return { ...name, family: texEscape(name.family) };
    return name;
  });
  return { ...item, author };
}

export function citationsAsBibtex(citations: readonly Citation[]): string {
  if (citations.length === 0) return '';
  return new Cite(citations.map((citation) => forBibtex(toCslItem(citation)))).format('bibtex');
}

/**
 * The RIS writer folds every value at 70 characters, and readers (its own included) join the pieces
 * with a space — "hexaaquarho dium". Each tag goes back on one line ("TAG  - value", RIS format
 * specification): a line that does not start with a tag continues the one before it.
 */
export function unfoldRis(text: string): string {
  const lines: string[] = [];
  for (const line of text.split(/\r?\n/)) {
    if (lines.length > 0 && line !== '' && !/^[A-Z][A-Z0-9] {2}-( |$)/.test(line)) lines[lines.length - 1] += line;
    else lines.push(line);
  }
  return lines.join('\r\n');
}

export function citationsAsRis(citations: readonly Citation[]): string {
  if (citations.length === 0) return '';
  return `${unfoldRis(new Cite(citations.map(toCslItem)).format('ris'))}\r\n`;
}

import { Cite, type CslItem, type CslName } from '@citation-js/core';
import '@citation-js/plugin-bibtex';
import '@citation-js/plugin-ris';
import type { Citation } from '@/lib/schemas/library';

/**
 * Citations as BibTeX and RIS, written by a maintained citation library through CSL-JSON (its
 * common data model) rather than by hand-made string templates.
 */

const particles = new Set(['van', 'von', 'de', 'der', 'den', 'da', 'del', 'di', 'du', 'la', 'le', 'dos', 'ten', 'ter']);

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
        const [family, given] = part.split(',').map((s) => s.trim());
        return given ? { family: family ?? part, given } : { literal: part };
      });
  }
  return text
    .split(/\s*(?:,|&|\band\b)\s*/)
    .map((part) => part.trim())
    .filter(Boolean)
    .map((part) => {
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

export function toCslItem(citation: Citation): CslItem {
  const item: CslItem = { id: citation.id, type: 'article-journal', author: splitAuthors(citation.authors), 'container-title': citation.journal };
  if (citation.title) item.title = citation.title;
  if (citation.year !== null) item.issued = { 'date-parts': [[citation.year]] };
  if (citation.volume) item.volume = citation.volume;
  if (citation.pages) item.page = citation.pages;
  if (citation.doi) item.DOI = citation.doi;
  return item;
}

export function citationsAsBibtex(citations: readonly Citation[]): string {
  if (citations.length === 0) return '';
  return new Cite(citations.map(toCslItem)).format('bibtex');
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

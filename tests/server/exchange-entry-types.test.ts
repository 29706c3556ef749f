import { Cite } from '@citation-js/core';
import '@citation-js/plugin-bibtex';
import '@citation-js/plugin-ris';
import { citationSchema } from '@/lib/schemas/library';
import { isCorporateAuthor, splitAuthors } from '@/server/modules/exchange/citation-formats';
import { createTestApp, type TestApp } from '../setup/test-app';
import { buildLibraryWorld, entryInState, type LibraryWorld } from '../factories/library-world';
import { measurementInput } from '../factories/library';
import { download } from './exchange-helpers';

/**
 * BibTeX and RIS entry types follow what a source is (BibTeX: Patashnik, "BibTeXing", 1988, standard
 * entry types @article, @book, @inbook, @misc; RIS: the Research Information Systems format
 * specification, TY JOUR, BOOK, CHAP, ELEC), written through the citation library.
 */

// Bard, Parsons & Jordan (eds.), Standard Potentials in Aqueous Solution, Marcel Dekker, New York, 1985 (book).
const book = { kind: 'book', authors: 'A. J. Bard, R. Parsons, J. Jordan', title: 'Standard Potentials in Aqueous Solution', publisher: 'Marcel Dekker', place: 'New York', year: 1985 };
// Richens, "Ligand substitution reactions at inorganic centers", Chem. Rev. 2005, 105, 1961-2002 (article).
const article = { authors: 'D. T. Richens', title: 'Ligand substitution reactions at inorganic centers', journal: 'Chem. Rev.', year: 2005, volume: '105', pages: '1961-2002' };
// A chapter in an edited book: Lincoln & Merbach, Adv. Inorg. Chem. 1995, 42, 1 is a serial; the
// invented lab's chapter below stands for the kind (fields, not a check value).
const chapter = { kind: 'chapter', authors: 'Larkspur Coordination Lab', title: 'Water exchange on aqua ions', journal: 'Methods in Coordination Kinetics', publisher: 'Larkspur Press', place: 'Larkspur', year: 2026, pages: '11-40' };
// IUPAC Compendium of Chemical Terminology (the Gold Book), a web page with a corporate author.
const webPage = { kind: 'web-page', authors: 'International Union of Pure and Applied Chemistry', title: 'labile', journal: 'Compendium of Chemical Terminology', url: 'https://goldbook.iupac.org/terms/view/L03418', year: 2019 };

let t: TestApp;
let w: LibraryWorld;
beforeAll(async () => {
  t = await createTestApp();
  w = await buildLibraryWorld(t, 'types');
  await entryInState(w, 'accepted', {
    formula: '[Fe(H2O)6]3+',
    name: 'hexaaquairon(III)',
    measurements: [
      measurementInput({ kind: 'reduction-potential', value: 0.771, unit: 'V', citation: book }),
      measurementInput({ value: 1.6e2, citation: article }),
      measurementInput({ value: 1.6e2, temperatureK: 299.15, citation: chapter }),
      measurementInput({ value: 1.6e2, temperatureK: 300.15, citation: webPage }),
    ],
  });
}, 30_000);
afterAll(async () => {
  await t.close();
});

describe('citations keep what kind of source they are', () => {
  it('a book is stored with its publisher and no journal (the entry’s record is found again); old-style records read as articles', async () => {
    const created = await w.author.post('/api/citations', { groupId: w.groupId, ...book });
    expect(created.status).toBe(200);
    expect(citationSchema.parse(created.body)).toMatchObject({ kind: 'book', publisher: 'Marcel Dekker', place: 'New York', journal: '' });
    expect(citationSchema.parse({ id: 'x', groupId: 'g', doi: null, authors: 'A', title: null, journal: 'J', year: null, volume: null, pages: null }).kind).toBe('article');
  });

  it('refuses a web page without an address and an article without a journal, naming the field', async () => {
    const page = await w.author.post('/api/citations', { groupId: w.groupId, kind: 'web-page', authors: 'IUPAC', title: 'labile' });
    expect(page.status).toBe(400);
    expect(page.body.error.fields.url).toMatch(/address/);
    const noJournal = await w.author.post('/api/citations', { groupId: w.groupId, authors: 'D. T. Richens', journal: '' });
    expect(noJournal.status).toBe(400);
    expect(noJournal.body.error.fields.journal).toMatch(/journal/);
  });
});

describe('BibTeX entry types', () => {
  let text = '';
  beforeAll(async () => {
    const response = await download(t.app, w.viewer, `/api/exports/citations.bib?groupId=${w.groupId}`);
    expect(response.status).toBe(200);
    text = (response.body as Buffer).toString('utf8');
  });
  const entryOf = (type: string, marker: string) => {
    const entries = text.split(/\n(?=@)/);
    return entries.find((e) => e.startsWith(`@${type}{`) && e.includes(marker)) ?? '';
  };

  it('a book is @book with its publisher and address, not a journal', () => {
    const entry = entryOf('book', 'Aqueous');
    expect(entry).toMatch(/publisher = \{Marcel Dekker\}/);
    expect(entry).toMatch(/address = \{New York\}/);
    expect(entry).not.toMatch(/journal =/);
  });

  it('an article is @article with its journal', () => {
    expect(entryOf('article', 'Richens')).toMatch(/journal = \{Chem\. Rev\.\}/);
  });

  it('a chapter is @inbook with the book as booktitle, and a corporate author kept whole in braces', () => {
    const entry = entryOf('inbook', 'Larkspur');
    expect(entry).toMatch(/booktitle = \{Methods in \{?Coordination\}? \{?Kinetics\}?\}/);
    expect(entry).toMatch(/author = \{\{Larkspur Coordination Lab\}\}/);
  });

  it('a web page is @misc with its address; the corporate author is not split into a first name', () => {
    const entry = entryOf('misc', 'goldbook');
    expect(entry).toMatch(/url = \{https:\/\/goldbook\.iupac\.org\/terms\/view\/L03418\}/);
    expect(entry).toMatch(/author = \{\{International Union of Pure and Applied Chemistry\}\}/);
  });

  it('reads back through the citation library as article, book and chapter (BibTeX has no web-page type: @misc)', () => {
    const types = new Cite(text).data.map((item) => item.type).sort();
    expect(types.filter((type) => type !== 'document')).toEqual(['article-journal', 'book', 'chapter']);
    expect(types).toHaveLength(4);
  });
});

describe('RIS entry types', () => {
  it('TY BOOK, CHAP, JOUR and ELEC, with publisher and address where they belong', async () => {
    const response = await download(t.app, w.viewer, `/api/exports/citations.ris?groupId=${w.groupId}`);
    const text = (response.body as Buffer).toString('utf8');
    const records = text.split(/\r?\nER {2}-.*(?:\r?\n|$)/).filter((r) => r.trim());
    const record = (marker: string) => records.find((r) => r.includes(marker)) ?? '';
    expect(record('Aqueous')).toMatch(/^TY {2}- BOOK/m);
    expect(record('Aqueous')).toMatch(/^PB {2}- Marcel Dekker/m);
    expect(record('Aqueous')).toMatch(/^CY {2}- New York/m);
    expect(record('Richens')).toMatch(/^TY {2}- JOUR/m);
    expect(record('Larkspur Press')).toMatch(/^TY {2}- CHAP/m);
    expect(record('goldbook')).toMatch(/^TY {2}- ELEC/m);
    expect(record('goldbook')).toMatch(/^AU {2}- International Union of Pure and Applied Chemistry\r?$/m);
  });
});

describe('corporate authors', () => {
  it.each([
    ['IUPAC', true],
    ['International Union of Pure and Applied Chemistry', true],
    ['{Larkspur Coordination Lab}', true],
    ['H. Taube', false],
    ['Xu', false],
    ['A. E. Merbach', false],
  ])('%s → corporate %s', (name, expected) => {
    expect(isCorporateAuthor(name)).toBe(expected);
  });

  it('people are still split into given and family names beside a body', () => {
    expect(splitAuthors('IUPAC; Helm, L.')).toEqual([{ literal: 'IUPAC' }, { family: 'Helm', given: 'L.' }]);
    expect(splitAuthors('L. Helm & A. E. Merbach')).toEqual([{ given: 'L.', family: 'Helm' }, { given: 'A. E.', family: 'Merbach' }]);
  });
});

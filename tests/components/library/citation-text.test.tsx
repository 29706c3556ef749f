import { citationText } from '@/components/library/library-format';
import { citationSchema } from '@/lib/schemas/library';

/** What users see of a source: a clean reference per kind, never an address. */
const base = { id: 'c', groupId: 'g', doi: null, volume: null, pages: null };

describe('citationText', () => {
  it('an article: authors, journal, year, volume, pages (Richens, Chem. Rev. 2005, 105, 1961-2002)', () => {
    const c = citationSchema.parse({ ...base, authors: 'D. T. Richens', title: null, journal: 'Chem. Rev.', year: 2005, volume: '105', pages: '1961-2002' });
    expect(citationText(c)).toBe('D. T. Richens, Chem. Rev., 2005, 105, 1961–2002');
  });

  it('a book: title, publisher, place and year, no "(book)" in a journal slot (Bard, Parsons & Jordan 1985)', () => {
    const c = citationSchema.parse({ ...base, kind: 'book', authors: 'A. J. Bard, R. Parsons, J. Jordan', title: 'Standard Potentials in Aqueous Solution', journal: '', publisher: 'Marcel Dekker', place: 'New York', year: 1985 });
    expect(citationText(c)).toBe('A. J. Bard, R. Parsons, J. Jordan, Standard Potentials in Aqueous Solution, Marcel Dekker, New York, 1985');
  });

  it('a web page shows its title and site, never its address (IUPAC Gold Book)', () => {
    const c = citationSchema.parse({ ...base, kind: 'web-page', authors: 'IUPAC', title: 'labile', journal: 'Compendium of Chemical Terminology', year: 2019, url: 'https://goldbook.iupac.org/terms/view/L03418' });
    expect(citationText(c)).toBe('IUPAC, labile, Compendium of Chemical Terminology, 2019');
    expect(citationText(c)).not.toMatch(/https?:/);
  });
});

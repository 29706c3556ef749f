import { csvColumnForHeader, planCsvColumns } from '@/lib/schemas/exchange';

/**
 * The one column mapping: the import screen runs it on the header line as soon as a file is chosen,
 * the server runs it before reading any row. Headers below are the kind the invented Larkspur
 * Coordination Lab's spreadsheets carry.
 */
describe('csvColumnForHeader', () => {
  it('recognises a column by its name or a synonym, ignoring case, spaces, _ - . brackets and °', () => {
    expect(csvColumnForHeader('formula')).toBe('formula');
    expect(csvColumnForHeader('Complex')).toBe('formula');
    expect(csvColumnForHeader('Temperature (K)')).toBe('temperature_K');
    expect(csvColumnForHeader('Ionic strength / M')).toBe('ionic_strength_M');
    expect(csvColumnForHeader('IUPAC name')).toBe('name');
    expect(csvColumnForHeader('  DOI ')).toBe('doi');
  });

  it('answers null for a header the importer does not use', () => {
    expect(csvColumnForHeader('Notebook page')).toBeNull();
    expect(csvColumnForHeader('')).toBeNull();
  });
});

describe('planCsvColumns', () => {
  it('maps every header in file order, marks unknown ones as not used and finds nothing missing', () => {
    const plan = planCsvColumns(['Complex', 'Name', 'k', 'Units', 'Notebook page']);
    expect(plan.columns).toEqual([
      { header: 'Complex', column: 'formula' },
      { header: 'Name', column: 'name' },
      { header: 'k', column: 'value' },
      { header: 'Units', column: 'unit' },
      { header: 'Notebook page', column: null },
    ]);
    expect(plan.index).toEqual({ formula: 0, name: 1, value: 2, unit: 3 });
    expect(plan.missing).toEqual([]);
    expect(plan.problems).toEqual({});
  });

  it('names the required columns no header fills', () => {
    expect(planCsvColumns(['Species', 'k']).missing).toEqual(['name']);
    expect(planCsvColumns(['k', 'unit']).missing).toEqual(['formula', 'name']);
  });

  it('lets the person’s mapping win: the mapped header fills that column, and the header that would have filled it is not used', () => {
    const plan = planCsvColumns(['Complex', 'Label', 'name'], { name: 'Label' });
    expect(plan.columns.map((c) => c.column)).toEqual(['formula', 'name', null]);
    expect(plan.missing).toEqual([]);
  });

  it('fills a missing required column through the mapping', () => {
    const plan = planCsvColumns(['Complex', 'Label'], { name: 'Label' });
    expect(plan.columns.map((c) => c.column)).toEqual(['formula', 'name']);
    expect(plan.missing).toEqual([]);
  });

  it('reports two headers for one column and a mapping to a header the file lacks', () => {
    const twice = planCsvColumns(['formula', 'Complex', 'name']);
    expect(twice.problems.formula).toMatch(/Two columns mean "formula": "formula" and "Complex"/);
    expect(twice.columns.map((c) => c.column)).toEqual(['formula', null, 'name']);
    const absent = planCsvColumns(['formula', 'name'], { value: 'Rate' });
    expect(absent.problems['mapping.value']).toMatch(/no column "Rate"/);
  });
});

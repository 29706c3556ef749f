/**
 * Clean provenance: what users see and what the command line prints carries clean references and a
 * structured `checked` field, never research notes (recalled-from-memory markers, "conflict" notes,
 * "secondary page", web mirrors, machine paths or reference-file names).
 */
import fs from 'node:fs';
import path from 'node:path';
import demoLibrary from '@/data/demo-library.json';
import checkSet from './check-set/formulas.json';
import { classifyMany } from '@/lib/chem/classify';
import { predictRoutes } from '@/lib/chem/route';

const RESEARCH_MARKERS = /from memory|CONFLICT|conflict:|secondary page|mirror|\/work\/|shared\/science|\b\w+\.json\b|https?:\/\/(?!doi\.org)|tripod|studylib|zhenzhi|datapdf|numerade/i;
const CHECKED = ['primary', 'review', 'secondary', 'recalled'];
const dataDir = path.join(__dirname, '..', '..', '..', 'data');

function records(value: unknown, visit: (record: Record<string, unknown>, where: string) => void, where = ''): void {
  if (Array.isArray(value)) value.forEach((item, index) => records(item, visit, `${where}[${index}]`));
  else if (value !== null && typeof value === 'object') {
    visit(value as Record<string, unknown>, where);
    for (const [key, inner] of Object.entries(value)) records(inner, visit, `${where}.${key}`);
  }
}

describe('data files', () => {
  const files = fs.readdirSync(dataDir).filter((name) => name.endsWith('.json'));

  it.each(files)('%s has no research markers anywhere, notes included', (name) => {
    const text = fs.readFileSync(path.join(dataDir, name), 'utf8');
    expect(text).not.toMatch(RESEARCH_MARKERS);
  });

  it.each(['ligands.json', 'measured-rates.json', 'metal-ions.json', 'atomic-weights.json', 'salt-readings.json', 'trivial-names.json', 'redox-couples.json'])(
    '%s: every record with a source says how well it was checked',
    (name) => {
      const data: unknown = JSON.parse(fs.readFileSync(path.join(dataDir, name), 'utf8'));
      let count = 0;
      records(data, (record, where) => {
        if (typeof record.source !== 'string' || where === '') return;
        if ('block' in record && 'series' in record && !('checked' in record)) return; // element rows cite the periodic table only
        count++;
        expect({ where, checked: record.checked }).toEqual({ where, checked: expect.stringMatching(new RegExp(`^(${CHECKED.join('|')})$`)) });
      });
      expect(count).toBeGreaterThan(3);
    },
  );

  it('keeps a recalled value marked as recalled (Cr(III) water exchange, Xu, Krouse & Swaddle 1985)', () => {
    const rates = JSON.parse(fs.readFileSync(path.join(dataDir, 'measured-rates.json'), 'utf8')) as { rates: { species: string; checked: string }[] };
    expect(rates.rates.find((rate) => rate.species === '[Cr(H2O)6]3+')?.checked).toBe('recalled');
  });
});

describe('what the command line prints over the demo library and the check set', () => {
  const formulas = [...new Set([...demoLibrary.complexes.map((entry) => entry.formula), ...checkSet.formulas.map((row) => row.formula)])];

  it('classify: no research markers in any answer (reasons, cautions, hints, measured sources)', () => {
    const answers = classifyMany(formulas);
    expect(answers.length).toBe(formulas.length);
    for (const answer of answers) expect(JSON.stringify(answer)).not.toMatch(RESEARCH_MARKERS);
  });

  it('route and Marcus notes: no research markers, and the checked marker instead', () => {
    const pairs: [string, string][] = [
      ['[Fe(H2O)6]3+', '[Cr(H2O)6]2+'],
      ['[Co(NH3)5Cl]2+', '[Cr(H2O)6]2+'],
      ['[Ru(NH3)6]3+', '[V(H2O)6]2+'],
      ['[Fe(CN)6]3-', '[Fe(CN)6]4-'],
      ['[Co(phen)3]3+', '[Ru(NH3)6]2+'],
      ['[IrCl6]2-', '[Fe(H2O)6]2+'],
      ['[Os(bpy)3]3+', '[Fe(H2O)6]2+'],
      ['[MnO4]-', '[Fe(CN)6]4-'],
    ];
    let notes = 0;
    for (const result of predictRoutes(pairs)) {
      const text = JSON.stringify(result);
      expect(text).not.toMatch(RESEARCH_MARKERS);
      if (/checked against the paper|from a review table|from a secondary source|recalled, not yet checked against the paper/.test(text)) notes++;
    }
    expect(notes).toBeGreaterThan(0);
  });
});

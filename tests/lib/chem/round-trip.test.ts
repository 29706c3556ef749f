/**
 * Round trip: every formula the app displays (typed formulas shown through toDisplayFormula, the
 * species a salt or name is read as, each centre of a dinuclear species, the demo library, the redox
 * couples, the trivial names and the check set) parses back to the same species.
 */
import fc from 'fast-check';
import demoLibrary from '@/data/demo-library.json';
import checkSet from './check-set/formulas.json';
import { toDisplayFormula } from '@/lib/chem/display-formula';
import { parseFormula, trivialNameTable } from '@/lib/chem/formula-parser';
import { listCouples } from '@/lib/chem/redox-couples';

function species(formula: string): unknown {
  const parsed = parseFormula(formula);
  return {
    metal: parsed.metal,
    oxidationState: parsed.oxidationState,
    complexCharge: parsed.complexCharge,
    ligands: parsed.ligands.map((instance) => `${instance.ligand.id}×${instance.count}`).sort(),
    centres: parsed.centres?.map((centre) => `${centre.metal}(${centre.oxidationState}):${centre.species}`) ?? null,
  };
}

const typed = new Set<string>();
for (const row of checkSet.formulas) typed.add(row.formula);
for (const entry of demoLibrary.complexes) typed.add(entry.formula);
for (const couple of listCouples()) {
  typed.add(couple.oxidised);
  typed.add(couple.reduced);
}
for (const record of trivialNameTable()) typed.add(record.formula);
for (const extra of ['Cr(H2O)6 3+', '[Cr(H2O)6]^3+', '[Co(NH3)6]+3', 'K3[Cr(ox)3].3H2O', '[Fe(CN)6]4−', 'trans-[Co(en)2Cl2]Cl']) typed.add(extra);
const readable = [...typed].filter((formula) => {
  try {
    parseFormula(formula);
    return true;
  } catch {
    return false;
  }
});

describe('every formula the app displays parses back to the same species', () => {
  it('covers the check set, the demo library, the redox couples and the names', () => {
    expect(readable.length).toBeGreaterThan(200);
  });

  it.each(readable.map((formula) => [formula, toDisplayFormula(formula)]))('%s shown as %s', (formula, shown) => {
    expect(species(shown)).toEqual(species(formula));
  });

  it('the species a salt, hydrate or name is read as parses to the species that was classified', () => {
    for (const formula of readable) {
      const parsed = parseFormula(formula);
      const classified = species(formula) as { metal: string; ligands: string[] };
      for (const reading of parsed.readings) {
        const shown = species(toDisplayFormula(reading.species)) as { metal: string; ligands: string[] };
        if (reading.kind === 'name') continue;
        expect([shown.metal, shown.ligands]).toEqual([classified.metal, classified.ligands]);
      }
      for (const centre of parsed.centres ?? []) {
        const back = parseFormula(toDisplayFormula(centre.species));
        expect([back.metal, back.oxidationState]).toEqual([centre.metal, centre.oxidationState]);
      }
    }
  });
});

describe('display of a charge set off by a space (IUPAC 2005 Red Book: charge as a right superscript)', () => {
  it('keeps the count a subscript and the charge a superscript', () => {
    expect(toDisplayFormula('Cr(H2O)6 3+')).toBe('Cr(H₂O)₆³⁺');
    expect(toDisplayFormula('[Co(NH3)6] +3')).toBe('[Co(NH₃)₆]³⁺');
  });
});

describe('round trip over generated formulas (property test)', () => {
  // Pieces chemists combine (common practice); the property is that display never changes the species.
  const metals = ['Co', 'Cr', 'Fe', 'Ni', 'Cu', 'Ru', 'Rh', 'Pt', 'Mn', 'V'];
  const ligands = ['NH3', 'H2O', 'Cl', 'CN', 'en', 'ox', 'bpy', 'py', 'NO2', 'OH', 'Br', 'NCS', 'phen', 'CO', 'PPh3', 'isn', 'cyclam'];
  const counterIons = ['', 'Cl', 'Cl2', 'Cl3', '(ClO4)2', '(NO3)3', 'SO4', 'K3', 'Na2', 'K4'];
  const charges = ['', '+', '2+', '3+', '-', '2-', '3-', '4-', '^3+', '+3'];

  it('shows every readable generated formula as one that parses to the same species', () => {
    let readableCount = 0;
    fc.assert(
      fc.property(
        fc.constantFrom(...metals),
        fc.array(fc.tuple(fc.constantFrom(...ligands), fc.integer({ min: 1, max: 6 })), { minLength: 1, maxLength: 3 }),
        fc.constantFrom(...counterIons),
        fc.constantFrom(...charges),
        fc.integer({ min: 0, max: 12 }),
        (metal, parts, counter, charge, waters) => {
          const inner = parts.map(([ligand, count]) => `(${ligand})${count > 1 ? count : ''}`).join('');
          const cation = /^[KN]/.test(counter) ? counter : '';
          const anion = cation === '' ? counter : '';
          const formula = `${cation}[${metal}${inner}]${anion === '' ? charge : anion}${waters > 0 ? `·${waters}H2O` : ''}`;
          let original: unknown;
          try {
            original = species(formula);
          } catch {
            return; // not a readable complex: nothing is displayed for it
          }
          readableCount++;
          expect(species(toDisplayFormula(formula))).toEqual(original);
        },
      ),
      { numRuns: 3000 },
    );
    expect(readableCount).toBeGreaterThan(300);
  });
});

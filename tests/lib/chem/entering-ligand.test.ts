import { readEnteringLigand } from '@/lib/chem/entering-ligand';

// How chemists write an entering species (common practice): the table id, the free ion with its charge, or its name.
describe('readEnteringLigand', () => {
  it.each([
    ['NH3', 'NH3'],
    ['Cl-', 'Cl'],
    ['Cl⁻', 'Cl'],
    ['NO2-', 'NO2'],
    ['CO32-', 'CO3'],
    ['CO3 2-', 'CO3'],
    ['ammonia', 'NH3'],
    ['Chloride', 'Cl'],
    ['pyridine', 'py'],
    ['chlorido', 'Cl'],
  ])('%s → %s', (text, id) => {
    const reading = readEnteringLigand(text);
    expect('ligand' in reading ? reading.ligand.id : reading.problem).toBe(id);
  });

  it('says what is wrong, with a spelling hint', () => {
    const reading = readEnteringLigand('nh3');
    expect('problem' in reading ? reading.problem : '').toMatch(/did you mean NH3/);
  });
});

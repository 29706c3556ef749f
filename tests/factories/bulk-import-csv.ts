/**
 * A large, valid import file: `rows` CSV rows, two measurements per entry, over a handful of
 * textbook formulas and 300 distinct DOIs. Shared by the bulk import test and the import benchmark.
 */
export function bulkImportCsv(rows: number): string {
  const formulas = ['[Cr(H2O)6]3+', '[Co(NH3)6]3+', '[Ni(H2O)6]2+', '[Rh(H2O)6]3+', '[Co(en)2(NO2)Cl]NO3', 'K3[Cr(ox)3]·3H2O'];
  const lines = ['entry,formula,name,kind,value,unit,temperature_K,doi,authors,journal,year'];
  for (let i = 0; i < rows; i += 1) {
    const entry = Math.floor(i / 2);
    const formula = formulas[entry % formulas.length];
    const measurement = i % 2 === 0 ? `water-exchange,${(1 + (i % 97)) * 1e-6},s-1,298.15` : `activation-enthalpy,${60 + (i % 50)},kJ/mol,`;
    lines.push(`${entry},"${formula}",bulk entry ${entry},${measurement},10.5555/bulk.${entry % 300},"A. Author, B. Writer",J. Demo Chem.,2001`);
  }
  return `${lines.join('\n')}\n`;
}

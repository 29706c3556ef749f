import {
  citationInputSchema,
  createComplexInputSchema,
  measurementInputSchema,
  type CitationInput,
  type CreateComplexInput,
  type MeasurementInput,
} from '@/lib/schemas/library';

/**
 * Library fixtures built through the shared schemas, so they cannot drift from the contract.
 * Values name their source (the water-exchange reference notes, as copied into
 * data/demo-library.json).
 */

/** Xu, Krouse & Swaddle, Inorg. Chem. 1985, 24, 267 (no DOI given in water_exchange.json). */
export const xuKrouseSwaddle1985: CitationInput = citationInputSchema.parse({
  authors: 'F.-C. Xu, H. R. Krouse, T. W. Swaddle',
  title: 'Conjugate base pathway for water exchange on aqueous chromium(III): variable-pressure and -temperature kinetics',
  journal: 'Inorg. Chem.',
  year: 1985,
  volume: '24',
  pages: '267-270',
});

/** Laurenczy, Rapaport, Zbinden & Merbach, Magn. Reson. Chem. 1991, 29, S45 — DOI as given in water_exchange.json. */
export const laurenczy1991: CitationInput = citationInputSchema.parse({
  doi: '10.1002/mrc.1260291311',
  authors: 'G. Laurenczy, I. Rapaport, D. Zbinden, A. E. Merbach',
  title: 'Variable-pressure oxygen-17 NMR study of water exchange on hexaaquarhodium(III)',
  journal: 'Magn. Reson. Chem.',
  year: 1991,
  volume: '29',
  pages: 'S45-S51',
});

export function measurementInput(overrides: Partial<Record<keyof MeasurementInput, unknown>> = {}): MeasurementInput {
  return measurementInputSchema.parse({
    // [Cr(H2O)6]3+ water exchange: 2.4e-6 s-1 at 298 K (Xu, Krouse & Swaddle 1985, water_exchange.json).
    kind: 'water-exchange',
    value: 2.4e-6,
    unit: 's-1',
    temperatureK: 298.15,
    medium: 'aqueous HClO4',
    method: '17O NMR',
    citation: xuKrouseSwaddle1985,
    ...overrides,
  });
}

export function complexInput(overrides: Partial<Record<keyof CreateComplexInput, unknown>> = {}): CreateComplexInput {
  return createComplexInputSchema.parse({
    formula: '[Cr(H2O)6]3+',
    name: 'hexaaquachromium(III)',
    ...overrides,
  });
}

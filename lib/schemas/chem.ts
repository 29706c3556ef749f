import { z } from 'zod';

/**
 * Contracts of the public engine endpoints (POST /api/classify, /api/route, /api/marcus), shared by
 * the server (request parsing), the app's forms and the API client (response parsing).
 */
export const MAX_FORMULA_LENGTH = 300;
export const MAX_BATCH_FORMULAS = 1000;
export const MAX_BATCH_PAIRS = 200;

export const geometrySchema = z.enum([
  'linear',
  'trigonal-planar',
  'tetrahedral',
  'square-planar',
  'trigonal-bipyramidal',
  'square-pyramidal',
  'octahedral',
  'pentagonal-bipyramidal',
  'square-antiprismatic',
  'tricapped-trigonal-prismatic',
  'sandwich',
  'bent-sandwich',
  'half-sandwich',
  'other',
]);

const formulaSchema = z
  .string({ error: 'must be a formula written as text, e.g. "[Co(NH3)6]3+"' })
  .trim()
  .min(1, 'is empty: write a formula such as [Co(NH3)6]3+')
  .max(MAX_FORMULA_LENGTH, `is longer than ${MAX_FORMULA_LENGTH} characters`);

/** °C; the engine's Eyring scaling is meaningful for liquid solutions only. */
const temperatureCSchema = z
  .number({ error: 'must be a number of degrees Celsius' })
  .min(-80, 'must be at least −80 °C')
  .max(250, 'must be at most 250 °C');

export const classifyRequestSchema = z
  .object({
    formula: formulaSchema.optional(),
    formulas: z
      .array(formulaSchema)
      .min(1, 'must hold at least one formula')
      .max(MAX_BATCH_FORMULAS, `may hold at most ${MAX_BATCH_FORMULAS} formulas`)
      .optional(),
    temperatureC: temperatureCSchema.optional(),
    geometry: geometrySchema.optional(),
    /** A group of the signed-in person: its accepted measurements decide for the species they cover. */
    groupId: z.uuid('must be the id of one of your groups').optional(),
  })
  .strict()
  .refine((body) => (body.formula === undefined) !== (body.formulas === undefined), {
    message: 'give either "formula" or "formulas" (not both)',
    path: ['formula'],
  });
export type ClassifyRequest = z.infer<typeof classifyRequestSchema>;

/** What decides a verdict: the group's library, a published reference rate, or the model. */
export const decidedBySchema = z.enum(['library', 'reference', 'model']);

export const citationRefSchema = z.object({
  authors: z.string(),
  title: z.string().nullable(),
  journal: z.string(),
  year: z.number().int().nullable(),
  volume: z.string().nullable(),
  pages: z.string().nullable(),
  doi: z.string().nullable(),
  kind: z.enum(['article', 'book', 'chapter', 'web-page']).optional(),
  publisher: z.string().nullable().optional(),
});

/** The group-library measurement that decided (decidedBy "library"). */
export const libraryMeasurementRefSchema = z.object({
  entryId: z.string(),
  entryName: z.string(),
  entryFormula: z.string(),
  kind: z.enum(['water-exchange', 'ligand-exchange', 'substitution', 'half-life']),
  kPerSecond: z.number().positive(),
  temperatureK: z.number().positive(),
  citation: citationRefSchema.nullable(),
});

/** The stable fields of a classification (PRODUCT.md); the rest passes through unchanged. */
export const classificationSchema = z
  .object({
    formula: z.string(),
    metal: z.string(),
    oxidationState: z.number(),
    dElectrons: z.number(),
    spinState: z.enum(['high', 'low']).nullable(),
    geometry: geometrySchema,
    verdict: z.enum(['labile', 'intermediate', 'inert']),
    reasons: z.array(z.string()),
    cautions: z.array(z.string()),
    decidedBy: decidedBySchema,
    libraryMeasurement: libraryMeasurementRefSchema.optional(),
    modelVerdict: z.enum(['labile', 'intermediate', 'inert']).optional(),
    modelReasons: z.array(z.string()).optional(),
  })
  .passthrough()
  .refine((c) => (c.decidedBy === 'library') === (c.libraryMeasurement !== undefined), {
    message: 'libraryMeasurement comes with decidedBy "library" and only then',
    path: ['libraryMeasurement'],
  });

export const formulaErrorItemSchema = z.object({
  formula: z.string(),
  error: z.string(),
  position: z.number().nullable(),
});

export const routeRequestSchema = z
  .object({
    oxidant: formulaSchema.optional(),
    reductant: formulaSchema.optional(),
    pairs: z
      .array(z.object({ oxidant: formulaSchema, reductant: formulaSchema }).strict())
      .min(1, 'must hold at least one pair')
      .max(MAX_BATCH_PAIRS, `may hold at most ${MAX_BATCH_PAIRS} pairs`)
      .optional(),
    temperatureC: temperatureCSchema.optional(),
    keepGivenRoles: z.boolean().optional(),
  })
  .strict()
  .superRefine((body, ctx) => {
    if (body.pairs !== undefined) {
      if (body.oxidant !== undefined || body.reductant !== undefined) {
        ctx.addIssue({ code: 'custom', message: 'give either "pairs" or "oxidant" and "reductant"', path: ['pairs'] });
      }
      return;
    }
    if (body.oxidant === undefined) ctx.addIssue({ code: 'custom', message: 'is required', path: ['oxidant'] });
    if (body.reductant === undefined) ctx.addIssue({ code: 'custom', message: 'is required', path: ['reductant'] });
  });
export type RouteRequest = z.infer<typeof routeRequestSchema>;

export const routeResultSchema = z
  .object({
    route: z.enum(['inner-sphere', 'outer-sphere', 'either']),
    reasons: z.array(z.string()),
    bridgingCandidates: z.array(
      z.object({ ligand: z.string(), donorAtom: z.string(), score: z.number() }).passthrough(),
    ),
    oxidant: classificationSchema,
    reductant: classificationSchema,
    expectedProducts: z.array(z.string()),
    cautions: z.array(z.string()),
  })
  .passthrough();

const rateConstantSchema = z
  .number({ error: 'must be a number in M⁻¹ s⁻¹' })
  .positive('must be greater than zero (M⁻¹ s⁻¹)')
  .max(1e13, 'is above any bimolecular rate constant in solution (max 1e13 M⁻¹ s⁻¹)');

export const marcusRequestSchema = z
  .object({
    k11: rateConstantSchema,
    k22: rateConstantSchema,
    dE: z.number({ error: 'must be a potential difference in volts' }).min(-5).max(5).optional(),
    K12: z.number({ error: 'must be a number' }).positive('must be greater than zero').optional(),
    T: temperatureCSchema.optional(),
    observed: rateConstantSchema.optional(),
    ionicStrength: z.number().min(0).max(5).optional(),
    charges: z
      .object({
        oxidant: z.number().int(),
        reductant: z.number().int(),
        oxidantReduced: z.number().int(),
        reductantOxidised: z.number().int(),
      })
      .strict()
      .optional(),
  })
  .strict()
  .refine((body) => (body.dE === undefined) !== (body.K12 === undefined), {
    message: 'give either dE (volts) or K12 (not both)',
    path: ['dE'],
  })
  .refine((body) => (body.ionicStrength === undefined) === (body.charges === undefined), {
    message: 'work terms need both ionicStrength and charges',
    path: ['ionicStrength'],
  });
export type MarcusRequest = z.infer<typeof marcusRequestSchema>;

export const marcusResultSchema = z
  .object({ k12: z.number(), f12: z.number(), K12: z.number() })
  .passthrough();

/** Text field → number, with a message a chemist understands; '' stays "not given". */
const numberText = (what: string) =>
  z
    .string()
    .trim()
    .refine((text) => text === '' || Number.isFinite(Number(text)), `${what} must be a number (e.g. 4.2e3)`);

/** The Marcus panel's form: strings as typed, checked field by field, then read as numbers. */
export const marcusFormSchema = z
  .object({
    k11: numberText('k11').refine((t) => t !== '' && Number(t) > 0 && Number(t) < 1e11, 'k11 must be > 0 and below 1e11 M⁻¹ s⁻¹'),
    k22: numberText('k22').refine((t) => t !== '' && Number(t) > 0 && Number(t) < 1e11, 'k22 must be > 0 and below 1e11 M⁻¹ s⁻¹'),
    dE: numberText('ΔE°').refine((t) => t !== '' && Math.abs(Number(t)) <= 5, 'ΔE° must be between −5 and 5 V'),
    T: numberText('T').refine((t) => t === '' || (Number(t) >= -50 && Number(t) <= 150), 'T must be between −50 and 150 °C'),
    observed: numberText('observed k12').refine((t) => t === '' || Number(t) > 0, 'observed k12 must be > 0'),
  })
  .strict();
export type MarcusForm = z.infer<typeof marcusFormSchema>;

const ligandTokenSchema = z
  .string({ error: 'must be a ligand from the ligand table written as text, e.g. "NH3"' })
  .trim()
  .min(1, 'is empty: give a ligand such as NH3, Cl or bpy')
  .max(40, 'is longer than 40 characters');

/** POST /api/formation: the Eigen–Wilkins estimate for a ligand entering a complex (usually an aqua ion). */
export const formationRequestSchema = z
  .object({
    complex: formulaSchema,
    ligand: ligandTokenSchema,
    /** Ionic strength (M). */
    I: z.number({ error: 'must be an ionic strength in mol/L' }).min(0, 'must be at least 0 M').max(5, 'must be at most 5 M').optional(),
    /** Temperature (°C). */
    T: z.number({ error: 'must be a number of degrees Celsius' }).min(0, 'must be at least 0 °C').max(100, 'must be at most 100 °C').optional(),
    /** Contact distance of the outer-sphere pair (Å). */
    a: z.number({ error: 'must be a distance in ångström' }).min(2, 'must be at least 2 Å').max(10, 'must be at most 10 Å').optional(),
  })
  .strict();
export type FormationRequest = z.infer<typeof formationRequestSchema>;

export const formationResultSchema = z
  .object({
    kf: z.number(),
    Kos: z.number(),
    kex: z.number(),
    reasons: z.array(z.string()),
    published: z.object({ kf: z.number(), source: z.string(), checked: z.string(), ratio: z.number() }).passthrough().optional(),
  })
  .passthrough();
export type FormationResultDto = z.infer<typeof formationResultSchema>;

export const MAX_SEQUENCE_LIGANDS = 12;

/** POST /api/sequence: a square-planar start complex and the ligands added one at a time. */
export const sequenceRequestSchema = z
  .object({
    start: formulaSchema,
    ligands: z
      .array(ligandTokenSchema, { error: 'must be a list of entering ligands, e.g. ["NH3", "NH3"]' })
      .min(1, 'must hold at least one entering ligand')
      .max(MAX_SEQUENCE_LIGANDS, `may hold at most ${MAX_SEQUENCE_LIGANDS} ligands`),
  })
  .strict();
export type SequenceRequest = z.infer<typeof sequenceRequestSchema>;

const sequenceIsomerSchema = z.enum(['cis', 'trans']).nullable();

export const sequenceStepSchema = z
  .object({
    entering: z.string(),
    leaving: z.string(),
    product: z.string(),
    isomer: sequenceIsomerSchema,
    reasons: z.array(z.string()),
    /** The four sites in order round the square (0 trans to 2, 1 trans to 3), ligand ids. */
    sites: z.array(z.string()).length(4),
    /** The site the entering ligand took, and the site of the ligand trans to it (the trans director). */
    site: z.number().int().min(0).max(3),
    transDirectorSite: z.number().int().min(0).max(3),
  })
  .passthrough();

export const sequenceResultSchema = z
  .object({
    start: z.object({ formula: z.string(), sites: z.array(z.string()).length(4), isomer: sequenceIsomerSchema }).passthrough(),
    steps: z.array(sequenceStepSchema),
    product: z.string(),
    isomer: sequenceIsomerSchema,
  })
  .passthrough();
export type SequenceResultDto = z.infer<typeof sequenceResultSchema>;

import { z } from 'zod';
import { classificationSchema, MAX_FORMULA_LENGTH } from './chem';
import { roleSchema } from './groups';

/**
 * The curated complex library: entries, measurements, citations, ligands, revisions,
 * reviews and search. One zod schema per request/response DTO, shared by the server (request
 * parsing), the app's forms (zodResolver) and the API client (response parsing).
 * Wire format: string ids (UUIDs), ISO date strings. Only additive changes from here on.
 */

// ───────────────────────────── workflow ─────────────────────────────

/**
 * draft → submitted → accepted | returned | declined; returned → (edit) → submitted;
 * accepted → (edit) → draft again while the accepted snapshot stays published; any → retired (curators).
 */
export const complexStatuses = ['draft', 'in-review', 'accepted', 'returned', 'declined', 'retired'] as const;
export const complexStatusSchema = z.enum(complexStatuses, {
  error: `Choose a status: ${complexStatuses.join(', ')}.`,
});
export type ComplexStatus = z.infer<typeof complexStatusSchema>;

export const reviewDecisions = ['accept', 'return', 'decline'] as const;
export const reviewDecisionSchema = z.enum(reviewDecisions, {
  error: `Choose a decision: ${reviewDecisions.join(', ')}.`,
});
export type ReviewDecision = z.infer<typeof reviewDecisionSchema>;

export const verdictSchema = z.enum(['labile', 'intermediate', 'inert'], {
  error: 'Choose a verdict: labile, intermediate or inert.',
});

// ───────────────────────────── measurements ─────────────────────────────

/** What was measured. Units and sign rules per kind are in `measurementKindRules`. */
export const measurementKinds = [
  'water-exchange', // k_ex per water molecule, first order
  'ligand-exchange', // first order (s⁻¹) or second order (M⁻¹ s⁻¹)
  'substitution', // first order (s⁻¹) or second order (M⁻¹ s⁻¹)
  'self-exchange', // k11, M⁻¹ s⁻¹
  'cross-reaction', // k12 with its partner formula, M⁻¹ s⁻¹
  'reduction-potential', // E°, V
  'ligand-field-splitting', // Δo, cm⁻¹
  'activation-enthalpy', // ΔH‡, kJ/mol
  'activation-entropy', // ΔS‡, J/(mol·K)
  'activation-volume', // ΔV‡, cm³/mol
  'half-life', // t½, s
] as const;
export const measurementKindSchema = z.enum(measurementKinds, {
  error: `Choose a measurement kind: ${measurementKinds.join(', ')}.`,
});
export type MeasurementKind = z.infer<typeof measurementKindSchema>;

/** Canonical unit spellings (ASCII, so they survive CSV and BibTeX round trips). */
export const measurementUnits = ['s-1', 'M-1 s-1', 'V', 'cm-1', 'kJ/mol', 'J/(mol K)', 'cm3/mol', 's'] as const;
export const measurementUnitSchema = z.enum(measurementUnits);
export type MeasurementUnit = z.infer<typeof measurementUnitSchema>;

/** Other ways chemists type the same unit → the canonical spelling. */
export const measurementUnitAliases: Readonly<Record<string, MeasurementUnit>> = {
  's^-1': 's-1', 's⁻¹': 's-1', '1/s': 's-1', '/s': 's-1',
  'M^-1 s^-1': 'M-1 s-1', 'M⁻¹ s⁻¹': 'M-1 s-1', 'M⁻¹s⁻¹': 'M-1 s-1', 'M-1s-1': 'M-1 s-1', 'L mol-1 s-1': 'M-1 s-1', 'dm3 mol-1 s-1': 'M-1 s-1', '1/(M s)': 'M-1 s-1',
  volt: 'V', volts: 'V',
  'cm^-1': 'cm-1', 'cm⁻¹': 'cm-1', '1/cm': 'cm-1',
  'kJ mol-1': 'kJ/mol', 'kJ mol⁻¹': 'kJ/mol', 'kJ·mol⁻¹': 'kJ/mol',
  'J/(mol·K)': 'J/(mol K)', 'J mol-1 K-1': 'J/(mol K)', 'J K-1 mol-1': 'J/(mol K)', 'J/mol/K': 'J/(mol K)', 'J K⁻¹ mol⁻¹': 'J/(mol K)',
  'cm³/mol': 'cm3/mol', 'cm3 mol-1': 'cm3/mol', 'cm³ mol⁻¹': 'cm3/mol',
  sec: 's', seconds: 's',
};

export interface MeasurementKindRule {
  label: string;
  symbol: string;
  units: readonly MeasurementUnit[];
  /** Rate constants, Δo and half-lives cannot be zero or negative. */
  positive: boolean;
  /** Plausible range (inclusive) to catch unit slips, e.g. kJ typed as J. */
  min: number;
  max: number;
}

/** Units and physical limits per kind (common practice; diffusion limit ≈ 10¹⁰–10¹¹ M⁻¹ s⁻¹). */
export const measurementKindRules: Readonly<Record<MeasurementKind, MeasurementKindRule>> = {
  'water-exchange': { label: 'Water exchange', symbol: 'kₑₓ', units: ['s-1'], positive: true, min: 0, max: 1e12 },
  'ligand-exchange': { label: 'Ligand exchange', symbol: 'k', units: ['s-1', 'M-1 s-1'], positive: true, min: 0, max: 1e12 },
  substitution: { label: 'Substitution', symbol: 'k', units: ['s-1', 'M-1 s-1'], positive: true, min: 0, max: 1e12 },
  'self-exchange': { label: 'Self-exchange', symbol: 'k11', units: ['M-1 s-1'], positive: true, min: 0, max: 1e12 },
  'cross-reaction': { label: 'Cross reaction', symbol: 'k12', units: ['M-1 s-1'], positive: true, min: 0, max: 1e12 },
  'reduction-potential': { label: 'Reduction potential', symbol: 'E°', units: ['V'], positive: false, min: -5, max: 5 },
  'ligand-field-splitting': { label: 'Ligand-field splitting', symbol: 'Δo', units: ['cm-1'], positive: true, min: 0, max: 80000 },
  'activation-enthalpy': { label: 'Activation enthalpy', symbol: 'ΔH‡', units: ['kJ/mol'], positive: false, min: -100, max: 400 },
  'activation-entropy': { label: 'Activation entropy', symbol: 'ΔS‡', units: ['J/(mol K)'], positive: false, min: -400, max: 400 },
  'activation-volume': { label: 'Activation volume', symbol: 'ΔV‡', units: ['cm3/mol'], positive: false, min: -50, max: 50 },
  'half-life': { label: 'Half-life', symbol: 't½', units: ['s'], positive: true, min: 0, max: 1e15 },
};

export const doiPattern = /^10\.\d{4,9}\/\S+$/;

/** A DOI as typed or pasted ("https://doi.org/10.…", "doi:10.…") → the bare, checked DOI. */
export const doiSchema = z
  .string({ error: 'A DOI is text such as 10.1021/cr030726o.' })
  .trim()
  .transform((text) => text.replace(/^(https?:\/\/(dx\.)?doi\.org\/|doi:\s*)/i, ''))
  .pipe(
    z
      .string()
      .max(200, 'A DOI has at most 200 characters.')
      .regex(doiPattern, 'A DOI starts with "10.", a registrant code of 4–9 digits, a slash and a suffix (e.g. 10.1021/cr030726o).'),
  );

const shortText = (what: string, max: number) =>
  z.string({ error: `${what} must be text.` }).trim().max(max, `${what} has at most ${max} characters.`);

/** What kind of work a citation is; decides the BibTeX and RIS entry type of an export. */
export const citationKinds = ['article', 'book', 'chapter', 'web-page'] as const;
export const citationKindSchema = z.enum(citationKinds, { error: `Choose a kind of source: ${citationKinds.join(', ')}.` });
export type CitationKind = z.infer<typeof citationKindSchema>;

/** A stored kind, or "article" for records from before kinds were kept. */
export function citationKindOf(kind: unknown): CitationKind {
  return (citationKinds as readonly unknown[]).includes(kind) ? (kind as CitationKind) : 'article';
}

export const citationInputSchema = z
  .object({
    doi: doiSchema.nullish(),
    kind: citationKindSchema.optional(),
    authors: shortText('Authors', 1000).min(1, 'Give the authors (e.g. "L. Helm, A. E. Merbach").'),
    title: shortText('Title', 500).nullish(),
    /** The journal of an article, the book a chapter is in, the site of a web page; books leave it empty. */
    journal: shortText('Journal', 200).default(''),
    year: z
      .number({ error: 'The year must be a number.' })
      .int('The year must be a whole number.')
      .min(1800, 'The year must be 1800 or later.')
      .max(2100, 'The year must be 2100 or earlier.')
      // Null only for undated sources (an online textbook page); journals and books carry a year.
      .nullish(),
    volume: shortText('Volume', 40).nullish(),
    pages: shortText('Pages', 40).nullish(),
    publisher: shortText('Publisher', 200).nullish(),
    place: shortText('Place', 120).nullish(),
    url: z
      .string({ error: 'The address must be text.' })
      .trim()
      .max(500, 'The address has at most 500 characters.')
      .regex(/^https?:\/\/\S+$/, 'The address starts with https:// or http://.')
      .nullish(),
  })
  .strict()
  .superRefine((c, ctx) => {
    const kind = c.kind ?? 'article';
    if ((kind === 'article' || kind === 'chapter') && !c.journal) {
      ctx.addIssue({ code: 'custom', path: ['journal'], message: kind === 'chapter' ? 'Give the book the chapter is in.' : 'Give the journal or book.' });
    }
    if (kind === 'book' && !c.title && !c.journal) ctx.addIssue({ code: 'custom', path: ['title'], message: 'Give the title of the book.' });
    if (kind === 'web-page' && !c.url) ctx.addIssue({ code: 'custom', path: ['url'], message: 'Give the address of the web page.' });
  });
export type CitationInput = z.infer<typeof citationInputSchema>;

/**
 * Citations belong to a group and are de-duplicated by DOI within it (case-insensitive): posting a
 * DOI the group already holds returns the existing record.
 */
export const citationSchema = z.object({
  id: z.string(),
  groupId: z.string(),
  doi: z.string().nullable(),
  authors: z.string(),
  title: z.string().nullable(),
  journal: z.string(),
  year: z.number().int().nullable(),
  volume: z.string().nullable(),
  pages: z.string().nullable(),
  // Records and snapshots from before kinds were kept read as articles.
  kind: citationKindSchema.default('article'),
  publisher: z.string().nullable().default(null),
  place: z.string().nullable().default(null),
  url: z.string().nullable().default(null),
});
export type Citation = z.infer<typeof citationSchema>;

/** POST /api/citations: `groupId` may be left out when the person belongs to one group only. */
export const createCitationInputSchema = citationInputSchema.extend({ groupId: z.uuid('groupId must be a group id.').optional() });
export type CreateCitationInput = z.infer<typeof createCitationInputSchema>;

const unitInputSchema = z
  .string({ error: 'Give the unit, e.g. "s-1".' })
  .trim()
  .min(1, 'Give the unit, e.g. "s-1".')
  // Checked against the kind in checkMeasurement, so the message can name the units that fit.
  .transform((unit) => measurementUnitAliases[unit] ?? unit);

const formulaTextSchema = z
  .string({ error: 'must be a formula written as text, e.g. "[Co(NH3)6]3+"' })
  .trim()
  .min(1, 'is empty: write a formula such as [Co(NH3)6]3+')
  .max(MAX_FORMULA_LENGTH, `is longer than ${MAX_FORMULA_LENGTH} characters`);

const measurementFields = {
  kind: measurementKindSchema,
  value: z.number({ error: 'The value must be a number.' }).finite('The value must be a finite number.'),
  unit: unitInputSchema,
  /** Kelvin; 298.15 K = 25 °C. */
  temperatureK: z.number({ error: 'The temperature must be a number of kelvin.' }).gt(0, 'The temperature must be above 0 K.').max(800, 'The temperature must be at most 800 K.').nullish(),
  /** mol/L. */
  ionicStrengthM: z.number({ error: 'The ionic strength must be a number (mol/L).' }).min(0, 'The ionic strength cannot be negative.').max(20, 'The ionic strength must be at most 20 M.').nullish(),
  medium: shortText('Medium', 200).nullish(),
  method: shortText('Method', 200).nullish(),
  /** The other partner of a cross reaction (k12), parsed by the engine. */
  partnerFormula: formulaTextSchema.nullish(),
  /** Either an existing citation of the group … */
  citationId: z.uuid('citationId must be a citation id.').nullish(),
  /** … or a new one (found again by DOI if the group already has it). */
  citation: citationInputSchema.nullish(),
  notes: shortText('Notes', 2000).nullish(),
};

/** Unit, sign and range per kind; partner formula only (and always) for cross reactions. */
function checkMeasurement(
  m: { kind?: MeasurementKind; value?: number; unit?: string; partnerFormula?: string | null; citationId?: string | null; citation?: unknown },
  ctx: z.RefinementCtx,
) {
  if (m.citationId && m.citation) {
    ctx.addIssue({ code: 'custom', path: ['citation'], message: 'Give either citationId or citation, not both.' });
  }
  if (!m.kind) return;
  const rule = measurementKindRules[m.kind];
  if (m.unit !== undefined && !(rule.units as readonly string[]).includes(m.unit)) {
    ctx.addIssue({
      code: 'custom',
      path: ['unit'],
      message: `${rule.label} (${rule.symbol}) is given in ${rule.units.map((u) => `"${u}"`).join(' or ')}, not "${m.unit}".`,
    });
  }
  if (m.value !== undefined && Number.isFinite(m.value)) {
    if (rule.positive && m.value <= 0) {
      ctx.addIssue({ code: 'custom', path: ['value'], message: `${rule.label} (${rule.symbol}) must be greater than zero.` });
    } else if (m.value < rule.min || m.value > rule.max) {
      ctx.addIssue({
        code: 'custom',
        path: ['value'],
        message: `${rule.label} (${rule.symbol}) of ${m.value} is outside the plausible range ${rule.min} to ${rule.max}: check the unit.`,
      });
    }
  }
  if (m.kind === 'cross-reaction' && !m.partnerFormula) {
    ctx.addIssue({ code: 'custom', path: ['partnerFormula'], message: 'A cross reaction (k12) needs the formula of its partner.' });
  }
  if (m.kind !== 'cross-reaction' && m.partnerFormula) {
    ctx.addIssue({ code: 'custom', path: ['partnerFormula'], message: 'Only a cross reaction (k12) has a partner formula.' });
  }
}

export const measurementInputSchema = z
  .object({ ...measurementFields, version: z.number().int().min(1).optional() })
  .strict()
  .superRefine(checkMeasurement);
export type MeasurementInput = z.infer<typeof measurementInputSchema>;

/**
 * PATCH /api/complexes/:id/measurements/:mid — any subset; the merged measurement is checked
 * again on the server (kind/unit/value together).
 */
export const updateMeasurementInputSchema = z
  .object({
    kind: measurementKindSchema.optional(),
    value: measurementFields.value.optional(),
    unit: unitInputSchema.optional(),
    temperatureK: measurementFields.temperatureK,
    ionicStrengthM: measurementFields.ionicStrengthM,
    medium: measurementFields.medium,
    method: measurementFields.method,
    partnerFormula: measurementFields.partnerFormula,
    citationId: measurementFields.citationId,
    citation: measurementFields.citation,
    notes: measurementFields.notes,
    /** The entry's version the edit is based on; a stale one → 409. */
    version: z.number().int().min(1).optional(),
  })
  .strict();
export type UpdateMeasurementInput = z.infer<typeof updateMeasurementInputSchema>;

/** Re-checks a merged measurement (server side, after PATCH). */
export const measurementCheckSchema = z
  .object({
    kind: measurementKindSchema,
    value: z.number(),
    unit: z.string(),
    partnerFormula: z.string().nullish(),
  })
  .superRefine(checkMeasurement);

export const measurementSchema = z.object({
  id: z.string(),
  kind: measurementKindSchema,
  value: z.number(),
  unit: measurementUnitSchema,
  temperatureK: z.number().nullable(),
  ionicStrengthM: z.number().nullable(),
  medium: z.string().nullable(),
  method: z.string().nullable(),
  partnerFormula: z.string().nullable(),
  citation: citationSchema.nullable(),
  notes: z.string().nullable(),
  createdAt: z.iso.datetime(),
  updatedAt: z.iso.datetime(),
});
export type Measurement = z.infer<typeof measurementSchema>;

// ───────────────────────────── complexes ─────────────────────────────

const complexNameSchema = shortText('Name', 200).min(1, 'Give a name, e.g. "hexaamminecobalt(III)".');

export const createComplexInputSchema = z
  .object({
    /** Optional when the person belongs to exactly one group. */
    groupId: z.uuid('groupId must be a group id.').optional(),
    formula: formulaTextSchema,
    name: complexNameSchema,
    notes: shortText('Notes', 4000).nullish(),
    /** Measurements created with the entry (each may carry a citation). */
    measurements: z.array(measurementInputSchema).max(100, 'At most 100 measurements at once.').optional(),
  })
  .strict();
export type CreateComplexInput = z.infer<typeof createComplexInputSchema>;

/**
 * One measurement of a whole-entry save: with the `id` of a stored measurement it replaces that
 * one; without, it is added. Stored measurements missing from the save are removed.
 */
export const entryMeasurementInputSchema = z
  .object({ ...measurementFields, id: z.uuid('id must be the id of a measurement of this entry.').optional() })
  .strict()
  .superRefine(checkMeasurement);
export type EntryMeasurementInput = z.infer<typeof entryMeasurementInputSchema>;

/**
 * PUT /api/complexes/:id — the whole entry as the person wants it, based on `version`. The server
 * diffs it against the stored entry and writes one revision in one transaction.
 */
export const saveComplexInputSchema = z
  .object({
    version: z.number({ error: 'Give the version you edited (from the entry you loaded).' }).int().min(1),
    formula: formulaTextSchema,
    name: complexNameSchema,
    notes: shortText('Notes', 4000).nullish(),
    measurements: z.array(entryMeasurementInputSchema).max(100, 'At most 100 measurements in one entry.'),
    /** Added to the history line after the summary the server writes ("Corrected the temperature"). */
    message: shortText('Message', 500).optional(),
  })
  .strict();
export type SaveComplexInput = z.infer<typeof saveComplexInputSchema>;

export const updateComplexInputSchema = z
  .object({
    /** The version the edit is based on (from the last GET); a stale one → 409 with error.current. */
    version: z.number({ error: 'Give the version you edited (from the entry you loaded).' }).int().min(1),
    formula: formulaTextSchema.optional(),
    name: complexNameSchema.optional(),
    notes: shortText('Notes', 4000).nullish(),
    /** Shown in the revision history ("Corrected the temperature"). */
    message: shortText('Message', 500).optional(),
  })
  .strict();
export type UpdateComplexInput = z.infer<typeof updateComplexInputSchema>;

/** An entry of the same species (metal, oxidation state, ligand set) already in the group. */
export const duplicateEntrySchema = z.object({
  id: z.string(),
  name: z.string(),
  formula: z.string(),
  status: complexStatusSchema,
});
export type DuplicateEntry = z.infer<typeof duplicateEntrySchema>;

/** GET /api/complexes/duplicates?formula=…&groupId=…[&exceptId=…] */
export const duplicatesQuerySchema = z
  .object({
    formula: formulaTextSchema,
    groupId: z.uuid('groupId must be a group id.').optional(),
    exceptId: z.uuid('exceptId must be an entry id.').optional(),
  })
  .strict();
export const duplicatesResponseSchema = z.object({ duplicates: z.array(duplicateEntrySchema) });
export type DuplicatesResponse = z.infer<typeof duplicatesResponseSchema>;

/** Body of submit / retire (optional): the version the action is based on, and a note. */
export const transitionInputSchema = z
  .object({ version: z.number().int().min(1).optional(), message: shortText('Message', 500).optional() })
  .strict();
export type TransitionInput = z.infer<typeof transitionInputSchema>;

export const reviewInputSchema = z
  .object({
    decision: reviewDecisionSchema,
    comment: shortText('Comment', 4000).default(''),
    version: z.number().int().min(1).optional(),
  })
  .strict()
  .refine((r) => r.decision === 'accept' || r.comment.length > 0, {
    path: ['comment'],
    message: 'Say what should change (or why it is declined): a comment is required unless you accept.',
  });
export type ReviewInput = z.infer<typeof reviewInputSchema>;

export const personRefSchema = z.object({ id: z.string(), displayName: z.string() });
export type PersonRef = z.infer<typeof personRefSchema>;

/** What the engine derived from the formula (stored for search). */
export const derivedFieldsSchema = z.object({
  metal: z.string(),
  oxidationState: z.number().int(),
  dElectrons: z.number().int(),
  spinState: z.enum(['high', 'low']).nullable(),
  verdict: verdictSchema,
  ligandIds: z.array(z.string()),
});
export type DerivedFields = z.infer<typeof derivedFieldsSchema>;

/** The content of an entry at one moment: what a revision stores and what a diff compares. */
export const complexSnapshotSchema = derivedFieldsSchema.extend({
  formula: z.string(),
  name: z.string(),
  notes: z.string().nullable(),
  status: complexStatusSchema,
  measurements: z.array(measurementSchema),
});
export type ComplexSnapshot = z.infer<typeof complexSnapshotSchema>;

export const complexPermissionsSchema = z.object({
  canEdit: z.boolean(),
  canSubmit: z.boolean(),
  canReview: z.boolean(),
  canRetire: z.boolean(),
});
export type ComplexPermissions = z.infer<typeof complexPermissionsSchema>;

/** A row of the library list / search. */
export const complexListItemSchema = derivedFieldsSchema.extend({
  id: z.string(),
  groupId: z.string(),
  formula: z.string(),
  name: z.string(),
  status: complexStatusSchema,
  version: z.number().int(),
  measurementCount: z.number().int(),
  measurementKinds: z.array(measurementKindSchema),
  hasCitation: z.boolean(),
  /** An accepted version exists and a newer revision waits (or is being drafted). */
  hasPendingRevision: z.boolean(),
  /** Search similarity 0–1 when `q` was given, else null. */
  rank: z.number().nullable(),
  /**
   * The entry's headline rate: the measurement that would decide its verdict (water exchange
   * before ligand exchange, substitution and a half-life; nearest 25 °C), as a first-order k.
   * Null when no measurement gives one.
   */
  headlineRate: z
    .object({
      kind: z.enum(['water-exchange', 'ligand-exchange', 'substitution', 'half-life']),
      kPerSecond: z.number(),
      temperatureK: z.number(),
    })
    .nullable()
    .default(null),
  createdBy: personRefSchema.nullable(),
  updatedAt: z.iso.datetime(),
});
export type ComplexListItem = z.infer<typeof complexListItemSchema>;

/**
 * GET /api/complexes/:id (and the answer to create/patch/transitions). `view` tells which copy the
 * reader sees: viewers (and contributors on other people's entries) see the accepted snapshot
 * ("published"); authors and curators see the working copy, with the accepted one beside it.
 */
export const complexDetailSchema = complexSnapshotSchema.extend({
  id: z.string(),
  groupId: z.string(),
  version: z.number().int(),
  view: z.enum(['working', 'published']),
  hasPendingRevision: z.boolean(),
  /** The accepted snapshot while a newer revision is pending (working view only), else null. */
  accepted: complexSnapshotSchema.nullable(),
  acceptedAt: z.iso.datetime().nullable(),
  createdBy: personRefSchema.nullable(),
  submittedBy: personRefSchema.nullable(),
  submittedAt: z.iso.datetime().nullable(),
  createdAt: z.iso.datetime(),
  updatedAt: z.iso.datetime(),
  myRole: roleSchema,
  permissions: complexPermissionsSchema,
  latestReview: z
    .object({ decision: reviewDecisionSchema, comment: z.string(), reviewer: personRefSchema.nullable(), createdAt: z.iso.datetime() })
    .nullable(),
});
export type ComplexDetail = z.infer<typeof complexDetailSchema>;

/** 409 on a stale version: the error body carries the entry as it is now. */
export const staleVersionErrorSchema = z.object({
  error: z.object({
    code: z.literal('CONFLICT'),
    message: z.string(),
    currentVersion: z.number().int(),
    current: complexDetailSchema,
  }),
});
export type StaleVersionError = z.infer<typeof staleVersionErrorSchema>;

const queryNumber = (what: string, min: number, max: number) =>
  z.coerce
    .number({ error: `${what} must be a number.` })
    .int(`${what} must be a whole number.`)
    .min(min, `${what} must be at least ${min}.`)
    .max(max, `${what} must be at most ${max}.`);

const queryBoolean = z.enum(['true', 'false', '1', '0'], { error: 'Use true or false.' }).transform((v) => v === 'true' || v === '1');

/**
 * Orders the list can be read in (`sort` + `dir`). Without `sort`: rank with search text, else
 * name. `metal` orders by metal, then oxidation state; `verdict` from labile to inert; `status` in
 * the order of the review workflow. Every order ends with the entry id, so ties never swap.
 */
export const librarySortKeys = ['formula', 'name', 'metal', 'dCount', 'verdict', 'measurements', 'status', 'updated'] as const;
export const librarySortSchema = z.enum(librarySortKeys, { error: `sort is one of: ${librarySortKeys.join(', ')}.` });
export type LibrarySort = z.infer<typeof librarySortSchema>;
export const sortDirectionSchema = z.enum(['asc', 'desc'], { error: 'dir is asc or desc.' });
export type SortDirection = z.infer<typeof sortDirectionSchema>;

/**
 * Columns of the library table on a wide screen, in their order. The formula always shows (it
 * names the row); which of the others show is kept per person (`libraryColumns` in
 * GET/PATCH /api/auth/me/preferences).
 */
export const libraryColumnKeys = ['formula', 'name', 'metal', 'dCount', 'verdict', 'rate', 'measurements', 'status', 'updated'] as const;
export const libraryColumnSchema = z.enum(libraryColumnKeys, { error: `A library column is one of: ${libraryColumnKeys.join(', ')}.` });
export type LibraryColumn = z.infer<typeof libraryColumnSchema>;
/** The shown columns, or null for every column (the default). */
export const libraryColumnsSchema = z
  .array(libraryColumnSchema)
  .max(libraryColumnKeys.length)
  .refine((columns) => new Set(columns).size === columns.length, 'Name each column once.')
  .nullable();
export const libraryPreferencesSchema = z.object({ libraryColumns: libraryColumnsSchema.default(null) });
export type LibraryPreferences = z.infer<typeof libraryPreferencesSchema>;

/** At most this many ids in one `ids` filter (an export of the rows someone ticked). */
export const MAX_SELECTED_IDS = 200;

/** `ids=<uuid>,<uuid>…`: only these entries (of those the person may see). */
const idListSchema = z
  .string({ error: 'ids is a comma-separated list of entry ids.' })
  .transform((text) => text.split(',').map((id) => id.trim()).filter((id) => id.length > 0))
  .pipe(
    z
      .array(z.uuid('ids holds entry ids separated by commas.'))
      .min(1, 'ids needs at least one entry id.')
      .max(MAX_SELECTED_IDS, `ids holds at most ${MAX_SELECTED_IDS} entry ids.`),
  );

/** GET /api/complexes query string. Filters combine with AND. */
export const complexSearchQuerySchema = z
  .object({
    groupId: z.uuid('groupId must be a group id.').optional(),
    q: z.string().trim().max(200, 'The search text has at most 200 characters.').optional(),
    metal: z.string().trim().regex(/^[A-Z][a-z]?$/, 'metal is an element symbol such as Co.').optional(),
    oxidationState: queryNumber('oxidationState', -4, 9).optional(),
    dCount: queryNumber('dCount', 0, 14).optional(),
    verdict: verdictSchema.optional(),
    ligand: z.string().trim().min(1).max(40).optional(),
    measurementKind: measurementKindSchema.optional(),
    status: complexStatusSchema.optional(),
    hasCitation: queryBoolean.optional(),
    ids: idListSchema.optional(),
    sort: librarySortSchema.optional(),
    dir: sortDirectionSchema.optional(),
    page: queryNumber('page', 1, 100000).default(1),
    pageSize: queryNumber('pageSize', 1, 100).default(20),
  })
  .strict();
export type ComplexSearchQuery = z.infer<typeof complexSearchQuerySchema>;

export const complexListResponseSchema = z.object({
  items: z.array(complexListItemSchema),
  /** Exact up to 1 000 matches (or the end of the page asked for); beyond that a lower bound. */
  total: z.number().int(),
  /** True when there are more matches than `total` (the server stopped counting). */
  totalIsLowerBound: z.boolean().default(false),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type ComplexListResponse = z.infer<typeof complexListResponseSchema>;

// ───────────────────────────── revisions, reviews, diff ─────────────────────────────

export const revisionKinds = ['create', 'edit', 'submit', 'review', 'retire', 'restore'] as const;
export const revisionSchema = z.object({
  id: z.string(),
  /** = the entry's version right after this change. */
  number: z.number().int(),
  kind: z.enum(revisionKinds),
  status: complexStatusSchema,
  message: z.string(),
  author: personRefSchema.nullable(),
  createdAt: z.iso.datetime(),
});
export type Revision = z.infer<typeof revisionSchema>;

export const revisionsResponseSchema = z.object({ revisions: z.array(revisionSchema) });
export type RevisionsResponse = z.infer<typeof revisionsResponseSchema>;

export const revisionDetailSchema = revisionSchema.extend({ snapshot: complexSnapshotSchema });
export type RevisionDetail = z.infer<typeof revisionDetailSchema>;

export const diffQuerySchema = z
  .object({ from: queryNumber('from', 1, 1e9), to: queryNumber('to', 1, 1e9) })
  .strict();

const jsonValue = z.union([z.string(), z.number(), z.boolean(), z.null(), z.array(z.string())]);

export const fieldChangeSchema = z.object({ field: z.string(), before: jsonValue, after: jsonValue });
export type FieldChange = z.infer<typeof fieldChangeSchema>;

export const revisionDiffSchema = z.object({
  from: z.number().int(),
  to: z.number().int(),
  fields: z.array(fieldChangeSchema),
  measurements: z.object({
    added: z.array(measurementSchema),
    removed: z.array(measurementSchema),
    changed: z.array(z.object({ id: z.string(), kind: measurementKindSchema, fields: z.array(fieldChangeSchema) })),
  }),
  /** One line per change, for people: "name: "a" → "b"", "+ water-exchange 2.5e-6 s-1". */
  summary: z.array(z.string()),
});
export type RevisionDiff = z.infer<typeof revisionDiffSchema>;

export const reviewSchema = z.object({
  id: z.string(),
  complexId: z.string(),
  revisionNumber: z.number().int(),
  decision: reviewDecisionSchema,
  comment: z.string(),
  reviewer: personRefSchema.nullable(),
  /** True when a curator accepted their own submission as the group's only curator. */
  selfAccepted: z.boolean(),
  createdAt: z.iso.datetime(),
});
export type Review = z.infer<typeof reviewSchema>;

/** POST /api/complexes/:id/reviews → the review and the entry after it. */
export const reviewResponseSchema = z.object({ review: reviewSchema, complex: complexDetailSchema });
export type ReviewResponse = z.infer<typeof reviewResponseSchema>;

/** GET /api/review-queue: submitted entries of the curator's groups, oldest submission first. */
export const reviewQueueItemSchema = complexListItemSchema.extend({
  groupName: z.string(),
  submittedBy: personRefSchema.nullable(),
  submittedAt: z.iso.datetime().nullable(),
  /** An edit of an already accepted entry (rather than a new entry). */
  isEditOfApproved: z.boolean(),
});
export const reviewQueueResponseSchema = z.object({ items: z.array(reviewQueueItemSchema), total: z.number().int() });
export type ReviewQueueResponse = z.infer<typeof reviewQueueResponseSchema>;

// ───────────────────────────── ligands ─────────────────────────────

export const libraryLigandSchema = z.object({
  /** Catalogue key, e.g. "NH3", "en"; group additions get their own key. */
  id: z.string(),
  name: z.string(),
  abbreviation: z.string(),
  charge: z.number().int(),
  denticity: z.number().int(),
  donorAtoms: z.array(z.string()),
  /** "reference" (data/ligands.json, read-only) or "group" (a curator's addition). */
  origin: z.enum(['reference', 'group']),
  groupId: z.string().nullable(),
  source: z.string(),
});
export type LibraryLigand = z.infer<typeof libraryLigandSchema>;

export const ligandsResponseSchema = z.object({ ligands: z.array(libraryLigandSchema) });
export type LigandsResponse = z.infer<typeof ligandsResponseSchema>;

export const createLigandInputSchema = z
  .object({
    abbreviation: z
      .string({ error: 'Give an abbreviation, e.g. "dppe".' })
      .trim()
      .min(1, 'Give an abbreviation, e.g. "dppe".')
      .max(40, 'An abbreviation has at most 40 characters.')
      .regex(/^[A-Za-z0-9,'()+-]+$/, 'An abbreviation uses letters, digits and , \' ( ) + - only.'),
    name: shortText('Name', 120).min(1, 'Give the ligand name, e.g. "1,2-bis(diphenylphosphino)ethane".'),
    charge: z.number({ error: 'The charge must be a whole number.' }).int().min(-4).max(2),
    denticity: z.number({ error: 'The denticity must be a whole number.' }).int().min(1).max(8),
    donorAtoms: z.array(z.string().regex(/^[A-Z][a-z]?$/, 'A donor atom is an element symbol such as N.')).min(1).max(8),
    source: shortText('Source', 500).min(1, 'Say where the ligand data come from.'),
  })
  .strict()
  .refine((l) => l.donorAtoms.length === l.denticity, {
    path: ['donorAtoms'],
    message: 'Give one donor atom per tooth (as many as the denticity).',
  });
export type CreateLigandInput = z.infer<typeof createLigandInputSchema>;

// ───────────────────────────── measured meets predicted ─────────────────────────────

/** An accepted measurement of the same complex (same metal, oxidation state and ligand set). */
export const libraryMeasurementSchema = measurementSchema.extend({
  complexId: z.string(),
  complexFormula: z.string(),
  complexName: z.string(),
});
export type LibraryMeasurement = z.infer<typeof libraryMeasurementSchema>;

/** GET /api/groups/:groupId/measured?formula=… */
export const measuredQuerySchema = z.object({ formula: formulaTextSchema }).strict();
export const measuredResponseSchema = z.object({
  formula: z.string(),
  classification: classificationSchema,
  libraryMeasurements: z.array(libraryMeasurementSchema),
});
export type MeasuredResponse = z.infer<typeof measuredResponseSchema>;

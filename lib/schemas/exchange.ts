import { z } from 'zod';
import { complexSearchQuerySchema, complexStatusSchema, doiSchema } from './library';

/**
 * Library exchange: CSV import/export, citation export (BibTeX, RIS), DOI look-up,
 * attachments and e-mail preferences. One zod schema per DTO, shared by the server and the app.
 * Wire format: string ids, ISO date strings.
 */

// ───────────────────────────── CSV columns ─────────────────────────────

/**
 * The columns the importer reads and the exporter writes, in export order. One row per
 * measurement; rows with the same `entry` label (or, without one, the same formula and name)
 * make one library entry. An entry without measurements is one row with the measurement
 * columns empty.
 */
export const csvColumns = [
  'entry',
  'formula',
  'name',
  'notes',
  'kind',
  'value',
  'unit',
  'temperature_K',
  'ionic_strength_M',
  'medium',
  'method',
  'partner_formula',
  'measurement_notes',
  'doi',
  'authors',
  'title',
  'journal',
  'year',
  'volume',
  'pages',
] as const;
export const csvColumnSchema = z.enum(csvColumns);
export type CsvColumn = z.infer<typeof csvColumnSchema>;

/**
 * The columns the CSV export writes: the importer's, with the entry's review state (`status`:
 * draft, in-review, accepted, returned, declined, retired, as the reader sees the entry) after its
 * name. The importer ignores `status`: imported entries wait for review (`in-review`).
 */
export const exportCsvColumns = ['entry', 'formula', 'name', 'status', ...csvColumns.slice(3)] as const;
export type ExportCsvColumn = (typeof exportCsvColumns)[number];

/** Other headers people use for the same column (compared lower-case, ignoring spaces, _ - . and brackets). */
export const csvColumnSynonyms: Readonly<Record<CsvColumn, readonly string[]>> = {
  entry: ['entry', 'entry id', 'entry key', 'group', 'complex id', 'key'],
  formula: ['formula', 'complex', 'complex formula', 'coordination formula', 'species'],
  name: ['name', 'complex name', 'compound', 'compound name', 'iupac name'],
  notes: ['notes', 'entry notes', 'complex notes', 'comment', 'comments'],
  kind: ['kind', 'measurement', 'measurement kind', 'quantity', 'type'],
  value: ['value', 'k', 'rate constant', 'measured value'],
  unit: ['unit', 'units'],
  temperature_K: ['temperature K', 'temperature', 'T', 'T K', 'temp', 'temp K'],
  ionic_strength_M: ['ionic strength M', 'ionic strength', 'I', 'I M', 'mu'],
  medium: ['medium', 'solvent'],
  method: ['method', 'technique'],
  partner_formula: ['partner formula', 'partner', 'reaction partner'],
  measurement_notes: ['measurement notes', 'measurement comment'],
  doi: ['doi', 'citation doi'],
  authors: ['authors', 'author', 'citation authors'],
  title: ['title', 'article title', 'paper title'],
  journal: ['journal', 'source', 'journal or book'],
  year: ['year', 'publication year'],
  volume: ['volume', 'vol'],
  pages: ['pages', 'page', 'pp'],
};

/** A user's mapping: our column → the header text in their file (exactly as in the file). */
export const csvMappingSchema = z.partialRecord(csvColumnSchema, z.string().min(1).max(200));
export type CsvMapping = z.infer<typeof csvMappingSchema>;

/** The columns an import cannot do without. */
export const csvRequiredColumns = ['formula', 'name'] as const satisfies readonly CsvColumn[];

/** "Temperature (K)" → "temperaturek": lower case, without spaces, _ - . ( ) [ ] / and °. */
export const normaliseCsvHeader = (header: string) => header.toLowerCase().replace(/[\s_\-.()[\]/°]+/g, '');

const synonymIndex = new Map<string, CsvColumn>();
for (const column of csvColumns) {
  for (const synonym of [column, ...csvColumnSynonyms[column]]) {
    const key = normaliseCsvHeader(synonym);
    if (!synonymIndex.has(key)) synonymIndex.set(key, column);
  }
}

/** The column a header names by itself (its name or a synonym), or null for a header the importer does not use. */
export const csvColumnForHeader = (header: string): CsvColumn | null => synonymIndex.get(normaliseCsvHeader(header)) ?? null;

/** How a file's headers map onto our columns, before any row is read. */
export interface CsvColumnPlan {
  /** Every header of the file in order, with the column it fills (null: not used). */
  columns: { header: string; column: CsvColumn | null }[];
  /** Our column → its index in the file. */
  index: Partial<Record<CsvColumn, number>>;
  /** Required columns that no header fills. */
  missing: CsvColumn[];
  /** Problems that stop the import: a mapping naming a header the file lacks, two headers for one column. Keyed by `mapping.<column>` or the column. */
  problems: Partial<Record<string, string>>;
}

/**
 * The one column mapping, used by the server before it reads any row and by the import screen as
 * soon as a file is chosen: headers recognised by name and synonyms; the person's mapping wins
 * where given (a header mapped explicitly fills only that column).
 */
export function planCsvColumns(headers: readonly string[], mapping: CsvMapping = {}): CsvColumnPlan {
  const index: Partial<Record<CsvColumn, number>> = {};
  const problems: Record<string, string> = {};
  const explicit = new Set<number>();
  for (const [column, header] of Object.entries(mapping) as [CsvColumn, string][]) {
    const at = headers.findIndex((h) => h === header.trim());
    if (at === -1) problems[`mapping.${column}`] = `The file has no column "${header}" (its headers are: ${headers.join(', ')}).`;
    else {
      index[column] = at;
      explicit.add(at);
    }
  }
  headers.forEach((header, at) => {
    if (explicit.has(at)) return;
    const column = csvColumnForHeader(header);
    if (!column || column in mapping) return;
    if (index[column] !== undefined) {
      problems[column] = `Two columns mean "${column}": "${headers[index[column] as number]}" and "${header}". Rename one, or say which to use with mapping.`;
      return;
    }
    index[column] = at;
  });
  const missing = csvRequiredColumns.filter((required) => index[required] === undefined);
  const byIndex = new Map(Object.entries(index).map(([column, at]) => [at as number, column as CsvColumn]));
  return { columns: headers.map((header, at) => ({ header, column: byIndex.get(at) ?? null })), index, missing, problems };
}

// ───────────────────────────── import ─────────────────────────────

export const IMPORT_MAX_BYTES = 5 * 1024 * 1024;
export const IMPORT_MAX_ROWS = 50_000;

/**
 * POST /api/imports — the body is the raw file (Content-Type text/csv, at most 5 MB); options go
 * in the query string: groupId (optional with one group), dryRun (true: validate only),
 * mapping (JSON of CsvMapping), wait (true: answer when the job has finished), fileName.
 */
/** What to do with a row whose species is already in the library or earlier in the file. */
export const duplicateChoices = ['skip', 'merge', 'import'] as const;
export const duplicateChoiceSchema = z.enum(duplicateChoices, { error: 'Choose skip, merge or import for duplicates.' });
export type DuplicateChoice = z.infer<typeof duplicateChoiceSchema>;

const jsonQuery = <T extends z.ZodType>(schema: T, example: string) =>
  z
    .string()
    .max(20_000)
    .transform((text, ctx) => {
      try {
        return JSON.parse(text) as unknown;
      } catch {
        ctx.addIssue({ code: 'custom', message: `must be JSON, e.g. ${example}.` });
        return z.NEVER;
      }
    })
    .pipe(schema);

export const importQuerySchema = z
  .object({
    /** For every duplicate row (default skip); `duplicateChoices` overrides it per row. */
    duplicates: duplicateChoiceSchema.default('skip'),
    /** Per row (the spreadsheet row number of the entry's first line): skip, merge or import. */
    duplicateChoices: jsonQuery(z.record(z.string().regex(/^\d+$/, 'rows are numbers'), duplicateChoiceSchema), '{"4":"merge"}').optional(),
    groupId: z.uuid('groupId must be a group id.').optional(),
    dryRun: z.enum(['true', 'false', '1', '0']).default('false').transform((v) => v === 'true' || v === '1'),
    wait: z.enum(['true', 'false', '1', '0']).default('false').transform((v) => v === 'true' || v === '1'),
    fileName: z.string().trim().max(200).optional(),
    mapping: z
      .string()
      .max(4000)
      .transform((text, ctx) => {
        try {
          return JSON.parse(text) as unknown;
        } catch {
          ctx.addIssue({ code: 'custom', message: 'mapping must be JSON, e.g. {"formula":"Complex"}.' });
          return z.NEVER;
        }
      })
      .pipe(csvMappingSchema)
      .optional(),
  })
  .strict();
export type ImportQuery = z.infer<typeof importQuerySchema>;

/** One problem in the file: `row` is the line number as a spreadsheet shows it (the header is row 1). */
export const importIssueSchema = z.object({
  row: z.number().int(),
  /** The header as written in the file (null for problems of the whole row). */
  column: z.string().nullable(),
  message: z.string(),
  /** Character position (1-based) inside the cell, for formulas the engine cannot read. */
  position: z.number().int().optional(),
});
export type ImportIssue = z.infer<typeof importIssueSchema>;

export const importStates = ['queued', 'validating', 'importing', 'succeeded', 'failed'] as const;
export const importStateSchema = z.enum(importStates);
export type ImportState = z.infer<typeof importStateSchema>;

/** An entry of the file whose species is already in the library (`existing`) or earlier in the file (`sameAsRow`). */
export const importDuplicateSchema = z.object({
  row: z.number().int(),
  formula: z.string(),
  name: z.string(),
  existing: z.object({ id: z.string(), name: z.string(), formula: z.string(), status: z.string() }).nullable(),
  sameAsRow: z.number().int().nullable(),
  /** What the import does (or, in a dry run, would do) with it. */
  choice: duplicateChoiceSchema,
});
export type ImportDuplicate = z.infer<typeof importDuplicateSchema>;

/** An entry a finished import wrote: its id, the file row it came from, and how it reads in the library. */
export const importCreatedEntrySchema = z.object({
  id: z.string(),
  row: z.number().int(),
  formula: z.string(),
  name: z.string(),
  status: complexStatusSchema,
});
export type ImportCreatedEntry = z.infer<typeof importCreatedEntrySchema>;

/** GET /api/imports/:id (and the answer to POST /api/imports). Poll until `state` is succeeded or failed. */
export const importJobSchema = z.object({
  id: z.string(),
  groupId: z.string(),
  fileName: z.string().nullable(),
  dryRun: z.boolean(),
  state: importStateSchema,
  /** Rows looked at so far, of `total` data rows. */
  processed: z.number().int(),
  total: z.number().int(),
  /** The headers found and the column each was mapped to (null: ignored). */
  columns: z.array(z.object({ header: z.string(), column: csvColumnSchema.nullable() })),
  errorCount: z.number().int(),
  /** At most 1000 issues are kept; errorCount has the full number. */
  errors: z.array(importIssueSchema),
  /** Entries and measurements the file holds (dry run) or that were written (import). */
  entryCount: z.number().int(),
  measurementCount: z.number().int(),
  complexIds: z.array(z.string()),
  /**
   * The entries a finished import created, in file order (empty for a dry run). Entries merged into
   * one already in the library, and skipped ones, are the `duplicates` with choice merge or skip.
   */
  created: z.array(importCreatedEntrySchema),
  /** Entries whose name cell was empty and that take (dry run: would take) the name suggested from the formula. */
  suggestedNames: z.array(z.object({ row: z.number().int(), name: z.string() })),
  /** Entries of the same species as one in the library or earlier in the file, with the choice applied. */
  duplicates: z.array(importDuplicateSchema),
  message: z.string().nullable(),
  createdAt: z.iso.datetime(),
  updatedAt: z.iso.datetime(),
  finishedAt: z.iso.datetime().nullable(),
});
export type ImportJob = z.infer<typeof importJobSchema>;

/** A file that cannot be read at all (4xx before any row is looked at): the error body's extra fields. */
export const importFileErrorSchema = z.object({
  error: z.object({
    code: z.enum(['VALIDATION_FAILED', 'PAYLOAD_TOO_LARGE', 'UNSUPPORTED_MEDIA', 'NOT_FOUND', 'FORBIDDEN', 'UNAUTHENTICATED']),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
    issues: z.array(importIssueSchema).optional(),
  }),
});

// ───────────────────────────── export ─────────────────────────────

/** GET /api/exports/library.csv | citations.bib | citations.ris — the library's search filters, no paging. */
export const exportQuerySchema = complexSearchQuerySchema.omit({ page: true, pageSize: true });
export type ExportQuery = z.infer<typeof exportQuerySchema>;

// ───────────────────────────── DOI look-up ─────────────────────────────

export const doiLookupQuerySchema = z.object({ doi: doiSchema }).strict();

/** GET /api/citations/lookup?doi=… → a citation ready for the form (not saved). */
export const doiLookupResponseSchema = z.object({
  doi: z.string(),
  authors: z.string(),
  title: z.string().nullable(),
  journal: z.string(),
  year: z.number().int().nullable(),
  volume: z.string().nullable(),
  pages: z.string().nullable(),
});
export type DoiLookupResponse = z.infer<typeof doiLookupResponseSchema>;

// ───────────────────────────── attachments ─────────────────────────────

export const ATTACHMENT_MAX_BYTES = 20 * 1024 * 1024;

export const attachmentKinds = ['pdf', 'png', 'jpeg', 'zip', 'cif', 'jcamp-dx', 'csv', 'text'] as const;
export const attachmentKindSchema = z.enum(attachmentKinds);
export type AttachmentKind = z.infer<typeof attachmentKindSchema>;

/** File extensions accepted per kind (checked together with the content). */
export const attachmentExtensions: Readonly<Record<AttachmentKind, readonly string[]>> = {
  pdf: ['pdf'],
  png: ['png'],
  jpeg: ['jpg', 'jpeg'],
  // Office files and zipped data sets are ZIP containers.
  zip: ['zip', 'xlsx', 'docx', 'pptx', 'odt', 'ods'],
  cif: ['cif'],
  'jcamp-dx': ['jdx', 'dx', 'jcamp'],
  csv: ['csv', 'tsv'],
  text: ['txt', 'dat', 'asc', 'xy'],
};

/**
 * POST /api/complexes/:id/attachments — the body is the raw file (any Content-Type, at most 20 MB);
 * `fileName` (query) is the name to show; `description` optional.
 */
export const attachmentUploadQuerySchema = z
  .object({
    fileName: z.string().trim().min(1, 'Give the file name, e.g. fileName=uv-vis.jdx.').max(255, 'A file name has at most 255 characters.'),
    description: z.string().trim().max(500).optional(),
  })
  .strict();

export const attachmentStates = ['pending', 'accepted', 'declined'] as const;
export const attachmentStateSchema = z.enum(attachmentStates);
export type AttachmentState = z.infer<typeof attachmentStateSchema>;

export const attachmentSchema = z.object({
  id: z.string(),
  complexId: z.string(),
  fileName: z.string(),
  kind: attachmentKindSchema,
  contentType: z.string(),
  sizeBytes: z.number().int(),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
  description: z.string().nullable(),
  uploadedBy: z.object({ id: z.string(), displayName: z.string() }).nullable(),
  createdAt: z.iso.datetime(),
  /** GET this path (same session) to download the file. */
  downloadPath: z.string(),
  /** Review state: pending until the entry's revision that added it is accepted (or declined). */
  state: attachmentStateSchema,
});
export type Attachment = z.infer<typeof attachmentSchema>;

export const attachmentListSchema = z.object({ attachments: z.array(attachmentSchema) });
export type AttachmentList = z.infer<typeof attachmentListSchema>;

// ───────────────────────────── e-mail preferences ─────────────────────────────

export const mailPreferencesSchema = z.object({
  /** Curators: a mail when an entry of their group is submitted for review. */
  reviewSubmissions: z.boolean(),
  /** Submitters: a mail when a curator decides on their submission. */
  reviewDecisions: z.boolean(),
});
export type MailPreferences = z.infer<typeof mailPreferencesSchema>;

export const updateMailPreferencesInputSchema = mailPreferencesSchema.partial().strict();
export type UpdateMailPreferencesInput = z.infer<typeof updateMailPreferencesInputSchema>;

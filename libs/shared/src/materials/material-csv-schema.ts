import * as z from 'zod';

/** Columns of the materials CSV, in export order; import accepts them in any order. */
export const MATERIAL_CSV_COLUMNS = [
  'tradeName',
  'inci',
  'usName',
  'cas',
  'ec',
  'functions',
  'category',
  'supplier',
  'colourIndex',
  'nano',
  'notes',
  'components',
  'ifraCertificate',
  'allergenDeclaration',
  'weightPerVolume',
  'calibrations',
] as const;
/** Columns an import file must have. */
export const MATERIAL_CSV_REQUIRED = ['tradeName', 'inci', 'category'] as const;
/** Columns that hold JSON (the structured certificate data) rather than plain text. */
export const MATERIAL_CSV_JSON_COLUMNS = [
  'components',
  'ifraCertificate',
  'allergenDeclaration',
  'weightPerVolume',
  'calibrations',
] as const;
/** Cell values of the `nano` column (case-insensitive); a blank or missing cell means no. */
export const MATERIAL_CSV_YES = ['yes', 'true'] as const;
export const MATERIAL_CSV_NO = ['no', 'false'] as const;
/** Separator of the functions column: `humectant; skin conditioning`. */
export const MATERIAL_CSV_LIST_SEPARATOR = ';';
/** Most rows one import takes; parsing stops at the next row, however long the file. */
export const MATERIAL_CSV_MAX_ROWS = 5000;
/**
 * Most rows a preview sends back (those needing attention first, then ready ones, in line
 * order); `validCount` and `errorCount` always count every row. Keeps the answer small.
 */
export const MATERIAL_CSV_PREVIEW_ROWS = 200;
/** Most characters of a JSON cell: a full certificate fits many times over. */
export const MATERIAL_CSV_MAX_JSON_CELL = 65_536;

/** One data row of an import file, checked. */
export const materialImportRowSchema = z.object({
  /** Line of the file the row starts on (the header is line 1). */
  line: z.number().int(),
  tradeName: z.string(),
  category: z.string(),
  /** Whether the row would be imported as it stands. */
  valid: z.boolean(),
  /** Messages per field, e.g. `{ components: ['Components add up to 90 % …'] }`. */
  errors: z.record(z.string(), z.array(z.string())),
  /**
   * The workshop's material this row matches (same trade name, ignoring case and spaces, and the
   * same supplier): imported as it stands it would be a second copy; with `existing=update` it
   * replaces that material's fields instead. Null when the row is new.
   */
  existingId: z.string().nullable().optional(),
});
export type MaterialImportRow = z.infer<typeof materialImportRowSchema>;

/**
 * What `POST /api/materials/import/preview` answers: the file's problems, the counts of every
 * row, and up to {@link MATERIAL_CSV_PREVIEW_ROWS} rows with their errors.
 */
export const materialImportPreviewSchema = z.object({
  /** Problems with the file as a whole (missing columns, unreadable CSV). */
  fileErrors: z.array(z.string()),
  rows: z.array(materialImportRowSchema),
  validCount: z.number().int(),
  errorCount: z.number().int(),
  /** How many valid rows match a material the workshop already has (see `existingId`). */
  existingCount: z.number().int().optional(),
});
export type MaterialImportPreview = z.infer<typeof materialImportPreviewSchema>;

/**
 * Query of `POST /api/materials/import`: what to do with rows matching an existing material,
 * `create` a second copy (the default, as before) or `update` the existing one.
 */
export const materialImportQuerySchema = z.object({
  existing: z
    .enum(['create', 'update'], { error: 'existing is create or update' })
    .default('create'),
});
export type MaterialImportQuery = z.output<typeof materialImportQuerySchema>;

/** What a successful `POST /api/materials/import` answers. */
export const materialImportResultSchema = z.object({
  /** Rows written, created and updated together. */
  imported: z.number().int(),
  /** Ids of every row written, in file order. */
  ids: z.array(z.string()),
  /** How many of them updated an existing material (`existing=update`). */
  updated: z.number().int().optional(),
});
export type MaterialImportResult = z.infer<typeof materialImportResultSchema>;

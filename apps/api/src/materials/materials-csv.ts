import { setImmediate as nextTurn } from 'node:timers/promises';
import Papa from 'papaparse';
import {
  MATERIAL_CSV_COLUMNS,
  MATERIAL_CSV_JSON_COLUMNS,
  MATERIAL_CSV_LIST_SEPARATOR,
  MATERIAL_CSV_MAX_JSON_CELL,
  MATERIAL_CSV_MAX_ROWS,
  MATERIAL_CSV_PREVIEW_ROWS,
  MATERIAL_CSV_NO,
  MATERIAL_CSV_REQUIRED,
  MATERIAL_CSV_YES,
  boundedErrors,
  clip,
  duplicateKey,
  parseProblems,
  shownRows,
  unescapeFormula,
  materialCreateSchema,
  type Material,
  type MaterialFields,
  type MaterialImportPreview,
  type MaterialImportQuery,
  type MaterialImportRow,
} from '@batchproof/shared';
import type { AuthUser } from '../auth/authenticate';
import { AppError } from '../core/app-error';
import { csvText } from '../core/csv-export';
import type { Database } from '../db/database';
import { suppliersByName } from '../suppliers/suppliers-repository';
import { categoryFromCell, columnErrors } from './materials-csv-messages';
import { toMaterial } from './materials-domain';
import * as repo from './materials-repository';

type Cells = Record<string, string | undefined>;
/** A valid row: its material's fields, and the existing material it matches, if any. */
interface ValidRow {
  fields: MaterialFields;
  existingId: string | null;
}

/** The `nano` cell as a boolean: yes/true, no/false or blank (no); anything else is undefined. */
function readYesNo(value: string): boolean | undefined {
  const v = value.toLowerCase();
  if (v === '' || (MATERIAL_CSV_NO as readonly string[]).includes(v)) return false;
  if ((MATERIAL_CSV_YES as readonly string[]).includes(v)) return true;
  return undefined;
}

/** Rows checked between two yields to the event loop, so other requests are answered meanwhile. */
const ROWS_PER_TURN = 250;
/** Characters of the file handed to the parser at a time. */
const PARSE_CHUNK_BYTES = 64 * 1024;
/**
 * Rows per insert statement: PostgreSQL takes at most 65,535 parameters in one, and building a
 * statement blocks the event loop, so a small one keeps other requests moving (`npm run bench`).
 */
const ROWS_PER_INSERT = 100;

/**
 * The file's header and data rows. Parsing stops after {@link MATERIAL_CSV_MAX_ROWS} rows, with
 * `more` set when another follows, so an oversized file costs no more than a full one; it pauses
 * every {@link ROWS_PER_TURN} rows so other requests are answered while a large file is read.
 */
async function readRows(text: string) {
  const source = text.replace(/^\uFEFF/, '');
  // Only the file's start: Papa splits all it is given into lines, even to read one.
  const header =
    Papa.parse<string[]>(source.slice(0, PARSE_CHUNK_BYTES), { preview: 1 }).data[0] ?? [];
  const rows: Cells[] = [];
  const problems: string[] = [];
  let more = false;
  await new Promise<void>((resolve) => {
    Papa.parse<Cells>(source, {
      header: true,
      skipEmptyLines: 'greedy',
      transformHeader: (h) => h.trim(),
      // In pieces: unchunked, Papa splits the whole text into lines before the first row.
      chunkSize: PARSE_CHUNK_BYTES,
      step: (row, parser) => {
        if (rows.length === MATERIAL_CSV_MAX_ROWS) {
          more = true;
          parser.abort();
          return;
        }
        rows.push(row.data);
        for (const e of row.errors) {
          if (e.type !== 'FieldMismatch') problems.push(`Line ${rows.length + 1}: ${e.message}`);
        }
        if (rows.length % ROWS_PER_TURN === 0) {
          parser.pause();
          setImmediate(() => parser.resume());
        }
      },
      complete: () => resolve(),
    });
  });
  return { headers: header.map((h) => h.trim()), rows, problems, more };
}

/** Problems with the file as a whole: columns, unreadable lines, size. */
function fileProblems(headers: string[], problems: string[]) {
  const fileErrors: string[] = [];
  const known = new Set<string>(MATERIAL_CSV_COLUMNS);
  for (const h of MATERIAL_CSV_REQUIRED) {
    if (!headers.includes(h)) fileErrors.push(`The file has no "${h}" column`);
  }
  for (const h of headers) {
    if (!known.has(h)) {
      fileErrors.push(
        `Unknown column "${clip(h, 100)}"; expected: ${MATERIAL_CSV_COLUMNS.join(', ')}`,
      );
    }
  }
  fileErrors.push(...parseProblems(problems));
  return fileErrors;
}

/** One row's cells as the material schema's input, and the errors found reading them. */
function rowInput(cells: Cells, supplierIds: Map<string, string>) {
  const errors: Record<string, string[]> = {};
  const cell = (k: string) => unescapeFormula((cells[k] ?? '').trim());
  const input: Record<string, unknown> = {};
  for (const k of [
    'tradeName',
    'inci',
    'usName',
    'cas',
    'ec',
    'category',
    'colourIndex',
    'notes',
  ]) {
    input[k] = cell(k);
  }
  // The screen's words ("Essential oil") name a category as well as its key.
  input['category'] = categoryFromCell(cell('category'));
  input['functions'] = cell('functions')
    .split(MATERIAL_CSV_LIST_SEPARATOR)
    .map((f) => f.trim())
    .filter(Boolean);
  const nano = readYesNo(cell('nano'));
  if (nano === undefined)
    errors['nano'] = ['Write yes or no (or true or false), or leave it blank'];
  else input['nano'] = nano;
  for (const k of MATERIAL_CSV_JSON_COLUMNS) {
    const raw = cell(k);
    if (!raw) continue;
    if (raw.length > MATERIAL_CSV_MAX_JSON_CELL) {
      errors[k] = [`This cell is too long (${MATERIAL_CSV_MAX_JSON_CELL} characters at most)`];
      continue;
    }
    try {
      input[k] = JSON.parse(raw);
    } catch {
      // SyntaxError from JSON.parse: report it on the cell instead of failing the file.
      errors[k] = ['This cell must hold JSON, as written by the export'];
    }
  }
  const supplier = cell('supplier');
  if (supplier) {
    const id = supplierIds.get(supplier.toLowerCase());
    if (id) input['supplierId'] = id;
    else {
      errors['supplier'] = [
        `No supplier named "${clip(supplier, 100)}" in this workshop; add it first`,
      ];
    }
  }
  return { input, errors, tradeName: cell('tradeName'), category: cell('category') };
}

/** What makes a row "the same material": its trade name (case and spaces folded) and supplier. */
const identityKey = (tradeName: string, supplierId: string | null) =>
  `${duplicateKey(tradeName)}\n${supplierId ?? ''}`;

/** The workshop's materials by {@link identityKey}; the first of several with one key wins. */
async function existingMaterials(db: Database, workshopId: string) {
  const byKey = new Map<string, string>();
  for (const m of await repo.materialIdentities(db, workshopId)) {
    const key = identityKey(m.tradeName, m.supplierId);
    if (!byKey.has(key)) byKey.set(key, m.id);
  }
  return byKey;
}

/**
 * Parses the CSV text and checks every row; nothing is written. A file over the row cap is
 * refused as a whole without checking its rows; the answer stays small whatever the file holds.
 */
export async function checkMaterialsCsv(db: Database, actor: AuthUser, text: string) {
  const { headers, rows: cellRows, problems, more } = await readRows(text);
  const fileErrors = fileProblems(headers, problems);
  if (more) {
    fileErrors.push(
      `The file has more than ${MATERIAL_CSV_MAX_ROWS} rows; import at most ${MATERIAL_CSV_MAX_ROWS} at a time`,
    );
    const preview: MaterialImportPreview = {
      fileErrors,
      rows: [],
      validCount: 0,
      errorCount: 0,
      existingCount: 0,
    };
    return { preview, valid: [] as ValidRow[] };
  }
  if (cellRows.length === 0) fileErrors.push('The file has no data rows');

  const supplierIds = await suppliersByName(db, actor.workshopId);
  const existing = await existingMaterials(db, actor.workshopId);
  const valid: ValidRow[] = [];
  const rows: MaterialImportRow[] = [];
  for (const [index, cells] of cellRows.entries()) {
    if (index > 0 && index % ROWS_PER_TURN === 0) await nextTurn();
    const { input, errors, tradeName, category } = rowInput(cells, supplierIds);
    const result = materialCreateSchema.safeParse(input);
    if (!result.success) {
      for (const [k, msgs] of Object.entries(columnErrors(result.error, category))) {
        (errors[k] ??= []).push(...msgs);
      }
    }
    const ok = Object.keys(errors).length === 0 && result.success;
    const existingId = ok
      ? (existing.get(identityKey(result.data.tradeName, result.data.supplierId)) ?? null)
      : null;
    if (ok) valid.push({ fields: result.data, existingId });
    rows.push({
      line: index + 2,
      tradeName: clip(tradeName, 200),
      category: clip(category, 100),
      valid: ok,
      errors: boundedErrors(errors),
      existingId,
    });
  }
  const errorCount = rows.filter((r) => !r.valid).length;
  const preview: MaterialImportPreview = {
    fileErrors,
    rows: shownRows(rows, MATERIAL_CSV_PREVIEW_ROWS),
    validCount: valid.length,
    errorCount,
    existingCount: valid.filter((r) => r.existingId !== null).length,
  };
  return { preview, valid };
}

/**
 * Imports the CSV only when the file and every row are valid, in one transaction: either all
 * rows are written or none is. A row matching an existing material (same trade name, ignoring
 * case and spaces, and same supplier) is created as a second copy, or with `existing: 'update'`
 * replaces that material's fields, as a full edit would.
 */
export async function importMaterialsCsv(
  db: Database,
  actor: AuthUser,
  text: string,
  options: MaterialImportQuery = { existing: 'create' },
) {
  const { preview, valid } = await checkMaterialsCsv(db, actor, text);
  if (preview.fileErrors.length > 0 || preview.errorCount > 0) {
    const fieldErrors: Record<string, string[]> = {};
    if (preview.fileErrors.length > 0) fieldErrors['file'] = preview.fileErrors;
    for (const row of preview.rows) {
      for (const [k, msgs] of Object.entries(row.errors))
        fieldErrors[`rows.${row.line}.${k}`] = msgs;
    }
    throw new AppError(
      400,
      'validation_failed',
      preview.errorCount > 0
        ? `${preview.errorCount} row(s) need attention; nothing was imported.`
        : 'The file cannot be imported as it stands; nothing was imported.',
      fieldErrors,
    );
  }
  const update = options.existing === 'update';
  const toUpdate = update ? valid.filter((r) => r.existingId !== null) : [];
  const toCreate = update ? valid.filter((r) => r.existingId === null) : valid;
  const ids = await db.transaction(async (tx) => {
    const created: string[] = [];
    for (let i = 0; i < toCreate.length; i += ROWS_PER_INSERT) {
      const chunk = toCreate.slice(i, i + ROWS_PER_INSERT).map((r) => r.fields);
      created.push(...(await repo.insertMaterials(tx, actor.workshopId, chunk)));
    }
    for (const [index, row] of toUpdate.entries()) {
      if (index > 0 && index % ROWS_PER_TURN === 0) await nextTurn();
      await repo.updateMaterial(tx, actor.workshopId, row.existingId!, row.fields);
    }
    // In file order: each row's new id, or the id of the material it updated.
    const next = created.values();
    return valid.map((r) => (update && r.existingId !== null ? r.existingId : next.next().value!));
  });
  return { imported: ids.length, ids, updated: toUpdate.length };
}

const json = (v: unknown) =>
  v === null || (Array.isArray(v) && v.length === 0) ? '' : JSON.stringify(v);

/** The workshop's materials as CSV text that the import reads back. */
export async function exportMaterialsCsv(db: Database, actor: AuthUser) {
  const rows = (await repo.findMaterials(db, actor.workshopId)).map(toMaterial);
  const cells = rows.map((m: Material) => ({
    tradeName: m.tradeName,
    inci: m.inci,
    usName: m.usName ?? '',
    cas: m.cas ?? '',
    ec: m.ec ?? '',
    functions: m.functions.join(`${MATERIAL_CSV_LIST_SEPARATOR} `),
    category: m.category,
    supplier: m.supplierName ?? '',
    colourIndex: m.colourIndex ?? '',
    nano: m.nano ? 'yes' : 'no',
    notes: m.notes ?? '',
    components: json(m.components),
    ifraCertificate: json(m.ifraCertificate),
    allergenDeclaration: json(m.allergenDeclaration),
    weightPerVolume: Object.keys(m.weightPerVolume).length ? JSON.stringify(m.weightPerVolume) : '',
    calibrations: json(m.calibrations),
  }));
  return csvText(MATERIAL_CSV_COLUMNS, cells);
}

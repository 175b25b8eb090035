import Papa from 'papaparse';
import {
  fieldErrorsFromZod,
  MATERIAL_CSV_COLUMNS,
  MATERIAL_CSV_JSON_COLUMNS,
  MATERIAL_CSV_LIST_SEPARATOR,
  MATERIAL_CSV_MAX_ROWS,
  MATERIAL_CSV_NO,
  MATERIAL_CSV_REQUIRED,
  MATERIAL_CSV_YES,
  materialCreateSchema,
  type Material,
  type MaterialFields,
  type MaterialImportPreview,
} from '@batchproof/shared';
import type { AuthUser } from '../auth/authenticate';
import { AppError } from '../core/app-error';
import type { Database } from '../db/database';
import { suppliersByName } from '../suppliers/suppliers-repository';
import { toMaterial } from './materials-domain';
import * as repo from './materials-repository';

type Cells = Record<string, string | undefined>;

/** The `nano` cell as a boolean: yes/true, no/false or blank (no); anything else is undefined. */
function readYesNo(value: string): boolean | undefined {
  const v = value.toLowerCase();
  if (v === '' || (MATERIAL_CSV_NO as readonly string[]).includes(v)) return false;
  if ((MATERIAL_CSV_YES as readonly string[]).includes(v)) return true;
  return undefined;
}

// Spreadsheet formula guard: export prefixes risky cells with an apostrophe; import drops it.
const unescapeFormula = (v: string) => (/^'[=+\-@\t\r]/.test(v) ? v.slice(1) : v);

/** Parses the CSV text and checks every row; nothing is written. */
export async function checkMaterialsCsv(db: Database, actor: AuthUser, text: string) {
  const parsed = Papa.parse<Cells>(text.replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (h) => h.trim(),
  });
  const fileErrors: string[] = [];
  const headers = parsed.meta.fields ?? [];
  const known = new Set<string>(MATERIAL_CSV_COLUMNS);
  for (const h of MATERIAL_CSV_REQUIRED) {
    if (!headers.includes(h)) fileErrors.push(`The file has no "${h}" column`);
  }
  for (const h of headers) {
    if (!known.has(h))
      fileErrors.push(`Unknown column "${h}"; expected: ${MATERIAL_CSV_COLUMNS.join(', ')}`);
  }
  for (const e of parsed.errors.filter((e) => e.type !== 'FieldMismatch')) {
    fileErrors.push(`Line ${(e.row ?? 0) + 2}: ${e.message}`);
  }
  if (parsed.data.length === 0) fileErrors.push('The file has no data rows');
  if (parsed.data.length > MATERIAL_CSV_MAX_ROWS) {
    fileErrors.push(`Import at most ${MATERIAL_CSV_MAX_ROWS} rows at a time`);
  }

  const supplierIds = await suppliersByName(db, actor.workshopId);
  const valid: MaterialFields[] = [];
  const rows: MaterialImportPreview['rows'] = parsed.data.map((cells, index) => {
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
      else errors['supplier'] = [`No supplier named "${supplier}" in this workshop; add it first`];
    }
    const result = materialCreateSchema.safeParse(input);
    if (!result.success) {
      for (const [k, msgs] of Object.entries(fieldErrorsFromZod(result.error))) {
        (errors[k] ??= []).push(...msgs);
      }
    }
    const ok = Object.keys(errors).length === 0 && result.success;
    if (ok) valid.push(result.data);
    return {
      line: index + 2,
      tradeName: cell('tradeName'),
      category: cell('category'),
      valid: ok,
      errors,
    };
  });
  const errorCount = rows.filter((r) => !r.valid).length;
  const preview: MaterialImportPreview = { fileErrors, rows, validCount: valid.length, errorCount };
  return { preview, valid };
}

/**
 * Imports the CSV only when the file and every row are valid, in one transaction: either all
 * materials are created or none is.
 */
export async function importMaterialsCsv(db: Database, actor: AuthUser, text: string) {
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
      `${preview.errorCount} row(s) need attention; nothing was imported.`,
      fieldErrors,
    );
  }
  const ids = await db.transaction((tx) => repo.insertMaterials(tx, actor.workshopId, valid));
  return { imported: ids.length, ids };
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
  return Papa.unparse(
    {
      fields: [...MATERIAL_CSV_COLUMNS],
      data: cells.map((c) => MATERIAL_CSV_COLUMNS.map((k) => c[k])),
    },
    { escapeFormulae: true, newline: '\r\n' },
  );
}

import * as z from 'zod';
import {
  UTF16_REFUSAL,
  boundedErrors,
  clip,
  isUtf16,
  parseProblems,
  readCsv,
  shownRows,
  unescapeFormula,
  type CsvParser,
} from '../csv/csv-import';
import { addDays, todayIso } from '../dates/calendar-day';
import { duplicateKey } from '../records/housekeeping-schema';
import { requiredText } from '../records/record-fields';
import {
  MAX_DELIVERY_LINES,
  deliveredOnSchema,
  deliveryGroupKey,
  deliveryReferenceSchema,
  deliveryUnitsSchema,
  finishedLotCodeSchema,
  repeatedLotMessage,
  unitsLeftMessage,
  type DeliveryFields,
} from './delivery-schema';

/** Columns of the deliveries CSV; an import accepts them in any order. */
export const DELIVERY_CSV_COLUMNS = [
  'delivered_on',
  'customer',
  'reference',
  'lot_code',
  'units',
] as const;
export type DeliveryCsvColumn = (typeof DELIVERY_CSV_COLUMNS)[number];
/** Columns an import file must have; without `reference`, a customer's day is one delivery. */
export const DELIVERY_CSV_REQUIRED = ['delivered_on', 'customer', 'lot_code', 'units'] as const;
/** Most rows one import takes; reading stops at the next row, however long the file. */
export const DELIVERY_CSV_MAX_ROWS = 5000;
/** Most rows (and deliveries) a preview sends back; the counts always count every one. */
export const DELIVERY_CSV_PREVIEW_ROWS = 200;

/** Case, spaces, dashes and underscores folded, so "Lot code" and "lot_code" meet. */
const fold = (text: string) =>
  text
    .trim()
    .toLowerCase()
    .replace(/[\s_-]+/g, ' ');

/** Headers an invoicing or order export may use for each column, folded. */
const HEADER_WORDS: Readonly<Record<DeliveryCsvColumn, readonly string[]>> = {
  delivered_on: ['delivered on', 'delivery date', 'date'],
  customer: ['customer', 'customer name'],
  reference: ['reference', 'invoice', 'invoice number', 'order', 'order number'],
  lot_code: ['lot code', 'lot', 'batch code', 'batch'],
  units: ['units', 'quantity', 'qty'],
};
const COLUMN_BY_HEADER = new Map<string, DeliveryCsvColumn>(
  DELIVERY_CSV_COLUMNS.flatMap((c) => HEADER_WORDS[c].map((w) => [w, c] as const)),
);

/** One data row's cells under their column names, trimmed. */
export type DeliveryCsvCells = Record<DeliveryCsvColumn, string>;

/** A file read: its problems as a whole, its rows, and the names the API must look up. */
export interface DeliveryCsvRead {
  fileErrors: string[];
  rows: { line: number; cells: DeliveryCsvCells }[];
  /** Distinct customer names (first spelling of each, case and spaces folded) and lot codes. */
  names: { customers: string[]; lotCodes: string[] };
}

/** The file's headers mapped onto the columns, and what is wrong with them. */
function mapHeaders(headers: string[]) {
  const fileErrors: string[] = [];
  const headerOf = new Map<DeliveryCsvColumn, string>();
  for (const header of headers) {
    const column = COLUMN_BY_HEADER.get(fold(header));
    if (!column) {
      fileErrors.push(
        `Unknown column "${clip(header, 100)}"; expected: ${DELIVERY_CSV_COLUMNS.join(', ')}`,
      );
    } else if (headerOf.has(column)) {
      fileErrors.push(
        `Columns "${headerOf.get(column)}" and "${clip(header, 100)}" both hold ${column}; keep one`,
      );
    } else headerOf.set(column, header);
  }
  for (const column of DELIVERY_CSV_REQUIRED) {
    if (!headerOf.has(column)) fileErrors.push(`The file has no "${column}" column`);
  }
  return { fileErrors, headerOf };
}

/**
 * Reads a deliveries CSV: refuses UTF-16, maps the headers, caps the rows. Pass papaparse
 * (`import Papa from 'papaparse'`). Nothing is checked against the workshop yet: look up
 * `names`, then call {@link checkDeliveryCsv}.
 */
export function readDeliveryCsv(text: string, parser: CsvParser): DeliveryCsvRead {
  const empty = { customers: [], lotCodes: [] };
  if (isUtf16(text)) return { fileErrors: [UTF16_REFUSAL], rows: [], names: empty };
  const table = readCsv(text, parser, DELIVERY_CSV_MAX_ROWS);
  const { fileErrors, headerOf } = mapHeaders(table.headers);
  fileErrors.push(...parseProblems(table.problems));
  if (table.more) {
    fileErrors.push(
      `The file has more than ${DELIVERY_CSV_MAX_ROWS} rows; import at most ${DELIVERY_CSV_MAX_ROWS} at a time`,
    );
    return { fileErrors, rows: [], names: empty };
  }
  if (table.rows.length === 0) fileErrors.push('The file has no data rows');
  const customers = new Map<string, string>();
  const lotCodes = new Set<string>();
  const rows = table.rows.map((raw, index) => {
    const cell = (c: DeliveryCsvColumn) => {
      const header = headerOf.get(c);
      return header === undefined ? '' : unescapeFormula((raw[header] ?? '').trim());
    };
    const cells = Object.fromEntries(
      DELIVERY_CSV_COLUMNS.map((c) => [c, cell(c)]),
    ) as DeliveryCsvCells;
    if (cells.customer && !customers.has(duplicateKey(cells.customer)))
      customers.set(duplicateKey(cells.customer), cells.customer);
    if (cells.lot_code) lotCodes.add(cells.lot_code);
    return { line: index + 2, cells };
  });
  return {
    fileErrors,
    rows,
    names: { customers: [...customers.values()], lotCodes: [...lotCodes] },
  };
}

/**
 * How the API answers the names: the workshop's customer of that name (matched with
 * `duplicateKey`) and its finished lot of that code (as written: lot codes are case-sensitive),
 * or null when there is none.
 */
export interface DeliveryCsvResolver {
  customerId(name: string): string | null;
  finishedLotId(lotCode: string): string | null;
  /**
   * Units of the finished lot not yet on any delivery (units made less units delivered), or null
   * when its units made is not known. Rows past it, counted in file order, are refused.
   */
  unitsLeft?(finishedLotId: string): number | null;
}

/** One data row of an import file, checked. */
export const deliveryImportRowSchema = z.object({
  /** Line of the file the row is on (the header is line 1). */
  line: z.number().int(),
  deliveredOn: z.string(),
  customer: z.string(),
  reference: z.string(),
  lotCode: z.string(),
  units: z.string(),
  /** Which delivery of `deliveries` the row falls in (0-based), when its key is readable. */
  delivery: z.number().int().nullable(),
  valid: z.boolean(),
  /** Messages per column, e.g. `{ units: ['Units must be at least 1'] }`. */
  errors: z.record(z.string(), z.array(z.string())),
});
export type DeliveryImportRow = z.infer<typeof deliveryImportRowSchema>;

/** One delivery the file would make. */
export const deliveryImportGroupSchema = z.object({
  customer: z.string(),
  deliveredOn: z.string(),
  reference: z.string().nullable(),
  /** File lines of its rows. */
  lines: z.array(z.number().int()),
  totalUnits: z.number().int(),
});
export type DeliveryImportGroup = z.infer<typeof deliveryImportGroupSchema>;

/** What `POST /api/deliveries/import/preview` answers. */
export const deliveryImportPreviewSchema = z.object({
  /** Problems with the file as a whole (UTF-16, missing or unknown columns, unreadable lines). */
  fileErrors: z.array(z.string()),
  /** Up to {@link DELIVERY_CSV_PREVIEW_ROWS} rows, those needing attention first. */
  rows: z.array(deliveryImportRowSchema),
  rowCount: z.number().int(),
  validCount: z.number().int(),
  errorCount: z.number().int(),
  /** Up to {@link DELIVERY_CSV_PREVIEW_ROWS} of the deliveries, in file order. */
  deliveries: z.array(deliveryImportGroupSchema),
  deliveryCount: z.number().int(),
  /** All or nothing: true only when the file and every row are fine. */
  commitable: z.boolean(),
});
export type DeliveryImportPreview = z.infer<typeof deliveryImportPreviewSchema>;

/** What a successful `POST /api/deliveries/import` answers. */
export const deliveryImportResultSchema = z.object({
  /** Deliveries written. */
  imported: z.number().int(),
  /** Their ids, in file order. */
  ids: z.array(z.string()),
});
export type DeliveryImportResult = z.infer<typeof deliveryImportResultSchema>;

const customerCell = requiredText('Customer');

/** A schema's first messages for a cell, or none. */
function cellErrors<T>(schema: z.ZodType<T>, value: unknown) {
  const result = schema.safeParse(value);
  return result.success
    ? { value: result.data, errors: [] }
    : { value: undefined, errors: [...new Set(result.error.issues.map((i) => i.message))] };
}

/** The units cell as a number for the schema: blank is "not given", other text is not a number. */
const unitsValue = (cell: string) => (cell === '' ? undefined : Number(cell));

/** A row's checked values and its problems by column. */
function checkRow(cells: DeliveryCsvCells, resolve: DeliveryCsvResolver, latest: string) {
  const errors: Record<string, string[]> = {};
  const put = (column: DeliveryCsvColumn, messages: string[]) => {
    if (messages.length > 0) (errors[column] ??= []).push(...messages);
  };
  const day = cellErrors(
    deliveredOnSchema(() => latest),
    cells.delivered_on,
  );
  put('delivered_on', day.errors);
  const customer = cellErrors(customerCell, cells.customer);
  put('customer', customer.errors);
  const customerId = customer.value === undefined ? null : resolve.customerId(customer.value);
  if (customer.value !== undefined && customerId === null)
    put('customer', [
      `No customer named "${clip(customer.value, 100)}" in this workshop; add it first`,
    ]);
  const reference = cellErrors(deliveryReferenceSchema, cells.reference);
  put('reference', reference.errors);
  const lot = cellErrors(finishedLotCodeSchema, cells.lot_code);
  put('lot_code', lot.errors);
  const finishedLotId = lot.value === undefined ? null : resolve.finishedLotId(lot.value);
  if (lot.value !== undefined && finishedLotId === null)
    put('lot_code', [`No finished lot with the code "${clip(lot.value, 40)}" in this workshop`]);
  const units =
    cells.units === ''
      ? { value: undefined, errors: ['Enter the units delivered'] }
      : cellErrors(deliveryUnitsSchema, unitsValue(cells.units));
  put('units', units.errors);
  const key =
    day.value !== undefined && customer.value !== undefined && reference.value !== undefined
      ? deliveryGroupKey(customer.value, day.value, reference.value)
      : null;
  return { errors, key, customerId, finishedLotId, day, customer, reference, lot, units };
}

/** A delivery being gathered from the rows that share its key. */
interface Gathering {
  group: DeliveryImportGroup;
  fields: DeliveryFields;
  lineOfLot: Map<string, number>;
}

/**
 * Checks every row of a read file against the workshop (through `resolve`) and gathers rows into
 * deliveries by customer, day and reference. `deliveries` holds the deliveries to write, as the
 * delivery contract's fields, only when the preview is `commitable`. `today` is the UTC calendar
 * day (a day later is still accepted, as for goods-in).
 */
export function checkDeliveryCsv(
  read: DeliveryCsvRead,
  resolve: DeliveryCsvResolver,
  { today = todayIso() }: { today?: string } = {},
) {
  const latest = addDays(today, 1);
  const byKey = new Map<string, Gathering>();
  const gatherings: Gathering[] = [];
  const rows: DeliveryImportRow[] = [];
  const unitsTaken = new Map<string, number>();
  for (const { line, cells } of read.rows) {
    const row = checkRow(cells, resolve, latest);
    const left =
      row.finishedLotId === null ? null : (resolve.unitsLeft?.(row.finishedLotId) ?? null);
    if (left !== null && row.units.value !== undefined) {
      const taken = unitsTaken.get(row.finishedLotId!) ?? 0;
      unitsTaken.set(row.finishedLotId!, taken + row.units.value);
      if (taken + row.units.value > left)
        (row.errors['units'] ??= []).push(unitsLeftMessage(row.lot.value!, left - taken));
    }
    let delivery: number | null = null;
    if (row.key !== null) {
      let gathering = byKey.get(row.key);
      if (!gathering) {
        gathering = {
          group: {
            customer: row.customer.value!,
            deliveredOn: row.day.value!,
            reference: row.reference.value!,
            lines: [],
            totalUnits: 0,
          },
          fields: {
            customerId: row.customerId ?? '',
            deliveredOn: row.day.value!,
            reference: row.reference.value!,
            lines: [],
            notes: null,
          },
          lineOfLot: new Map(),
        };
        byKey.set(row.key, gathering);
        gatherings.push(gathering);
      }
      delivery = gatherings.indexOf(gathering);
      const lotCode = row.lot.value;
      const earlier = lotCode === undefined ? undefined : gathering.lineOfLot.get(lotCode);
      if (earlier !== undefined)
        (row.errors['lot_code'] ??= []).push(
          `${repeatedLotMessage(lotCode!)} (it is on line ${earlier} too)`,
        );
      else if (lotCode !== undefined) gathering.lineOfLot.set(lotCode, line);
      gathering.group.lines.push(line);
      if (gathering.group.lines.length > MAX_DELIVERY_LINES)
        (row.errors['reference'] ??= []).push(
          `A delivery has at most ${MAX_DELIVERY_LINES} lines; give the rest another reference`,
        );
      if (row.units.value !== undefined) gathering.group.totalUnits += row.units.value;
      if (lotCode !== undefined && row.units.value !== undefined)
        gathering.fields.lines.push({ lotCode, units: row.units.value });
    }
    const valid = Object.keys(row.errors).length === 0;
    rows.push({
      line,
      deliveredOn: clip(cells.delivered_on, 40),
      customer: clip(cells.customer, 200),
      reference: clip(cells.reference, 100),
      lotCode: clip(cells.lot_code, 40),
      units: clip(cells.units, 20),
      delivery,
      valid,
      errors: boundedErrors(row.errors),
    });
  }
  const errorCount = rows.filter((r) => !r.valid).length;
  const commitable = read.fileErrors.length === 0 && errorCount === 0 && rows.length > 0;
  const preview: DeliveryImportPreview = {
    fileErrors: read.fileErrors,
    rows: shownRows(rows, DELIVERY_CSV_PREVIEW_ROWS),
    rowCount: rows.length,
    validCount: rows.length - errorCount,
    errorCount,
    deliveries: gatherings.slice(0, DELIVERY_CSV_PREVIEW_ROWS).map((g) => g.group),
    deliveryCount: gatherings.length,
    commitable,
  };
  return { preview, deliveries: commitable ? gatherings.map((g) => g.fields) : [] };
}

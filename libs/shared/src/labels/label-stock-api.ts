import * as z from 'zod';
import { archivedAtField, includeArchivedSchema } from '../records/housekeeping-schema';
import { isStorableText } from '../records/record-fields';
import { labelStockSchema, sheetLabelStockSchema, rollLabelStockSchema } from './label-stock';

/**
 * The label stock routes' contract (`/api/label-stocks`). A workshop's own stock is the shared
 * geometry ({@link labelStockSchema}) plus a record id; a built-in stock is answered in the same
 * shape, with its key as its id, and cannot be changed.
 */

/**
 * What the owner or formulator sends to create or replace a stock: the geometry, every check
 * naming the field at fault, and a name PostgreSQL can store.
 */
export const labelStockCreateSchema = labelStockSchema.superRefine((stock, ctx) => {
  if (!isStorableText(stock.name)) {
    ctx.addIssue({
      code: 'custom',
      path: ['name'],
      message:
        'The name contains a character that cannot be stored (a NUL or a broken Unicode character)',
    });
  }
});
/** A stock as a form sends it. */
export type LabelStockCreate = z.input<typeof labelStockCreateSchema>;
/** Full replacement of a stock (PUT). */
export const labelStockUpdateSchema = labelStockCreateSchema;
export type LabelStockUpdate = z.input<typeof labelStockUpdateSchema>;

/** A stored or built-in stock's geometry as answered (already checked on the way in). */
const answeredStockSchema = z.discriminatedUnion('kind', [
  sheetLabelStockSchema,
  rollLabelStockSchema,
]);

/** A label stock as the API answers it. */
export const labelStockRecordSchema = z.object({
  /** The record id of a workshop's own stock; the key of a built-in one. */
  id: z.string(),
  /** Built in: every workshop has it, nobody can change it. */
  builtIn: z.boolean(),
  /** A built-in stock's stable key (equal to its id); null for a workshop's own. */
  key: z.string().nullable(),
  /** The geometry, ready for `labelPositions` and `calibrationPage`. */
  stock: answeredStockSchema,
  archivedAt: archivedAtField,
  /** Null for a built-in stock. */
  createdAt: z.string().nullable(),
  updatedAt: z.string().nullable(),
});
export type LabelStockRecord = z.infer<typeof labelStockRecordSchema>;

/** `GET /api/label-stocks`: the built-in stocks first, then the workshop's own by name. */
export const labelStockListSchema = z.object({ items: z.array(labelStockRecordSchema) });
export type LabelStockList = z.infer<typeof labelStockListSchema>;

/** Query of `GET /api/label-stocks`: archived stocks of the workshop only when asked for. */
export const labelStockListQuerySchema = z.object({ includeArchived: includeArchivedSchema });
export type LabelStockListQuery = z.output<typeof labelStockListQuerySchema>;

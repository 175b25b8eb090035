import { boolean, date, index, pgEnum, pgTable, text, uuid } from 'drizzle-orm/pg-core';
import { COMPLAINT_STATUSES } from '@batchproof/shared';
import { id, timestamps, workshopKey, workshopReference } from './columns';
import { batches } from './batches';
import { formulas } from './formulas';
import { members } from './users';
import { workshops } from './workshops';

export const complaintStatusEnum = pgEnum('complaint_status', COMPLAINT_STATUSES);

/** A complaint or adverse event about a product (and batch, when known). */
export const complaints = pgTable(
  'complaints',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    formulaId: uuid().notNull(),
    batchId: uuid(),
    finishedLotCode: text(),
    receivedOn: date({ mode: 'string' }).notNull(),
    reporterName: text(),
    reporterContact: text(),
    whatHappened: text().notNull(),
    bodyArea: text(),
    serious: boolean().notNull(),
    status: complaintStatusEnum().notNull().default('open'),
    followUpNotes: text(),
    reportedToFdaOn: date({ mode: 'string' }),
    createdBy: uuid(),
    ...timestamps,
  },
  (t) => [
    index('complaints_workshop_received_idx').on(t.workshopId, t.receivedOn, t.id),
    index('complaints_workshop_open_idx').on(t.workshopId, t.status, t.serious),
    index('complaints_batch_idx').on(t.workshopId, t.batchId),
    workshopKey('complaints', t),
    workshopReference(
      'complaints_formula_fk',
      { workshopId: t.workshopId, column: t.formulaId },
      formulas,
      'restrict',
    ),
    workshopReference(
      'complaints_batch_fk',
      { workshopId: t.workshopId, column: t.batchId },
      batches,
      'set null',
    ),
    workshopReference(
      'complaints_created_by_fk',
      { workshopId: t.workshopId, column: t.createdBy },
      members,
      'set null',
    ),
  ],
);

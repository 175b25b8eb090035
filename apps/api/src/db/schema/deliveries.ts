import {
  boolean,
  date,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import {
  CUSTOMER_KINDS,
  RECALL_NOTICE_STATUSES,
  RECALL_SEVERITIES,
  type RecallAffectedCustomer,
  type RecallDrillReport,
  type RecallScope,
} from '@batchproof/shared';
import { archivedAt, id, timestamps, workshopKey, workshopReference } from './columns';
import { batches } from './batches';
import { lots } from './lots';
import { members } from './users';
import { workshops } from './workshops';

export const customerKindEnum = pgEnum('customer_kind', CUSTOMER_KINDS);

/** Who the workshop sells to: stockists, market stalls, online orders. */
export const customers = pgTable(
  'customers',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    kind: customerKindEnum().notNull(),
    name: text().notNull(),
    contact: text(),
    email: text(),
    phone: text(),
    address: text(),
    notes: text(),
    archivedAt: archivedAt(),
    ...timestamps,
  },
  (t) => [
    index('customers_workshop_name_idx').on(t.workshopId, t.name, t.id),
    index('customers_workshop_created_idx').on(t.workshopId, t.createdAt, t.id),
    workshopKey('customers', t),
  ],
);

/** Finished lots that left the workshop for one customer on one day. */
export const deliveries = pgTable(
  'deliveries',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    customerId: uuid().notNull(),
    deliveredOn: date({ mode: 'string' }).notNull(),
    reference: text(),
    notes: text(),
    createdBy: uuid(),
    ...timestamps,
  },
  (t) => [
    index('deliveries_workshop_delivered_idx').on(t.workshopId, t.deliveredOn, t.id),
    index('deliveries_customer_idx').on(t.workshopId, t.customerId, t.deliveredOn),
    workshopKey('deliveries', t),
    workshopReference(
      'deliveries_customer_fk',
      { workshopId: t.workshopId, column: t.customerId },
      customers,
      'restrict',
    ),
    workshopReference(
      'deliveries_created_by_fk',
      { workshopId: t.workshopId, column: t.createdBy },
      members,
      'set null',
    ),
  ],
);

/** One finished lot (a released batch) and the units of it on a delivery. */
export const deliveryLines = pgTable(
  'delivery_lines',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    deliveryId: uuid().notNull(),
    position: integer().notNull(),
    batchId: uuid().notNull(),
    units: integer().notNull(),
    ...timestamps,
  },
  (t) => [
    uniqueIndex('delivery_lines_position_key').on(t.deliveryId, t.position),
    index('delivery_lines_batch_idx').on(t.batchId, t.deliveryId),
    workshopKey('delivery_lines', t),
    workshopReference(
      'delivery_lines_delivery_fk',
      { workshopId: t.workshopId, column: t.deliveryId },
      deliveries,
      'cascade',
    ),
    workshopReference(
      'delivery_lines_batch_fk',
      { workshopId: t.workshopId, column: t.batchId },
      batches,
      'restrict',
    ),
  ],
);

export const recallSeverityEnum = pgEnum('recall_severity', RECALL_SEVERITIES);
export const recallStateEnum = pgEnum('recall_state', ['open', 'closed']);
export const recallNoticeStatusEnum = pgEnum('recall_notice_status', RECALL_NOTICE_STATUSES);

/**
 * A recall case (or a drill): its scope, and the affected customers and lots as traced when it was
 * opened, kept as they were so the record shows what was known and done.
 */
export const recalls = pgTable(
  'recalls',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    scope: jsonb().$type<RecallScope>().notNull(),
    /** The supplier lot of a supplier-lot scope, for lookups from the lot. */
    supplierLotId: uuid(),
    reason: text().notNull(),
    severity: recallSeverityEnum().notNull(),
    drill: boolean().notNull().default(false),
    state: recallStateEnum().notNull().default('open'),
    whatToDo: text(),
    batchCodes: jsonb().$type<string[]>().notNull(),
    affected: jsonb().$type<RecallAffectedCustomer[]>().notNull(),
    drillReport: jsonb().$type<RecallDrillReport>(),
    summary: text(),
    openedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    openedBy: uuid(),
    closedAt: timestamp({ withTimezone: true }),
    closedBy: uuid(),
    ...timestamps,
  },
  (t) => [
    index('recalls_workshop_state_idx').on(t.workshopId, t.state, t.openedAt),
    index('recalls_workshop_opened_idx').on(t.workshopId, t.openedAt, t.id),
    workshopKey('recalls', t),
    workshopReference(
      'recalls_supplier_lot_fk',
      { workshopId: t.workshopId, column: t.supplierLotId },
      lots,
      'restrict',
    ),
    workshopReference(
      'recalls_opened_by_fk',
      { workshopId: t.workshopId, column: t.openedBy },
      members,
      'set null',
    ),
    workshopReference(
      'recalls_closed_by_fk',
      { workshopId: t.workshopId, column: t.closedBy },
      members,
      'set null',
    ),
  ],
);

/** A recall notice to one customer: sent through the mailer, or written only (a drill). */
export const recallNotices = pgTable(
  'recall_notices',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    recallId: uuid().notNull(),
    customerId: uuid().notNull(),
    to: text().notNull(),
    subject: text().notNull(),
    body: text().notNull(),
    status: recallNoticeStatusEnum().notNull().default('not-sent'),
    sentAt: timestamp({ withTimezone: true }),
    failure: text(),
    ...timestamps,
  },
  (t) => [
    uniqueIndex('recall_notices_customer_key').on(t.recallId, t.customerId),
    workshopKey('recall_notices', t),
    workshopReference(
      'recall_notices_recall_fk',
      { workshopId: t.workshopId, column: t.recallId },
      recalls,
      'cascade',
    ),
    workshopReference(
      'recall_notices_customer_fk',
      { workshopId: t.workshopId, column: t.customerId },
      customers,
      'restrict',
    ),
  ],
);

/** A customer's answer to a recall: units still on hand and units sent back. */
export const recallReplies = pgTable(
  'recall_replies',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    recallId: uuid().notNull(),
    customerId: uuid().notNull(),
    repliedOn: date({ mode: 'string' }).notNull(),
    unitsOnHand: integer().notNull(),
    unitsReturned: integer().notNull(),
    notes: text(),
    createdBy: uuid(),
    ...timestamps,
  },
  (t) => [
    index('recall_replies_recall_idx').on(t.recallId, t.createdAt),
    workshopKey('recall_replies', t),
    workshopReference(
      'recall_replies_recall_fk',
      { workshopId: t.workshopId, column: t.recallId },
      recalls,
      'cascade',
    ),
    workshopReference(
      'recall_replies_customer_fk',
      { workshopId: t.workshopId, column: t.customerId },
      customers,
      'restrict',
    ),
    workshopReference(
      'recall_replies_created_by_fk',
      { workshopId: t.workshopId, column: t.createdBy },
      members,
      'set null',
    ),
  ],
);

import {
  retainUntil,
  seriousAdverseEventClock,
  type Complaint,
  type ComplaintFields,
  type ComplaintListQuery,
  type ComplaintPage,
} from '@batchproof/shared';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { AppError, notFound } from '../core/app-error';
import { withIsoDates } from '../core/list-paging';
import type { Database } from '../db/database';
import * as repo from './complaints-repository';

type Row = NonNullable<Awaited<ReturnType<typeof repo.findComplaint>>>;

/**
 * A complaint as the API answers it, with its US reporting clock (serious, and the product sold
 * in the US) and how long its record is kept (products sold in the US), as of `today`.
 */
function toComplaint(row: Row, today: string, smallBusiness: boolean): Complaint {
  const { soldInUs, ...fields } = withIsoDates(row);
  return {
    ...fields,
    usReportingClock:
      soldInUs && row.serious
        ? seriousAdverseEventClock({
            receivedOn: row.receivedOn,
            today,
            reportedOn: row.reportedToFdaOn,
          })
        : null,
    // Counted from the record's latest entry, as adverse-event-clock.ts explains.
    retention: soldInUs
      ? retainUntil({ recordedOn: fields.updatedAt.slice(0, 10), smallBusiness })
      : null,
  };
}

/** A page of the caller's workshop's complaints. */
export async function listComplaints(
  db: Database,
  actor: AuthUser,
  q: ComplaintListQuery,
  today: string,
): Promise<ComplaintPage> {
  const [{ items, total }, small] = await Promise.all([
    repo.pageComplaints(db, actor.workshopId, q),
    repo.isSmallBusiness(db, actor.workshopId),
  ]);
  return {
    items: items.map((row) => toComplaint(row, today, small)),
    total,
    page: q.page,
    pageSize: q.pageSize,
  };
}

/** One complaint of the caller's workshop; 404 for any other. */
export async function getComplaint(
  db: Database,
  actor: AuthUser,
  id: string,
  today: string,
): Promise<Complaint> {
  const row = await repo.findComplaint(db, actor.workshopId, id);
  if (!row) throw notFound('That complaint');
  return toComplaint(row, today, await repo.isSmallBusiness(db, actor.workshopId));
}

/** Refuses a product of another workshop, or a batch that is not of that product. */
async function checkProductAndBatch(db: Database, workshopId: string, input: ComplaintFields) {
  const fieldErrors: Record<string, string[]> = {};
  if (!(await repo.formulaExists(db, workshopId, input.formulaId))) {
    fieldErrors.formulaId = ['Choose one of this workshop’s products'];
  } else if (input.batchId) {
    const formulaId = await repo.batchFormula(db, workshopId, input.batchId);
    if (formulaId !== input.formulaId) {
      fieldErrors.batchId = ['Choose a batch of this product'];
    }
  }
  if (Object.keys(fieldErrors).length > 0) {
    throw new AppError(400, 'validation_failed', 'Some fields need attention.', fieldErrors);
  }
}

/** Logs a complaint, and its audit entry in the same transaction. */
export async function createComplaint(
  db: Database,
  actor: AuthUser,
  input: ComplaintFields,
  today: string,
) {
  return db.transaction(async (tx) => {
    await checkProductAndBatch(tx, actor.workshopId, input);
    const id = await repo.insertComplaint(tx, actor.workshopId, actor.id, input);
    const complaint = await getComplaint(tx, actor, id, today);
    await recordAudit(tx, actor, {
      action: 'complaint.created',
      subjectType: 'complaint',
      subjectId: id,
      detail: {
        productName: complaint.productName,
        batchCode: complaint.batchCode,
        receivedOn: input.receivedOn,
        serious: input.serious,
      },
    });
    return complaint;
  });
}

const FIELDS = [
  'formulaId',
  'batchId',
  'finishedLotCode',
  'receivedOn',
  'reporterName',
  'reporterContact',
  'whatHappened',
  'bodyArea',
  'serious',
  'status',
  'followUpNotes',
  'reportedToFdaOn',
] as const satisfies readonly (keyof ComplaintFields)[];

/**
 * Replaces a complaint's fields. The audit entry names the fields changed, with the before and
 * after of the ones that move the reporting clock (serious, received, reported, status).
 */
export async function updateComplaint(
  db: Database,
  actor: AuthUser,
  id: string,
  input: ComplaintFields,
  today: string,
) {
  return db.transaction(async (tx) => {
    const before = await repo.findComplaint(tx, actor.workshopId, id);
    if (!before) throw notFound('That complaint');
    await checkProductAndBatch(tx, actor.workshopId, input);
    await repo.updateComplaint(tx, actor.workshopId, id, input);
    const changed = FIELDS.filter((f) => before[f] !== input[f]);
    const tracked = (['serious', 'receivedOn', 'reportedToFdaOn', 'status'] as const).filter((f) =>
      changed.includes(f),
    );
    await recordAudit(tx, actor, {
      action: 'complaint.changed',
      subjectType: 'complaint',
      subjectId: id,
      detail: {
        changed,
        ...Object.fromEntries(tracked.map((f) => [f, { from: before[f], to: input[f] }])),
      },
    });
    return getComplaint(tx, actor, id, today);
  });
}

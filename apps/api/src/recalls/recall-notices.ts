import {
  recallNoticeText,
  type Recall,
  type RecallAffectedCustomer,
  type RecallNoticeStatus,
} from '@batchproof/shared';
import type { AuthUser } from '../auth/authenticate';
import { recordAudit } from '../audit/audit-log';
import type { Database } from '../db/database';
import type { Mailer } from '../mail/mailer';
import { getRecall, openRecallForChange } from './recalls-domain';
import * as repo from './recalls-repository';

/** Why a customer gets no e-mail, and how to reach them instead. */
export function noEmailNote(customer: Pick<RecallAffectedCustomer, 'phone'>): string {
  return customer.phone
    ? `No e-mail address: call ${customer.phone}`
    : 'No e-mail address or phone number: reach them another way';
}

/** The notice for one customer, naming only the lots they received. */
function noticeFor(
  recall: repo.RecallRow['recall'],
  customer: RecallAffectedCustomer,
  workshopName: string,
  actor: AuthUser,
  whatToDo: string | null,
) {
  const products = [...new Set(customer.lots.map((l) => l.productName ?? ''))].filter(Boolean);
  return recallNoticeText({
    workshopName,
    productName: products.join(' and '),
    batchCodes: customer.lots.map((l) => l.lotCode),
    reason: recall.reason,
    whatToDo,
    contact: { person: actor.name, email: actor.email },
    customerName: customer.customerName,
  });
}

/**
 * Writes one notice per affected customer and e-mails it. A customer with no e-mail gets a
 * `not-sent` notice saying to call them; a mail the server refuses is `failed` with the reason,
 * and the others still go. Sending again only retries the failed ones, so nobody gets the same
 * notice twice. A drill writes its notices as `drill` and sends nothing.
 *
 * The recall row stays locked while the mails go out, so two sends at once cannot both mail the
 * same customer; a recall reaches tens of customers, not thousands.
 */
export async function sendNotices(
  db: Database,
  mailer: Mailer,
  actor: AuthUser,
  id: string,
  input: { whatToDo: string | null },
): Promise<Recall> {
  return db.transaction(async (tx) => {
    const { recall } = await openRecallForChange(tx, actor, id);
    const done = new Map(
      (await repo.noticesOf(tx, id)).map((n) => [n.customerId, n.status] as const),
    );
    const whatToDo = input.whatToDo ?? recall.whatToDo;
    if (whatToDo !== recall.whatToDo) await repo.setWhatToDo(tx, id, whatToDo);
    const workshopName = await repo.workshopName(tx, actor.workshopId);
    const counts: Record<RecallNoticeStatus, number> = {
      sent: 0,
      failed: 0,
      'not-sent': 0,
      drill: 0,
    };
    for (const customer of recall.affected) {
      const before = done.get(customer.customerId);
      if (before !== undefined && before !== 'failed') continue;
      const text = noticeFor(recall, customer, workshopName, actor, whatToDo);
      const status: RecallNoticeStatus = recall.drill ? 'drill' : 'not-sent';
      const noticeId = await repo.saveNotice(tx, {
        workshopId: actor.workshopId,
        recallId: id,
        customerId: customer.customerId,
        to: customer.email ?? '',
        subject: text.subject,
        body: text.body,
        status,
        failure: customer.email ? null : noEmailNote(customer),
      });
      if (recall.drill || !customer.email) {
        counts[status] += 1;
        continue;
      }
      try {
        await mailer.send({ to: customer.email, subject: text.subject, text: text.body });
        await repo.markNotice(tx, noticeId, { status: 'sent', failure: null });
        counts.sent += 1;
      } catch (error) {
        // Any refusal or connection failure of the mail server: recorded, and the rest still go.
        const reason = error instanceof Error ? error.message : String(error);
        await repo.markNotice(tx, noticeId, {
          status: 'failed',
          failure: `The mail server did not take it: ${reason}`,
        });
        counts.failed += 1;
      }
    }
    await recordAudit(tx, actor, {
      action: recall.drill ? 'recall.drill-notices-written' : 'recall.notices-sent',
      subjectType: 'recall',
      subjectId: id,
      detail: counts,
    });
    return getRecall(tx, actor, id);
  });
}

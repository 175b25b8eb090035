import {
  addDays,
  ATTENTION_EXPIRY_DAYS,
  ATTENTION_LOW_STOCK_FRACTION,
  ATTENTION_ROWS_PER_KIND,
  daysBetween,
  documentStatusEntries,
  expectedDocumentKinds,
  MATERIAL_CATEGORIES,
  ROLE_SETS,
  seriousAdverseEventClock,
  todayIso,
  type Attention,
  type AttentionItem,
  type AttentionKind,
  type LotUnit,
  type Role,
} from '@batchproof/shared';
import type { AuthUser } from '../auth/authenticate';
import type { Database } from '../db/database';
import { listPendingInvitations } from '../members/members-repository';
import { releasedWithoutAssessment } from '../readiness/readiness-repository';
import * as repo from './attention-repository';

/** The rows of one kind the caller is shown, and how many there are in all. */
interface Collected {
  items: AttentionItem[];
  total: number;
}

/** One kind of attention item: who may see it and how it is found. */
interface Collector {
  kind: AttentionKind;
  /** The roles that can open the records this kind links to. */
  roles: readonly Role[];
  collect(db: Database, workshopId: string, today: string): Promise<Collected>;
}

const limit = ATTENTION_ROWS_PER_KIND;

/** Rows of a query that counted its matches before the LIMIT, as items of one kind. */
function counted<R extends { matched: number }>(
  rows: R[],
  item: (row: Omit<R, 'matched'>) => AttentionItem,
): Collected {
  return {
    total: rows[0]?.matched ?? 0,
    items: rows.map(({ matched: _matched, ...row }) => item(row)),
  };
}

/** Every kind the home page lists, most pressing first. A new kind is one more entry here. */
const COLLECTORS: readonly Collector[] = [
  {
    kind: 'complaint-clock',
    roles: ROLE_SETS.members,
    async collect(db, workshopId, today) {
      const rows = await repo.unreportedSeriousComplaints(db, workshopId, limit);
      return counted(rows, (row) => {
        const clock = seriousAdverseEventClock({ receivedOn: row.receivedOn, today });
        return {
          kind: 'complaint-clock',
          ...row,
          dueOn: clock.dueOn,
          businessDaysLeft: clock.businessDaysLeft!,
          // Nothing reported, so the clock is running or overdue.
          state: clock.state as 'running' | 'overdue',
        };
      });
    },
  },
  {
    kind: 'recall-open',
    roles: ROLE_SETS.members,
    async collect(db, workshopId) {
      const rows = await repo.openRecalls(db, workshopId, limit);
      return counted(rows, (row) => ({
        kind: 'recall-open',
        ...row,
        openedAt: row.openedAt.toISOString(),
      }));
    },
  },
  {
    kind: 'formula-blocked',
    roles: ROLE_SETS.members,
    async collect(db, workshopId) {
      const rows = await repo.blockedVersions(db, workshopId, limit);
      return {
        total: rows[0]?.matched ?? 0,
        items: rows.map(({ matched: _matched, state, blockCount, ...row }) => ({
          kind: 'formula-blocked',
          ...row,
          // The query keeps only draft and released versions with a block count above zero.
          state: state as 'draft' | 'released',
          blockCount: blockCount ?? 0,
        })),
      };
    },
  },
  {
    kind: 'lot-expiring',
    roles: ROLE_SETS.members,
    async collect(db, workshopId, today) {
      const cutoff = addDays(today, ATTENTION_EXPIRY_DAYS);
      const rows = await repo.expiringLotsWithStock(db, workshopId, cutoff, limit);
      return {
        total: rows[0]?.matched ?? 0,
        items: rows.map(({ matched: _matched, expiresOn, ...row }) => ({
          kind: 'lot-expiring',
          ...row,
          // The query keeps only lots with an expiry date.
          expiresOn: expiresOn!,
          daysLeft: daysBetween(today, expiresOn!),
        })),
      };
    },
  },
  {
    kind: 'material-documents',
    roles: ROLE_SETS.members,
    async collect(db, workshopId, today) {
      const kinds = [...new Set(MATERIAL_CATEGORIES.flatMap(expectedDocumentKinds))];
      const [materials, docs] = await Promise.all([
        repo.materialsByName(db, workshopId),
        repo.newestMaterialDocuments(db, workshopId, kinds),
      ]);
      const docsOf = new Map<string | null, typeof docs>();
      for (const d of docs) docsOf.set(d.materialId, [...(docsOf.get(d.materialId) ?? []), d]);
      const items: AttentionItem[] = [];
      for (const m of materials) {
        const pending = documentStatusEntries(m.category, docsOf.get(m.id) ?? [], today).flatMap(
          ({ kind, state, message }) => (state === 'current' ? [] : [{ kind, state, message }]),
        );
        if (pending.length > 0) {
          items.push({
            kind: 'material-documents',
            materialId: m.id,
            materialName: m.tradeName,
            documents: pending,
          });
        }
      }
      return { items: items.slice(0, limit), total: items.length };
    },
  },
  {
    kind: 'lot-low-stock',
    roles: ROLE_SETS.members,
    async collect(db, workshopId) {
      const rows = await repo.lowStockLots(db, workshopId, ATTENTION_LOW_STOCK_FRACTION, limit);
      return counted(rows, (row) => ({
        kind: 'lot-low-stock',
        ...row,
        unit: row.unit as LotUnit,
      }));
    },
  },
  {
    kind: 'batch-awaiting-release',
    roles: ROLE_SETS.members,
    async collect(db, workshopId) {
      const rows = await repo.draftBatches(db, workshopId, limit);
      return counted(rows, ({ readyOn: _readyOn, ...row }) => ({
        kind: 'batch-awaiting-release',
        ...row,
      }));
    },
  },
  {
    kind: 'batch-curing',
    roles: ROLE_SETS.members,
    async collect(db, workshopId, today) {
      const rows = await repo.curingBatches(db, workshopId, today, limit);
      return counted(rows, ({ madeOn: _madeOn, readyOn, ...row }) => ({
        kind: 'batch-curing',
        ...row,
        // The query keeps only batches with a ready day after today.
        readyOn: readyOn!,
        daysLeft: daysBetween(today, readyOn!),
      }));
    },
  },
  {
    kind: 'labels-out-of-date',
    roles: ROLE_SETS.members,
    async collect(db, workshopId) {
      const rows = await repo.formulasWithOutOfDateLabels(db, workshopId, limit);
      return {
        total: rows[0]?.matched ?? 0,
        items: rows.map(({ matched: _matched, ...row }) => ({
          kind: 'labels-out-of-date',
          ...row,
        })),
      };
    },
  },
  {
    kind: 'assessment-missing',
    roles: ROLE_SETS.members,
    async collect(db, workshopId) {
      const rows = await releasedWithoutAssessment(db, workshopId, limit);
      return counted(rows, (row) => ({
        kind: 'assessment-missing',
        ...row,
        // The query keeps only the version's EU and UK markets.
        markets: row.markets as ('EU' | 'UK')[],
      }));
    },
  },
  {
    kind: 'invitation-pending',
    roles: ROLE_SETS.ownerOnly,
    async collect(db, workshopId) {
      const rows = await listPendingInvitations(db, workshopId);
      return {
        total: rows.length,
        items: rows.slice(0, limit).map((i) => ({
          kind: 'invitation-pending',
          invitationId: i.id,
          email: i.email,
          role: i.role,
          expiresAt: i.expiresAt.toISOString(),
        })),
      };
    },
  },
];

/**
 * What needs attention in the caller's workshop on `now`'s day, limited to the kinds the caller's
 * role can open (an assessor sees none; only owners see invitations), with the workshop's
 * progress for the getting-started steps.
 */
export async function attention(db: Database, actor: AuthUser, now: Date): Promise<Attention> {
  const today = todayIso(now);
  const visible = COLLECTORS.filter((c) => c.roles.includes(actor.role));
  const collected = await Promise.all(visible.map((c) => c.collect(db, actor.workshopId, today)));
  const mayReadRecords = (ROLE_SETS.members as readonly Role[]).includes(actor.role);
  return {
    asOf: today,
    items: collected.flatMap((c) => c.items),
    counts: Object.fromEntries(visible.map((c, i) => [c.kind, collected[i]!.total])),
    progress: mayReadRecords ? await repo.workshopCounts(db, actor.workshopId) : null,
  };
}

import { formatNumber } from '@angular/common';
import {
  ATTENTION_EXPIRY_DAYS,
  ATTENTION_LOW_STOCK_FRACTION,
  type Attention,
  type AttentionItem,
  type AttentionKind,
} from '@batchproof/shared';
import { reportingDeadline } from '../../complaints/reporting-deadline';
import { formatDay } from '../../dates/calendar-day-pipe';

/** One row on the home page: an icon, a plain sentence and where it leads. */
export interface AttentionRow {
  key: string;
  icon: string;
  text: string;
  link: string;
}

/** One kind's rows under a heading that counts them all, with a way to the full list. */
export interface AttentionGroup {
  kind: AttentionKind;
  icon: string;
  heading: string;
  rows: AttentionRow[];
  /** How many more exist than are listed (0 when all are). */
  more: number;
  all: { link: string; queryParams?: Record<string, string>; label: string };
}

/** A message as it reads after a colon: "No safety data sheet" → "no safety data sheet". */
const inSentence = (message: string) =>
  /^[A-Z][a-z]/.test(message) ? message[0]!.toLowerCase() + message.slice(1) : message;

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

type Formats = {
  date(day: string): string;
  number(n: number): string;
  deadline(clock: Parameters<typeof reportingDeadline>[0]): string;
};

/** How each kind reads. A new kind of item gets its entry here and nowhere else on the page. */
const KINDS: {
  [K in AttentionKind]: {
    icon: string;
    heading(n: number): string;
    /** What "none of these" means, for the empty state. */
    clear: string;
    all: AttentionGroup['all'];
    row(item: Extract<AttentionItem, { kind: K }>, f: Formats): Omit<AttentionRow, 'key'>;
  };
} = {
  'complaint-clock': {
    icon: 'timer',
    heading: (n) =>
      `${plural(n, 'serious complaint has', 'serious complaints have')} a US reporting clock running`,
    clear: 'no serious complaint is waiting to be reported',
    all: {
      link: '/complaints',
      queryParams: { serious: 'true', status: 'open' },
      label: 'Open the serious complaints',
    },
    row: (i, f) => ({
      icon: i.state === 'overdue' ? 'alarm' : 'timer',
      link: `/complaints/${i.complaintId}`,
      text: `${i.productName}${i.batchCode ? ` (batch ${i.batchCode})` : ''}, received ${f.date(i.receivedOn)}. ${f.deadline({ ...i, reportedOn: null })}`,
    }),
  },
  'recall-open': {
    icon: 'campaign',
    heading: (n) => `${plural(n, 'recall is', 'recalls are')} open`,
    clear: 'no recall is open',
    all: { link: '/recalls', label: 'Open the recalls' },
    row: (i, f) => ({
      icon: 'campaign',
      link: `/recalls/${i.recallId}`,
      text: `${i.drill ? 'Recall drill' : 'Recall'} of ${i.batchCodes.length ? i.batchCodes.join(', ') : 'no finished lots yet'}, opened ${f.date(i.openedAt)}: ${i.reason}`,
    }),
  },
  'formula-blocked': {
    icon: 'block',
    heading: (n) =>
      `${plural(n, 'formula version has', 'formula versions have')} blocking findings`,
    clear: 'no draft or released version has blocking findings',
    all: { link: '/formulas', label: 'Open the formulas' },
    row: (i) => ({
      icon: 'block',
      link: `/formulas/${i.formulaId}/versions/${i.versionNumber}`,
      text:
        i.state === 'released'
          ? `${i.formulaName}: version ${i.versionNumber} is released with ${plural(i.blockCount, 'blocking finding', 'blocking findings')}.`
          : `${i.formulaName}: the draft, version ${i.versionNumber}, has ${plural(i.blockCount, 'blocking finding', 'blocking findings')}.`,
    }),
  },
  'lot-expiring': {
    icon: 'schedule',
    heading: (n) =>
      `${plural(n, 'lot with stock has', 'lots with stock have')} expired or expire within ${ATTENTION_EXPIRY_DAYS} days`,
    clear: `no lot with stock expires within ${ATTENTION_EXPIRY_DAYS} days`,
    all: {
      link: '/lots',
      queryParams: { expiry: String(ATTENTION_EXPIRY_DAYS), sort: 'expiresOn', dir: 'asc' },
      label: 'Open the lots by expiry date',
    },
    row: (i, f) => {
      const stock = `${f.number(i.stockOnHand)} ${i.unit}`;
      const lot = `Lot ${i.supplierLotNumber} of ${i.materialName}`;
      const when =
        i.daysLeft < 0
          ? `expired ${plural(-i.daysLeft, 'day', 'days')} ago, on ${f.date(i.expiresOn)}`
          : i.daysLeft === 0
            ? 'expires today'
            : `expires in ${plural(i.daysLeft, 'day', 'days')}, on ${f.date(i.expiresOn)}`;
      return {
        icon: i.daysLeft < 0 ? 'event_busy' : 'schedule',
        link: `/lots/${i.lotId}`,
        text: `${lot} ${when}; ${stock} still in stock.`,
      };
    },
  },
  'material-documents': {
    icon: 'description',
    heading: (n) =>
      `${plural(n, 'material is', 'materials are')} missing a supplier document or have one that is not current`,
    clear: 'every material has its expected documents on file and current',
    all: { link: '/materials', label: 'Open the materials' },
    row: (i) => ({
      icon: 'description',
      link: `/materials/${i.materialId}`,
      text: `${i.materialName}: ${i.documents.map((d) => inSentence(d.message)).join('; ')}.`,
    }),
  },
  'lot-low-stock': {
    icon: 'inventory',
    heading: (n) =>
      `${plural(n, 'lot is', 'lots are')} low: less than ${ATTENTION_LOW_STOCK_FRACTION * 100} % of what was received is left`,
    clear: `no lot is down to less than ${ATTENTION_LOW_STOCK_FRACTION * 100} % of what was received`,
    all: { link: '/lots', label: 'Open the lots' },
    row: (i, f) => ({
      icon: 'inventory',
      link: `/lots/${i.lotId}`,
      text: `Lot ${i.supplierLotNumber} of ${i.materialName}: ${f.number(i.stockOnHand)} ${i.unit} left of ${f.number(i.quantity)} ${i.unit} received.`,
    }),
  },
  'batch-awaiting-release': {
    icon: 'pending_actions',
    heading: (n) => `${plural(n, 'batch is', 'batches are')} waiting to be recorded and released`,
    clear: 'no batch is waiting for release',
    all: { link: '/production', label: 'Open production' },
    row: (i, f) => ({
      icon: 'pending_actions',
      link: `/production/${i.batchId}`,
      text: `${i.batchCode}, ${i.productName}, made ${f.date(i.madeOn)}: not released yet.`,
    }),
  },
  'batch-curing': {
    icon: 'hourglass_top',
    heading: (n) => `${plural(n, 'batch is', 'batches are')} curing or drying`,
    clear: 'no released batch is still curing',
    all: { link: '/production', label: 'Open production' },
    row: (i, f) => ({
      icon: 'hourglass_top',
      link: `/production/${i.batchId}`,
      text: `${i.batchCode}, ${i.productName}: ready on ${f.date(i.readyOn)}, in ${plural(i.daysLeft, 'day', 'days')}.`,
    }),
  },
  'labels-out-of-date': {
    icon: 'label_off',
    heading: (n) =>
      `${plural(n, 'product has', 'products have')} labels printed from a version older than the released one`,
    clear: 'every product’s newest labels match its released version',
    all: {
      link: '/labels',
      queryParams: { show: 'outOfDate' },
      label: 'Open the out-of-date print runs',
    },
    row: (i, f) => ({
      icon: 'label_off',
      link: `/formulas/${i.formulaId}`,
      text: `${i.formulaName}: the labels printed on ${f.date(i.printedAt)} are of version ${i.printedVersion}; version ${i.releasedVersion} is released. Print new labels.`,
    }),
  },
  'assessment-missing': {
    icon: 'health_and_safety',
    heading: (n) =>
      `${plural(n, 'product is', 'products are')} made for the EU or UK without a signed safety assessment`,
    clear: 'every released version sold in the EU or UK has a signed safety assessment',
    all: { link: '/readiness', label: 'Open market readiness' },
    row: (i) => ({
      icon: 'health_and_safety',
      link: `/formulas/${i.formulaId}/versions/${i.versionNumber}`,
      text: `${i.formulaName}: version ${i.versionNumber} (${i.markets.join(', ')}) has no signed safety assessment${i.lastAssessedVersion === null ? '' : `; version ${i.lastAssessedVersion} was assessed`}. Share it with a safety assessor before it is sold there.`,
    }),
  },
  'invitation-pending': {
    icon: 'mail',
    heading: (n) => `${plural(n, 'invitation is', 'invitations are')} waiting to be accepted`,
    clear: 'no invitation is waiting',
    all: { link: '/workshop', label: 'Open the workshop members' },
    row: (i, f) => ({
      icon: 'mail',
      link: '/workshop',
      text: `${i.email} has not yet joined as ${i.role}; the link works until ${f.date(i.expiresAt)}.`,
    }),
  },
};

/** The attention answer as groups of rows, in the order the API ranks the kinds. */
export function attentionGroups(
  attention: Attention,
  locale: string,
  dateLocale = locale,
): AttentionGroup[] {
  const f: Formats = {
    date: (day) => formatDay(day, dateLocale),
    number: (n) => formatNumber(n, locale, '1.0-3'),
    deadline: (clock) => reportingDeadline(clock, dateLocale),
  };
  const groups = new Map<AttentionKind, AttentionRow[]>();
  attention.items.forEach((item, index) => {
    const kind = KINDS[item.kind] as (typeof KINDS)[AttentionKind];
    const row = (kind.row as (i: AttentionItem, f: Formats) => Omit<AttentionRow, 'key'>)(item, f);
    groups.set(item.kind, [
      ...(groups.get(item.kind) ?? []),
      { key: `${item.kind}-${index}`, ...row },
    ]);
  });
  return [...groups].map(([kind, rows]) => {
    const total = attention.counts[kind] ?? rows.length;
    const { icon, heading, all } = KINDS[kind];
    return { kind, icon, heading: heading(total), rows, more: total - rows.length, all };
  });
}

/**
 * The empty state in words: which kinds were checked and found clear, or that none is open to
 * this role.
 */
export function allClearSentence(attention: Attention): string {
  const checked = (Object.keys(attention.counts) as AttentionKind[]).map((k) => KINDS[k].clear);
  if (checked.length === 0) {
    return 'Nothing the home page tracks is open to your role yet; the reference lists are.';
  }
  const list =
    checked.length === 1 ? checked[0] : `${checked.slice(0, -1).join(', ')} and ${checked.at(-1)}`;
  return `Nothing needs attention today: ${list}.`;
}

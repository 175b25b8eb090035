import {
  RECALL_AUTHORITY_NOTE,
  RECALL_SEVERITY_LABELS,
  recallConcernsHarm,
  type Recall,
} from '@batchproof/shared';
import { LABEL_FONT_FAMILY, renderDocumentPdf } from '../labels/pdf';
import { dataTable as table, utcMinute } from '../labels/pdf/document-blocks';

/** What the summary needs beyond the recall itself. */
export interface RecallSummaryContext {
  workshopName: string;
  /** The supplier lot of a supplier-lot scope, in words (material and lot number). */
  supplierLot: string | null;
  openedBy: string | null;
  closedBy: string | null;
}

const NOTICE_WORDS = {
  sent: 'Sent',
  failed: 'Failed',
  'not-sent': 'Not sent',
  drill: 'Drill: not sent',
} as const;

const when = utcMinute;

const heading = (text: string) => ({ text, style: 'heading' });

function timeline(recall: Recall, ctx: RecallSummaryContext, names: Map<string, string>) {
  const events: [string, string][] = [
    [
      recall.openedAt,
      `${recall.drill ? 'Drill' : 'Recall'} opened${ctx.openedBy ? ` by ${ctx.openedBy}` : ''}`,
    ],
  ];
  for (const n of recall.notices) {
    if (n.sentAt) events.push([n.sentAt, `Notice sent to ${names.get(n.customerId) ?? n.to}`]);
  }
  for (const r of recall.replies) {
    events.push([r.createdAt, `Reply from ${names.get(r.customerId) ?? 'a customer'} recorded`]);
  }
  if (recall.closedAt) {
    events.push([recall.closedAt, `Closed${ctx.closedBy ? ` by ${ctx.closedBy}` : ''}`]);
  }
  return events.sort(([a], [b]) => a.localeCompare(b)).map(([at, what]) => [when(at), what]);
}

/** The pdfmake definition of a recall's summary: everything the record holds, for the file. */
export function recallSummaryDocument(recall: Recall, ctx: RecallSummaryContext): object {
  const names = new Map(recall.affected.map((c) => [c.customerId, c.customerName]));
  const returned = new Map<string, number>();
  for (const r of recall.replies) {
    returned.set(r.customerId, (returned.get(r.customerId) ?? 0) + r.unitsReturned);
  }
  const scope =
    recall.scope.kind === 'supplier-lot'
      ? `Everything made with supplier lot ${ctx.supplierLot ?? recall.scope.supplierLotId}`
      : 'The finished lots named below';
  const title = recall.drill ? 'Recall drill summary' : 'Recall summary';
  return {
    info: { title: `${title}: ${recall.batchCodes.join(', ')}` },
    pageSize: 'A4',
    pageMargins: [40, 40, 40, 48],
    defaultStyle: { font: LABEL_FONT_FAMILY, fontSize: 10, lineHeight: 1.2 },
    styles: {
      title: { fontSize: 18, bold: true, margin: [0, 0, 0, 4] },
      heading: { fontSize: 12, bold: true, margin: [0, 10, 0, 4] },
    },
    // A plain object, not a function: the definition crosses to the PDF worker thread.
    footer: { text: `${ctx.workshopName} · ${title}`, fontSize: 8, alignment: 'center' },
    content: [
      { text: title, style: 'title' },
      { text: ctx.workshopName, margin: [0, 0, 0, 8] },
      {
        table: {
          widths: [110, '*'],
          body: [
            ['Products', recall.products.join(', ') || '—'],
            ['Batch codes', recall.batchCodes.join(', ')],
            ['Scope', scope],
            ['Reason', recall.reason],
            ['How serious', RECALL_SEVERITY_LABELS[recall.severity]],
            ['State', recall.state === 'open' ? 'Open' : 'Closed'],
            ['Opened', when(recall.openedAt)],
            ['Closed', recall.closedAt ? when(recall.closedAt) : 'Not yet'],
            ['Units', `${recall.unitsReturned} returned of ${recall.unitsDelivered} delivered`],
          ].map(([k, v]) => [{ text: k!, bold: true }, v!]),
        },
        layout: 'noBorders',
      },
      recallConcernsHarm(recall.severity)
        ? { text: RECALL_AUTHORITY_NOTE, bold: true, margin: [0, 8, 0, 0] }
        : { text: '' },
      heading('Affected customers'),
      table(
        ['Customer', 'E-mail', 'Phone', 'Lots', 'Delivered', 'Returned'],
        recall.affected.map((c) => [
          c.customerName,
          c.email ?? '—',
          c.phone ?? '—',
          c.lots.map((l) => `${l.lotCode} × ${l.unitsDelivered}`).join('\n'),
          String(c.unitsDelivered),
          String(returned.get(c.customerId) ?? 0),
        ]),
        ['*', '*', 70, '*', 50, 50],
      ),
      heading('Notices'),
      table(
        ['Customer', 'To', 'Status', 'Sent', 'Note'],
        recall.notices.map((n) => [
          names.get(n.customerId) ?? '',
          n.to || '—',
          NOTICE_WORDS[n.status],
          n.sentAt ? when(n.sentAt) : '—',
          n.failure ?? '',
        ]),
        ['*', '*', 60, 70, '*'],
      ),
      heading('Replies'),
      table(
        ['Day', 'Customer', 'On hand', 'Returned', 'Notes'],
        recall.replies.map((r) => [
          r.repliedOn,
          names.get(r.customerId) ?? '',
          String(r.unitsOnHand),
          String(r.unitsReturned),
          r.notes ?? '',
        ]),
        [60, '*', 45, 50, '*'],
      ),
      heading('Timeline'),
      table(['When', 'What'], timeline(recall, ctx, names), [110, '*']),
      heading('Summary'),
      { text: recall.summary ?? 'Not closed yet.', italics: recall.summary === null },
      ...(recall.drillReport
        ? [
            heading('Drill report'),
            {
              text: `The trace took ${recall.drillReport.traceMilliseconds} ms.`,
              margin: [0, 0, 0, 4],
            },
            recall.drillReport.missing.length > 0
              ? { ul: recall.drillReport.missing }
              : { text: 'Nothing was missing.' },
          ]
        : []),
    ],
  };
}

/** The summary PDF of a recall, drawn in the label PDF worker (A4, the label font embedded). */
export function renderRecallSummaryPdf(recall: Recall, ctx: RecallSummaryContext): Promise<Buffer> {
  return renderDocumentPdf(recallSummaryDocument(recall, ctx));
}

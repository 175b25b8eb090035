import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import type { FinishedLotTrace, FinishedLotTraceLine, TraceDelivery } from '@batchproof/shared';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { TraceApi } from '../trace-api';
import { deliveryColumns } from '../trace-columns';
import { counted, formatAmount, formatTraceDay, unitsWord } from '../trace-format';
import { TraceGraph } from '../trace-graph/trace-graph';
import { TracePageFrame } from '../trace-page-frame';
import { TraceSection } from '../trace-section';
import { TraceSummary, type TraceFact } from '../trace-summary';
import { type TraceColumn, TraceTable } from '../trace-table/trace-table';

/** How each kind of supplier document is named in the table. */
const DOCUMENT_WORDS: Record<string, string> = {
  sds: 'SDS',
  'certificate-of-analysis': 'Certificate of analysis',
  'ifra-certificate': 'IFRA certificate',
  'allergen-declaration': 'Allergen declaration',
  specification: 'Specification',
  other: 'Document',
};

/** A line's documents in one cell: "SDS: Citric acid SDS (1 Nov 2025); …", or "none on file". */
export function documentsText(line: FinishedLotTraceLine): string {
  if (!line.documents.length) return 'none on file';
  return line.documents
    .map((d) => `${DOCUMENT_WORDS[d.kind] ?? d.kind}: ${d.title} (${formatTraceDay(d.issuedOn)})`)
    .join('; ');
}

/** The sentence a screen reader hears for the graph. */
export function backwardSummary(trace: FinishedLotTrace): string {
  const { finishedLot: lot, totals } = trace;
  const used = `Finished lot ${lot.batchCode} of ${lot.productName} used ${counted(totals.supplierLots, 'supplier lot')} from ${counted(totals.suppliers, 'supplier')}`;
  return totals.customers === 0
    ? `${used}, and has not been delivered.`
    : `${used}, and went to ${counted(totals.customers, 'customer')}: ${unitsWord(totals.unitsDelivered)}.`;
}

/**
 * `/trace/finished-lots/:id`: backward from a finished lot (a released batch) to every supplier
 * lot each line used, its supplier and its documents, with the lot's own deliveries, as a
 * summary, two sortable tables and a graph. The owner opens a recall of this lot from here.
 */
@Component({
  selector: 'bp-finished-lot-trace-page',
  imports: [CalendarDayPipe, TraceGraph, TracePageFrame, TraceSection, TraceSummary, TraceTable],
  templateUrl: './finished-lot-trace-page.html',
  styleUrl: './finished-lot-trace-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class FinishedLotTracePage {
  /** The finished lot's (batch's) id, from the path. */
  readonly id = input.required<string>();

  protected readonly traceResource = inject(TraceApi).finishedLot(this.id);
  protected readonly trace = computed(() =>
    this.traceResource.hasValue() ? this.traceResource.value() : null,
  );

  protected readonly facts = computed<TraceFact[]>(() => {
    const t = this.trace();
    if (!t) return [];
    const made = t.finishedLot.unitsMade;
    return [
      { label: 'Supplier lots', value: formatAmount(t.totals.supplierLots) },
      { label: 'Suppliers', value: formatAmount(t.totals.suppliers) },
      { label: 'Units made', value: made === null ? 'not counted' : formatAmount(made) },
      { label: 'Units delivered', value: formatAmount(t.totals.unitsDelivered) },
      { label: 'Customers', value: formatAmount(t.totals.customers) },
    ];
  });
  protected readonly summary = computed(() => {
    const t = this.trace();
    return t ? backwardSummary(t) : '';
  });

  protected readonly lineColumns: TraceColumn<FinishedLotTraceLine>[] = [
    { key: 'lineNumber', header: 'Line', numeric: true, value: (l) => l.lineNumber },
    { key: 'material', header: 'Material', value: (l) => l.supplierLot.materialName },
    {
      key: 'lotNumber',
      header: 'Supplier lot',
      value: (l) => l.supplierLot.lotNumber,
      link: (l) => `/lots/${l.supplierLot.id}`,
    },
    {
      key: 'supplier',
      header: 'Supplier',
      value: (l) => l.supplierLot.supplierName,
      text: (l) => l.supplierLot.supplierName ?? 'not recorded',
      link: (l) => (l.supplierLot.supplierId ? `/suppliers/${l.supplierLot.supplierId}` : null),
    },
    {
      key: 'quantityUsed',
      header: 'Used',
      numeric: true,
      value: (l) => l.quantityUsed,
      text: (l) => formatAmount(l.quantityUsed),
      unit: (l) => l.supplierLot.unit,
    },
    {
      key: 'expiresOn',
      header: 'Lot expires',
      value: (l) => l.supplierLot.expiresOn,
      text: (l) =>
        l.supplierLot.expiresOn ? formatTraceDay(l.supplierLot.expiresOn) : 'none given',
    },
    {
      key: 'documents',
      header: 'Documents',
      value: (l) => l.documents.length,
      text: documentsText,
    },
  ];

  protected readonly deliveryColumns = deliveryColumns<TraceDelivery>();
}

import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import type { SupplierLotTrace, SupplierLotTraceBatch } from '@batchproof/shared';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { TraceApi } from '../trace-api';
import { deliveryColumns } from '../trace-columns';
import { counted, formatAmount, formatTraceDay, unitsWord } from '../trace-format';
import { TraceGraph } from '../trace-graph/trace-graph';
import { TracePageFrame } from '../trace-page-frame';
import { TraceSection } from '../trace-section';
import { TraceSummary, type TraceFact } from '../trace-summary';
import { type TraceColumn, TraceTable } from '../trace-table/trace-table';

/** One delivery of a finished lot that used the supplier lot. */
export interface ForwardDeliveryRow {
  customerId: string;
  customerName: string;
  deliveredOn: string;
  reference: string | null;
  batchId: string;
  batchCode: string;
  productName: string;
  units: number;
}

/** The delivery rows of a forward trace, one per finished lot and delivery. */
export function forwardDeliveryRows(trace: SupplierLotTrace): ForwardDeliveryRow[] {
  return trace.batches.flatMap((b) =>
    b.deliveries.map((d) => ({
      customerId: d.customerId,
      customerName: d.customerName,
      deliveredOn: d.deliveredOn,
      reference: d.reference,
      batchId: b.batchId,
      batchCode: b.batchCode,
      productName: b.productName,
      units: d.units,
    })),
  );
}

/** The sentence a screen reader hears for the graph. */
export function forwardSummary(trace: SupplierLotTrace): string {
  const { supplierLot: lot, totals } = trace;
  const start = `Supplier lot ${lot.lotNumber} of ${lot.materialName}`;
  if (totals.batches === 0) return `${start} has not gone into any released batch.`;
  return `${start} went into ${totals.batches === 1 ? '1 batch' : `${totals.batches} batches`}, delivered to ${counted(totals.customers, 'customer')}: ${unitsWord(totals.unitsDelivered)} in all.`;
}

/**
 * `/trace/supplier-lots/:id`: forward from a supplier lot to the released batches that used it
 * (net of amendments) and the customers who received their finished lots, as a summary, two
 * sortable tables and a graph. The owner opens a recall from here.
 */
@Component({
  selector: 'bp-supplier-lot-trace-page',
  imports: [CalendarDayPipe, TraceGraph, TracePageFrame, TraceSection, TraceSummary, TraceTable],
  templateUrl: './supplier-lot-trace-page.html',
  styleUrl: './supplier-lot-trace-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class SupplierLotTracePage {
  /** The supplier lot's id, from the path. */
  readonly id = input.required<string>();

  protected readonly traceResource = inject(TraceApi).supplierLot(this.id);
  protected readonly trace = computed(() =>
    this.traceResource.hasValue() ? this.traceResource.value() : null,
  );

  protected readonly facts = computed<TraceFact[]>(() => {
    const t = this.trace();
    if (!t) return [];
    return [
      { label: 'Batches', value: formatAmount(t.totals.batches) },
      { label: 'Units made', value: formatAmount(t.totals.unitsMade) },
      { label: 'Units delivered', value: formatAmount(t.totals.unitsDelivered) },
      { label: 'Customers', value: formatAmount(t.totals.customers) },
    ];
  });
  protected readonly deliveries = computed(() => {
    const t = this.trace();
    return t ? forwardDeliveryRows(t) : [];
  });
  protected readonly summary = computed(() => {
    const t = this.trace();
    return t ? forwardSummary(t) : '';
  });

  protected readonly batchColumns = computed<TraceColumn<SupplierLotTraceBatch>[]>(() => {
    const unit = this.trace()?.supplierLot.unit ?? '';
    return [
      {
        key: 'batchCode',
        header: 'Batch',
        value: (b) => b.batchCode,
        link: (b) => `/production/${b.batchId}`,
      },
      { key: 'productName', header: 'Product', value: (b) => b.productName },
      {
        key: 'madeOn',
        header: 'Made',
        value: (b) => b.madeOn,
        text: (b) => formatTraceDay(b.madeOn),
      },
      {
        key: 'quantityUsed',
        header: 'Used',
        numeric: true,
        value: (b) => b.quantityUsed,
        text: (b) => formatAmount(b.quantityUsed),
        unit: () => unit,
      },
      {
        key: 'unitsMade',
        header: 'Units made',
        numeric: true,
        value: (b) => b.unitsMade,
        text: (b) => (b.unitsMade === null ? 'not counted' : formatAmount(b.unitsMade)),
      },
      {
        key: 'unitsDelivered',
        header: 'Delivered',
        numeric: true,
        value: (b) => b.unitsDelivered,
        text: (b) => formatAmount(b.unitsDelivered),
      },
    ];
  });

  protected readonly deliveryColumns = deliveryColumns<ForwardDeliveryRow>([
    {
      key: 'batchCode',
      header: 'Lot',
      value: (d) => d.batchCode,
      link: (d) => `/production/${d.batchId}`,
    },
    { key: 'productName', header: 'Product', value: (d) => d.productName },
  ]);
}

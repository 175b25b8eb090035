import { formatAmount, formatTraceDay } from './trace-format';
import type { TraceColumn } from './trace-table/trace-table';

/** The delivery columns both traces show: customer (a link), day, reference and units. */
export function deliveryColumns<
  T extends {
    customerId: string;
    customerName: string;
    deliveredOn: string;
    reference: string | null;
    units: number;
  },
>(between: TraceColumn<T>[] = []): TraceColumn<T>[] {
  return [
    {
      key: 'customerName',
      header: 'Customer',
      value: (d) => d.customerName,
      link: (d) => `/deliveries/customers/${d.customerId}`,
    },
    {
      key: 'deliveredOn',
      header: 'Delivered',
      value: (d) => d.deliveredOn,
      text: (d) => formatTraceDay(d.deliveredOn),
    },
    ...between,
    { key: 'reference', header: 'Reference', value: (d) => d.reference },
    {
      key: 'units',
      header: 'Units',
      numeric: true,
      value: (d) => d.units,
      text: (d) => formatAmount(d.units),
    },
  ];
}

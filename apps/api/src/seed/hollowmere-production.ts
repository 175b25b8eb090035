import type { CustomerCreate } from '@batchproof/shared';
import { lot, type DemoLot } from './hollowmere-materials';

/**
 * Hollowmere Bathworks' production history (invented): earlier goods-in that the first batches
 * drew on, the shops and stalls it sells to, a few months of batches, what went to whom, and one
 * recall drill. Every name, address and number is invented; e-mail addresses use the reserved
 * `.example` domain and phone numbers the 555-01xx range kept for fiction.
 */

/** Goods-in from before the batches began (received about six months ago). */
export const demoEarlierLots: DemoLot[] = [
  lot('bicarb', 'FB-SB-1870', 25, 'kg', 1.85, 185, 400),
  lot('citric', 'FB-CA-0612', 12, 'kg', 3.3, 185, 400),
  lot('cornstarch', 'FB-CS-0934', 5, 'kg', 2.1, 185, 400),
  lot('epsom', 'FB-MS-5230', 25, 'kg', 1.05, 185, 400),
  lot('seaSalt', 'FB-NA-0044', 12, 'kg', 1.55, 185, null),
  lot('creamOfTartar', 'FB-PB-3120', 2, 'kg', 9.2, 185, 400),
  lot('oat', 'FB-OA-2104', 2, 'kg', 8.5, 185, 400),
  lot('slsa', 'LB-SL-4102', 4, 'kg', 14.5, 185, 400),
  lot('capb', 'LB-CB-2030', 1, 'L', 8.7, 185, 400),
  lot('coconut', 'LB-FC-8711', 3, 'L', 8.9, 185, 400),
  lot('almond', 'LB-AL-5980', 1, 'L', 10.2, 185, 400),
  lot('glycerin', 'LB-GL-4211', 2, 'L', 5.4, 185, 400),
  lot('polysorbate', 'LB-PS-7820', 1, 'kg', 11.8, 185, 400),
  lot('orchardFog', 'LB-OF-1302', 1, 'kg', 41.0, 185, 400),
  lot('wrenfieldRain', 'LB-WR-2011', 1, 'kg', 38.0, 185, 400),
  lot('lavender', 'LB-LV-7002', 500, 'mL', 0.1, 185, 400),
  lot('redOxide', 'CK-RO-4107', 100, 'g', 0.17, 185, 1095),
];

/** Who Hollowmere sells to. */
export const demoCustomers: CustomerCreate[] = [
  {
    kind: 'stockist',
    name: 'Wrenfield Corner Pantry',
    contact: 'Mara Quill',
    email: 'orders@cornerpantry.example',
    phone: '802-555-0131',
    address: '3 Market Row, Wrenfield',
    notes: 'Takes fizzers by the dozen; restocks monthly.',
  },
  {
    kind: 'stockist',
    name: 'Saltmarsh Gift House',
    contact: 'Theo Brannock',
    email: 'buying@saltmarshgifts.example',
    phone: '802-555-0158',
    address: '22 Harbour Street, Saltmarsh',
    notes: null,
  },
  {
    kind: 'market-stall',
    name: 'Millbrook Saturday Market',
    contact: 'Stall 14 (our own table)',
    email: null,
    phone: '802-555-0176',
    address: 'Millbrook Green',
    notes: 'Our own stall: units taken and units brought back are both recorded.',
  },
  {
    kind: 'online-order',
    name: 'Hollowmere web shop orders',
    contact: null,
    email: 'shop@hollowmere.example',
    phone: null,
    address: null,
    notes: 'Orders shipped from the workshop, recorded weekly.',
  },
  {
    kind: 'stockist',
    name: 'Fernhill Farm Shop',
    contact: 'Ida Morrow',
    email: 'ida@fernhillfarm.example',
    phone: '802-555-0192',
    address: 'Fernhill Road, Ashby',
    notes: null,
  },
];

/** One batch of the history, `daysAgo` days before seeding. */
export interface DemoBatch {
  formula: 'Orchard Fog Fizzer' | 'Rainfall Foaming Fizzer' | 'Lavender Oat Bath Salts';
  daysAgo: number;
  units: number;
  /** Released (the usual), or left as a draft awaiting release. */
  release: boolean;
  /** Units that went to each customer (by index in demoCustomers), `daysAfter` the batch was made. */
  deliveries: { customer: number; units: number; daysAfter: number }[];
}

const fizzer = (
  daysAgo: number,
  units: number,
  deliveries: DemoBatch['deliveries'] = [],
): DemoBatch => ({ formula: 'Orchard Fog Fizzer', daysAgo, units, release: true, deliveries });
const foaming = (
  daysAgo: number,
  units: number,
  deliveries: DemoBatch['deliveries'] = [],
): DemoBatch => ({ formula: 'Rainfall Foaming Fizzer', daysAgo, units, release: true, deliveries });
const salts = (
  daysAgo: number,
  units: number,
  deliveries: DemoBatch['deliveries'] = [],
): DemoBatch => ({ formula: 'Lavender Oat Bath Salts', daysAgo, units, release: true, deliveries });

/** About five months of batches, oldest first; the newest is curing and one waits for release. */
export const demoBatches: DemoBatch[] = [
  fizzer(150, 24, [
    { customer: 0, units: 12, daysAfter: 5 },
    { customer: 2, units: 8, daysAfter: 7 },
  ]),
  salts(140, 16, [
    { customer: 1, units: 8, daysAfter: 4 },
    { customer: 3, units: 6, daysAfter: 9 },
  ]),
  foaming(128, 20, [
    { customer: 0, units: 10, daysAfter: 6 },
    { customer: 4, units: 6, daysAfter: 6 },
  ]),
  fizzer(112, 24, [
    { customer: 1, units: 12, daysAfter: 5 },
    { customer: 3, units: 10, daysAfter: 8 },
  ]),
  salts(96, 16, [{ customer: 4, units: 10, daysAfter: 3 }]),
  foaming(84, 20, [
    { customer: 2, units: 10, daysAfter: 5 },
    { customer: 3, units: 8, daysAfter: 10 },
  ]),
  fizzer(70, 24, [
    { customer: 0, units: 12, daysAfter: 4 },
    { customer: 4, units: 8, daysAfter: 6 },
  ]),
  foaming(52, 20, [{ customer: 1, units: 12, daysAfter: 5 }]),
  salts(41, 16, [{ customer: 2, units: 8, daysAfter: 5 }]),
  fizzer(30, 24, [
    { customer: 3, units: 10, daysAfter: 4 },
    { customer: 0, units: 8, daysAfter: 6 },
  ]),
  foaming(16, 20, [{ customer: 4, units: 10, daysAfter: 5 }]),
  fizzer(2, 24),
  { formula: 'Rainfall Foaming Fizzer', daysAgo: 0, units: 20, release: false, deliveries: [] },
];

/** The recall drill run on the earlier citric acid lot. */
export const demoRecallDrill = {
  supplierLotNumber: 'FB-CA-0612',
  reason:
    'Drill: the supplier told us lot FB-CA-0612 of citric acid may hold foreign matter. Practising the trace and the notices; nothing is wrong with the products.',
  summary:
    'Drill finished. The trace found every batch made with FB-CA-0612 and every shop that received them. Millbrook Saturday Market has no e-mail address: for a real recall, phone the stall organiser.',
};

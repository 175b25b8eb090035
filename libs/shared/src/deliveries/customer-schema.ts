import * as z from 'zod';
import { listQuerySchema, pageSchema } from '../lists/list-query-schema';
import {
  archivedAtField,
  includeArchivedSchema,
  warningsField,
} from '../records/housekeeping-schema';
import {
  optionalEmail,
  optionalText,
  requiredText,
  storedRecordFields,
} from '../records/record-fields';

/** Who a workshop sells to. */
export const CUSTOMER_KINDS = ['stockist', 'market-stall', 'online-order', 'other'] as const;
export type CustomerKind = (typeof CUSTOMER_KINDS)[number];

/** How the screens name each kind. */
export const CUSTOMER_KIND_LABELS: Readonly<Record<CustomerKind, string>> = {
  stockist: 'Stockist',
  'market-stall': 'Market stall',
  'online-order': 'Online order',
  other: 'Other',
};

export const customerKindSchema = z.enum(CUSTOMER_KINDS, {
  error: `Choose a kind of customer: ${CUSTOMER_KINDS.map((k) => CUSTOMER_KIND_LABELS[k]).join(', ')}`,
});

/** Characters of a phone number: digits and the usual separators (`+44 (0)1632 960 123`). */
const PHONE_CHARACTERS = /^[0-9+()./ -]*$/;

/** What a member enters for a customer (create and full update). */
export const customerCreateSchema = z.object({
  kind: customerKindSchema,
  name: requiredText('Customer name'),
  contact: optionalText('Contact person'),
  /** Where recall notices go; a customer without one is listed for a call instead. */
  email: optionalEmail(),
  phone: optionalText('Phone', 40).refine((v) => v === null || PHONE_CHARACTERS.test(v), {
    error: 'Enter a phone number with digits, spaces and + ( ) - . / only',
  }),
  address: optionalText('Address', 500),
  notes: optionalText('Notes', 2000),
});
/** Customer input as a form sends it. */
export type CustomerCreate = z.input<typeof customerCreateSchema>;
/** A customer's fields as checked (what the API stores). */
export type CustomerFields = z.output<typeof customerCreateSchema>;
/** Full replacement of a customer's fields (PUT). */
export const customerUpdateSchema = customerCreateSchema;
export type CustomerUpdate = z.input<typeof customerUpdateSchema>;

/** A customer as the API returns it. */
export const customerSchema = z.object({
  ...storedRecordFields,
  kind: customerKindSchema,
  name: z.string(),
  contact: z.string().nullable(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
  address: z.string().nullable(),
  notes: z.string().nullable(),
  /** How many deliveries name this customer. */
  deliveryCount: z.number().int(),
  archivedAt: archivedAtField,
  /** On a create or update: another customer has the same name (the save went through). */
  warnings: warningsField,
});
export type Customer = z.infer<typeof customerSchema>;

/**
 * Query of `GET /api/customers`: `q` matches name, contact and e-mail; `kind` keeps one kind;
 * archived customers only with `includeArchived=true`.
 */
export const customerListQuerySchema = listQuerySchema(
  ['name', 'kind', 'createdAt', 'updatedAt'],
  'name',
).extend({
  kind: customerKindSchema.optional(),
  includeArchived: includeArchivedSchema,
});
export type CustomerListQuery = z.output<typeof customerListQuerySchema>;
export const customerPageSchema = pageSchema(customerSchema);
export type CustomerPage = z.infer<typeof customerPageSchema>;

import * as z from 'zod';
import { complianceMarketSchema } from '../reference-data/reference-row';
import { recordIdSchema, textField } from '../records/record-fields';

/**
 * The contract of the safety-assessment hand-over (`/api/assessment-shares`, `/api/assessments`,
 * `/api/formulas/:id/versions/:number/safety-notes`). The maker shares one exact formula version
 * with an assessor; the assessor enters exposure, absorption and points of departure, writes Part
 * B and signs. Batchproof computes and lays out; the qualified safety assessor judges and signs.
 */

/** Free text of a packet section or Part B: trimmed, empty allowed, 8,000 characters at most. */
export const packetText = (label: string, max = 8000) =>
  textField(label)
    .trim()
    .max(max, { error: `${label} is too long (${max} characters at most)` })
    .default('');

/**
 * The maker's notes for Part A items 2–5 of Annex I to Regulation (EC) No 1223/2009, per formula
 * version: what they know about the product that the formula itself does not say.
 */
export const safetyNotesSchema = z.object({
  /** Item 2: physical/chemical characteristics (appearance, pH, density…). */
  physicalChemical: packetText('Physical and chemical characteristics'),
  /** Item 2: stability under reasonably foreseeable storage (test results, conditions, dates). */
  stability: packetText('Stability'),
  /** Item 3: microbiological quality (challenge test, water activity, preservation). */
  microbiological: packetText('Microbiological quality'),
  /** Item 4: impurities and traces of prohibited substances, with their technical unavoidability. */
  impurities: packetText('Impurities and traces'),
  /** Item 4: packaging material and its relevant characteristics. */
  packaging: packetText('Packaging material'),
  /** Item 5: normal and reasonably foreseeable use (directions, who uses it, how often). */
  normalUse: packetText('Normal and reasonably foreseeable use'),
});
export type SafetyNotes = z.output<typeof safetyNotesSchema>;
export type SafetyNotesInput = z.input<typeof safetyNotesSchema>;

/** `GET/PUT …/safety-notes`: the notes of one version, with who last changed them. */
export const safetyNotesRecordSchema = z.object({
  versionId: z.string(),
  notes: safetyNotesSchema,
  updatedAt: z.string().nullable(),
  updatedByName: z.string().nullable(),
});
export type SafetyNotesRecord = z.infer<typeof safetyNotesRecordSchema>;

const positive = (label: string, max: number) =>
  z
    .number({ error: `${label} must be a number` })
    .gt(0, { error: `${label} must be more than 0` })
    .max(max, { error: `${label} cannot exceed ${max}` });

/**
 * Exposure to the product (Annex I Part A item 6). Either one of the shipped defaults for common
 * product types (`presetKey`, see `EXPOSURE_DEFAULTS`), whose A value is used as published, or the
 * assessor's own daily amount, retention factor and body weight with their source.
 */
export const exposureInputSchema = z
  .object({
    /** Key of a row of `EXPOSURE_DEFAULTS`, or null when the assessor enters their own values. */
    presetKey: z.string().max(60).nullable(),
    /** Daily amount of product applied, grams per day. */
    dailyAmountGrams: positive('Daily amount', 1000),
    /** Fraction of the product left on the skin (1 leave-on, 0.01 rinse-off). */
    retentionFactor: positive('Retention factor', 1),
    /** Body weight, kg (60 kg when nothing else is known). */
    bodyWeightKg: positive('Body weight', 500),
    /** Where the values come from (a guidance table, the assessor's own data). */
    source: packetText('Exposure source', 500),
  })
  .refine((e) => e.presetKey !== null || e.source.length > 0, {
    path: ['source'],
    error: 'Say where your own exposure values come from',
  });
export type ExposureInput = z.output<typeof exposureInputSchema>;

/**
 * The assessor's values for one substance (Annex I Part A items 7–8). A null point of departure is
 * "not entered yet"; a null dermal absorption is the default 100 % and is marked as a default.
 */
export const substanceInputSchema = z.object({
  /** `SafetySubstance.key` of the packet's substance. */
  substanceKey: textField('Substance').max(200),
  /** Systemic point of departure (PoD_sys, e.g. NOAEL × oral bioavailability), mg/kg bw/day. */
  pointOfDepartureMgPerKgDay: positive('Point of departure', 1_000_000).nullable(),
  /** Where the point of departure comes from (study, opinion, database). */
  pointOfDepartureSource: packetText('Point of departure source', 500),
  /** Dermal absorption, percent of the applied amount; null means the default 100 %. */
  dermalAbsorptionPercent: positive('Dermal absorption', 100).nullable(),
  /** Where the absorption value comes from. */
  dermalAbsorptionSource: packetText('Dermal absorption source', 500),
});
export type SubstanceInput = z.output<typeof substanceInputSchema>;

/** Part B of Annex I, written by the assessor. */
export const partBSchema = z.object({
  /** 1. Assessment conclusion. */
  conclusion: packetText('Conclusion'),
  /** 2. Labelled warnings and instructions of use. */
  labelWarnings: packetText('Label warnings and instructions'),
  /** 3. Reasoning (margins of safety discussed where relevant). */
  reasoning: packetText('Reasoning', 20_000),
  /** 4. Assessor's credentials. */
  credentials: packetText('Credentials', 2000),
});
export type PartB = z.output<typeof partBSchema>;

/** `PUT /api/assessments/:id`: the assessor's draft; refused once signed. */
export const assessmentUpdateSchema = z.object({
  exposure: exposureInputSchema.nullable(),
  substances: z.array(substanceInputSchema).max(500, { error: 'At most 500 substances' }),
  partB: partBSchema,
});
export type AssessmentUpdate = z.output<typeof assessmentUpdateSchema>;
export type AssessmentUpdateInput = z.input<typeof assessmentUpdateSchema>;

/** `POST /api/assessment-shares` (owner): share one version with an assessor member. */
export const shareCreateSchema = z.object({
  versionId: recordIdSchema('formula version'),
  assessorId: recordIdSchema('assessor'),
});
export type ShareCreate = z.infer<typeof shareCreateSchema>;

/** `GET /api/assessment-shares?versionId=`: the live shares, of one version when named. */
export const shareListQuerySchema = z.object({
  versionId: recordIdSchema('formula version').optional(),
});
export type ShareListQuery = z.infer<typeof shareListQuerySchema>;

/** `POST /api/assessments` (the assessor): accept a share and start the assessment. */
export const assessmentCreateSchema = z.object({ shareId: recordIdSchema('shared version') });
export type AssessmentCreate = z.infer<typeof assessmentCreateSchema>;

/**
 * `POST /api/assessments/:id/sign`: the hash of the packet the assessor read. Signing is refused
 * (409 `packet_changed`) when the packet has changed since, so a signature always covers what was
 * on the screen.
 */
export const assessmentSignSchema = z.object({
  contentHash: z
    .string({ error: 'The packet hash is missing' })
    .regex(/^[0-9a-f]{64}$/, { error: 'The packet hash must be 64 hex digits' }),
  /** The assessor confirms they are signing as the qualified safety assessor. */
  confirm: z.literal(true, { error: 'Confirm that you sign as the safety assessor' }),
});
export type AssessmentSign = z.infer<typeof assessmentSignSchema>;

export const ASSESSMENT_STATUSES = ['draft', 'signed'] as const;
export const assessmentStatusSchema = z.enum(ASSESSMENT_STATUSES);
export type AssessmentStatus = z.infer<typeof assessmentStatusSchema>;

/** A share as the owner's and the assessor's lists show it. */
export const shareRecordSchema = z.object({
  id: z.string(),
  formulaId: z.string(),
  formulaName: z.string(),
  versionId: z.string(),
  versionNumber: z.number().int(),
  assessorId: z.string(),
  assessorName: z.string(),
  sharedByName: z.string().nullable(),
  sharedAt: z.string(),
  /** The assessment started from this share, if any. */
  assessmentId: z.string().nullable(),
  assessmentStatus: assessmentStatusSchema.nullable(),
});
export type ShareRecord = z.infer<typeof shareRecordSchema>;
export const shareListSchema = z.object({ items: z.array(shareRecordSchema) });
export type ShareList = z.infer<typeof shareListSchema>;

/** One row of `GET /api/assessments`. */
export const assessmentSummarySchema = z.object({
  id: z.string(),
  formulaId: z.string(),
  formulaName: z.string(),
  versionId: z.string(),
  versionNumber: z.number().int(),
  status: assessmentStatusSchema,
  assessorName: z.string(),
  signedAt: z.string().nullable(),
  updatedAt: z.string(),
});
export type AssessmentSummary = z.infer<typeof assessmentSummarySchema>;

/** `GET /api/assessments`: assessments the caller may see, and shares waiting to be accepted. */
export const assessmentListSchema = z.object({
  items: z.array(assessmentSummarySchema),
  /** Live shares without an assessment yet (for the assessor: theirs; for others: all). */
  waiting: z.array(shareRecordSchema),
});
export type AssessmentList = z.infer<typeof assessmentListSchema>;

export const ASSESSMENT_MARKETS = complianceMarketSchema.options;

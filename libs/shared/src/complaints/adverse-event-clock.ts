import * as z from 'zod';
import { addYears } from '../dates/calendar-day';
import { addUsBusinessDays, usBusinessDaysBetween } from './business-days';

/**
 * MoCRA's clocks for serious adverse events (Federal Food, Drug, and Cosmetic Act §605, added by
 * the Modernization of Cosmetics Regulation Act of 2022; 21 U.S.C. 364a).
 *
 * These functions only count days. Whether an event is a "serious adverse event" (§604(5),
 * 21 U.S.C. 364(5)), whether the product is a cosmetic in the US at all (a soap sold solely as
 * soap is not, 21 CFR 701.20) and whether a report is due are decided by the owner and their
 * adviser, never by Batchproof. The clock starts on the day the report reached the responsible
 * person, the business named on the label.
 */

/** Business days to submit a serious adverse event report. */
export const SERIOUS_ADVERSE_EVENT_REPORT_BUSINESS_DAYS = 15;

/**
 * The responsible person submits a serious adverse event report to FDA no later than 15 business
 * days after the report is received.
 */
export const SERIOUS_ADVERSE_EVENT_REPORT_SOURCE = 'FD&C Act §605(b)(1), 21 U.S.C. 364a(b)(1)';

/**
 * New medical information about a submitted report, received within 1 year of the initial
 * report, goes to FDA no later than 15 business days after it is received.
 */
export const NEW_MEDICAL_INFORMATION_SOURCE = 'FD&C Act §605(b)(2), 21 U.S.C. 364a(b)(2)';

/** Where a reporting clock stands. */
export const reportingClockStates = ['running', 'overdue', 'reported', 'reported-late'] as const;
export type ReportingClockState = (typeof reportingClockStates)[number];

/** A reporting deadline as the API answers it and the home page shows it. */
export const reportingClockSchema = z.object({
  /** Last day to submit, YYYY-MM-DD. */
  dueOn: z.string(),
  /** Business days from today to `dueOn` (0 on the day itself, negative once past); null once reported. */
  businessDaysLeft: z.number().int().nullable(),
  /** Whether the deadline has passed with nothing submitted. */
  overdue: z.boolean(),
  state: z.enum(reportingClockStates),
  /** The day the report was submitted, when it has been. */
  reportedOn: z.string().nullable(),
  /** The provision the deadline comes from. */
  source: z.string(),
});
export type ReportingClock = z.infer<typeof reportingClockSchema>;

interface ClockInput {
  /** The day the report (or the new information) was received: day 0. */
  receivedOn: string;
  /** Today as the UTC calendar day. */
  today: string;
  /** The day it was submitted to FDA, if it has been. */
  reportedOn?: string | null | undefined;
}

function clock(input: ClockInput, source: string): ReportingClock {
  const dueOn = addUsBusinessDays(input.receivedOn, SERIOUS_ADVERSE_EVENT_REPORT_BUSINESS_DAYS);
  const reportedOn = input.reportedOn ?? null;
  if (reportedOn) {
    const late = reportedOn > dueOn;
    return {
      dueOn,
      businessDaysLeft: null,
      overdue: false,
      state: late ? 'reported-late' : 'reported',
      reportedOn,
      source,
    };
  }
  const overdue = input.today > dueOn;
  return {
    dueOn,
    businessDaysLeft: usBusinessDaysBetween(input.today, dueOn),
    overdue,
    state: overdue ? 'overdue' : 'running',
    reportedOn: null,
    source,
  };
}

/**
 * The 15-business-day clock for reporting a serious adverse event to FDA. Call it only for an
 * event the owner has judged serious, for a product sold in the US.
 */
export function seriousAdverseEventClock(input: ClockInput): ReportingClock {
  return clock(input, SERIOUS_ADVERSE_EVENT_REPORT_SOURCE);
}

/**
 * The clock for new medical information about a report already submitted: 15 business days from
 * receiving it, when it arrives within 1 year of the initial report; null when it arrives later
 * (the duty no longer applies; the owner and their adviser may still choose to send it).
 */
export function newMedicalInformationClock(
  input: ClockInput & { initialReportOn: string },
): ReportingClock | null {
  if (input.receivedOn > addYears(input.initialReportOn, 1)) return null;
  return clock(input, NEW_MEDICAL_INFORMATION_SOURCE);
}

/**
 * Records of each adverse event report are kept 6 years, 3 years for a small business (§612:
 * average US cosmetic sales under $1,000,000 a year over the previous 3 years, adjusted for
 * inflation). The statute's wording of the start of the period was not confirmed; counting from
 * the day the record was made (pass the day of its latest entry) keeps it at least as long.
 */
export const ADVERSE_EVENT_RECORDS_SOURCE = 'FD&C Act §605(e)(1), 21 U.S.C. 364a(e)(1)';

export const ADVERSE_EVENT_RECORD_YEARS = 6;
export const SMALL_BUSINESS_ADVERSE_EVENT_RECORD_YEARS = 3;

/** How long an adverse event record is kept. */
export interface RecordRetention {
  /** Keep the record until at least this day, YYYY-MM-DD. */
  keepUntil: string;
  years: number;
  source: string;
}

/**
 * How long to keep an adverse event record: every adverse event report, serious or not, as the
 * secondary summaries of §605(e) read it (the statute's own text was not seen). Whether the
 * business is a small business is the owner's statement.
 */
export function retainUntil(input: {
  recordedOn: string;
  smallBusiness: boolean;
}): RecordRetention {
  const years = input.smallBusiness
    ? SMALL_BUSINESS_ADVERSE_EVENT_RECORD_YEARS
    : ADVERSE_EVENT_RECORD_YEARS;
  return {
    keepUntil: addYears(input.recordedOn, years),
    years,
    source: ADVERSE_EVENT_RECORDS_SOURCE,
  };
}

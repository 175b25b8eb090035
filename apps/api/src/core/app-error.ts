import type {
  ComplianceFinding,
  ErrorCode,
  LabelFitProblem,
  MissingLabelElementRecord,
} from '@batchproof/shared';

/** A print run's refusal data, sent as the envelope's `missing` or `fitProblems`. */
export interface LabelRefusal {
  missing?: MissingLabelElementRecord[];
  fitProblems?: LabelFitProblem[];
}

/** An error the API turns into the error envelope with the given status. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly fieldErrors?: Record<string, string[]>,
    /** The engine's findings behind a refusal, sent as the envelope's `findings`. */
    readonly findings?: ComplianceFinding[],
    /** What a print run lacks or what does not fit, sent as `missing` or `fitProblems`. */
    readonly labelRefusal?: LabelRefusal,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const notFound = (what = 'That record') =>
  new AppError(404, 'not_found', `${what} was not found.`);
export const forbidden = () =>
  new AppError(403, 'forbidden', 'Your role in this workshop does not allow this.');
export const conflict = (message: string, fieldErrors?: Record<string, string[]>) =>
  new AppError(409, 'conflict', message, fieldErrors);

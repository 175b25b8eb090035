import type {
  ComplianceFinding,
  ErrorCode,
  LabelFitProblem,
  MissingLabelElementRecord,
} from '@batchproof/shared';

/** What the client knows about a failed request: the API's envelope, or why there was none. */
export class ApiError extends Error {
  constructor(
    /** HTTP status; 0 when the server could not be reached. */
    readonly status: number,
    readonly code: ErrorCode | 'network' | 'unexpected',
    message: string,
    /** Messages per field path, as the API's envelope sends them. */
    readonly fieldErrors: Record<string, string[]> = {},
    /** The engine's findings behind a refusal (`release_blocked`), as the envelope sends them. */
    readonly findings: ComplianceFinding[] = [],
    /** What each market's label lacks (`label_incomplete`), as the envelope sends it. */
    readonly missing: MissingLabelElementRecord[] = [],
    /** Text that cannot fit at its legal minimum size (`label_does_not_fit`). */
    readonly fitProblems: LabelFitProblem[] = [],
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

/** The message to show for any error a request may end with. */
export function messageOf(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  return 'Something went wrong. Try again in a moment.';
}

/**
 * Runs work that must not change a response, after the response has been sent: a mail whose
 * sending (or not) would otherwise show in the answer's timing. A failure is logged in one line;
 * the client already has its answer.
 */
export function runAfterAnswer(what: string, task: () => Promise<void>): void {
  task().catch((err: unknown) => {
    console.error(
      `[api] ${what} failed after answering: ${err instanceof Error ? err.message : String(err)}`,
    );
  });
}

import { sql } from 'drizzle-orm';
import { expect, vi } from 'vitest';
import type { Database } from '../../apps/api/src/db/database';

type Transaction = Parameters<Parameters<Database['transaction']>[0]>[0];

/**
 * Stages a race deterministically: runs `hold` in a transaction, starts `send` while that
 * transaction is still open, waits until the request's query is blocked behind its locks, then
 * commits. The request then meets the committed change at the exact moment a real race would.
 */
export async function whileHeld<T>(
  db: Database,
  hold: (tx: Transaction) => Promise<unknown>,
  send: () => PromiseLike<T>,
): Promise<T> {
  let commit!: () => void;
  const committed = new Promise<void>((resolve) => (commit = resolve));
  let holding!: (pid: number) => void;
  const held = new Promise<number>((resolve) => (holding = resolve));
  const transaction = db.transaction(async (tx) => {
    await hold(tx);
    const { rows } = await tx.execute<{ pid: number }>(sql`select pg_backend_pid() as pid`);
    holding(rows[0]!.pid);
    await committed;
  });
  const pid = await held;
  const answer = Promise.resolve(send());
  await vi.waitFor(
    async () => {
      const { rows } = await db.execute<{ n: number }>(
        sql`select count(*)::int as n from pg_stat_activity where ${pid} = any(pg_blocking_pids(pid))`,
      );
      expect(rows[0]!.n).toBeGreaterThan(0);
    },
    { timeout: 5_000, interval: 20 },
  );
  commit();
  await transaction;
  return answer;
}

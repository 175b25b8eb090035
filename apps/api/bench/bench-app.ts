// What every API bench starts from: the migrated test database, a workshop of its own with an
// owner, and createApp() listening on a free loopback port with limits no bench reaches.
import { execFileSync } from 'node:child_process';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { sql } from 'drizzle-orm';
import type { Role } from '@batchproof/shared';
import { buildWorkshop } from '../../../tests/support/workshop-builder';
import { createApp } from '../src/app';
import { applyMigrations, openDatabase } from '../src/db/database';

const SECRET = 'bench-secret-that-is-at-least-32-characters';
const root = path.resolve(import.meta.dirname, '../../..');

/**
 * Opens TEST_DATABASE_URL (else the project's test database) with a pool of `poolSize`, applies
 * the migrations, builds a workshop named `name` with an owner (and a member of each of `roles`)
 * and serves the app. `close` stops the server, deletes the workshop and closes the pool.
 */
export async function startBench(name: string, poolSize: number, roles: readonly Role[] = []) {
  const url =
    process.env['TEST_DATABASE_URL'] ??
    execFileSync('node', [path.join(root, 'scripts/test-db-url.mjs')], {
      encoding: 'utf8',
    }).trim();
  const handle = openDatabase(url, poolSize);
  await applyMigrations(handle.db, path.join(root, 'drizzle'));
  const { db } = handle;
  const w = await buildWorkshop(db, SECRET, { name, roles: ['owner', ...roles] });
  const app = createApp({
    db,
    mailer: { send: async () => undefined, close: () => undefined },
    jwtSecret: SECRET,
    appUrl: 'http://127.0.0.1',
    rateLimits: { signInPerAccount: 1_000_000, signInPerAddress: 1_000_000 },
  });
  const server = app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  return {
    db,
    w,
    base,
    /**
     * A JSON request as the workshop's owner (or the member `as`); throws with the answer unless
     * it is 2xx.
     */
    async call(method: string, route: string, body?: unknown, as = w.members.owner) {
      const res = await fetch(base + route, {
        method,
        headers: { Authorization: `Bearer ${as.token}`, 'Content-Type': 'application/json' },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      const text = await res.text();
      if (!res.ok) throw new Error(`${method} ${route} → ${res.status} ${text.slice(0, 300)}`);
      return JSON.parse(text) as Record<string, unknown>;
    },
    async close() {
      server.close();
      await db.execute(sql`delete from workshops where id = ${w.id}`);
      await handle.close();
    },
  };
}

/** p50 and p95 of `run`, one call at a time, after five warm-up calls. */
export async function latency(run: () => Promise<unknown>, runs: number) {
  for (let i = 0; i < 5; i++) await run();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const start = performance.now();
    await run();
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  const p = (q: number) => times[Math.min(times.length - 1, Math.ceil(q * times.length) - 1)]!;
  return { p50: p(0.5), p95: p(0.95) };
}

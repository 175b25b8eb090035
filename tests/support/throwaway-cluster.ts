import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { ensureCluster, ensureDatabase } from '../../scripts/lib/provision.mjs';

/**
 * A PostgreSQL cluster of one spec's own, in a temporary folder on a free port, built and run the
 * way the project's scripts run theirs (Debian's binaries, as the postgres user when root). A test
 * may stop and start it freely; the project's shared cluster is never touched.
 */
export interface ThrowawayCluster {
  /** Connection URL of the cluster's one database. */
  url: string;
  /** Stops the server (fast shutdown: open connections are closed by the server). */
  stop(): void;
  /** Starts it again on the same port, with the same data. */
  start(): void;
  /** Stops the server and deletes its folder. */
  remove(): void;
}

export async function startThrowawayCluster(): Promise<ThrowawayCluster> {
  const home = mkdtempSync(path.join(os.tmpdir(), 'batchproof-throwaway-'));
  const port = await freePort();
  let cluster = ensureCluster(port, home);
  const url = ensureDatabase(cluster, 'batchproof_throwaway');
  return {
    url,
    stop: () => cluster.stop(),
    start: () => {
      cluster = ensureCluster(port, home);
    },
    remove: () => {
      cluster.stop();
      rmSync(home, { recursive: true, force: true });
    },
  };
}

/** A loopback port nothing listens on right now. */
function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      server.close(() =>
        typeof address === 'object' && address ? resolve(address.port) : reject(address),
      );
    });
  });
}

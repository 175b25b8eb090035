/** Types for the parts of `provision.mjs` that the test suites import. */
export interface Cluster {
  bin: string;
  pgdata: string;
  socketDir: string;
  port: number;
  home: string;
  /** Whether this call started the server. */
  startedHere: boolean;
  /** A connection URL for `database` as the cluster's superuser over TCP. */
  url(database: string): string;
  /** Stops the server (fast shutdown) and waits for it. */
  stop(): void;
}

export function ensureCluster(port: number, home?: string): Cluster;

export function ensureDatabase(
  cluster: Cluster,
  name: string,
  options?: { fresh?: boolean },
): string;

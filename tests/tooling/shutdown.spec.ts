import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

const shutdownModule = pathToFileURL(path.resolve('scripts/lib/shutdown.mjs')).href;

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(path.join(tmpdir(), 'batchproof-shutdown-'));
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

/**
 * Runs a script shaped like `npm start`: a clean-up standing for "stop the cluster" that appends
 * `cleaned` to a file, then `body`. Resolves with the script's exit and what it printed.
 */
function runScript(body: string, onOutput?: (text: string, pid: number) => void) {
  const file = path.join(dir, 'script.mjs');
  const cleanedFile = path.join(dir, 'cleaned');
  writeFileSync(
    file,
    `import { spawn, spawnSync } from 'node:child_process';
     import { appendFileSync } from 'node:fs';
     import { atExit, superviseChildren } from ${JSON.stringify(shutdownModule)};
     atExit(() => appendFileSync(${JSON.stringify(cleanedFile)}, 'cleaned'));
     const server = () => spawn(process.execPath, ['-e', 'setInterval(() => {}, 1000)']);
     ${body}`,
  );
  const child = spawn(process.execPath, [file], { stdio: ['ignore', 'pipe', 'pipe'] });
  let output = '';
  child.stdout.on('data', (chunk: Buffer) => {
    output += chunk.toString();
    onOutput?.(output, child.pid!);
  });
  child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()));
  return new Promise<{ code: number | null; output: string; cleaned: string }>((resolve) =>
    child.once('exit', (code) => {
      let cleaned = '';
      try {
        cleaned = readFileSync(cleanedFile, 'utf8');
      } catch {
        // ENOENT: the clean-up never ran.
      }
      resolve({ code, output, cleaned });
    }),
  );
}

const isAlive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    // ESRCH: the process is gone.
    return false;
  }
};

/** The pids a script printed as `pids a b`. */
const printedPids = (output: string) =>
  (/pids (\d+) (\d+)/.exec(output) ?? []).slice(1).map(Number);

const supervisedServers = `
  const children = [server(), server()];
  superviseChildren(children, { log: () => {} });
  console.log('pids', children[0].pid, children[1].pid);`;

describe('npm start and npm test: the cluster is stopped on every way out', () => {
  it('when a server is killed by a signal, stops the other server and runs the clean-up', async () => {
    const result = await runScript(supervisedServers, (output) => {
      const [first] = printedPids(output);
      if (first) process.kill(first, 'SIGKILL');
    });
    expect(result.cleaned).toBe('cleaned');
    expect(result.code).not.toBe(0);
    expect(isAlive(printedPids(result.output)[1]!)).toBe(false);
  });

  it('when the script receives SIGTERM, stops both servers and runs the clean-up', async () => {
    const result = await runScript(supervisedServers, (output, pid) => {
      if (printedPids(output).length) process.kill(pid, 'SIGTERM');
    });
    expect(result.cleaned).toBe('cleaned');
    expect(printedPids(result.output).some(isAlive)).toBe(false);
  });

  it('when the script receives SIGINT before any server runs, runs the clean-up', async () => {
    const result = await runScript(
      `console.log('ready'); setInterval(() => {}, 1000);`,
      (o, pid) => {
        if (o.includes('ready')) process.kill(pid, 'SIGINT');
      },
    );
    expect(result).toMatchObject({ code: 130, cleaned: 'cleaned' });
  });

  it('when a build or the seed fails (the script calls process.exit), runs the clean-up', async () => {
    const result = await runScript(`
      const build = spawnSync(process.execPath, ['-e', 'process.exit(3)']);
      if (build.status !== 0) process.exit(1);`);
    expect(result).toMatchObject({ code: 1, cleaned: 'cleaned' });
  });

  it('when the script itself crashes, runs the clean-up', async () => {
    const result = await runScript(`setTimeout(() => { throw new Error('boom'); }, 10);`);
    expect(result.code).toBe(1);
    expect(result.cleaned).toBe('cleaned');
    expect(result.output).toContain('boom');
  });

  it('runs each clean-up once, however many ways out are taken', async () => {
    const result = await runScript(`
      const children = [server()];
      superviseChildren(children, { log: () => {} });
      process.kill(children[0].pid, 'SIGKILL');
      process.kill(process.pid, 'SIGTERM');`);
    expect(result.cleaned).toBe('cleaned');
  });
});

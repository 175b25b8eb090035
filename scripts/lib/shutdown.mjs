// How the long-running scripts end. Clean-ups registered with `atExit` run once, synchronously,
// whichever way the script ends: a normal end, process.exit() (so `fail()` too), an uncaught
// error, or SIGINT / SIGTERM / SIGHUP. Child processes are stopped before the clean-ups run.
import { constants } from 'node:os';

const cleanups = [];
let cleanedUp = false;

/** Registers a synchronous clean-up; the last registered runs first. */
export function atExit(cleanup) {
  cleanups.push(cleanup);
  listen();
}

function runCleanups() {
  if (cleanedUp) return;
  cleanedUp = true;
  for (const cleanup of cleanups.reverse()) {
    try {
      cleanup();
    } catch (error) {
      // Any error: report it and carry on, so one failed clean-up does not skip the others.
      console.error('[batchproof] clean-up failed:', error);
    }
  }
}

/** The exit code a shell reports for a process ended by `signal`. */
export const signalExitCode = (signal) => 128 + (constants.signals[signal] ?? 1);

let onSignal = (signal) => process.exit(signalExitCode(signal));
let listening = false;

/**
 * Takes over the exit and signal events, once. Until a script registers something, Node's own
 * handling stays (a signal ends the process at once), so scripts without clean-ups are unchanged.
 */
function listen() {
  if (listening) return;
  listening = true;
  process.on('exit', runCleanups);
  for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP']) process.on(signal, () => onSignal(signal));
}

/** Replaces what a signal does (by default: exit at once, which runs the clean-ups). */
export function handleSignals(handler) {
  onSignal = handler;
  listen();
}

/** Whether a child process has ended, by exit code or by a signal. */
const ended = (child) => child.exitCode !== null || child.signalCode !== null;

/** Resolves when the child has ended (at once when it already has, or could not start). */
const whenEnded = (child) =>
  ended(child) || child.pid === undefined
    ? Promise.resolve()
    : new Promise((resolve) => child.once('exit', resolve));

/**
 * Keeps long-running children (servers) up together: when one of them ends, however it ends, or
 * when the script receives a signal, the others get SIGTERM (SIGKILL after `graceMs`), and the
 * script exits once all have ended, which runs the clean-ups. A second signal exits at once.
 */
export function superviseChildren(children, { log = console.log, graceMs = 10_000 } = {}) {
  let stopping = false;
  const stopAll = (code) => {
    if (stopping) return;
    stopping = true;
    log('stopping…');
    for (const child of children) if (!ended(child)) child.kill('SIGTERM');
    const force = setTimeout(() => {
      for (const child of children) if (!ended(child)) child.kill('SIGKILL');
    }, graceMs);
    Promise.all(children.map(whenEnded)).then(() => {
      clearTimeout(force);
      log('stopped.');
      process.exit(code);
    });
  };
  handleSignals((signal) => {
    if (stopping) process.exit(signalExitCode(signal));
    stopAll(0);
  });
  for (const child of children) {
    child.once('exit', (code, signal) => {
      if (stopping) return;
      console.error(
        `[batchproof] a server process exited (${signal ?? `code ${code}`}); shutting down.`,
      );
      stopAll(code || 1);
    });
    child.once('error', (error) => {
      if (stopping) return;
      console.error(
        `[batchproof] a server process could not run (${error.message}); shutting down.`,
      );
      stopAll(1);
    });
  }
  return { isStopping: () => stopping, stop: stopAll };
}

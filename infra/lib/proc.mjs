// Running commands and tracking the processes we start, so that we stop exactly those, by PID.
import { spawn, spawnSync } from 'node:child_process';
import { InfraError, info } from './log.mjs';

const started = []; // { name, child, stop }

/** Runs a command to completion, streaming its output; throws InfraError with `hint` on failure. */
export function run(command, args, { cwd, env, hint, quiet = false } = {}) {
  const result = spawnSync(command, args, {
    cwd,
    env: env ?? process.env,
    stdio: quiet ? ['ignore', 'pipe', 'pipe'] : 'inherit',
    encoding: 'utf8',
  });
  if (result.error)
    throw new InfraError(`${command} could not be run (${result.error.message}). ${hint ?? ''}`);
  if (result.status !== 0) {
    const tail = quiet
      ? `\n${(result.stderr || result.stdout || '').trim().split('\n').slice(-15).join('\n')}`
      : '';
    throw new InfraError(
      `${command} ${args.join(' ')} failed with exit code ${result.status}. ${hint ?? ''}${tail}`,
    );
  }
  return result.stdout ?? '';
}

/** Runs a command and resolves with its exit code (output inherited). */
export function runAsync(command, args, { cwd, env } = {}) {
  return new Promise((resolve) => {
    const child = spawn(command, args, { cwd, env: env ?? process.env, stdio: 'inherit' });
    track(`${command} ${args[0] ?? ''}`, child);
    child.on('exit', (code, signal) => {
      untrack(child);
      resolve(code ?? (signal ? 1 : 0));
    });
  });
}

/** Starts a long-running child and records it; `stop` overrides the default SIGTERM-and-wait. */
export function startChild(name, command, args, { cwd, env, logFile, stop } = {}) {
  const child = spawn(command, args, {
    cwd,
    env: env ?? process.env,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  track(name, child, stop);
  if (logFile) {
    child.stdout.pipe(logFile, { end: false });
    child.stderr.pipe(logFile, { end: false });
  }
  child.on('exit', () => untrack(child));
  return child;
}

function track(name, child, stop) {
  started.push({ name, child, stop });
}
function untrack(child) {
  const i = started.findIndex((s) => s.child === child);
  if (i >= 0) started.splice(i, 1);
}

export const isRunning = (child) => child.exitCode === null && child.signalCode === null;

/** Waits until `child` prints a line matching `pattern`, or fails with `hint`. */
export function waitForLine(child, pattern, { name, timeoutMs = 30000, hint = '' }) {
  return new Promise((resolve, reject) => {
    let buffer = '';
    const timer = setTimeout(
      () => done(new InfraError(`${name} did not become ready in ${timeoutMs / 1000}s. ${hint}`)),
      timeoutMs,
    );
    const onData = (chunk) => {
      buffer += chunk.toString();
      const m = buffer.match(pattern);
      if (m) done(null, m);
    };
    const onExit = (code) =>
      done(
        new InfraError(
          `${name} stopped during start-up (exit code ${code}). ${hint}\n${buffer.trim().split('\n').slice(-10).join('\n')}`,
        ),
      );
    function done(err, m) {
      clearTimeout(timer);
      child.stdout.off('data', onData);
      child.stderr.off('data', onData);
      child.off('exit', onExit);
      if (err) reject(err);
      else resolve(m);
    }
    child.stdout.on('data', onData);
    child.stderr.on('data', onData);
    child.on('exit', onExit);
  });
}

const waitExit = (child, ms) =>
  new Promise((resolve) => {
    if (!isRunning(child)) return resolve(true);
    const timer = setTimeout(() => resolve(false), ms);
    child.once('exit', () => {
      clearTimeout(timer);
      resolve(true);
    });
  });

/** Stops every process this script started, newest first, each by its own PID. */
export async function stopAll() {
  const list = [...started].reverse();
  for (const { name, child, stop } of list) {
    if (!isRunning(child)) continue;
    info(`stopping ${name} (PID ${child.pid})`);
    try {
      if (stop) await stop();
      else child.kill('SIGTERM');
    } catch {
      child.kill('SIGTERM');
    }
    if (!(await waitExit(child, 15000))) {
      child.kill('SIGKILL');
      await waitExit(child, 5000);
    }
  }
  started.length = 0;
}

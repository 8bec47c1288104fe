// Background processes started by the project's scripts: each one's PID is kept in <data>/run/<name>.pid so
// `npm run stop` can stop exactly what `npm start` started.
import { spawn } from "node:child_process";
import { existsSync, mkdirSync, openSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import net from "node:net";
import path from "node:path";

export function log(message: string): void {
  process.stdout.write(`lotwarden: ${message}\n`);
}

export class SetupError extends Error {}

export function pidFile(dataDir: string, name: string): string {
  return path.join(dataDir, "run", `${name}.pid`);
}

export function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

export function readPid(dataDir: string, name: string): number | null {
  const file = pidFile(dataDir, name);
  if (!existsSync(file)) return null;
  const pid = Number(readFileSync(file, "utf8").trim());
  return Number.isInteger(pid) && pid > 0 ? pid : null;
}

/** True when something accepts TCP connections on 127.0.0.1:port. */
export function portInUse(port: number, host = "127.0.0.1"): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect({ port, host });
    socket.once("connect", () => {
      socket.destroy();
      resolve(true);
    });
    socket.once("error", () => resolve(false));
    socket.setTimeout(1000, () => {
      socket.destroy();
      resolve(false);
    });
  });
}

export async function waitForPort(port: number, what: string, timeoutMs = 30_000, pid?: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (await portInUse(port)) return;
    if (pid !== undefined && !isAlive(pid)) throw new SetupError(`${what} exited during start-up; see its log`);
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new SetupError(`${what} did not open port ${port} within ${timeoutMs / 1000} s`);
}

export interface Started {
  pid: number;
  logFile: string;
}

/** Starts a detached background process, logging to <data>/logs/<name>.log, and records its PID. */
export function startDetached(
  dataDir: string,
  name: string,
  command: string,
  args: string[],
  env: NodeJS.ProcessEnv,
  cwd: string,
): Started {
  mkdirSync(path.join(dataDir, "run"), { recursive: true });
  mkdirSync(path.join(dataDir, "logs"), { recursive: true });
  const logFile = path.join(dataDir, "logs", `${name}.log`);
  const out = openSync(logFile, "a");
  const child = spawn(command, args, { cwd, env, detached: true, stdio: ["ignore", out, out] });
  if (!child.pid) throw new SetupError(`could not start ${name}`);
  child.unref();
  writeFileSync(pidFile(dataDir, name), String(child.pid));
  return { pid: child.pid, logFile };
}

/** Stops a recorded process by PID (TERM, then KILL after a grace period) and removes its PID file. */
export async function stopRecorded(dataDir: string, name: string, graceMs = 5000): Promise<boolean> {
  const pid = readPid(dataDir, name);
  rmSync(pidFile(dataDir, name), { force: true });
  if (pid === null || !isAlive(pid)) return false;
  const signal = (sig: NodeJS.Signals) => {
    try {
      process.kill(-pid, sig); // the process group: next start spawns workers of its own
    } catch {
      try {
        process.kill(pid, sig);
      } catch {
        /* already gone */
      }
    }
  };
  signal("SIGTERM");
  const deadline = Date.now() + graceMs;
  while (Date.now() < deadline && isAlive(pid)) await new Promise((r) => setTimeout(r, 100));
  if (isAlive(pid)) signal("SIGKILL");
  return true;
}

/** A recorded process still running, or null (a stale PID file is removed). */
export function runningRecorded(dataDir: string, name: string): number | null {
  const pid = readPid(dataDir, name);
  if (pid !== null && isAlive(pid)) return pid;
  rmSync(pidFile(dataDir, name), { force: true });
  return null;
}

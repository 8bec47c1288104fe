// Memory and CPU time of processes, read from /proc (Linux only).
import { execFileSync } from "node:child_process";
import { readdirSync, readFileSync } from "node:fs";

let ticksPerSecond: number | null = null;

function clockTicks(): number {
  ticksPerSecond ??= Number(execFileSync("getconf", ["CLK_TCK"]).toString().trim()) || 100;
  return ticksPerSecond;
}

/** Fields of /proc/<pid>/stat after the parenthesised command name (index 0 is field 3, the state). */
function statFields(pid: number): string[] | null {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
    return stat.slice(stat.lastIndexOf(")") + 2).split(" ");
  } catch {
    return null; // the process has ended
  }
}

export function vmRssBytes(pid: number): number {
  try {
    const match = /^VmRSS:\s+(\d+)\s+kB/m.exec(readFileSync(`/proc/${pid}/status`, "utf8"));
    return match ? Number(match[1]) * 1024 : 0;
  } catch {
    return 0;
  }
}

function listPids(): number[] {
  return readdirSync("/proc").filter((e) => /^\d+$/.test(e)).map(Number);
}

/** The PIDs below `root`, by parent PID (stat field 4). */
export function descendants(root: number): number[] {
  const children = new Map<number, number[]>();
  for (const pid of listPids()) {
    const ppid = Number(statFields(pid)?.[1]);
    if (Number.isInteger(ppid)) children.set(ppid, [...(children.get(ppid) ?? []), pid]);
  }
  const found: number[] = [];
  const visit = (pid: number) => {
    for (const child of children.get(pid) ?? []) {
      found.push(child);
      visit(child);
    }
  };
  visit(root);
  return found;
}

/**
 * CPU seconds (user + system) used by `root` and its descendants so far: utime + stime of each live process, plus
 * the root's cutime + cstime, which hold the children it has already reaped (PostgreSQL backends that exited).
 */
export function treeCpuSeconds(root: number): number {
  const own = statFields(root);
  if (own === null) return 0;
  // utime, stime, cutime, cstime are stat fields 14–17: indices 11–14 here.
  let ticks = Number(own[11]) + Number(own[12]) + Number(own[13]) + Number(own[14]);
  for (const pid of descendants(root)) {
    const f = statFields(pid);
    if (f) ticks += Number(f[11]) + Number(f[12]);
  }
  return ticks / clockTicks();
}

/** The postmaster listening on `port`: a `postgres` process whose arguments hold `-p <port>`. */
export function findPostmaster(port: number): number | null {
  for (const pid of listPids()) {
    try {
      const args = readFileSync(`/proc/${pid}/cmdline`, "utf8").split("\0");
      const at = args.indexOf("-p");
      if (args[0]?.endsWith("/postgres") && at !== -1 && args[at + 1] === String(port)) return pid;
    } catch {
      /* gone or not ours to read */
    }
  }
  return null;
}

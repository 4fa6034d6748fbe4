// CPU time read from /proc (Linux), for the benchmarks: on a machine shared with other work,
// throughput follows whatever else runs, but CPU time per answered request does not. Where /proc
// cannot be read, every figure is NaN and the tables print '-'.
import fs from 'node:fs';

const USER_HZ = 100; // clock ticks per second in /proc on Linux

/** CPU time (ms) used so far by the processes `roots` and all their descendants (threads included). */
export function treeCpuMs(roots) {
  let entries = [];
  try {
    entries = fs.readdirSync('/proc').filter((d) => /^\d+$/.test(d));
  } catch {
    return NaN;
  }
  const stats = new Map();
  for (const pid of entries) {
    try {
      const text = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
      const fields = text.slice(text.lastIndexOf(')') + 2).split(' ');
      // After the command name: state, ppid, ..., utime (14th field overall), stime (15th).
      stats.set(Number(pid), { ppid: Number(fields[1]), ticks: Number(fields[11]) + Number(fields[12]) });
    } catch {
      // The process ended meanwhile.
    }
  }
  const children = new Map();
  for (const [pid, st] of stats) children.set(st.ppid, [...(children.get(st.ppid) ?? []), pid]);
  const seen = new Set();
  const queue = roots.filter((pid) => stats.has(pid));
  if (queue.length === 0) return NaN;
  while (queue.length) {
    const pid = queue.pop();
    if (seen.has(pid)) continue;
    seen.add(pid);
    queue.push(...(children.get(pid) ?? []));
  }
  let ticks = 0;
  for (const pid of seen) ticks += stats.get(pid).ticks;
  return (ticks * 1000) / USER_HZ;
}

/** CPU time (ms) the whole machine has spent busy (every core, every process: not idle, not waiting for disk). */
export function machineBusyMs() {
  try {
    const [cpu] = fs.readFileSync('/proc/stat', 'utf8').split('\n');
    const [user, nice, system, , , irq, softirq, steal] = cpu.trim().split(/\s+/).slice(1).map(Number);
    return ((user + nice + system + irq + softirq + steal) * 1000) / USER_HZ;
  } catch {
    return NaN;
  }
}

/** The postmaster's pid, from its data folder. */
export function postmasterPid(dataDir) {
  try {
    return Number(fs.readFileSync(`${dataDir}/postmaster.pid`, 'utf8').split('\n')[0]);
  } catch {
    return NaN;
  }
}

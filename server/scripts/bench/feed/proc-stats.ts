// CPU and memory of a process from /proc (Linux): utime + stime in clock ticks, VmRSS and VmHWM in KiB.
import { readdirSync, readFileSync, readlinkSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { availableParallelism } from 'node:os';

const CLOCK_TICKS_PER_SECOND = (() => {
  const r = spawnSync('getconf', ['CLK_TCK'], { encoding: 'utf8' });
  const n = Number(r.stdout?.trim());
  return Number.isFinite(n) && n > 0 ? n : 100; // 100 is the Linux default (USER_HZ), used when getconf is missing
})();

/** Fields of /proc/<pid>/stat after the command name, which may itself hold spaces and parentheses. */
function statFields(pid: number): string[] {
  const raw = readFileSync(`/proc/${pid}/stat`, 'utf8');
  return raw.slice(raw.lastIndexOf(')') + 2).split(' ');
}

/** CPU time used so far, in seconds (user + system). */
export function cpuSeconds(pid: number): number {
  const f = statFields(pid);
  // After the name: state is field 3, so utime (14) and stime (15) sit at offsets 11 and 12.
  return (Number(f[11]) + Number(f[12])) / CLOCK_TICKS_PER_SECOND;
}

export interface Memory {
  rssMiB: number;
  peakRssMiB: number;
}

export function memory(pid: number): Memory {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const kib = (field: string) => Number(new RegExp(`^${field}:\\s+(\\d+)\\s+kB`, 'm').exec(status)?.[1] ?? NaN);
  return { rssMiB: kib('VmRSS') / 1024, peakRssMiB: kib('VmHWM') / 1024 };
}

function listeningInodes(port: number): Set<string> {
  const inodes = new Set<string>();
  for (const table of ['/proc/net/tcp', '/proc/net/tcp6']) {
    let text = '';
    try {
      text = readFileSync(table, 'utf8');
    } catch {
      continue; // no IPv6 on this machine
    }
    for (const line of text.split('\n').slice(1)) {
      const cols = line.trim().split(/\s+/);
      if (cols.length < 10) continue;
      const localPort = parseInt(cols[1].split(':').pop() ?? '', 16);
      if (localPort === port && cols[3] === '0A') inodes.add(cols[9]); // 0A is TCP_LISTEN
    }
  }
  return inodes;
}

function allPids(): number[] {
  return readdirSync('/proc').filter((d) => /^\d+$/.test(d)).map(Number);
}

function descendantsOf(root: number): number[] {
  const children = new Map<number, number[]>();
  for (const pid of allPids()) {
    try {
      const parent = Number(statFields(pid)[1]);
      children.set(parent, [...(children.get(parent) ?? []), pid]);
    } catch {
      // the process ended while we looked
    }
  }
  const out = [root];
  for (let i = 0; i < out.length; i++) out.push(...(children.get(out[i]) ?? []));
  return out;
}

/**
 * The process that listens on `port`, looked for among `root` and its descendants when given (the server is
 * started through the tsx wrapper, whose child is the real Node process), else among all processes.
 */
export function pidListeningOn(port: number, root?: number): number | null {
  const inodes = listeningInodes(port);
  if (!inodes.size) return null;
  for (const pid of root ? descendantsOf(root) : allPids()) {
    let fds: string[] = [];
    try {
      fds = readdirSync(`/proc/${pid}/fd`);
    } catch {
      continue;
    }
    for (const fd of fds) {
      try {
        const m = /^socket:\[(\d+)\]$/.exec(readlinkSync(`/proc/${pid}/fd/${fd}`));
        if (m && inodes.has(m[1])) return pid;
      } catch {
        // descriptor closed while we looked
      }
    }
  }
  return null;
}

export interface CpuReport {
  /** Average over the window, in percent of one core (200 % is both cores of a 2-core machine). */
  averagePercent: number;
  /** The busiest one-second sample. */
  peakPercent: number;
}

/** Samples a process's CPU once a second until stopped; the figures cover only the sampled window. */
export function sampleCpu(pid: number) {
  const startedAt = Date.now();
  const startCpu = cpuSeconds(pid);
  let lastAt = startedAt;
  let lastCpu = startCpu;
  let peak = 0;
  const readCpu = () => {
    try {
      return cpuSeconds(pid);
    } catch {
      return lastCpu; // the process has gone: its last reading stands
    }
  };
  const timer = setInterval(() => {
    const now = Date.now();
    const cpu = readCpu();
    peak = Math.max(peak, ((cpu - lastCpu) / ((now - lastAt) / 1000)) * 100);
    lastAt = now;
    lastCpu = cpu;
  }, 1000);
  return {
    stop(): CpuReport {
      clearInterval(timer);
      const seconds = (Date.now() - startedAt) / 1000;
      return { averagePercent: ((readCpu() - startCpu) / seconds) * 100, peakPercent: peak };
    },
  };
}

function machineTicks(): { busy: number; total: number } {
  // First line of /proc/stat: cpu user nice system idle iowait irq softirq steal …, summed over all cores.
  const cols = readFileSync('/proc/stat', 'utf8').split('\n')[0].trim().split(/\s+/).slice(1, 9).map(Number);
  const total = cols.reduce((a, b) => a + b, 0);
  return { busy: total - cols[3] - cols[4], total };
}

/**
 * How busy the whole machine was over a window, in percent of one core (so 200 % is a 2-core machine flat out):
 * what our processes did not use of it was used by others and competed with the bench.
 */
export function sampleMachine() {
  const start = machineTicks();
  const cores = availableParallelism();
  return {
    stop(): { busyPercent: number; cores: number } {
      const end = machineTicks();
      return { busyPercent: ((end.busy - start.busy) / Math.max(1, end.total - start.total)) * cores * 100, cores };
    },
  };
}

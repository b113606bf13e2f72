/** The app server's process, found by the port it listens on, and its resident memory. */
import { readdirSync, readFileSync, readlinkSync } from "node:fs";

/** Socket inodes listening on `port` (IPv4 and IPv6), from /proc/net/tcp*. */
function listeningInodes(port: number): Set<string> {
  const hexPort = port.toString(16).toUpperCase().padStart(4, "0");
  const inodes = new Set<string>();
  for (const table of ["/proc/net/tcp", "/proc/net/tcp6"]) {
    let text = "";
    try {
      text = readFileSync(table, "utf8");
    } catch {
      continue;
    }
    for (const line of text.split("\n").slice(1)) {
      const cols = line.trim().split(/\s+/);
      // local_address is "ADDR:PORT"; state 0A is LISTEN; the inode is column 10.
      if (cols[1]?.endsWith(`:${hexPort}`) && cols[3] === "0A" && cols[9]) inodes.add(cols[9]);
    }
  }
  return inodes;
}

/** The pid of the process listening on `port`, or null. */
export function pidListeningOn(port: number): number | null {
  const inodes = listeningInodes(port);
  if (inodes.size === 0) return null;
  for (const entry of readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    let fds: string[];
    try {
      fds = readdirSync(`/proc/${entry}/fd`);
    } catch {
      continue;
    }
    for (const fd of fds) {
      try {
        const target = readlinkSync(`/proc/${entry}/fd/${fd}`);
        const inode = /^socket:\[(\d+)\]$/.exec(target)?.[1];
        if (inode && inodes.has(inode)) return Number(entry);
      } catch {
        // The descriptor closed while we looked.
      }
    }
  }
  return null;
}

/** Resident set size of `pid` in bytes (VmRSS), or null when it is gone. */
export function residentBytes(pid: number): number | null {
  try {
    const kb = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, "utf8"))?.[1];
    return kb ? Number(kb) * 1024 : null;
  } catch {
    return null;
  }
}

/** Samples `pid`'s resident memory every `everyMs` until stop() is called; stop() returns the peak in bytes. */
export function watchMemory(pid: number, everyMs = 50): { stop: () => number } {
  let peak = residentBytes(pid) ?? 0;
  const timer = setInterval(() => {
    peak = Math.max(peak, residentBytes(pid) ?? 0);
  }, everyMs);
  return {
    stop: () => {
      clearInterval(timer);
      return Math.max(peak, residentBytes(pid) ?? 0);
    },
  };
}

// One process per data directory: PGlite does not lock its files, so the server takes a lock
// file (created atomically) and a second process on the same directory refuses to start.
import fs from "node:fs";
import path from "node:path";

export class DataDirLockedError extends Error {}

// Directories this process holds: a second acquire in the same process is refused too.
const held = new Set<string>();

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === "EPERM";
  }
}

export function acquireDataLock(dataDir: string): () => void {
  fs.mkdirSync(dataDir, { recursive: true });
  const file = path.join(dataDir, "facula.lock");
  const key = path.resolve(dataDir);
  if (held.has(key)) throw new DataDirLockedError(`The data directory ${dataDir} is already in use by this process.`);
  for (let attempt = 0; attempt < 2; attempt++) {
    try {
      const fd = fs.openSync(file, "wx");
      fs.writeSync(fd, JSON.stringify({ pid: process.pid, startedAt: new Date().toISOString() }));
      fs.closeSync(fd);
      let released = false;
      held.add(key);
      return () => {
        if (released) return;
        released = true;
        held.delete(key);
        fs.rmSync(file, { force: true });
      };
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code !== "EEXIST") throw err;
      const holder = readHolder(file);
      if (holder && holder.pid !== process.pid && isAlive(holder.pid)) {
        throw new DataDirLockedError(
          `The data directory ${dataDir} is in use by another Facula process (pid ${holder.pid}, started ${holder.startedAt}). ` +
            "Stop that process or choose another DATA_DIR.",
        );
      }
      // A stale lock from a process that died: remove it and try once more.
      fs.rmSync(file, { force: true });
    }
  }
  throw new DataDirLockedError(`Could not lock the data directory ${dataDir}.`);
}

function readHolder(file: string): { pid: number; startedAt: string } | null {
  try {
    const value = JSON.parse(fs.readFileSync(file, "utf8")) as { pid: number; startedAt: string };
    return Number.isInteger(value.pid) ? value : null;
  } catch {
    return null;
  }
}

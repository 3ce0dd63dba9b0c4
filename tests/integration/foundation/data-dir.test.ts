import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterEach, describe, expect, it } from "vitest";
import { acquireDataLock, DataDirLockedError } from "@/server/runtime/data-lock";
import { loadOrCreateAuthSecret } from "@/server/runtime/secret";

const dirs: string[] = [];
const freshDir = () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "facula-lock-"));
  dirs.push(dir);
  return dir;
};
afterEach(() => {
  for (const dir of dirs.splice(0)) fs.rmSync(dir, { recursive: true, force: true });
});

const lockFile = (dir: string) => path.join(dir, "facula.lock");
const writeHolder = (dir: string, pid: number) =>
  fs.writeFileSync(lockFile(dir), JSON.stringify({ pid, startedAt: "2026-05-04T09:30:00.000Z" }));

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === "EPERM";
  }
}

/** A process id nobody holds right now, searched downward from 999999. */
function deadPid(): number {
  for (let pid = 999_999; pid > 900_000; pid--) if (!isAlive(pid)) return pid;
  throw new Error("no free pid found");
}

describe("the data-directory lock", () => {
  it("writes our pid into a new lock file and removes it on release", () => {
    const dir = freshDir();
    const release = acquireDataLock(dir);
    expect(JSON.parse(fs.readFileSync(lockFile(dir), "utf8"))).toMatchObject({ pid: process.pid });
    release();
    expect(fs.existsSync(lockFile(dir))).toBe(false);
    expect(() => release()).not.toThrow();
  });

  it("refuses a directory locked by another live process, naming the directory and the holder", () => {
    const dir = freshDir();
    expect(isAlive(process.ppid)).toBe(true);
    writeHolder(dir, process.ppid);
    expect(() => acquireDataLock(dir)).toThrow(DataDirLockedError);
    expect(() => acquireDataLock(dir)).toThrow(
      `The data directory ${dir} is in use by another Facula process (pid ${process.ppid}`,
    );
    expect(JSON.parse(fs.readFileSync(lockFile(dir), "utf8")).pid).toBe(process.ppid);
  });

  it("takes over a stale lock left by a process that has died", () => {
    const dir = freshDir();
    const pid = deadPid();
    writeHolder(dir, pid);
    const release = acquireDataLock(dir);
    expect(JSON.parse(fs.readFileSync(lockFile(dir), "utf8")).pid).toBe(process.pid);
    release();
  });

  it("takes over a lock file that is not readable as a lock", () => {
    const dir = freshDir();
    fs.writeFileSync(lockFile(dir), "half-writ");
    const release = acquireDataLock(dir);
    expect(JSON.parse(fs.readFileSync(lockFile(dir), "utf8")).pid).toBe(process.pid);
    release();
  });

  it("creates a data directory that does not exist yet", () => {
    const dir = path.join(freshDir(), "nested", "data");
    acquireDataLock(dir)();
    expect(fs.statSync(dir).isDirectory()).toBe(true);
  });
});

describe("the sign-in secret", () => {
  it("prefers AUTH_SECRET from the environment and writes nothing", () => {
    const dir = freshDir();
    expect(loadOrCreateAuthSecret(dir, { AUTH_SECRET: "from-env" })).toBe("from-env");
    expect(fs.existsSync(path.join(dir, "auth-secret"))).toBe(false);
  });

  it("generates a long secret once, readable by the owner only, and reuses it", () => {
    const dir = freshDir();
    const first = loadOrCreateAuthSecret(dir, {});
    expect(first.length).toBeGreaterThanOrEqual(32);
    expect(fs.statSync(path.join(dir, "auth-secret")).mode & 0o777).toBe(0o600);
    expect(loadOrCreateAuthSecret(dir, {})).toBe(first);
    expect(loadOrCreateAuthSecret(freshDir(), {})).not.toBe(first);
  });
});

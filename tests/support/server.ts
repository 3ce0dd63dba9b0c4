// Starts the built app as its own process (the real start script) on a free port with its own
// data directory, and stops it again. Browser and route tests use this.
import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";

export interface RunningServer {
  baseUrl: string;
  dataDir: string;
  port: number;
  output: () => string;
  stop: () => Promise<void>;
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.listen(0, "127.0.0.1", () => {
      const address = srv.address();
      srv.close(() => (typeof address === "object" && address ? resolve(address.port) : reject(new Error("no port"))));
    });
  });
}

export function newDataDir(label: string): string {
  return fs.mkdtempSync(path.join(os.tmpdir(), `facula-${label}-`));
}

export async function startServer(options: { dataDir?: string; port?: number; env?: Record<string, string> } = {}): Promise<RunningServer> {
  const dataDir = options.dataDir ?? newDataDir("e2e");
  const port = options.port ?? (await freePort());
  const child: ChildProcess = spawn(process.execPath, ["--import", "tsx", "scripts/start.ts"], {
    cwd: process.cwd(),
    // The two-year demo archive takes seconds to load; a test that needs it passes FACULA_DEMO_ARCHIVE: "on".
    env: { ...process.env, DATA_DIR: dataDir, PORT: String(port), HOST: "127.0.0.1", AUTH_SECRET: "", FACULA_DEMO_ARCHIVE: "off", ...options.env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let log = "";
  child.stdout?.on("data", (d) => (log += String(d)));
  child.stderr?.on("data", (d) => (log += String(d)));
  const baseUrl = `http://127.0.0.1:${port}`;
  const exited = new Promise<number | null>((resolve) => child.once("exit", (code) => resolve(code)));
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server exited early (${child.exitCode}):\n${log}`);
    if (/Server listening/.test(log)) {
      const ok = await fetch(`${baseUrl}/api/health`).then((r) => r.ok).catch(() => false);
      if (ok) break;
    }
    if (Date.now() > deadline) {
      child.kill("SIGKILL");
      throw new Error(`server did not start in time:\n${log}`);
    }
    await new Promise((r) => setTimeout(r, 150));
  }
  return {
    baseUrl,
    dataDir,
    port,
    output: () => log,
    stop: async () => {
      if (child.exitCode !== null) return;
      child.kill("SIGTERM");
      const timer = setTimeout(() => child.kill("SIGKILL"), 10_000);
      await exited;
      clearTimeout(timer);
    },
  };
}

/** Runs the start script expecting it to refuse (e.g. a locked data directory); returns its output. */
export async function startExpectingFailure(dataDir: string): Promise<{ code: number | null; output: string }> {
  const port = await freePort();
  const child = spawn(process.execPath, ["--import", "tsx", "scripts/start.ts"], {
    cwd: process.cwd(),
    env: { ...process.env, DATA_DIR: dataDir, PORT: String(port), HOST: "127.0.0.1" },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let output = "";
  child.stdout?.on("data", (d) => (output += String(d)));
  child.stderr?.on("data", (d) => (output += String(d)));
  // A start that wrongly succeeds would never exit: give up after 60 s.
  const timer = setTimeout(() => child.kill("SIGKILL"), 60_000);
  const code = await new Promise<number | null>((resolve) => child.once("exit", resolve));
  clearTimeout(timer);
  return { code, output };
}

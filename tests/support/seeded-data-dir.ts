// A data directory already migrated and seeded, copied from a template made once per set of
// migrations and demo data, so that end-to-end files skip the slow first start of PGlite.
import { createHash } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { newDataDir, startServer } from "./server";

// Files that decide what a freshly seeded directory holds.
const INPUTS = ["drizzle", "src/server/demo", "src/db/schema"];
// Per-run state that a copy must not inherit: the lock, the caught mail, the signing secret.
const LEFT_OUT = new Set(["facula.lock", "mailbox.jsonl", "auth-secret"]);

function hashInputs(): string {
  const hash = createHash("sha256");
  for (const root of INPUTS) {
    const files = fs
      .readdirSync(root, { recursive: true, withFileTypes: true })
      .filter((e) => e.isFile())
      .map((e) => path.join(e.parentPath, e.name))
      .sort();
    for (const file of files) hash.update(file).update(fs.readFileSync(file));
  }
  return hash.digest("hex").slice(0, 16);
}

async function ensureTemplate(): Promise<string> {
  const template = path.join(os.tmpdir(), `facula-template-${hashInputs()}`);
  if (fs.existsSync(path.join(template, "pgdata"))) {
    const now = new Date();
    fs.utimesSync(template, now, now); // marks it as in use for pruneOldTemplates
    return template;
  }
  const building = newDataDir("template-build");
  const server = await startServer({ dataDir: building });
  await server.stop();
  try {
    fs.renameSync(building, template);
  } catch {
    // Another run finished the same template first; its copy is as good as ours.
    fs.rmSync(building, { recursive: true, force: true });
  }
  pruneOldTemplates(template);
  return template;
}

/** Templates of earlier migrations pile up at 40 MB each; an hour unused is long enough. */
function pruneOldTemplates(keep: string): void {
  const hourAgo = Date.now() - 3600_000;
  for (const name of fs.readdirSync(os.tmpdir())) {
    const dir = path.join(os.tmpdir(), name);
    if (!name.startsWith("facula-template-") || dir === keep) continue;
    if (fs.statSync(dir).mtimeMs < hourAgo) fs.rmSync(dir, { recursive: true, force: true });
  }
}

/** A fresh copy of the seeded template, for one test file's server. */
export async function seededDataDir(label: string): Promise<string> {
  const template = await ensureTemplate();
  const dir = newDataDir(label);
  fs.cpSync(template, dir, { recursive: true, filter: (src) => !LEFT_OUT.has(path.basename(src)) });
  return dir;
}

/** Removes a data directory a test file made, once its server has stopped. */
export function removeDataDir(dir: string | undefined): void {
  if (dir && dir.startsWith(os.tmpdir())) fs.rmSync(dir, { recursive: true, force: true });
}

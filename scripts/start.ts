// Starts Facula: locks the data directory, prepares the secret, starts the local e-mail fake,
// opens PGlite and applies migrations, seeds the demo office on first start, then serves.
import fs from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { closeDatabase, openDatabase } from "../src/db/client";
import { readConfig } from "../src/server/config";
import { seedDemoOffice } from "../src/server/demo/seed";
import { startDeliveryWorker } from "../src/server/dissemination/worker";
import { DEMO_PEOPLE } from "../src/server/demo/people";
import { ROLE_LABELS } from "../src/lib/auth/roles";
import { acquireDataLock, DataDirLockedError } from "../src/server/runtime/data-lock";
import { loadOrCreateAuthSecret } from "../src/server/runtime/secret";
import { startResendFake } from "./resend-fake.mjs";

async function main(): Promise<void> {
  const config = readConfig();
  // FACULA_DIST_DIR lets a second build (e.g. a test build) run from its own folder.
  const entry = path.resolve(process.env.FACULA_DIST_DIR || "dist", "server/entry.mjs");
  if (!fs.existsSync(entry)) fail("The server is not built: run `npm run build` (or `npm start`, which builds first).");

  let release: () => void;
  try {
    release = acquireDataLock(config.dataDir);
  } catch (err) {
    if (err instanceof DataDirLockedError) fail(err.message);
    throw err;
  }
  process.env.AUTH_SECRET = loadOrCreateAuthSecret(config.dataDir);

  let fake: { url: string; close(): Promise<void> } | null = null;
  if (config.isEmailFake) {
    fake = await startResendFake({
      host: "127.0.0.1",
      port: Number(process.env.EMAIL_FAKE_PORT || 0),
      storeFile: path.join(config.dataDir, "mailbox.jsonl"),
    });
    process.env.RESEND_BASE_URL = fake!.url;
    process.env.RESEND_API_KEY ||= "re_local_fake_key";
  } else if (!process.env.RESEND_API_KEY) {
    fail("EMAIL_FAKE=off needs RESEND_API_KEY for the real e-mail service.");
  }
  process.env.PUBLIC_BASE_URL ||= config.publicBaseUrl;
  process.env.HOST = config.host;
  process.env.PORT = String(config.port);

  const t0 = Date.now();
  await openDatabase({ location: path.join(config.dataDir, "pgdata"), migrationsFolder: path.resolve("drizzle") });
  const { seeded } = await seedDemoOffice();
  console.log(`[facula] database ready in ${Date.now() - t0} ms at ${config.dataDir}${seeded ? " (demo office seeded)" : ""}`);

  // Delivers queued e-mails (resuming any left mid-way by a previous process) and escalates
  // unacknowledged alerts.
  const worker = startDeliveryWorker({ intervalMs: 2000 });

  const shutdown = async (signal: string) => {
    console.log(`[facula] ${signal}: shutting down`);
    await worker.stop().catch(() => undefined);
    await closeDatabase().catch(() => undefined);
    await fake?.close().catch(() => undefined);
    release();
    process.exit(0);
  };
  process.on("SIGINT", () => void shutdown("SIGINT"));
  process.on("SIGTERM", () => void shutdown("SIGTERM"));
  process.on("exit", () => release());

  await import(pathToFileURL(entry).href);
  printBanner(config.publicBaseUrl, fake?.url ?? "real Resend service");
}

function printBanner(url: string, mail: string): void {
  const lines = [
    `[facula] Facula is serving on ${url}`,
    `[facula] e-mail: ${mail}`,
    "[facula] Demo sign-ins (invented demo accounts):",
    ...DEMO_PEOPLE.map((p) => `           ${ROLE_LABELS[p.role].padEnd(14)} ${p.email.padEnd(38)} ${p.password}`),
  ];
  console.log(lines.join("\n"));
}

function fail(message: string): never {
  console.error(`[facula] ${message}`);
  process.exit(1);
}

main().catch((err) => {
  console.error("[facula] failed to start:", err);
  process.exit(1);
});

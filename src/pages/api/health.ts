import { sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { allowPublic } from "@/server/auth/guards";
import { readConfig } from "@/server/config";
import { getMailer } from "@/server/delivery/transactional";
import { json, withApi } from "@/server/http/handler";

// Public for monitoring; reports reachability only, never data.
export const GET = withApi(async () => {
  allowPublic();
  const t0 = performance.now();
  const database = await getDb()
    .execute(sql`select 1`)
    .then(() => ({ ok: true, latencyMs: Math.round((performance.now() - t0) * 10) / 10 }))
    .catch((err: unknown) => ({ ok: false, detail: String(err) }));
  const email = await getMailer()
    .checkHealth()
    .catch((err: unknown) => ({ ok: false, detail: String(err) }));
  const ok = database.ok && email.ok;
  return json({ status: ok ? "ok" : "degraded", database, email: { ...email, mode: readConfig().isEmailFake ? "local-fake" : "resend" } }, ok ? 200 : 503);
});

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { listAudit, recordAudit } from "@/server/audit/audit.db";
import { runWithRequestFacts } from "@/server/http/request-context";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";

beforeAll(async () => {
  await useTestDatabase();
  await runWithRequestFacts({ ip: "192.0.2.7", requestId: "r" }, () =>
    recordAudit({
      actor: { id: 1, email: "sam@halden-ridge.example" },
      action: "settings.changed",
      targetType: "settings",
      targetId: "office",
      details: { officeName: "Desk" },
    }),
  );
});
afterAll(closeTestDatabase);

/** The database's own refusal: drizzle wraps it, the PostgreSQL error is the cause. */
async function refusalOf(
  statement: ReturnType<typeof sql>,
): Promise<{ code?: string; message?: string }> {
  const err = await getDb()
    .execute(statement)
    .then(
      () => null,
      (e: unknown) => e,
    );
  const cause = (err as { cause?: { code?: string; message?: string } } | null)?.cause;
  return { code: cause?.code, message: cause?.message };
}

const countRows = async () => {
  const result = await getDb().execute<{ n: number }>(
    sql`select count(*)::int as n from audit_events`,
  );
  return result.rows[0]?.n;
};

describe("the audit trail", () => {
  it("records who, what, on what, with details and the client address", async () => {
    const { rows, total } = await listAudit({ page: 1, pageSize: 10 });
    expect(total).toBe(1);
    expect(rows[0]).toMatchObject({
      actorEmail: "sam@halden-ridge.example",
      action: "settings.changed",
      targetType: "settings",
      targetId: "office",
      details: { officeName: "Desk" },
      ip: "192.0.2.7",
    });
  });

  it("accepts new rows through plain SQL", async () => {
    await getDb().execute(sql`insert into audit_events (action) values ('test.appended')`);
    expect(await countRows()).toBe(2);
  });

  it("refuses UPDATE in the database itself and leaves the row as it was", async () => {
    // 42501 is SQLSTATE insufficient_privilege (PostgreSQL manual, appendix A).
    expect(await refusalOf(sql`update audit_events set action = 'rewritten'`)).toEqual({
      code: "42501",
      message: "audit_events is append-only (UPDATE refused)",
    });
    const { rows } = await listAudit({ page: 1, pageSize: 10 });
    expect(rows.map((r) => r.action).sort()).toEqual(["settings.changed", "test.appended"]);
  });

  it("refuses DELETE and TRUNCATE", async () => {
    expect(await refusalOf(sql`delete from audit_events where action = 'test.appended'`)).toEqual({
      code: "42501",
      message: "audit_events is append-only (DELETE refused)",
    });
    expect(await refusalOf(sql`truncate audit_events`)).toEqual({
      code: "42501",
      message: "audit_events is append-only (TRUNCATE refused)",
    });
    expect(await countRows()).toBe(2);
  });

  it("filters by action prefix and by actor", async () => {
    expect((await listAudit({ action: "settings", page: 1, pageSize: 10 })).total).toBe(1);
    expect((await listAudit({ action: "user.", page: 1, pageSize: 10 })).total).toBe(0);
    expect((await listAudit({ actor: "sam@", page: 1, pageSize: 10 })).total).toBe(1);
  });
});

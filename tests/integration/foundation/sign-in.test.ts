import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { desc, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { auditEvents, signInFailures } from "@/db/schema";
import { checkCredentials } from "@/server/auth/sign-in";
import { runWithRequestFacts } from "@/server/http/request-context";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { insertPerson } from "./people-fixture";

const NOW = new Date("2026-05-04T09:30:00Z");
const PASSWORD = "corona-hole-2026";

beforeAll(async () => {
  await useTestDatabase();
  await insertPerson({
    email: "active@halden-ridge.example",
    role: "forecaster",
    name: "Active One",
    password: PASSWORD,
  });
  await insertPerson({
    email: "gone@halden-ridge.example",
    role: "verifier",
    password: PASSWORD,
    isActive: false,
  });
  await insertPerson({ email: "invited@halden-ridge.example", role: "verifier" });
});
afterAll(closeTestDatabase);

const from = <T>(ip: string, fn: () => Promise<T>) =>
  runWithRequestFacts({ ip, requestId: "t" }, fn);
const lastAudit = async () =>
  (await getDb().select().from(auditEvents).orderBy(desc(auditEvents.id)).limit(1))[0];

describe("checkCredentials", () => {
  it("returns the account for the right password, whatever the case of the address", async () => {
    const user = await from("10.0.0.1", () =>
      checkCredentials({ email: " Active@Halden-Ridge.example ", password: PASSWORD }, NOW),
    );
    expect(user).toEqual({
      id: expect.any(String),
      email: "active@halden-ridge.example",
      name: "Active One",
      role: "forecaster",
    });
    expect(await lastAudit()).toMatchObject({
      action: "auth.sign_in",
      actorEmail: "active@halden-ridge.example",
      ip: "10.0.0.1",
    });
  });

  it("answers a wrong password and an unknown address the same way: null", async () => {
    const wrongPassword = await from("10.0.0.2", () =>
      checkCredentials({ email: "active@halden-ridge.example", password: "corona-hole-2025" }, NOW),
    );
    const unknownAddress = await from("10.0.0.2", () =>
      checkCredentials({ email: "nobody@halden-ridge.example", password: PASSWORD }, NOW),
    );
    expect(wrongPassword).toBeNull();
    expect(unknownAddress).toBeNull();
    expect((await lastAudit())?.details).toEqual({
      email: "nobody@halden-ridge.example",
      reason: "unknown account",
    });
  });

  it("refuses a deactivated account even with its right password, and an invited one without a password", async () => {
    expect(
      await from("10.0.0.3", () =>
        checkCredentials({ email: "gone@halden-ridge.example", password: PASSWORD }, NOW),
      ),
    ).toBeNull();
    expect((await lastAudit())?.details).toMatchObject({ reason: "deactivated" });
    expect(
      await from("10.0.0.3", () =>
        checkCredentials({ email: "invited@halden-ridge.example", password: PASSWORD }, NOW),
      ),
    ).toBeNull();
  });

  it("refuses input that is not a sign-in form without recording a failure", async () => {
    const before = (await getDb().select().from(signInFailures)).length;
    for (const raw of [
      null,
      {},
      { email: "active@halden-ridge.example" },
      { email: "x", password: PASSWORD },
    ]) {
      expect(await checkCredentials(raw, NOW)).toBeNull();
    }
    expect((await getDb().select().from(signInFailures)).length).toBe(before);
  });

  it("records each failure under the lower-cased address and the client address", async () => {
    await from("10.0.0.4", () =>
      checkCredentials({ email: "Case@Halden-Ridge.example", password: "wrong-one-1" }, NOW),
    );
    const rows = await getDb()
      .select()
      .from(signInFailures)
      .where(eq(signInFailures.email, "case@halden-ridge.example"));
    expect(rows.map((r) => r.ip)).toEqual(["10.0.0.4"]);
  });
});

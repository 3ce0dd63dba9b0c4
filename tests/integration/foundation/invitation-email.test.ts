import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import type { CurrentUser } from "@/lib/auth/roles";
import { getCaught, listCaught } from "@/server/delivery/mailbox";
import { inviteUser } from "@/server/users/users.service";
import {
  closeTestDatabase,
  useFakeMail,
  useTestDatabase,
  type FakeMail,
} from "../../support/test-db";
import { insertPerson, readAuditActions, readUser } from "./people-fixture";

let fake: FakeMail;
let admin: CurrentUser;

beforeAll(async () => {
  fake = await useFakeMail();
  await useTestDatabase();
  admin = await insertPerson({ email: "admin@halden-ridge.example", role: "admin" });
});
afterAll(async () => {
  await closeTestDatabase();
  await fake.close();
});
beforeEach(() => {
  fake.reset();
  delete process.env.EMAIL_FAKE;
});

describe("the e-mail path of invitations", () => {
  it("keeps the account when the e-mail service refuses, and records the failure", async () => {
    fake.setFailure({ status: 422, count: 1 });
    const result = await inviteUser(
      { email: "bounce@halden-ridge.example", name: "Bounce", role: "verifier" },
      admin,
    );
    expect(result).toMatchObject({
      emailSent: false,
      emailError: expect.stringContaining("Injected failure 422"),
    });
    expect(await readUser(result.userId)).toMatchObject({ email: "bounce@halden-ridge.example" });
    expect(await readAuditActions(result.userId)).toEqual([
      "user.invited",
      "email.invitation_failed",
    ]);
    expect(fake.messages()).toEqual([]);
  });

  it("lets the mailbox list and open what the fake caught", async () => {
    await inviteUser(
      { email: "mailbox@halden-ridge.example", name: "Mail Box", role: "forecaster" },
      admin,
    );
    await inviteUser(
      { email: "other@halden-ridge.example", name: "Other", role: "forecaster" },
      admin,
    );
    const all = await listCaught({ page: 1, pageSize: 25 });
    expect(all.total).toBe(2);
    const filtered = await listCaught({
      to: "mailbox@halden-ridge.example",
      page: 1,
      pageSize: 25,
    });
    expect(filtered.messages.map((m) => m.to)).toEqual([["mailbox@halden-ridge.example"]]);
    const opened = await getCaught(filtered.messages[0]?.id ?? "");
    expect(opened.text).toContain("/invitations/accept?token=");
    await expect(getCaught("no-such-message")).rejects.toMatchObject({ code: "NOT_FOUND" });
  });

  it("has no mailbox when the real e-mail service is configured", async () => {
    process.env.EMAIL_FAKE = "off";
    await expect(listCaught({ page: 1, pageSize: 25 })).rejects.toMatchObject({
      code: "NOT_FOUND",
      message: "The mailbox exists only while the local e-mail fake is in use.",
    });
  });
});

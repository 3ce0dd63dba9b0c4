import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { CurrentUser } from "@/lib/auth/roles";
import { AppError } from "@/server/http/errors";
import {
  acceptInvitation,
  inspectInvitation,
  inviteUser,
  resendInvitation,
} from "@/server/users/users.service";
import {
  closeTestDatabase,
  useFakeMail,
  useTestDatabase,
  type FakeMail,
} from "../../support/test-db";
import { insertPerson, readAuditActions, readInvitations, tokenFromMail } from "./people-fixture";

const NOW = new Date("2026-05-04T09:30:00Z");
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

const tokensTo = (email: string) =>
  fake
    .messages()
    .filter((m) => [m.to].flat().includes(email))
    .map((m) => tokenFromMail(m.text));

describe("resending an invitation", () => {
  it("revokes the earlier link and sends a new one that works", async () => {
    const email = "resend@halden-ridge.example";
    const { userId } = await inviteUser(
      { email, name: "Resend Person", role: "duty_officer" },
      admin,
      NOW,
    );
    const later = new Date(NOW.getTime() + 3600_000);
    expect(await resendInvitation(userId, admin, later)).toEqual({ userId, emailSent: true });

    const [newest, oldest] = tokensTo(email); // the fake lists newest first
    expect(oldest).toBeDefined();
    expect(newest).not.toBe(oldest);
    expect(await inspectInvitation(oldest ?? "", later)).toEqual({
      ok: false,
      message: "This invitation was replaced by a newer one. Use the link in the latest e-mail.",
    });
    const rows = await readInvitations(userId);
    expect(rows.map((r) => r.revokedAt?.getTime() ?? null)).toEqual([later.getTime(), null]);
    expect(await readAuditActions(userId)).toEqual([
      "user.invited",
      "email.invitation_sent",
      "user.invitation_resent",
      "email.invitation_sent",
    ]);
    await expect(acceptInvitation(oldest ?? "", "old-link-pass-1", later)).rejects.toThrow(
      AppError,
    );
    expect(await acceptInvitation(newest ?? "", "new-link-pass-1", later)).toEqual({ email });
  });

  it("refuses to resend to someone who already set a password, or to nobody", async () => {
    const email = "done@halden-ridge.example";
    const { userId } = await inviteUser(
      { email, name: "Done Person", role: "forecaster" },
      admin,
      NOW,
    );
    await acceptInvitation(tokensTo(email)[0] ?? "", "already-set-pass-1", NOW);
    await expect(resendInvitation(userId, admin, NOW)).rejects.toMatchObject({ code: "CONFLICT" });
    await expect(resendInvitation(987654, admin, NOW)).rejects.toMatchObject({ code: "NOT_FOUND" });
  });
});

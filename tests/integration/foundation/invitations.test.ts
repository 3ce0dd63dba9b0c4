import bcrypt from "bcryptjs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { CurrentUser } from "@/lib/auth/roles";
import { AppError } from "@/server/http/errors";
import { acceptInvitation, inspectInvitation, inviteUser } from "@/server/users/users.service";
import {
  closeTestDatabase,
  useFakeMail,
  useTestDatabase,
  type FakeMail,
} from "../../support/test-db";
import {
  insertPerson,
  readAuditActions,
  readInvitations,
  readUser,
  tokenFromMail,
} from "./people-fixture";

const NOW = new Date("2026-05-04T09:30:00Z");
const HOUR = 3600_000;
let fake: FakeMail;
let admin: CurrentUser;

beforeAll(async () => {
  process.env.PUBLIC_BASE_URL = "https://desk.halden-ridge.example";
  fake = await useFakeMail();
  await useTestDatabase();
  admin = await insertPerson({
    email: "admin@halden-ridge.example",
    role: "admin",
    name: "Sam Admin",
  });
});
afterAll(async () => {
  await closeTestDatabase();
  await fake.close();
});

async function inviteAndReadToken(email: string, role: "forecaster" | "verifier" = "forecaster") {
  const result = await inviteUser({ email, name: "Invited Person", role }, admin, NOW);
  const mail = fake.messages().find((m) => [m.to].flat().includes(email));
  return { result, token: tokenFromMail(mail?.text) };
}

async function refusal(promise: Promise<unknown>): Promise<{ code: string; message: string }> {
  const err = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  if (!(err instanceof AppError)) throw new Error(`expected an AppError, got ${String(err)}`);
  return { code: err.code, message: err.message };
}

describe("inviting a person", () => {
  it("creates the account without a password, an invitation, audit entries and the e-mail", async () => {
    const { result, token } = await inviteAndReadToken("ines.new@halden-ridge.example", "verifier");
    expect(result).toEqual({ userId: expect.any(Number), emailSent: true });
    const user = await readUser(result.userId);
    expect(user).toMatchObject({
      email: "ines.new@halden-ridge.example",
      role: "verifier",
      passwordHash: null,
      isActive: true,
    });
    const [invitation, ...more] = await readInvitations(result.userId);
    expect(more).toEqual([]);
    expect(invitation).toMatchObject({ invitedBy: admin.id, usedAt: null, revokedAt: null });
    expect(invitation?.expiresAt.getTime()).toBe(NOW.getTime() + 72 * HOUR);
    expect(await readAuditActions(result.userId)).toEqual([
      "user.invited",
      "email.invitation_sent",
    ]);

    const mail = fake
      .messages()
      .find((m) => [m.to].flat().includes("ines.new@halden-ridge.example"));
    expect(mail?.subject).toContain("Sam Admin invited you");
    expect(mail?.text).toContain("https://desk.halden-ridge.example/invitations/accept?token=");
    expect(mail?.html).toContain(
      `href="https://desk.halden-ridge.example/invitations/accept?token=`,
    );
    expect(await inspectInvitation(token, NOW)).toMatchObject({
      ok: true,
      email: "ines.new@halden-ridge.example",
      roleLabel: "Verifier",
    });
  });

  it("refuses an address that already has an account, whatever its case, with a field message", async () => {
    await inviteUser(
      { email: "dup@halden-ridge.example", name: "First", role: "forecaster" },
      admin,
      NOW,
    );
    const sentBefore = fake.messages().length;
    const err = await inviteUser(
      { email: "DUP@halden-ridge.example", name: "Second", role: "admin" },
      admin,
      NOW,
    ).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(AppError);
    expect(err).toMatchObject({
      code: "CONFLICT",
      fields: { email: "This address is already in use." },
    });
    expect(fake.messages().length).toBe(sentBefore);
  });
});

describe("accepting an invitation", () => {
  it("sets a bcrypt hash of the password, never the password itself, and records it", async () => {
    const { result, token } = await inviteAndReadToken("accept@halden-ridge.example");
    const later = new Date(NOW.getTime() + 2 * HOUR);
    expect(await acceptInvitation(token, "flare-watch-2026", later)).toEqual({
      email: "accept@halden-ridge.example",
    });
    const hash = (await readUser(result.userId))?.passwordHash ?? "";
    expect(hash).not.toContain("flare-watch-2026");
    // Modular crypt format of bcrypt: $2b$, two-digit cost, 53 characters of salt and hash.
    expect(hash).toMatch(/^\$2[aby]\$10\$[./A-Za-z0-9]{53}$/);
    expect(await bcrypt.compare("flare-watch-2026", hash)).toBe(true);
    expect(await bcrypt.compare("flare-watch-2027", hash)).toBe(false);
    expect((await readInvitations(result.userId))[0]?.usedAt?.getTime()).toBe(later.getTime());
    expect(await readAuditActions(result.userId)).toContain("user.password_set");
  });

  it("refuses the same link a second time and keeps the first password", async () => {
    const { result, token } = await inviteAndReadToken("reuse@halden-ridge.example");
    await acceptInvitation(token, "first-password-1", NOW);
    const hash = (await readUser(result.userId))?.passwordHash;
    expect(await refusal(acceptInvitation(token, "second-password-2", NOW))).toEqual({
      code: "UNPROCESSABLE_CONTENT",
      message: "This invitation link has already been used. Sign in with the password you set.",
    });
    expect((await readUser(result.userId))?.passwordHash).toBe(hash);
  });

  it("refuses a link whose token was altered and sets no password", async () => {
    const { result, token } = await inviteAndReadToken("tamper@halden-ridge.example");
    const [body = "", signature = ""] = token.split(".");
    const flipped = `${body}.${signature.startsWith("A") ? "B" : "A"}${signature.slice(1)}`;
    expect(await refusal(acceptInvitation(flipped, "tampered-pass-1", NOW))).toEqual({
      code: "UNPROCESSABLE_CONTENT",
      message: "This invitation link is not valid. Ask your administrator for a new invitation.",
    });
    expect((await readUser(result.userId))?.passwordHash).toBeNull();
    expect(await inspectInvitation(token, NOW)).toMatchObject({ ok: true });
  });

  it("works 71 hours after sending and is refused 73 hours after", async () => {
    const { result, token } = await inviteAndReadToken("late@halden-ridge.example");
    expect(await inspectInvitation(token, new Date(NOW.getTime() + 71 * HOUR))).toMatchObject({
      ok: true,
    });
    expect(
      await refusal(
        acceptInvitation(token, "too-late-pass-1", new Date(NOW.getTime() + 73 * HOUR)),
      ),
    ).toEqual({
      code: "UNPROCESSABLE_CONTENT",
      message: "This invitation link has expired. Ask your administrator to send a new one.",
    });
    expect((await readUser(result.userId))?.passwordHash).toBeNull();
  });

  it("refuses a link for an invitation row that does not exist", async () => {
    expect(await inspectInvitation("bm90LWEtdG9rZW4.c2ln", NOW)).toMatchObject({ ok: false });
    expect(await refusal(acceptInvitation("x".repeat(20), "some-password-1", NOW))).toMatchObject({
      code: "UNPROCESSABLE_CONTENT",
      message:
        "This invitation link is incomplete or damaged. Copy the whole link from the e-mail.",
    });
  });
});

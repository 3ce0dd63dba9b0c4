// Use cases for people: invite, accept an invitation, change role or status, organisations.
import { and, eq, isNull, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { invitations, organisations, users } from "@/db/schema";
import { ROLE_LABELS, type CurrentUser } from "@/lib/auth/roles";
import type { InviteInput, OrganisationInput, UpdateUserInput } from "@/lib/schemas/users";
import { recordAudit } from "@/server/audit/audit.db";
import { hashPassword } from "@/server/auth/passwords";
import { readConfig } from "@/server/config";
import { sendTemplate } from "@/server/delivery/transactional";
import { AppError } from "@/server/http/errors";
import { getOfficeSettings } from "@/server/settings/settings.db";
import { findUserByEmail, findUserById } from "./users.db";
import {
  INVITATION_FAILURE_TEXT,
  invitationExpiry,
  newNonce,
  readInvitation,
  signInvitation,
} from "./invitations";

const actorOf = (u: CurrentUser) => ({ id: u.id, email: u.email });

export interface InviteResult {
  userId: number;
  emailSent: boolean;
  emailError?: string;
}

export async function inviteUser(input: InviteInput, actor: CurrentUser, now = new Date()): Promise<InviteResult> {
  const db = getDb();
  if (await findUserByEmail(input.email)) {
    throw new AppError("CONFLICT", "Someone with this e-mail address already has an account.", {
      fields: { email: "This address is already in use." },
    });
  }
  if (input.organisationId) await requireOrganisation(input.organisationId);
  const { userId, token, expiresAt } = await db.transaction(async (tx) => {
    const [user] = await tx
      .insert(users)
      .values({
        email: input.email,
        name: input.name,
        role: input.role,
        organisationId: input.role === "subscriber" ? (input.organisationId ?? null) : null,
      })
      .returning({ id: users.id });
    if (!user) throw new Error("insert returned no user");
    const issued = await issueInvitation(tx, user.id, actor.id, now);
    await recordAudit(
      { actor: actorOf(actor), action: "user.invited", targetType: "user", targetId: user.id, details: { email: input.email, role: input.role } },
      tx,
    );
    return { userId: user.id, ...issued };
  });
  return { userId, ...(await mailInvitation(userId, token, expiresAt, actor)) };
}

export async function resendInvitation(userId: number, actor: CurrentUser, now = new Date()): Promise<InviteResult> {
  const user = await findUserById(userId);
  if (!user) throw new AppError("NOT_FOUND", "No such user.");
  if (user.passwordHash) throw new AppError("CONFLICT", "This person has already set a password.");
  const { token, expiresAt } = await getDb().transaction(async (tx) => {
    await tx
      .update(invitations)
      .set({ revokedAt: now })
      .where(and(eq(invitations.userId, userId), isNull(invitations.usedAt), isNull(invitations.revokedAt)));
    const issued = await issueInvitation(tx, userId, actor.id, now);
    await recordAudit({ actor: actorOf(actor), action: "user.invitation_resent", targetType: "user", targetId: userId }, tx);
    return issued;
  });
  return { userId, ...(await mailInvitation(userId, token, expiresAt, actor)) };
}

async function issueInvitation(tx: Parameters<Parameters<ReturnType<typeof getDb>["transaction"]>[0]>[0], userId: number, invitedBy: number, now: Date) {
  const nonce = newNonce();
  const expiresAt = invitationExpiry(now);
  const [row] = await tx.insert(invitations).values({ userId, invitedBy, nonce, expiresAt }).returning({ id: invitations.id });
  if (!row) throw new Error("insert returned no invitation");
  return { token: signInvitation({ invitationId: row.id, nonce }, expiresAt), expiresAt };
}

async function mailInvitation(userId: number, token: string, expiresAt: Date, actor: CurrentUser) {
  const user = await findUserById(userId);
  if (!user) throw new Error("invited user vanished");
  const office = await getOfficeSettings();
  const acceptUrl = `${readConfig().publicBaseUrl}/invitations/accept?token=${encodeURIComponent(token)}`;
  const outcome = await sendTemplate("invitation", user.email, {
    officeName: office.officeName,
    inviteeName: user.name,
    roleLabel: ROLE_LABELS[user.role],
    inviterName: actor.name,
    acceptUrl,
    expiresAtUtc: formatUtc(expiresAt),
  });
  await recordAudit({
    actor: actorOf(actor),
    action: outcome.ok ? "email.invitation_sent" : "email.invitation_failed",
    targetType: "user",
    targetId: userId,
    details: outcome.ok ? { messageId: outcome.id } : { error: outcome.message },
  });
  return outcome.ok ? { emailSent: true } : { emailSent: false, emailError: outcome.message };
}

/** The templates add the " UTC" suffix themselves. */
function formatUtc(d: Date): string {
  return d.toISOString().slice(0, 16).replace("T", " ");
}

export interface InvitationView {
  ok: boolean;
  message?: string;
  email?: string;
  name?: string;
  roleLabel?: string;
  expiresAt?: Date;
}

/** Checks a link without using it, for the page that asks for a password. */
export async function inspectInvitation(token: string, now = new Date()): Promise<InvitationView> {
  const checked = await loadInvitation(token, now);
  if (!checked.ok) return { ok: false, message: checked.message };
  const user = await findUserById(checked.row.userId);
  if (!user) return { ok: false, message: INVITATION_FAILURE_TEXT.unknown };
  return { ok: true, email: user.email, name: user.name, roleLabel: ROLE_LABELS[user.role], expiresAt: checked.row.expiresAt };
}

async function loadInvitation(token: string, now: Date) {
  const check = readInvitation(token, now);
  if (!check.ok) return { ok: false as const, message: INVITATION_FAILURE_TEXT[check.reason] };
  const [row] = await getDb().select().from(invitations).where(eq(invitations.id, check.payload.invitationId));
  if (!row || row.nonce !== check.payload.nonce) return { ok: false as const, message: INVITATION_FAILURE_TEXT.unknown };
  if (row.usedAt) return { ok: false as const, message: INVITATION_FAILURE_TEXT.used };
  if (row.revokedAt) return { ok: false as const, message: INVITATION_FAILURE_TEXT.revoked };
  if (row.expiresAt.getTime() <= now.getTime()) return { ok: false as const, message: INVITATION_FAILURE_TEXT.expired };
  return { ok: true as const, row };
}

export async function acceptInvitation(token: string, password: string, now = new Date()): Promise<{ email: string }> {
  const checked = await loadInvitation(token, now);
  if (!checked.ok) throw new AppError("UNPROCESSABLE_CONTENT", checked.message, { fields: { token: checked.message } });
  const passwordHash = await hashPassword(password);
  return getDb().transaction(async (tx) => {
    // Claim the invitation atomically: of two simultaneous uses only one updates the row.
    const claimed = await tx
      .update(invitations)
      .set({ usedAt: now })
      .where(and(eq(invitations.id, checked.row.id), isNull(invitations.usedAt), isNull(invitations.revokedAt)))
      .returning({ userId: invitations.userId });
    if (claimed.length === 0) {
      throw new AppError("UNPROCESSABLE_CONTENT", INVITATION_FAILURE_TEXT.used, { fields: { token: INVITATION_FAILURE_TEXT.used } });
    }
    const [user] = await tx
      .update(users)
      .set({ passwordHash })
      .where(eq(users.id, checked.row.userId))
      .returning({ id: users.id, email: users.email, isActive: users.isActive });
    if (!user) throw new AppError("NOT_FOUND", INVITATION_FAILURE_TEXT.unknown);
    if (!user.isActive) throw new AppError("FORBIDDEN", "This account has been deactivated.");
    await recordAudit({ actor: { id: user.id, email: user.email }, action: "user.password_set", targetType: "user", targetId: user.id }, tx);
    return { email: user.email };
  });
}

export async function updateUser(userId: number, input: UpdateUserInput, actor: CurrentUser, now = new Date()): Promise<void> {
  const user = await findUserById(userId);
  if (!user) throw new AppError("NOT_FOUND", "No such user.");
  if (userId === actor.id && (input.isActive === false || (input.role && input.role !== "admin"))) {
    throw new AppError("CONFLICT", "You cannot remove your own administrator access; ask another administrator.");
  }
  const role = input.role ?? user.role;
  const organisationId = input.organisationId !== undefined ? input.organisationId : user.organisationId;
  if (role === "subscriber" && !organisationId) {
    throw new AppError("BAD_REQUEST", "A subscriber belongs to an organisation.", { fields: { organisationId: "Choose an organisation." } });
  }
  if (organisationId) await requireOrganisation(organisationId);
  await getDb().transaction(async (tx) => {
    await tx
      .update(users)
      .set({
        role,
        organisationId: role === "subscriber" ? organisationId : null,
        ...(input.isActive === undefined ? {} : { isActive: input.isActive, deactivatedAt: input.isActive ? null : now }),
      })
      .where(eq(users.id, userId));
    if (input.role && input.role !== user.role) {
      await recordAudit({ actor: actorOf(actor), action: "user.role_changed", targetType: "user", targetId: userId, details: { from: user.role, to: input.role } }, tx);
    }
    if (input.isActive !== undefined && input.isActive !== user.isActive) {
      await recordAudit({ actor: actorOf(actor), action: input.isActive ? "user.reactivated" : "user.deactivated", targetType: "user", targetId: userId }, tx);
    }
  });
}

async function requireOrganisation(id: number) {
  const [org] = await getDb().select({ id: organisations.id }).from(organisations).where(eq(organisations.id, id));
  if (!org) throw new AppError("BAD_REQUEST", "No such organisation.", { fields: { organisationId: "Choose an existing organisation." } });
}

export async function createOrganisation(input: OrganisationInput, actor: CurrentUser): Promise<{ id: number }> {
  const [dupe] = await getDb().select({ id: organisations.id }).from(organisations).where(sql`lower(${organisations.name}) = ${input.name.toLowerCase()}`);
  if (dupe) throw new AppError("CONFLICT", "An organisation with this name exists.", { fields: { name: "This name is already used." } });
  return getDb().transaction(async (tx) => {
    const [org] = await tx.insert(organisations).values(input).returning({ id: organisations.id });
    if (!org) throw new Error("insert returned no organisation");
    await recordAudit({ actor: actorOf(actor), action: "organisation.created", targetType: "organisation", targetId: org.id, details: { ...input } }, tx);
    return org;
  });
}

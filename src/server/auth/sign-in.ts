// Checks e-mail + password for the credentials sign-in; records failures for throttling and the
// audit trail. Wrong e-mail and wrong password are indistinguishable to the caller.
import { signInSchema } from "@/lib/schemas/users";
import type { Role } from "@/lib/auth/roles";
import { recordAudit } from "@/server/audit/audit.db";
import { currentRequestFacts } from "@/server/http/request-context";
import { findUserByEmail } from "@/server/users/users.db";
import { verifyPassword } from "./passwords";
import { checkSignInThrottle, clearSignInFailures, recordSignInFailure } from "./throttle";

export interface AuthenticatedUser {
  id: string;
  email: string;
  name: string;
  role: Role;
}

export async function checkCredentials(raw: unknown, now = new Date()): Promise<AuthenticatedUser | null> {
  const parsed = signInSchema.safeParse(raw);
  if (!parsed.success) return null;
  const { email, password } = parsed.data;
  const { ip } = currentRequestFacts();
  // The middleware answers 429 before we get here; this second check closes the race.
  if (!(await checkSignInThrottle(email, ip, now)).allowed) return null;
  const user = await findUserByEmail(email);
  const isMatch = await verifyPassword(password, user?.passwordHash);
  if (!user || !isMatch || !user.isActive) {
    await recordSignInFailure(email, ip, now);
    await recordAudit({
      actor: null,
      action: "auth.sign_in_failed",
      targetType: "user",
      targetId: user?.id,
      details: { email, reason: !user ? "unknown account" : !isMatch ? "wrong password" : "deactivated" },
    });
    return null;
  }
  await clearSignInFailures(email);
  await recordAudit({ actor: { id: user.id, email: user.email }, action: "auth.sign_in", targetType: "user", targetId: user.id });
  return { id: String(user.id), email: user.email, name: user.name, role: user.role };
}

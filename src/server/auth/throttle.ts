// Sign-in throttling: too many failures for one account or from one address within a window
// refuse further attempts (429 with Retry-After) until the oldest failure leaves the window.
import { and, count, eq, gte, lt, min } from "drizzle-orm";
import { getDb } from "@/db/client";
import { signInFailures } from "@/db/schema";

export const THROTTLE = { windowMinutes: 15, perAccount: 5, perAddress: 20 } as const;

export type ThrottleDecision = { allowed: true } | { allowed: false; retryAfterSeconds: number };

export async function checkSignInThrottle(email: string, ip: string, now: Date): Promise<ThrottleDecision> {
  const db = getDb();
  const since = new Date(now.getTime() - THROTTLE.windowMinutes * 60_000);
  const key = email.trim().toLowerCase();
  const [byAccount] = await db
    .select({ n: count(), oldest: min(signInFailures.at) })
    .from(signInFailures)
    .where(and(eq(signInFailures.email, key), gte(signInFailures.at, since)));
  const [byAddress] = await db
    .select({ n: count(), oldest: min(signInFailures.at) })
    .from(signInFailures)
    .where(and(eq(signInFailures.ip, ip), gte(signInFailures.at, since)));
  const blocked = [
    byAccount && byAccount.n >= THROTTLE.perAccount ? byAccount.oldest : null,
    byAddress && byAddress.n >= THROTTLE.perAddress ? byAddress.oldest : null,
  ].filter((d): d is Date => d instanceof Date);
  if (blocked.length === 0) return { allowed: true };
  const until = Math.max(...blocked.map((d) => d.getTime() + THROTTLE.windowMinutes * 60_000));
  return { allowed: false, retryAfterSeconds: Math.max(1, Math.ceil((until - now.getTime()) / 1000)) };
}

export async function recordSignInFailure(email: string, ip: string, now: Date): Promise<void> {
  await getDb().insert(signInFailures).values({ email: email.trim().toLowerCase(), ip, at: now });
}

export async function clearSignInFailures(email: string): Promise<void> {
  await getDb().delete(signInFailures).where(eq(signInFailures.email, email.trim().toLowerCase()));
}

/** Old rows are useless once outside every window; trimmed opportunistically. */
export async function pruneSignInFailures(now: Date): Promise<void> {
  const before = new Date(now.getTime() - 24 * 3600_000);
  await getDb().delete(signInFailures).where(lt(signInFailures.at, before));
}


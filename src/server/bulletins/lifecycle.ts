// Shared steps of every bulletin use case: load the row, ask the state machine, and turn a
// refusal or a lost race into the matching AppError (409, 403 or 400).
import {
  transition,
  type BulletinAction,
  type BulletinState,
  type TransitionContext,
} from "@/lib/domain/bulletin-states";
import type { CurrentUser } from "@/lib/auth/roles";
import { AppError } from "@/server/http/errors";
import { findBulletin, type BulletinRow } from "./bulletins.db";

const CODE = { illegal: "CONFLICT", forbidden: "FORBIDDEN", incomplete: "BAD_REQUEST" } as const;

export function requireTransition(
  state: BulletinState,
  action: BulletinAction,
  ctx: TransitionContext,
): BulletinState {
  const result = transition(state, action, ctx);
  if (!result.ok) throw new AppError(CODE[result.kind], result.reason);
  return result.next;
}

export function requireSeenRevision(current: number, seen: number | undefined): void {
  if (seen !== undefined && seen !== current) {
    throw new AppError(
      "CONFLICT",
      "The bulletin changed since you opened it: reload to see the latest version.",
      { fields: { revision: `Now at revision ${current}.` } },
    );
  }
}

export function lostRace(): AppError {
  return new AppError(
    "CONFLICT",
    "Someone else changed this bulletin at the same moment: reload to see what happened.",
  );
}

export async function requireBulletin(id: number): Promise<BulletinRow> {
  const row = await findBulletin(id);
  if (!row) throw new AppError("NOT_FOUND", "No such bulletin.");
  return row;
}

export function actorOf(user: CurrentUser): { id: number; email: string } {
  return { id: user.id, email: user.email };
}

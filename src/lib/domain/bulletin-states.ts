// The lifecycle of a bulletin as one pure state machine: which action moves which state where,
// and why anything else is refused. Server and islands both ask it; the server enforces it.

export const BULLETIN_STATES = [
  "draft",
  "in_review",
  "returned",
  "issued",
  "superseded",
  "withdrawn",
] as const;
export type BulletinState = (typeof BULLETIN_STATES)[number];

export const BULLETIN_ACTIONS = [
  "edit",
  "submit",
  "return",
  "reopen",
  "approve",
  "supersede",
  "withdraw",
] as const;
export type BulletinAction = (typeof BULLETIN_ACTIONS)[number];

export const BULLETIN_STATE_LABELS: Readonly<Record<BulletinState, string>> = {
  draft: "draft",
  in_review: "in review",
  returned: "returned",
  issued: "issued",
  superseded: "superseded",
  withdrawn: "withdrawn",
};

export interface TransitionContext {
  actorId: number;
  authorId: number;
  /** Everyone who created, edited or submitted the bulletin; none of them may approve it. */
  contributorIds?: readonly number[];
  /** Required to return a bulletin. */
  comment?: string | null;
  /** Required to withdraw a bulletin. */
  reason?: string | null;
}

/** illegal: not from this state (409) · forbidden: four-eyes rule (403) · incomplete: a comment or reason is missing (400). */
export type RefusalKind = "illegal" | "forbidden" | "incomplete";

export type TransitionResult =
  { ok: true; next: BulletinState } | { ok: false; kind: RefusalKind; reason: string };

// The only legal moves. "edit" of a returned bulletin reopens it as a draft.
const MOVES: Readonly<Record<BulletinAction, Partial<Record<BulletinState, BulletinState>>>> = {
  edit: { draft: "draft", returned: "draft" },
  submit: { draft: "in_review", returned: "in_review" },
  return: { in_review: "returned" },
  reopen: { returned: "draft" },
  approve: { in_review: "issued" },
  supersede: { issued: "superseded" },
  withdraw: { issued: "withdrawn" },
};

const VERBS: Readonly<Record<BulletinAction, string>> = {
  edit: "edited",
  submit: "submitted for review",
  return: "returned",
  reopen: "reopened",
  approve: "approved",
  supersede: "superseded",
  withdraw: "withdrawn",
};

function isBlank(text: string | null | undefined): boolean {
  return !text || text.trim() === "";
}

export function transition(
  state: BulletinState,
  action: BulletinAction,
  ctx: TransitionContext,
): TransitionResult {
  const next = MOVES[action][state];
  if (!next) {
    return {
      ok: false,
      kind: "illegal",
      reason: `A bulletin that is ${BULLETIN_STATE_LABELS[state]} cannot be ${VERBS[action]}.`,
    };
  }
  if (action === "approve") {
    if (ctx.actorId === ctx.authorId)
      return {
        ok: false,
        kind: "forbidden",
        reason: "You wrote this bulletin: another duty officer must approve it.",
      };
    if (ctx.contributorIds?.includes(ctx.actorId))
      return {
        ok: false,
        kind: "forbidden",
        reason: "You edited or submitted this bulletin: another duty officer must approve it.",
      };
  }
  if (action === "return" && isBlank(ctx.comment))
    return {
      ok: false,
      kind: "incomplete",
      reason: "Say what needs to change: returning a bulletin needs a comment.",
    };
  if (action === "withdraw" && isBlank(ctx.reason))
    return {
      ok: false,
      kind: "incomplete",
      reason: "Give the reason for withdrawing the bulletin.",
    };
  return { ok: true, next };
}

/**
 * Actions a person could take now (comments and reasons aside), to show only usable controls.
 * Superseding is left out: it happens only when a correction is issued.
 */
export function availableActions(
  state: BulletinState,
  ctx: Pick<TransitionContext, "actorId" | "authorId" | "contributorIds">,
): BulletinAction[] {
  return BULLETIN_ACTIONS.filter(
    (action) =>
      action !== "supersede" && transition(state, action, { ...ctx, comment: "-", reason: "-" }).ok,
  );
}

/** Not yet issued: the content is still computed live from the day's assessments. */
export function isOpenState(state: BulletinState): boolean {
  return state === "draft" || state === "in_review" || state === "returned";
}

/** Issued at some point: frozen, readable by subscribers and, if the office allows, the public. */
export function isPublishedState(state: BulletinState): boolean {
  return state === "issued" || state === "superseded" || state === "withdrawn";
}

export function isBulletinState(value: unknown): value is BulletinState {
  return typeof value === "string" && (BULLETIN_STATES as readonly string[]).includes(value);
}

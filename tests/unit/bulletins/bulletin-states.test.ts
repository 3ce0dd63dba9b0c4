import { describe, expect, it } from "vitest";
import {
  availableActions,
  BULLETIN_ACTIONS,
  BULLETIN_STATES,
  isBulletinState,
  isOpenState,
  isPublishedState,
  transition,
  type BulletinAction,
  type BulletinState,
} from "@/lib/domain/bulletin-states";

// The lifecycle from the product brief, written out here independently of the module:
// draft → in review (submit) → returned (return, with a comment) → draft (edit/reopen) …
// in review → issued (approve) → superseded (a correction is issued) or withdrawn (with a reason).
// A returned bulletin may also be resubmitted as it is, and a draft edited in place.
const LEGAL: Record<string, BulletinState> = {
  "draft/edit": "draft",
  "draft/submit": "in_review",
  "returned/edit": "draft",
  "returned/reopen": "draft",
  "returned/submit": "in_review",
  "in_review/return": "returned",
  "in_review/approve": "issued",
  "issued/supersede": "superseded",
  "issued/withdraw": "withdrawn",
};

const AUTHOR = 1;
const REVIEWER = 2;
const complete = {
  actorId: REVIEWER,
  authorId: AUTHOR,
  comment: "Check HR-0412's M+ final.",
  reason: "Wrong forecast day in the header.",
};

const pairs = BULLETIN_STATES.flatMap((state) =>
  BULLETIN_ACTIONS.map((action) => ({
    state,
    action,
    expected: LEGAL[`${state}/${action}`] ?? null,
  })),
);

describe("transition: every state × action", () => {
  it("covers all 42 pairs, 9 of them legal", () => {
    expect(pairs).toHaveLength(6 * 7);
    expect(pairs.filter((p) => p.expected !== null)).toHaveLength(Object.keys(LEGAL).length);
  });

  it.each(pairs.filter((p) => p.expected !== null))(
    "$state --$action--> $expected",
    ({ state, action, expected }) => {
      expect(transition(state, action, complete)).toEqual({ ok: true, next: expected });
    },
  );

  it.each(pairs.filter((p) => p.expected === null))(
    "$state --$action--> refused as illegal",
    ({ state, action }) => {
      const result = transition(state, action, complete);
      expect(result.ok).toBe(false);
      if (!result.ok) {
        expect(result.kind).toBe("illegal");
        expect(result.reason).toMatch(/cannot be/);
      }
    },
  );

  it("never lets anything leave superseded or withdrawn, nor go back to in review from issued", () => {
    for (const state of ["superseded", "withdrawn"] as const) {
      for (const action of BULLETIN_ACTIONS)
        expect(transition(state, action, complete).ok).toBe(false);
    }
    expect(BULLETIN_ACTIONS.filter((a) => transition("issued", a, complete).ok).sort()).toEqual([
      "supersede",
      "withdraw",
    ]);
  });
});

describe("four-eyes rule on approval", () => {
  it("refuses the author as forbidden, and lets another duty officer issue", () => {
    expect(transition("in_review", "approve", { actorId: AUTHOR, authorId: AUTHOR })).toMatchObject(
      { ok: false, kind: "forbidden" },
    );
    expect(transition("in_review", "approve", { actorId: REVIEWER, authorId: AUTHOR })).toEqual({
      ok: true,
      next: "issued",
    });
  });

  it("refuses anyone who edited or submitted it, but not an unrelated contributor list", () => {
    expect(
      transition("in_review", "approve", {
        actorId: 7,
        authorId: AUTHOR,
        contributorIds: [AUTHOR, 7],
      }),
    ).toMatchObject({ ok: false, kind: "forbidden" });
    expect(
      transition("in_review", "approve", {
        actorId: 8,
        authorId: AUTHOR,
        contributorIds: [AUTHOR, 7],
      }),
    ).toEqual({ ok: true, next: "issued" });
  });

  it("reports the state first: the author approving a draft is illegal, not forbidden", () => {
    expect(transition("draft", "approve", { actorId: AUTHOR, authorId: AUTHOR })).toMatchObject({
      ok: false,
      kind: "illegal",
    });
  });
});

describe("comments and reasons", () => {
  it.each([undefined, null, "", "   \n"])("return with comment %j is incomplete", (comment) => {
    expect(
      transition("in_review", "return", { actorId: REVIEWER, authorId: AUTHOR, comment }),
    ).toMatchObject({ ok: false, kind: "incomplete" });
  });

  it.each([undefined, null, "", "  "])("withdraw with reason %j is incomplete", (reason) => {
    expect(
      transition("issued", "withdraw", { actorId: REVIEWER, authorId: AUTHOR, reason }),
    ).toMatchObject({ ok: false, kind: "incomplete" });
  });

  it("accepts a real comment and a real reason", () => {
    expect(
      transition("in_review", "return", { actorId: REVIEWER, authorId: AUTHOR, comment: "x" }),
    ).toEqual({ ok: true, next: "returned" });
    expect(
      transition("issued", "withdraw", { actorId: REVIEWER, authorId: AUTHOR, reason: "y" }),
    ).toEqual({ ok: true, next: "withdrawn" });
  });

  it("does not ask for a comment on other actions", () => {
    expect(transition("draft", "submit", { actorId: AUTHOR, authorId: AUTHOR })).toEqual({
      ok: true,
      next: "in_review",
    });
  });
});

describe("availableActions", () => {
  const expectActions = (state: BulletinState, actorId: number, expected: BulletinAction[]) =>
    expect(availableActions(state, { actorId, authorId: AUTHOR }).sort()).toEqual(
      [...expected].sort(),
    );

  it("offers the author no approval, and another person approval and return", () => {
    expectActions("in_review", AUTHOR, ["return"]);
    expectActions("in_review", REVIEWER, ["return", "approve"]);
  });

  it("offers edit and submit on drafts and returned ones, withdraw on issued, nothing after", () => {
    expectActions("draft", AUTHOR, ["edit", "submit"]);
    expectActions("returned", AUTHOR, ["edit", "submit", "reopen"]);
    expectActions("issued", REVIEWER, ["withdraw"]);
    expectActions("superseded", REVIEWER, []);
    expectActions("withdrawn", REVIEWER, []);
  });
});

describe("state groups", () => {
  it("splits the six states into open and published, with nothing in both", () => {
    expect(BULLETIN_STATES.filter(isOpenState)).toEqual(["draft", "in_review", "returned"]);
    expect(BULLETIN_STATES.filter(isPublishedState)).toEqual(["issued", "superseded", "withdrawn"]);
    expect(BULLETIN_STATES.filter((s) => isOpenState(s) && isPublishedState(s))).toEqual([]);
  });

  it("recognises state names and nothing else", () => {
    expect(isBulletinState("in_review")).toBe(true);
    expect(isBulletinState("in review")).toBe(false);
    expect(isBulletinState("approved")).toBe(false);
    expect(isBulletinState(3)).toBe(false);
  });
});

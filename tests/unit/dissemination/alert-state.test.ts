import { describe, expect, it } from "vitest";
import { alertStateAt, isChaseable } from "@/server/dissemination/alert-state";

const at = (iso: string) => new Date(iso);
const open = {
  acknowledgedAt: null,
  remindedAt: null,
  escalatedAt: null,
  windowEndsAt: at("2026-05-05T00:30:00Z"),
};
const NOW = at("2026-05-04T02:00:00Z");

describe("alertStateAt", () => {
  it("walks open → reminded → escalated while unacknowledged", () => {
    expect(alertStateAt(open, NOW)).toBe("open");
    expect(alertStateAt({ ...open, remindedAt: at("2026-05-04T01:00:00Z") }, NOW)).toBe("reminded");
    expect(
      alertStateAt(
        {
          ...open,
          remindedAt: at("2026-05-04T01:00:00Z"),
          escalatedAt: at("2026-05-04T01:30:00Z"),
        },
        NOW,
      ),
    ).toBe("escalated");
  });

  it("says acknowledged once acknowledged, even after escalation or the window's end", () => {
    const acked = {
      ...open,
      escalatedAt: at("2026-05-04T01:30:00Z"),
      acknowledgedAt: at("2026-05-04T01:45:00Z"),
    };
    expect(alertStateAt(acked, NOW)).toBe("acknowledged");
    expect(alertStateAt(acked, at("2026-05-06T00:00:00Z"))).toBe("acknowledged");
  });

  it("says expired when the window ended unacknowledged", () => {
    expect(alertStateAt(open, at("2026-05-05T00:30:00Z"))).toBe("expired");
    expect(alertStateAt(open, at("2026-05-05T00:29:59Z"))).toBe("open");
  });

  it("chases open, reminded and escalated alerts only", () => {
    expect(["open", "reminded", "escalated"].every((s) => isChaseable(s as never))).toBe(true);
    expect(isChaseable("acknowledged")).toBe(false);
    expect(isChaseable("expired")).toBe(false);
  });
});

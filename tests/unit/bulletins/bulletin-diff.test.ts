import { describe, expect, it } from "vitest";
import { diffBulletins, diffGrids } from "@/server/bulletins/bulletin-diff";
import { gridOf, issued } from "./bulletin-fixture";

describe("diffBulletins", () => {
  it("reports nothing changed between a bulletin and itself", () => {
    const b = issued();
    const changes = diffBulletins(b, issued({ id: 8, version: 2 }));
    expect(changes.hasChanges).toBe(false);
    expect(changes.fullDisk.filter((c) => c.isChanged)).toEqual([]);
    expect(changes.previous).toMatchObject({ id: 7, version: 1 });
  });

  it("lists the full-disk cells that changed with old and new values", () => {
    const before = issued();
    const fullDisk = structuredClone(before.fullDisk);
    fullDisk["M+"]["24h"] = 0.4;
    const changes = diffBulletins(before, issued({ fullDisk }));
    expect(changes.fullDisk.filter((c) => c.isChanged)).toEqual([
      { level: "M+", window: "24h", before: 0.25, after: 0.4, isChanged: true },
    ]);
    expect(changes.hasChanges).toBe(true);
  });

  it("ignores differences below 0.05 percentage points (rounding), not above", () => {
    const a = gridOf(0.5, 0.2, 0.02);
    const b = structuredClone(a);
    b["C+"]["24h"] = 0.5004;
    b.X["72h"] = a.X["72h"] + 0.001;
    expect(
      diffGrids(a, b)
        .filter((c) => c.isChanged)
        .map((c) => `${c.level}.${c.window}`),
    ).toEqual(["X.72h"]);
  });

  it("lists regions added, removed and changed, and a changed discussion", () => {
    const before = issued();
    const [first] = before.regions;
    const moved = { ...first!, probabilities: gridOf(0.8, 0.35, 0.06) };
    const added = { ...first!, region: "HR-0420", probabilities: gridOf(0.1, 0.01, 0.001) };
    const changes = diffBulletins(
      before,
      issued({ regions: [moved, added], discussion: "HR-0413 decayed." }),
    );
    expect(changes.regionsAdded).toEqual(["HR-0420"]);
    expect(changes.regionsRemoved).toEqual(["HR-0413"]);
    expect(changes.regionsChanged.map((r) => r.region)).toEqual(["HR-0412"]);
    expect(changes.regionsChanged[0]?.cells).toHaveLength(9);
    expect(changes.isDiscussionChanged).toBe(true);
  });

  it("treats everything as new when there is no previous bulletin", () => {
    const changes = diffBulletins(null, issued());
    expect(changes.previous).toBeNull();
    expect(changes.fullDisk.every((c) => c.before === null && c.isChanged)).toBe(true);
    expect(changes.regionsAdded).toEqual(["HR-0412", "HR-0413"]);
    expect(changes.regionsRemoved).toEqual([]);
  });
});

import { describe, expect, it } from "vitest";
import { composeBulletinContent, type ContentSources } from "@/server/bulletins/bulletin-content";
import { BULLETIN_CAUTIONS } from "@/lib/domain/cautions";
import { formatValidityRange, validityWindows } from "@/server/bulletins/validity";
import { gridOf, regionSource } from "./bulletin-fixture";

const sources = (overrides: Partial<ContentSources> = {}): ContentSources => ({
  id: 3,
  forecastDay: "2031-05-06",
  version: 2,
  issueTime: new Date("2031-05-06T00:30:00Z"),
  officeName: "Halden Ridge Space Weather Desk (demo)",
  contactLine: "Duty desk (demo)",
  cautions: BULLETIN_CAUTIONS,
  fullDisk: gridOf(0.7, 0.25, 0.04),
  regions: [regionSource()],
  discussion: "Quiet elsewhere.",
  supersedesVersion: 1,
  isDemo: false,
  ...overrides,
});

describe("composeBulletinContent", () => {
  it("takes the finals of a region, or its blended guidance when there are none, and says which", () => {
    const finals = gridOf(0.6, 0.2, 0.03);
    const blended = gridOf(0.3, 0.1, 0.01);
    const { bulletin, problems } = composeBulletinContent(
      sources({
        regions: [
          regionSource({ region: "HR-0412", finals, blended }),
          regionSource({ region: "HR-0413", finals: null, blended }),
        ],
      }),
    );
    expect(problems).toEqual([]);
    expect(bulletin?.regions.map((r) => [r.region, r.probabilities, r.probabilitySource])).toEqual([
      ["HR-0412", finals, "final"],
      ["HR-0413", blended, "guidance"],
    ]);
  });

  it("carries the cautions, contact line, version and full disk unchanged", () => {
    const { bulletin } = composeBulletinContent(sources());
    expect(bulletin?.cautions).toEqual([...BULLETIN_CAUTIONS]);
    expect(bulletin?.cautions.length).toBeGreaterThan(0);
    expect(bulletin).toMatchObject({
      version: 2,
      supersedesVersion: 1,
      contactLine: "Duty desk (demo)",
      fullDisk: gridOf(0.7, 0.25, 0.04),
    });
  });

  it("is demo when any region is demo, and not otherwise", () => {
    expect(composeBulletinContent(sources()).bulletin?.isDemo).toBe(true);
    expect(
      composeBulletinContent(sources({ regions: [regionSource({ isDemo: false })] })).bulletin
        ?.isDemo,
    ).toBe(false);
  });

  it("names a region without any probabilities, an empty full disk and a missing discussion", () => {
    const { bulletin, problems } = composeBulletinContent(
      sources({
        regions: [regionSource({ region: "HR-0499", finals: null, blended: null })],
        fullDisk: null,
        discussion: "  ",
      }),
    );
    expect(bulletin).toBeNull();
    expect(problems).toHaveLength(3);
    expect(problems[0]).toContain("HR-0499");
    expect(problems.join(" ")).toMatch(/full-disk/);
    expect(problems.join(" ")).toMatch(/discussion/);
  });
});

describe("validity windows", () => {
  // Calendar arithmetic: 00:30 UTC plus 24, 48 and 72 hours.
  it("start at the issue time and end 24, 48 and 72 h later, in UTC", () => {
    const windows = validityWindows(new Date("2031-05-06T00:30:00Z"));
    expect(
      windows.map((w) => [w.window, w.startsAt.toISOString(), w.endsAt.toISOString()]),
    ).toEqual([
      ["24h", "2031-05-06T00:30:00.000Z", "2031-05-07T00:30:00.000Z"],
      ["48h", "2031-05-06T00:30:00.000Z", "2031-05-08T00:30:00.000Z"],
      ["72h", "2031-05-06T00:30:00.000Z", "2031-05-09T00:30:00.000Z"],
    ]);
    expect(formatValidityRange(windows[0]!)).toBe("2031-05-06 00:30 – 2031-05-07 00:30 UTC");
  });

  it("crosses month and year ends", () => {
    const [, , w72] = validityWindows(new Date("2031-12-30T18:05:00Z"));
    expect(w72?.endsAt.toISOString()).toBe("2032-01-02T18:05:00.000Z");
    expect(w72?.endsAt.toISOString()).not.toBe("2031-12-33T18:05:00.000Z");
  });
});

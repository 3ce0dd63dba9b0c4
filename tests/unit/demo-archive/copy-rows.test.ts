import { describe, expect, it } from "vitest";
import { encodeCopyCsv, encodeCopyField } from "@/server/demo/archive/copy-rows";

// Expected strings follow the CSV format of PostgreSQL's COPY (manual, "COPY", CSV Format) with
// NULL '': an unquoted empty field is NULL, a quoted empty field is an empty string.
describe("encodeCopyField", () => {
  it("writes NULL as an empty field and the empty string quoted", () => {
    expect(encodeCopyField(null)).toBe("");
    expect(encodeCopyField("")).toBe('""');
  });

  it("quotes text with commas, quotes, line breaks or backslashes, doubling inner quotes", () => {
    expect(encodeCopyField("HR-0412")).toBe("HR-0412");
    expect(encodeCopyField("a,b")).toBe('"a,b"');
    expect(encodeCopyField('say "hi"')).toBe('"say ""hi"""');
    expect(encodeCopyField("two\nlines")).toBe('"two\nlines"');
    expect(encodeCopyField("\\.")).toBe('"\\."');
  });

  it("writes numbers, booleans, dates and objects in forms PostgreSQL reads back", () => {
    expect(encodeCopyField(2.21e22)).toBe("2.21e+22");
    expect(encodeCopyField(0.05)).toBe("0.05");
    expect(encodeCopyField(true)).toBe("t");
    expect(encodeCopyField(false)).toBe("f");
    expect(encodeCopyField(new Date(Date.UTC(2025, 0, 2, 0, 30)))).toBe("2025-01-02T00:30:00.000Z");
    expect(encodeCopyField({ "M+": { "24h": 0.1 } })).toBe('"{""M+"":{""24h"":0.1}}"');
    expect(encodeCopyField(["limb: N12W70"])).toBe('"[""limb: N12W70""]"');
  });

  it("refuses numbers PostgreSQL would store as NaN or Infinity", () => {
    expect(() => encodeCopyField(Number.NaN)).toThrow(RangeError);
    expect(() => encodeCopyField(Number.POSITIVE_INFINITY)).toThrow(RangeError);
  });

  it("joins fields with commas and rows with line breaks", () => {
    expect(
      encodeCopyCsv([
        ["a", null, 1],
        ["", true, "x,y"],
      ]),
    ).toBe('a,,1\n"",t,"x,y"');
  });
});

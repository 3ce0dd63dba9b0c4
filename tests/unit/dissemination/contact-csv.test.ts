import { describe, expect, it } from "vitest";
import { parseThresholdList, previewContactCsv } from "@/server/dissemination/contact-csv";

// Invented roster (demo — invented for the scenario).
const ctx = {
  organisations: new Map([
    ["northmarch transmission cooperative (demo)", 3],
    ["skylark hf aviation radio (demo)", 4],
  ]),
  existingEmails: new Set(["dana.whitlock@northmarch.example"]),
};
const HEADER = "organisation,name,email,bulletins,thresholds";

describe("previewContactCsv", () => {
  it("reads valid rows with their organisation, bulletin choice and thresholds", () => {
    const csv = `${HEADER}\nNorthmarch Transmission Cooperative (demo),Edda Strand,edda@northmarch.example,yes,"M+ 24h 40%; X 72h 10%"\nSkylark HF Aviation Radio (demo),Night desk,night@skylark-hf.example,no,\n`;
    const preview = previewContactCsv(csv, ctx);
    expect(preview).toMatchObject({ fileErrors: [], validCount: 2, invalidCount: 0 });
    expect(preview.rows[0]).toMatchObject({
      line: 2,
      organisationId: 3,
      name: "Edda Strand",
      wantsBulletins: true,
      errors: [],
    });
    expect(preview.rows[0]?.thresholds).toEqual([
      { level: "M+", windowHours: 24, probabilityPercent: 40 },
      { level: "X", windowHours: 72, probabilityPercent: 10 },
    ]);
    expect(preview.rows[1]).toMatchObject({
      organisationId: 4,
      wantsBulletins: false,
      thresholds: [],
    });
  });

  it("accepts header aliases and a missing bulletins column (defaults to yes)", () => {
    const preview = previewContactCsv(
      "Organization,Name,E-mail\nskylark hf aviation radio (demo),Ada Lind,ada@skylark-hf.example\n",
      ctx,
    );
    expect(preview.rows[0]).toMatchObject({
      organisationId: 4,
      email: "ada@skylark-hf.example",
      wantsBulletins: true,
      errors: [],
    });
  });

  it("names every problem of every row", () => {
    const csv = [
      HEADER,
      "Nowhere Grid,Bo,bo@nowhere.example,yes,",
      "Northmarch Transmission Cooperative (demo),Dana W,dana.whitlock@northmarch.example,yes,",
      "Northmarch Transmission Cooperative (demo),X,not-an-address,maybe,M+ 12h 40%",
      "Northmarch Transmission Cooperative (demo),Twin One,twin@northmarch.example,,",
      "Northmarch Transmission Cooperative (demo),Twin Two,TWIN@northmarch.example,,",
    ].join("\n");
    const preview = previewContactCsv(csv, ctx);
    expect(preview.validCount).toBe(1);
    expect(preview.invalidCount).toBe(4);
    const errors = preview.rows.map((r) => r.errors.join(" | "));
    expect(errors[0]).toContain('Organisation "Nowhere Grid" does not exist');
    expect(errors[1]).toContain("dana.whitlock@northmarch.example is already a contact.");
    expect(errors[2]).toContain("Enter the contact's name.");
    expect(errors[2]).toContain("Enter a valid e-mail address");
    expect(errors[2]).toContain('Bulletins must be yes or no, not "maybe".');
    expect(errors[2]).toContain('Threshold "M+ 12h 40%" is not like');
    expect(errors[3]).toBe("");
    expect(errors[4]).toContain("TWIN@northmarch.example is also on line 5.");
  });

  it("refuses a file without the required columns, without rows, or with too many rows", () => {
    expect(previewContactCsv("name,email\nA,a@x.example\n", ctx).fileErrors[0]).toContain(
      "lacks organisation",
    );
    expect(previewContactCsv(`${HEADER}\n`, ctx).fileErrors).toEqual([
      "The file has no contact rows.",
    ]);
    const many = [
      HEADER,
      ...Array.from(
        { length: 4 },
        (_, i) => `Skylark HF Aviation Radio (demo),P ${i},p${i}@x.example,,`,
      ),
    ].join("\n");
    expect(previewContactCsv(many, { ...ctx, maxRows: 3 }).fileErrors).toEqual([
      "The file has 4 rows; import at most 3 at a time.",
    ]);
    expect(previewContactCsv(many, { ...ctx, maxRows: 4 }).fileErrors).toEqual([]);
  });
});

describe("parseThresholdList", () => {
  it("reads level, window and whole percentage; refuses repeats and out-of-range values", () => {
    expect(parseThresholdList("c+ 48h 90").thresholds).toEqual([
      { level: "C+", windowHours: 48, probabilityPercent: 90 },
    ]);
    expect(parseThresholdList("M+ 24h 40%; M+ 24h 50%").errors).toEqual([
      'Threshold "M+ 24h 50%" repeats a level and window already given.',
    ]);
    expect(parseThresholdList("X 24h 0%").errors).toHaveLength(1);
    expect(parseThresholdList("X 24h 101%").errors).toHaveLength(1);
    expect(parseThresholdList("").thresholds).toEqual([]);
  });
});

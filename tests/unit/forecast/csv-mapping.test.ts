import { describe, expect, it } from "vitest";
import {
  completeMappingSchema,
  normaliseHeader,
  suggestColumnMapping,
} from "@/lib/schemas/csv-import";
import {
  checkMappingAgainstHeaders,
  parseCsvTable,
  readMappedValues,
} from "@/server/forecast/csv-mapping";
import { AppError } from "@/server/http/errors";

function refusal(fn: () => unknown): AppError {
  try {
    fn();
  } catch (err) {
    if (err instanceof AppError) return err;
    throw err;
  }
  throw new Error("expected an AppError");
}

describe("automatic column matching", () => {
  it("matches common spellings regardless of case, spaces and underscores", () => {
    const headers = [
      " Region ",
      "LOCATION",
      "area_msh",
      "Spots",
      "McIntosh Class",
      "mag_class",
      "flux_mx",
      "PIL length",
      "log R",
      "Shear",
      "C",
      "M",
      "X",
      "Remarks",
    ];
    expect(suggestColumnMapping(headers)).toEqual({
      region: " Region ",
      location: "LOCATION",
      areaMsh: "area_msh",
      spotCount: "Spots",
      mcintosh: "McIntosh Class",
      mountWilson: "mag_class",
      unsignedFluxMx: "flux_mx",
      pilLengthMm: "PIL length",
      logR: "log R",
      meanShearDeg: "Shear",
      flaresC: "C",
      flaresM: "M",
      flaresX: "X",
      notes: "Remarks",
    });
  });

  it("matches a field's own label and camel-case name", () => {
    expect(suggestColumnMapping(["Area (MSH)", "spotCount", "Mean shear (°)"])).toEqual({
      areaMsh: "Area (MSH)",
      spotCount: "spotCount",
      meanShearDeg: "Mean shear (°)",
    });
  });

  it("leaves unknown headers unmapped and uses each header once", () => {
    const mapping = suggestColumnMapping(["Observer", "area", "Area MSH"]);
    expect(mapping).toEqual({ areaMsh: "area" });
    expect(Object.values(mapping)).not.toContain("Observer");
  });

  it("prefers the remembered choice when the file still has that column", () => {
    const headers = ["Area", "Corrected area", "Region"];
    expect(suggestColumnMapping(headers, { areaMsh: "Corrected area" }).areaMsh).toBe(
      "Corrected area",
    );
    // A remembered column that is not in this file falls back to matching.
    expect(suggestColumnMapping(headers, { areaMsh: "Area (corr.)" }).areaMsh).toBe("Area");
  });

  it("normalises headers for comparison only", () => {
    expect(normaliseHeader(" Flux_Mx ")).toBe("fluxmx");
    expect(normaliseHeader("Mount-Wilson")).toBe("mountwilson");
    expect(normaliseHeader("Mount Wilson 2")).not.toBe("mountwilson");
  });
});

describe("a complete mapping", () => {
  const complete = {
    region: "R",
    location: "L",
    areaMsh: "A",
    spotCount: "S",
    mcintosh: "Mc",
    mountWilson: "MW",
  };

  it("needs a column for every required field", () => {
    expect(completeMappingSchema.safeParse(complete).success).toBe(true);
    const missing = completeMappingSchema.safeParse({ ...complete, mcintosh: "" });
    expect(missing.success).toBe(false);
    expect(missing.error?.issues.map((i) => [i.path.join("."), i.message])).toEqual([
      ["mcintosh", "Choose a column for McIntosh class."],
    ]);
  });

  it("must name columns the file has", () => {
    const headers = Object.values(complete);
    expect(checkMappingAgainstHeaders({ ...complete, notes: "" }, headers)).toEqual(complete);
    const err = refusal(() => checkMappingAgainstHeaders({ ...complete, logR: "log R" }, headers));
    expect(err.fields).toEqual({
      "mapping.logR": 'The file has no column "log R" (chosen for log R).',
    });
  });
});

describe("reading the table", () => {
  it("reads a header row and data rows, with a byte-order mark and quoted commas", () => {
    const table = parseCsvTable('\uFEFFRegion,Notes\nHR-1,"west, near limb"\n\nHR-2,\n', 10);
    expect(table.headers).toEqual(["Region", "Notes"]);
    expect(table.rows).toEqual([
      ["HR-1", "west, near limb"],
      ["HR-2", ""],
    ]);
    expect(
      readMappedValues(table.rows[0]!, table.headers, { region: "Region", notes: "Notes" }),
    ).toEqual({ region: "HR-1", notes: "west, near limb" });
  });

  it("refuses a file without a header row, a repeated column and too many rows", () => {
    expect(refusal(() => parseCsvTable("HR-1,N10E10\nHR-2,N11E10", 10)).message).toMatch(
      /header row/,
    );
    expect(refusal(() => parseCsvTable("Area,area2,Area\n1,2,3", 10)).message).toMatch(
      /"Area" twice/,
    );
    expect(refusal(() => parseCsvTable("Region\nHR-1\nHR-2\nHR-3", 2)).message).toMatch(
      /too many rows: 3 data rows, at most 2/,
    );
    expect(parseCsvTable("Region\nHR-1\nHR-2", 2).rows).toHaveLength(2);
  });
});

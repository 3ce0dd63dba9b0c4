// Shared rows and helpers of the CSV import tests: a valid file, the request, and a check that a
// refused import left every table as it was.
import { expect } from "vitest";
import type { CurrentUser } from "@/lib/auth/roles";
import { suggestColumnMapping, type ColumnMapping } from "@/lib/schemas/csv-import";
import { POST } from "@/pages/api/assessments/import";
import { callRoute, countRows } from "./api-call";

// Demo rows — invented for the scenario. Row 3's area (5200 MSH) is above the 5000 MSH
// plausibility bound of src/lib/domain/metrics.ts, so it must carry a warning.
export const HEADER =
  "Region,Location,Area,Spots,McIntosh,Mag Class,Flux_Mx,PIL,logR,Shear,C,M,X,Notes";
export const VALID = [
  HEADER,
  "HR-0901,N12E34,250,14,Dkc,beta-gamma,2.5e22,60,4.2,45,3,1,0,demo",
  "hr-0902,S05W20,80,6,Cso,beta,,,,,1,0,0,",
  "HR-0903,N20W40,5200,22,Fkc,beta-gamma-delta,6e22,120,4.9,60,5,2,1,big",
].join("\n");
export const DAY = "2031-03-14";

export const mappingOf = (csv: string): ColumnMapping =>
  suggestColumnMapping(csv.split("\n")[0]!.split(","));

/** POSTs an import (commit unless the body says otherwise) with the file's automatic mapping. */
export const sendImport = (body: Record<string, unknown>, user: CurrentUser | null) =>
  callRoute(POST, "/api/assessments/import", {
    method: "POST",
    user,
    body: { forecastDay: DAY, mapping: mappingOf(String(body.csv)), mode: "commit", ...body },
  });

export async function snapshot() {
  return {
    assessments: await countRows("assessments"),
    regions: await countRows("regions"),
    guidance: await countRows("guidance"),
    audit: await countRows("audit_events"),
  };
}

/** Runs a refused import and checks that no table gained a row. */
export async function expectRefusedAndUnchanged(
  body: Record<string, unknown>,
  status: number,
  user: CurrentUser,
) {
  const before = await snapshot();
  const answer = await sendImport(body, user);
  expect(answer.status).toBe(status);
  expect(await snapshot()).toEqual(before);
  return answer.body;
}

// The frozen `content` column: an IssuedBulletin as JSON (issue time as ISO text), read back with
// a schema so a damaged row fails loudly, plus the fingerprint a reviewer approves against.
import { createHash } from "node:crypto";
import { z } from "zod";
import type { BulletinContentJson } from "@/lib/query/bulletins";
import { probabilityGridSchema } from "@/lib/schemas/assessment";
import type { IssuedBulletin } from "./issued-bulletin";

const regionRowSchema = z.object({
  region: z.string(),
  location: z.string(),
  isLimbFlagged: z.boolean(),
  areaMsh: z.number().nullable(),
  mcintosh: z.string().nullable(),
  mountWilson: z.string().nullable(),
  probabilities: probabilityGridSchema,
  probabilitySource: z.enum(["final", "guidance"]).optional(),
});

const storedContentSchema = z.object({
  id: z.number().int(),
  forecastDay: z.string(),
  version: z.number().int(),
  issueTime: z.iso.datetime({ offset: true }),
  officeName: z.string(),
  contactLine: z.string(),
  fullDisk: probabilityGridSchema,
  regions: z.array(regionRowSchema),
  discussion: z.string(),
  cautions: z.array(z.string()),
  supersedesVersion: z.number().int().nullable(),
  isDemo: z.boolean(),
});

export function toStoredContent(bulletin: IssuedBulletin): BulletinContentJson {
  return {
    ...bulletin,
    issueTime: bulletin.issueTime.toISOString(),
    regions: bulletin.regions.map((r) => ({ ...r })),
  };
}

export function fromStoredContent(json: unknown): IssuedBulletin {
  const parsed = storedContentSchema.safeParse(json);
  if (!parsed.success)
    throw new Error(`Stored bulletin content is not readable: ${parsed.error.message}`);
  const { issueTime, regions, ...rest } = parsed.data;
  return {
    ...rest,
    issueTime: new Date(issueTime),
    regions: regions.map(({ probabilitySource, ...r }) =>
      probabilitySource ? { ...r, probabilitySource } : r,
    ),
  };
}

/**
 * SHA-256 of what a reader sees, without the id and issue time (which only exist at issue).
 * The reviewer's page carries it; approving refuses if the live content no longer matches.
 */
export function fingerprintContent(bulletin: IssuedBulletin): string {
  const { id: _id, issueTime: _issueTime, ...seen } = bulletin;
  return createHash("sha256").update(canonicalJson(seen)).digest("hex");
}

// jsonb does not keep key order, so keys are sorted before hashing.
function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(",")}]`;
  if (value && typeof value === "object") {
    const entries = Object.entries(value as Record<string, unknown>).filter(
      ([, v]) => v !== undefined,
    );
    entries.sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(",")}}`;
  }
  return JSON.stringify(value);
}

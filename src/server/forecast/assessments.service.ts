// Use cases of the forecaster's daily work: save a region's assessment with its guidance
// (inputs recorded for reproduction) and finals, in one transaction each.
import { eq } from "drizzle-orm";
import { getDb, type Tx } from "@/db/client";
import { assessments, guidance } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import { finalsOrderErrors, missingReasonErrors } from "@/lib/domain/finals";
import { parseLocation, isBeyondLimbThreshold } from "@/lib/domain/location";
import { createAssessmentSchema, type CreateAssessmentData } from "@/lib/schemas/assessment";
import { recordAudit } from "@/server/audit/audit.db";
import { AppError } from "@/server/http/errors";
import { parseWith } from "@/server/http/body";
import { getOfficeSettings } from "@/server/settings/settings.db";
import { findAssessment, findOrCreateRegion, getAssessment, type AssessmentView } from "./assessments.db";
import { computeGuidance, toModelInput, type GuidanceAnswer } from "./guidance.service";

const PATCHABLE = new Set(["location", "areaMsh", "spotCount", "mcintosh", "mountWilson", "unsignedFluxMx", "pilLengthMm", "logR", "meanShearDeg", "freeEnergyProxy", "flares24h", "notes", "finals", "finalReasons"]);

export async function createAssessment(data: CreateAssessmentData, actor: CurrentUser, options: { isDemo?: boolean } = {}): Promise<AssessmentView> {
  const margin = (await getOfficeSettings()).guidanceMarginPoints;
  const answer = await computeGuidance(toModelInput(data));
  checkFinals(data, answer, margin);
  return getDb().transaction(async (tx) => {
    const regionId = await findOrCreateRegion(tx, data.region, options.isDemo);
    if (await findAssessment(tx, regionId, data.forecastDay)) {
      throw new AppError("CONFLICT", `${data.region} already has an assessment for ${data.forecastDay}; edit that one.`, { fields: { region: "Already assessed on this day." } });
    }
    const id = await insertAssessment(tx, regionId, data, answer, actor, options.isDemo ?? false);
    await recordAudit({ actor: { id: actor.id, email: actor.email }, action: "assessment.created", targetType: "assessment", targetId: id, details: { region: data.region, day: data.forecastDay } }, tx);
    const view = await getAssessment(id, tx);
    if (!view) throw new Error("assessment vanished");
    return view;
  });
}

/** Applies a partial change, re-validates the whole assessment with the one schema, re-scores. */
export async function updateAssessment(id: number, patch: unknown, actor: CurrentUser): Promise<AssessmentView> {
  if (typeof patch !== "object" || patch === null || Array.isArray(patch)) throw new AppError("BAD_REQUEST", "Send a JSON object of the fields to change.");
  const unknown = Object.keys(patch).filter((k) => !PATCHABLE.has(k));
  if (unknown.length) throw new AppError("BAD_REQUEST", "Some fields cannot be changed here.", { fields: Object.fromEntries(unknown.map((k) => [k, "Not a field you can change (region and day are fixed)."])) });
  const current = await getAssessment(id);
  if (!current) throw new AppError("NOT_FOUND", "No such assessment.");
  const merged = { ...current, ...patch, region: current.region, forecastDay: current.forecastDay };
  const data = parseWith(createAssessmentSchema, merged);
  const margin = (await getOfficeSettings()).guidanceMarginPoints;
  const answer = await computeGuidance(toModelInput(data));
  checkFinals(data, answer, margin);
  return getDb().transaction(async (tx) => {
    await tx.update(assessments).set({ ...columnsOf(data, answer), updatedBy: actor.id, updatedAt: new Date() }).where(eq(assessments.id, id));
    await storeGuidance(tx, id, data, answer);
    await recordAudit({ actor: { id: actor.id, email: actor.email }, action: "assessment.updated", targetType: "assessment", targetId: id, details: { fields: Object.keys(patch) } }, tx);
    const view = await getAssessment(id, tx);
    if (!view) throw new Error("assessment vanished");
    return view;
  });
}

export function checkFinals(data: CreateAssessmentData, answer: GuidanceAnswer, marginPoints: number): void {
  if (!data.finals) return;
  const fields = { ...finalsOrderErrors(data.finals), ...missingReasonErrors(data.finals, answer.blended, data.finalReasons, marginPoints) };
  if (Object.keys(fields).length) throw new AppError("BAD_REQUEST", "Some final probabilities need attention.", { fields });
}

export async function insertAssessment(tx: Tx, regionId: number, data: CreateAssessmentData, answer: GuidanceAnswer, actor: CurrentUser, isDemo: boolean): Promise<number> {
  const [row] = await tx
    .insert(assessments)
    .values({ regionId, forecastDay: data.forecastDay, ...columnsOf(data, answer), isDemo, createdBy: actor.id, updatedBy: actor.id })
    .returning({ id: assessments.id });
  if (!row) throw new Error("assessment insert returned nothing");
  await storeGuidance(tx, row.id, data, answer);
  return row.id;
}

function columnsOf(data: CreateAssessmentData, answer: GuidanceAnswer) {
  const parsed = parseLocation(data.location);
  if (!parsed.ok) throw new AppError("BAD_REQUEST", parsed.error, { fields: { location: parsed.error } });
  return {
    location: data.location,
    latitudeDeg: parsed.location.latitudeDeg,
    longitudeDeg: parsed.location.longitudeDeg,
    isLimbFlagged: isBeyondLimbThreshold(parsed.location),
    areaMsh: data.areaMsh,
    spotCount: data.spotCount,
    mcintosh: data.mcintosh,
    mountWilson: data.mountWilson,
    unsignedFluxMx: data.unsignedFluxMx ?? null,
    pilLengthMm: data.pilLengthMm ?? null,
    logR: data.logR ?? null,
    meanShearDeg: data.meanShearDeg ?? null,
    freeEnergyProxy: data.freeEnergyProxy ?? null,
    flaresC: data.flares24h.C,
    flaresM: data.flares24h.M,
    flaresX: data.flares24h.X,
    notes: data.notes,
    blended: answer.blended,
    finals: data.finals ?? null,
    finalReasons: data.finalReasons,
  };
}

async function storeGuidance(tx: Tx, assessmentId: number, data: CreateAssessmentData, answer: GuidanceAnswer): Promise<void> {
  await tx.delete(guidance).where(eq(guidance.assessmentId, assessmentId));
  if (answer.models.length === 0) return;
  const inputs = toModelInput(data);
  await tx.insert(guidance).values(
    answer.models.map((m) => ({ assessmentId, modelId: m.modelId, modelKey: m.key, modelVersion: m.version, inputs, probabilities: m.probabilities, flags: m.flags, missingInputs: m.missingInputs })),
  );
}

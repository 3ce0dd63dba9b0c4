// Recalibrates an active model on the office archive in reported stages: label region-days, fit
// on the training years, compare with the active model on the held-out year, refit on everything.
import { FLARE_LEVELS, type FlareLevel } from "@/lib/domain/flare-levels";
import { isValidMcIntosh } from "@/lib/domain/mcintosh";
import type { FitResultJson } from "@/lib/query/verification-recalibration";
import { findModel, toDefinition } from "@/server/forecast/models.db";
import { AppError } from "@/server/http/errors";
import {
  parseModelParams,
  type LogisticParams,
  type McIntoshPoissonParams,
} from "@/server/scoring/model-params";
import { compileModel, type CompiledModel, type ModelDefinition } from "@/server/scoring/models";
import { loadArchive, type ArchiveDay } from "./archive.db";
import { compareOnHeldOut, splitAtLastYear } from "./holdout";
import { fitLogisticCandidate } from "./logistic-candidate";
import { fitPoissonCandidate, MIN_REGION_DAYS } from "./poisson-candidate";
import { ARCHIVE_RULE, countRegionDayFlares, labelRegionDays } from "./region-days";

export const FIT_STAGES = [
  "Reading the archive",
  "Labelling region-days with observed events",
  "Fitting on the training years",
  "Comparing with the active model on the held-out year",
  "Fitting on the whole archive",
] as const;

export interface FitOutcome {
  result: FitResultJson;
  /** Parameters fitted on the whole archive; null when not proposable. */
  params: McIntoshPoissonParams | LogisticParams | null;
}

type Labelled = ArchiveDay & {
  counts: { C: number; M: number; X: number };
  outcomes: Record<FlareLevel, 0 | 1>;
  outcomesModelWindow: Record<FlareLevel, 0 | 1>;
};

type Fitted = {
  params: McIntoshPoissonParams | LogisticParams | null;
  detail: Pick<FitResultJson, "poisson" | "logistic">;
};

function label(
  days: ArchiveDay[],
  events: Parameters<typeof countRegionDayFlares>[1],
  modelWindowHours: number,
): Labelled[] {
  const counts = countRegionDayFlares(days, events);
  const o24 = labelRegionDays(days, events, 24);
  const oW = modelWindowHours === 24 ? o24 : labelRegionDays(days, events, modelWindowHours);
  const pick = (o: Record<FlareLevel, Uint8Array>, i: number) =>
    Object.fromEntries(FLARE_LEVELS.map((l) => [l, o[l][i] as 0 | 1])) as Record<FlareLevel, 0 | 1>;
  return days.map((d, i) => ({
    ...d,
    counts: counts[i] as Labelled["counts"],
    outcomes: pick(o24, i),
    outcomesModelWindow: pick(oW, i),
  }));
}

function fitOn(def: ModelDefinition, days: readonly Labelled[]): Fitted {
  if (def.kind === "mcintosh-poisson") {
    const usable = days.map((d) => ({ mcintosh: d.input.mcintosh, counts: d.counts }));
    if (!usable.some((d) => isValidMcIntosh(d.mcintosh)))
      return { params: null, detail: { poisson: null, logistic: null } };
    const c = fitPoissonCandidate(usable);
    return {
      params: c.params,
      detail: {
        logistic: null,
        poisson: {
          regionDays: c.regionDays,
          skipped: c.skipped,
          minRegionDays: MIN_REGION_DAYS,
          pooledClasses: [...c.table.pooledClasses],
          zurichFromArchive: c.zurichFromArchive,
          rows: c.table.rows,
        },
      },
    };
  }
  const c = fitLogisticCandidate(
    def.params as LogisticParams,
    days.map((d) => ({ input: d.input, outcomes: d.outcomesModelWindow })),
  );
  return { params: c.params, detail: { poisson: null, logistic: { levels: c.levels } } };
}

const candidateModel = (def: ModelDefinition, params: Fitted["params"]): CompiledModel =>
  compileModel({ ...def, version: "candidate", params, active: false } as ModelDefinition);

const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

export interface ModelToFit {
  id: number;
  def: ModelDefinition;
}

/** The active McIntosh–Poisson or logistic model to recalibrate; AppError for any other. */
export async function openModelForFit(modelId: number): Promise<ModelToFit> {
  const row = await findModel(modelId);
  if (!row || !row.isActive)
    throw new AppError("NOT_FOUND", "Choose an active model to recalibrate.");
  if (row.kind !== "mcintosh-poisson" && row.kind !== "logistic")
    throw new AppError(
      "BAD_REQUEST",
      `A ${row.kind} model has nothing to fit on the archive; choose a McIntosh–Poisson or logistic model.`,
    );
  const parsed = parseModelParams(row.kind, row.params);
  if (!parsed.ok)
    throw new AppError(
      "UNPROCESSABLE_CONTENT",
      "The active model's parameters are invalid; fix them before recalibrating.",
    );
  return { id: row.id, def: { ...toDefinition(row), params: parsed.params } as ModelDefinition };
}

/** Runs every stage, calling onStage before each. */
export async function runRecalibration(
  { id, def }: ModelToFit,
  onStage: (index: number, stage: string) => void,
): Promise<FitOutcome> {
  const step = async (i: number) => {
    onStage(i, FIT_STAGES[i] as string);
    await yieldToEventLoop();
  };
  await step(0);
  const archive = await loadArchive();
  await step(1);
  const days = label(
    archive.days,
    archive.events,
    def.kind === "logistic" ? (def.params as LogisticParams).windowHours : 24,
  );
  const split = splitAtLastYear(days.map((d) => d.day));
  await step(2);
  let holdout: FitResultJson["holdout"] = {
    levels: null,
    reason: "The archive covers a year or less: there is no earlier year to train on.",
  };
  if (split) {
    const train = fitOn(
      def,
      days.filter((d) => d.day <= split.trainTo),
    );
    await step(3);
    holdout = train.params
      ? {
          levels: compareOnHeldOut(
            candidateModel(def, train.params),
            compileModel(def),
            days.filter((d) => d.day >= split.testFrom),
          ),
          reason: null,
        }
      : { levels: null, reason: "The fit on the training years did not converge for every level." };
  }
  await step(4);
  const full =
    archive.days.length > 0
      ? fitOn(def, days)
      : { params: null, detail: { poisson: null, logistic: null } };
  const notProposableReason =
    archive.days.length === 0
      ? "The archive has no assessed region-days."
      : !full.params
        ? "The fit on the whole archive did not converge for every level."
        : holdout.levels === null
          ? holdout.reason
          : null;
  const result: FitResultJson = {
    model: { id, key: def.key, version: def.version, kind: def.kind, name: def.name },
    archive: {
      from: archive.from,
      to: archive.to,
      regionDays: archive.days.length,
      events: archive.events.length,
      isDemo: archive.isDemo,
      rule: ARCHIVE_RULE,
    },
    split,
    ...full.detail,
    holdout,
    isProposable: notProposableReason === null,
    notProposableReason,
  };
  return { result, params: notProposableReason === null ? full.params : null };
}

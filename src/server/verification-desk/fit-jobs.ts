// Recalibration fits as background jobs of this process: started by one request, polled by
// others for their stage, kept in memory until a proposal takes their result.
import { randomUUID } from "node:crypto";
import type { CurrentUser } from "@/lib/auth/roles";
import type { FitJobJson } from "@/lib/query/verification-recalibration";
import { AppError } from "@/server/http/errors";
import {
  FIT_STAGES,
  openModelForFit,
  runRecalibration,
  type FitOutcome,
} from "./recalibration.service";

interface FitJob {
  id: string;
  status: FitJobJson["status"];
  stage: string;
  done: number;
  error: string | null;
  outcome: FitOutcome | null;
  createdBy: number;
  createdAt: number;
  finished: Promise<void>;
}

// A fit lives only as long as the process: a restart means fitting again, which is cheap and
// deterministic. The cap keeps a forgotten page from holding results forever.
const MAX_JOBS = 20;
const jobs = new Map<string, FitJob>();

function evictOldest(): void {
  while (jobs.size >= MAX_JOBS) {
    const oldest = [...jobs.values()]
      .filter((j) => j.status !== "running")
      .sort((a, b) => a.createdAt - b.createdAt)[0];
    if (!oldest)
      throw new AppError(
        "TOO_MANY_REQUESTS",
        "Too many fits are running; wait for one to finish.",
        { retryAfterSeconds: 10 },
      );
    jobs.delete(oldest.id);
  }
}

export function toJobJson(job: FitJob): FitJobJson {
  return {
    id: job.id,
    status: job.status,
    stage: job.stage,
    done: job.done,
    total: FIT_STAGES.length,
    error: job.error,
    result: job.outcome?.result ?? null,
  };
}

/** Checks the model at once (a wrong choice is answered now), then fits in the background. */
export async function startFitJob(modelId: number, actor: CurrentUser): Promise<FitJobJson> {
  const model = await openModelForFit(modelId);
  evictOldest();
  const job: FitJob = {
    id: randomUUID(),
    status: "running",
    stage: "Queued",
    done: 0,
    error: null,
    outcome: null,
    createdBy: actor.id,
    createdAt: Date.now(),
    finished: Promise.resolve(),
  };
  jobs.set(job.id, job);
  job.finished = runRecalibration(model, (index, stage) => {
    job.done = index;
    job.stage = stage;
  })
    .then((outcome) => {
      job.outcome = outcome;
      job.status = "done";
      job.done = FIT_STAGES.length;
      job.stage = "Finished";
    })
    .catch((err: unknown) => {
      job.status = "failed";
      job.error = err instanceof AppError ? err.message : "The fit failed on the server.";
      if (!(err instanceof AppError)) console.error("[facula] recalibration fit failed", err);
    });
  return toJobJson(job);
}

export function getFitJob(id: string): FitJob {
  const job = jobs.get(id);
  if (!job)
    throw new AppError(
      "NOT_FOUND",
      "This fit is no longer held (the desk restarted or it expired); run it again.",
    );
  return job;
}

/** Resolves when the job has finished (tests and the proposal step wait on it). */
export async function waitForFitJob(id: string): Promise<FitJobJson> {
  const job = getFitJob(id);
  await job.finished;
  return toJobJson(job);
}

/** A finished, proposable fit of this verifier, for a proposal. */
export function readProposableOutcome(id: string, actor: CurrentUser): FitOutcome {
  const job = getFitJob(id);
  if (job.status === "running") throw new AppError("CONFLICT", "The fit is still running.");
  if (job.status === "failed" || !job.outcome)
    throw new AppError("UNPROCESSABLE_CONTENT", job.error ?? "The fit failed.");
  if (job.createdBy !== actor.id)
    throw new AppError("FORBIDDEN", "Propose only fits you ran yourself.");
  if (!job.outcome.result.isProposable || !job.outcome.params)
    throw new AppError(
      "UNPROCESSABLE_CONTENT",
      job.outcome.result.notProposableReason ?? "This fit cannot be proposed.",
    );
  return job.outcome;
}

/** Forgets a job once its result is stored, so it is proposed once. */
export function forgetFitJob(id: string): void {
  jobs.delete(id);
}

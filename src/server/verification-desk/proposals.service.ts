// Calibration proposals: a verifier proposes a finished fit; an admin activates it as a new
// model version (deactivating the key's previous one) or rejects it. Each step is audited.
import { and, eq, ne } from "drizzle-orm";
import { getDb, type Tx } from "@/db/client";
import { models } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import type { ProposalJson } from "@/lib/query/verification-recalibration";
import { recordAudit } from "@/server/audit/audit.db";
import { forgetCompiledModels } from "@/server/forecast/models.db";
import { AppError } from "@/server/http/errors";
import { isModelKind, parseModelParams } from "@/server/scoring/model-params";
import { forgetFitJob, readProposableOutcome } from "./fit-jobs";
import {
  findProposal,
  getProposalView,
  insertProposal,
  markDecided,
  readReport,
  versionForProposal,
  type ProposalRow,
} from "./proposals.db";

const actorOf = (u: CurrentUser) => ({ id: u.id, email: u.email });

export async function proposeCalibration(jobId: string, actor: CurrentUser): Promise<ProposalJson> {
  const { result, params } = readProposableOutcome(jobId, actor);
  const id = await getDb().transaction(async (tx) => {
    const id = await insertProposal(tx, {
      kind: result.model.kind,
      modelKey: result.model.key,
      params,
      report: result,
      proposedBy: actor.id,
    });
    await recordAudit(
      {
        actor: actorOf(actor),
        action: "calibration.proposed",
        targetType: "calibration_proposal",
        targetId: id,
        details: {
          modelKey: result.model.key,
          basedOn: result.model.version,
          kind: result.model.kind,
          archive: { from: result.archive.from, to: result.archive.to },
        },
      },
      tx,
    );
    return id;
  });
  forgetFitJob(jobId);
  return (await getProposalView(id)) as ProposalJson;
}

async function openProposal(id: number, tx: Tx): Promise<ProposalRow> {
  const row = await findProposal(id, tx);
  if (!row) throw new AppError("NOT_FOUND", "There is no such proposal.");
  if (row.status !== "proposed")
    throw new AppError("CONFLICT", `This proposal was already ${row.status}.`);
  return row;
}

/** "fitted by Facula on the office archive <period>", with "; demo data" when the archive is demo. */
export function describeProvenance(archive: {
  from: string | null;
  to: string | null;
  isDemo: boolean;
}): string {
  return `fitted by Facula on the office archive ${archive.from ?? "?"} – ${archive.to ?? "?"}${archive.isDemo ? "; demo data" : ""}`;
}

/**
 * Creates the new version inactive, then in the same transaction deactivates the key's other
 * versions and activates it, so guidance never has zero or two active versions of one key. The
 * compiled-model cache is dropped afterwards so the next guidance uses the new coefficients.
 */
export async function activateProposal(
  id: number,
  actor: CurrentUser,
  now = new Date(),
): Promise<{ modelId: number; key: string; version: string }> {
  const activated = await getDb().transaction(async (tx) => {
    const row = await openProposal(id, tx);
    if (!isModelKind(row.kind))
      throw new AppError("UNPROCESSABLE_CONTENT", `Unknown model kind "${row.kind}".`);
    const parsed = parseModelParams(row.kind, row.params);
    if (!parsed.ok)
      throw new AppError(
        "UNPROCESSABLE_CONTENT",
        `The proposed parameters are invalid: ${parsed.fieldErrors[0]?.message ?? "unknown problem"}.`,
      );
    const report = readReport(row);
    const previous = await tx
      .select()
      .from(models)
      .where(and(eq(models.key, row.modelKey), eq(models.isActive, true)));
    const version = versionForProposal(row, now);
    const [created] = await tx
      .insert(models)
      .values({
        key: row.modelKey,
        version,
        kind: row.kind,
        name: previous[0]?.name ?? report.model.name,
        provenance: describeProvenance(report.archive),
        params: parsed.params,
        isActive: false,
        isDemo: report.archive.isDemo,
        createdBy: actor.id,
      })
      .onConflictDoNothing()
      .returning({ id: models.id });
    if (!created)
      throw new AppError("CONFLICT", `Version ${version} of ${row.modelKey} already exists.`);
    await tx
      .update(models)
      .set({ isActive: false })
      .where(and(eq(models.key, row.modelKey), ne(models.id, created.id)));
    await tx.update(models).set({ isActive: true }).where(eq(models.id, created.id));
    await markDecided(tx, id, "activated", actor.id, now);
    await recordAudit(
      {
        actor: actorOf(actor),
        action: "calibration.activated",
        targetType: "model",
        targetId: created.id,
        details: {
          proposalId: id,
          key: row.modelKey,
          version,
          deactivated: previous.map((p) => p.version),
        },
      },
      tx,
    );
    return { modelId: created.id, key: row.modelKey, version };
  });
  forgetCompiledModels();
  return activated;
}

export async function rejectProposal(
  id: number,
  actor: CurrentUser,
  reason: string,
): Promise<void> {
  await getDb().transaction(async (tx) => {
    await openProposal(id, tx);
    await markDecided(tx, id, "rejected", actor.id, new Date());
    await recordAudit(
      {
        actor: actorOf(actor),
        action: "calibration.rejected",
        targetType: "calibration_proposal",
        targetId: id,
        details: { reason },
      },
      tx,
    );
  });
}

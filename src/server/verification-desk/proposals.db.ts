// Drizzle access for calibration proposals; returns them as the recalibration page shows them.
import { desc, eq } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { getDb, type Db, type Tx } from "@/db/client";
import { calibrationProposals, users } from "@/db/schema";
import type { FitResultJson, ProposalJson } from "@/lib/query/verification-recalibration";

export type ProposalRow = typeof calibrationProposals.$inferSelect;

/** The version a proposal becomes on activation: the decision day and the proposal id. */
export function versionForProposal(row: Pick<ProposalRow, "id">, decidedAt: Date): string {
  return `fit-${decidedAt.toISOString().slice(0, 10)}-p${row.id}`;
}

export function readReport(row: Pick<ProposalRow, "report">): FitResultJson {
  return JSON.parse(row.report) as FitResultJson;
}

function toView(
  row: ProposalRow,
  proposedBy: string | null,
  decidedBy: string | null,
): ProposalJson {
  const report = readReport(row);
  return {
    id: row.id,
    kind: row.kind,
    modelKey: row.modelKey,
    status: row.status as ProposalJson["status"],
    proposedBy,
    decidedBy,
    createdAt: row.createdAt.toISOString(),
    decidedAt: row.decidedAt?.toISOString() ?? null,
    archive: { from: report.archive.from, to: report.archive.to, isDemo: report.archive.isDemo },
    heldOut: (report.holdout.levels ?? []).map((l) => ({
      level: l.level,
      candidateBss: l.candidate.bss,
      activeBss: l.active.bss,
    })),
    activatedVersion:
      row.status === "activated" && row.decidedAt ? versionForProposal(row, row.decidedAt) : null,
  };
}

export async function insertProposal(
  tx: Db | Tx,
  values: {
    kind: string;
    modelKey: string;
    params: unknown;
    report: FitResultJson;
    proposedBy: number;
  },
): Promise<number> {
  const [row] = await tx
    .insert(calibrationProposals)
    .values({
      kind: values.kind,
      modelKey: values.modelKey,
      params: JSON.stringify(values.params),
      report: JSON.stringify(values.report),
      proposedBy: values.proposedBy,
    })
    .returning({ id: calibrationProposals.id });
  if (!row) throw new Error("proposal insert returned nothing");
  return row.id;
}

export async function findProposal(id: number, tx: Db | Tx = getDb()): Promise<ProposalRow | null> {
  const [row] = await tx.select().from(calibrationProposals).where(eq(calibrationProposals.id, id));
  return row ?? null;
}

export async function markDecided(
  tx: Db | Tx,
  id: number,
  status: "activated" | "rejected",
  actorId: number,
  decidedAt: Date,
): Promise<void> {
  await tx
    .update(calibrationProposals)
    .set({ status, decidedBy: actorId, decidedAt })
    .where(eq(calibrationProposals.id, id));
}

export async function listProposals(limit = 50): Promise<ProposalJson[]> {
  const proposer = alias(users, "proposer");
  const decider = alias(users, "decider");
  const rows = await getDb()
    .select({ p: calibrationProposals, proposedBy: proposer.email, decidedBy: decider.email })
    .from(calibrationProposals)
    .leftJoin(proposer, eq(calibrationProposals.proposedBy, proposer.id))
    .leftJoin(decider, eq(calibrationProposals.decidedBy, decider.id))
    .orderBy(desc(calibrationProposals.createdAt), desc(calibrationProposals.id))
    .limit(limit);
  return rows.map((r) => toView(r.p, r.proposedBy, r.decidedBy));
}

export async function getProposalView(id: number): Promise<ProposalJson | null> {
  return (await listProposals(500)).find((p) => p.id === id) ?? null;
}

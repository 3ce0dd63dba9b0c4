// Calibration proposals with their held-out skill; an admin activates or rejects them.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { verificationKeys } from "@/lib/query/verification";
import { type ProposalJson } from "@/lib/query/verification-recalibration";
import { fetchJson } from "@/lib/query/fetch-json";
import { formatUtc } from "@/lib/ui/format";
import { FormAlert } from "@/components/ui/FormAlert";
import { formatScore } from "./format-score";

export function ProposalList({
  proposals,
  canActivate,
}: {
  proposals: ProposalJson[];
  canActivate: boolean;
}) {
  const queryClient = useQueryClient();
  const [message, setMessage] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const decide = useMutation({
    mutationFn: async ({ id, action }: { id: number; action: "activate" | "reject" }) => {
      if (action === "activate")
        return fetchJson<{ version: string; key: string }>(
          `/api/verification/recalibration/proposals/${id}/activate`,
          { method: "POST" },
        );
      const reason = window.prompt("Why is this proposal rejected?") ?? "";
      await fetchJson<void>(`/api/verification/recalibration/proposals/${id}/reject`, {
        method: "POST",
        json: { reason },
      });
      return null;
    },
    onSuccess: (r) => {
      setMessage({
        tone: "success",
        text: r
          ? `${r.key} ${r.version} is now the active version; guidance uses it from the next scoring.`
          : "The proposal was rejected.",
      });
      void queryClient.invalidateQueries({ queryKey: verificationKeys.proposals });
    },
    onError: (err) => setMessage({ tone: "error", text: err.message }),
  });
  if (proposals.length === 0) return <p className="text-sm text-ink-700">No proposals yet.</p>;
  return (
    <div className="space-y-3">
      {message && <FormAlert tone={message.tone}>{message.text}</FormAlert>}
      <div className="overflow-x-auto">
        <table className="data-table" aria-label="Proposals">
          <thead>
            <tr>
              <th>#</th>
              <th>Model</th>
              <th>Archive</th>
              <th>Held-out BSS (candidate / active)</th>
              <th>Proposed</th>
              <th>Status</th>
              {canActivate && (
                <th>
                  <span className="sr-only">Decide</span>
                </th>
              )}
            </tr>
          </thead>
          <tbody>
            {proposals.map((p) => (
              <tr key={p.id} data-testid={`proposal-${p.id}`}>
                <td className="num">{p.id}</td>
                <td>
                  {p.modelKey}
                  <div className="text-xs text-ink-700">{p.kind}</div>
                </td>
                <td className="num text-xs">
                  {p.archive.from} – {p.archive.to}
                  {p.archive.isDemo && (
                    <span className="chip ml-1 border-gold-500/50 text-gold-600">demo</span>
                  )}
                </td>
                <td className="num text-xs">
                  {p.heldOut.map((h) => (
                    <div key={h.level}>
                      {h.level}: {formatScore(h.candidateBss)} / {formatScore(h.activeBss)}
                    </div>
                  ))}
                </td>
                <td className="text-xs">
                  {formatUtc(p.createdAt)}
                  <div>{p.proposedBy}</div>
                </td>
                <td className="text-xs">
                  {p.status}
                  {p.activatedVersion && <div className="num">{p.activatedVersion}</div>}
                  {p.decidedBy && <div>{p.decidedBy}</div>}
                </td>
                {canActivate && (
                  <td className="space-x-2 whitespace-nowrap text-right">
                    {p.status === "proposed" && (
                      <>
                        <button
                          type="button"
                          className="btn-primary px-2 py-1"
                          disabled={decide.isPending}
                          onClick={() => {
                            if (
                              window.confirm(
                                `Activate the recalibrated ${p.modelKey}? Its current version is deactivated.`,
                              )
                            )
                              decide.mutate({ id: p.id, action: "activate" });
                          }}
                        >
                          Activate
                        </button>
                        <button
                          type="button"
                          className="btn-quiet px-2 py-1"
                          disabled={decide.isPending}
                          onClick={() => decide.mutate({ id: p.id, action: "reject" })}
                        >
                          Reject
                        </button>
                      </>
                    )}
                  </td>
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}

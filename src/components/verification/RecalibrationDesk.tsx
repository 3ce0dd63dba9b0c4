// The recalibration island: start a fit of an active model, follow its stages, read the result,
// propose it; the proposals below, which an admin activates.
import { QueryClientProvider, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { verificationKeys } from "@/lib/query/verification";
import { type FitJobJson, type ProposalJson } from "@/lib/query/verification-recalibration";
import { fetchJson } from "@/lib/query/fetch-json";
import { getQueryClient } from "@/lib/query/client";
import { FormAlert } from "@/components/ui/FormAlert";
import { FitResultView } from "./FitResultView";
import { ProgressBar } from "@/components/ui/ProgressBar";
import { ProposalList } from "./ProposalList";

export interface FittableModel {
  id: number;
  key: string;
  version: string;
  kind: string;
  name: string;
}

interface Props {
  models: FittableModel[];
  proposals: ProposalJson[];
  canPropose: boolean;
  canActivate: boolean;
}

function FitPanel({ models }: { models: FittableModel[] }) {
  const queryClient = useQueryClient();
  const [modelId, setModelId] = useState(models[0]?.id ?? 0);
  const [jobId, setJobId] = useState<string | null>(null);
  const [message, setMessage] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const start = useMutation({
    mutationFn: () =>
      fetchJson<FitJobJson>("/api/verification/recalibration/fits", {
        method: "POST",
        json: { modelId },
      }),
    onSuccess: (job) => {
      setJobId(job.id);
      setMessage(null);
    },
    onError: (err) => setMessage({ tone: "error", text: err.message }),
  });
  const job = useQuery({
    queryKey: verificationKeys.fit(jobId ?? ""),
    queryFn: () => fetchJson<FitJobJson>(`/api/verification/recalibration/fits/${jobId}`),
    enabled: jobId !== null,
    refetchInterval: (q) => (q.state.data && q.state.data.status !== "running" ? false : 400),
  });
  const propose = useMutation({
    mutationFn: () =>
      fetchJson<ProposalJson>("/api/verification/recalibration/proposals", {
        method: "POST",
        json: { jobId },
      }),
    onSuccess: (p) => {
      setMessage({ tone: "success", text: `Proposal #${p.id} is waiting for an administrator.` });
      setJobId(null);
      void queryClient.invalidateQueries({ queryKey: verificationKeys.proposals });
    },
    onError: (err) => setMessage({ tone: "error", text: err.message }),
  });
  const data = job.data;
  const isRunning = start.isPending || (jobId !== null && (!data || data.status === "running"));
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end gap-3">
        <label className="text-sm">
          Model to recalibrate
          <select
            className="field-input mt-1"
            value={modelId}
            onChange={(e) => setModelId(Number(e.target.value))}
          >
            {models.map((m) => (
              <option key={m.id} value={m.id}>
                {m.name} ({m.key} {m.version})
              </option>
            ))}
          </select>
        </label>
        <button
          type="button"
          className="btn-primary"
          disabled={isRunning || models.length === 0}
          onClick={() => start.mutate()}
        >
          Fit on the archive
        </button>
      </div>
      {isRunning && (
        <ProgressBar
          label={
            data
              ? `Stage ${Math.min(data.done + 1, data.total)} of ${data.total}: ${data.stage}`
              : "Starting the fit"
          }
          value={data ? data.done / data.total : null}
        />
      )}
      {data?.status === "failed" && <FormAlert tone="error">{data.error}</FormAlert>}
      {message && <FormAlert tone={message.tone}>{message.text}</FormAlert>}
      {data?.status === "done" && data.result && (
        <>
          <FitResultView result={data.result} />
          {data.result.isProposable ? (
            <button
              type="button"
              className="btn-accent"
              disabled={propose.isPending}
              onClick={() => propose.mutate()}
            >
              Propose these {data.result.model.kind === "logistic" ? "coefficients" : "rates"}
            </button>
          ) : (
            <FormAlert tone="info">Not proposable: {data.result.notProposableReason}</FormAlert>
          )}
        </>
      )}
    </div>
  );
}

function Proposals({ initial, canActivate }: { initial: ProposalJson[]; canActivate: boolean }) {
  const list = useQuery({
    queryKey: verificationKeys.proposals,
    queryFn: () =>
      fetchJson<{ proposals: ProposalJson[] }>("/api/verification/recalibration/proposals"),
    initialData: { proposals: initial },
  });
  return <ProposalList proposals={list.data.proposals} canActivate={canActivate} />;
}

export function RecalibrationDesk({ models, proposals, canPropose, canActivate }: Props) {
  return (
    <QueryClientProvider client={getQueryClient()}>
      {canPropose && (
        <section className="card" aria-labelledby="fit-heading">
          <h2 id="fit-heading" className="mb-4">
            Fit
          </h2>
          <FitPanel models={models} />
        </section>
      )}
      <section className="card mt-6" aria-labelledby="proposals-heading">
        <h2 id="proposals-heading" className="mb-4">
          Proposals
        </h2>
        <Proposals initial={proposals} canActivate={canActivate} />
      </section>
    </QueryClientProvider>
  );
}

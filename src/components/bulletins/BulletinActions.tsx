// The next steps on a bulletin for the signed-in person, as the server listed them: drafters edit
// and submit; duty officers return, approve and issue, or withdraw; anyone who drafts may correct.
import { QueryClientProvider, useMutation } from "@tanstack/react-query";
import { useState } from "react";
import type { BulletinAction, BulletinState } from "@/lib/domain/bulletin-states";
import { getQueryClient } from "@/lib/query/client";
import { ApiError } from "@/lib/query/fetch-json";
import { FormAlert } from "@/components/ui/FormAlert";
import { DraftSteps } from "./DraftSteps";
import { IssuedSteps } from "./IssuedSteps";
import { ReviewSteps } from "./ReviewSteps";
import type { StepContext } from "./step-context";

export interface BulletinActionsProps {
  id: number;
  forecastDay: string;
  status: BulletinState;
  revision: number;
  contentHash: string | null;
  discussion: string;
  actions: BulletinAction[];
  problems: string[];
  canCorrect: boolean;
}

function Actions(p: BulletinActionsProps) {
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const run = useMutation({
    mutationFn: (call: () => Promise<{ id: number }>) => call(),
    onSuccess: (result) => window.location.assign(`/bulletins/${result.id}?done=1`),
    onError: (err) => setFieldErrors(err instanceof ApiError ? err.fields : {}),
  });
  const ctx: StepContext = {
    id: p.id,
    revision: p.revision,
    isPending: run.isPending,
    fieldErrors,
    go: (call) => {
      setFieldErrors({});
      run.mutate(call);
    },
    check: (schema, value, key, then) => {
      const parsed = schema.safeParse(value);
      if (parsed.success) return then();
      setFieldErrors({ [key]: parsed.error.issues[0]?.message ?? "Check this field." });
    },
  };
  const has = (a: BulletinAction) => p.actions.includes(a);
  if (!p.actions.length && !p.canCorrect) return null;
  const isConflict = run.error instanceof ApiError && run.error.status === 409;
  return (
    <section className="card space-y-4" aria-labelledby="next-h" data-testid="bulletin-actions">
      <h2 id="next-h">Next step</h2>
      {run.isError && (
        <FormAlert tone="error">
          {run.error.message}
          {isConflict && (
            <>
              {" "}
              <a className="underline" href={`/bulletins/${p.id}`}>
                Reload
              </a>
            </>
          )}
        </FormAlert>
      )}
      <DraftSteps
        ctx={ctx}
        discussion={p.discussion}
        problems={p.problems}
        canEdit={has("edit")}
        canSubmit={has("submit")}
        canReopen={has("reopen")}
      />
      <ReviewSteps
        ctx={ctx}
        contentHash={p.contentHash}
        hasProblems={p.problems.length > 0}
        canApprove={has("approve")}
        canReturn={has("return")}
      />
      <IssuedSteps
        ctx={ctx}
        forecastDay={p.forecastDay}
        canWithdraw={has("withdraw")}
        canCorrect={p.canCorrect}
      />
    </section>
  );
}

export function BulletinActions(props: BulletinActionsProps) {
  return (
    <QueryClientProvider client={getQueryClient()}>
      <Actions {...props} />
    </QueryClientProvider>
  );
}

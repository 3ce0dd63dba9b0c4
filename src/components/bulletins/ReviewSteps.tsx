// A duty officer's steps on a bulletin in review: approve and issue (after a confirmation), or
// return it with a comment.
import { useState } from "react";
import { stepBulletin } from "@/lib/query/bulletins";
import { returnBulletinSchema } from "@/lib/schemas/bulletins";
import { describedBy, Field } from "@/components/ui/Field";
import type { StepContext } from "./step-context";

interface Props {
  ctx: StepContext;
  contentHash: string | null;
  hasProblems: boolean;
  canApprove: boolean;
  canReturn: boolean;
}

export function ReviewSteps({ ctx, contentHash, hasProblems, canApprove, canReturn }: Props) {
  const [isConfirming, setConfirming] = useState(false);
  const [comment, setComment] = useState("");
  const approve = () =>
    ctx.go(() =>
      stepBulletin(ctx.id, "approve", {
        revision: ctx.revision,
        ...(contentHash ? { contentHash } : {}),
      }),
    );
  const sendBack = () =>
    ctx.check(returnBulletinSchema, { comment }, "comment", () =>
      ctx.go(() => stepBulletin(ctx.id, "return", { comment })),
    );
  return (
    <>
      {canApprove && (
        <div className="rounded-md border border-calm-600/40 bg-calm-100/50 p-3">
          {!isConfirming ? (
            <button
              type="button"
              className="btn-accent"
              disabled={ctx.isPending || hasProblems}
              onClick={() => setConfirming(true)}
            >
              Approve and issue…
            </button>
          ) : (
            <div className="space-y-2">
              <p className="text-sm">
                Issuing freezes this version, e-mails every subscriber and raises their alerts. It
                cannot be undone, only corrected or withdrawn.
              </p>
              <div className="flex gap-2">
                <button
                  type="button"
                  className="btn-primary"
                  disabled={ctx.isPending}
                  onClick={approve}
                >
                  Issue now
                </button>
                <button type="button" className="btn-quiet" onClick={() => setConfirming(false)}>
                  Cancel
                </button>
              </div>
            </div>
          )}
        </div>
      )}
      {canReturn && (
        <div>
          <Field
            id="return-comment"
            label="Comment for the forecaster"
            error={ctx.fieldErrors.comment}
          >
            <textarea
              {...describedBy("return-comment", ctx.fieldErrors.comment)}
              className="field-input min-h-24"
              value={comment}
              onChange={(e) => setComment(e.target.value)}
            />
          </Field>
          <button
            type="button"
            className="btn-quiet mt-2"
            disabled={ctx.isPending}
            onClick={sendBack}
          >
            Return with comment
          </button>
        </div>
      )}
    </>
  );
}

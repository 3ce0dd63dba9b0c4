// Steps on an issued bulletin: withdraw it with a reason (duty officers), or start a correction.
import { useState } from "react";
import { createBulletin, stepBulletin } from "@/lib/query/bulletins";
import { withdrawBulletinSchema } from "@/lib/schemas/bulletins";
import { describedBy, Field } from "@/components/ui/Field";
import type { StepContext } from "./step-context";

interface Props {
  ctx: StepContext;
  forecastDay: string;
  canWithdraw: boolean;
  canCorrect: boolean;
}

export function IssuedSteps({ ctx, forecastDay, canWithdraw, canCorrect }: Props) {
  const [reason, setReason] = useState("");
  const error = ctx.fieldErrors.reason;
  const withdraw = () =>
    ctx.check(withdrawBulletinSchema, { reason }, "reason", () =>
      ctx.go(() => stepBulletin(ctx.id, "withdraw", { reason })),
    );
  return (
    <>
      {canWithdraw && (
        <div>
          <Field
            id="withdraw-reason"
            label="Reason for withdrawing"
            error={error}
            hint="Subscribers and the feed see this reason."
          >
            <textarea
              {...describedBy("withdraw-reason", error, true)}
              className="field-input min-h-20"
              value={reason}
              onChange={(e) => setReason(e.target.value)}
            />
          </Field>
          <button
            type="button"
            className="btn-quiet mt-2 text-warn-700"
            disabled={ctx.isPending}
            onClick={withdraw}
          >
            Withdraw bulletin
          </button>
        </div>
      )}
      {canCorrect && (
        <button
          type="button"
          className="btn-quiet"
          disabled={ctx.isPending}
          onClick={() => ctx.go(() => createBulletin(forecastDay))}
        >
          Start a correction
        </button>
      )}
    </>
  );
}

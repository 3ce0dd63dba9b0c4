// A drafter's steps: edit the discussion, submit for review, reopen a returned bulletin.
import { useState } from "react";
import { editBulletin, stepBulletin } from "@/lib/query/bulletins";
import { DISCUSSION_MAX_CHARS } from "@/lib/schemas/bulletins";
import { describedBy, Field } from "@/components/ui/Field";
import type { StepContext } from "./step-context";

interface Props {
  ctx: StepContext;
  discussion: string;
  problems: string[];
  canEdit: boolean;
  canSubmit: boolean;
  canReopen: boolean;
}

export function DraftSteps({
  ctx,
  discussion: saved,
  problems,
  canEdit,
  canSubmit,
  canReopen,
}: Props) {
  const [discussion, setDiscussion] = useState(saved);
  const isDirty = discussion.trim() !== saved.trim();
  const error = ctx.fieldErrors.discussion;
  return (
    <>
      {canEdit && (
        <div>
          <Field
            id="discussion"
            label="Edit the discussion"
            error={error}
            hint="Blank lines separate paragraphs. Probabilities are edited on the forecast day."
          >
            <textarea
              {...describedBy("discussion", error, true)}
              className="field-input min-h-40"
              maxLength={DISCUSSION_MAX_CHARS}
              value={discussion}
              onChange={(e) => setDiscussion(e.target.value)}
            />
          </Field>
          <button
            type="button"
            className="btn-quiet mt-2"
            disabled={!isDirty || ctx.isPending}
            onClick={() =>
              ctx.go(() => editBulletin(ctx.id, { discussion, revision: ctx.revision }))
            }
          >
            Save discussion
          </button>
        </div>
      )}
      {canSubmit && (
        <div>
          {problems.length > 0 && (
            <ul className="mb-2 list-disc pl-5 text-sm text-warn-700">
              {problems.map((m) => (
                <li key={m}>{m}</li>
              ))}
            </ul>
          )}
          <button
            type="button"
            className="btn-primary"
            disabled={isDirty || problems.length > 0 || ctx.isPending}
            onClick={() => ctx.go(() => stepBulletin(ctx.id, "submit", {}))}
          >
            Submit for review
          </button>
          {isDirty && <p className="field-hint">Save the discussion first.</p>}
        </div>
      )}
      {canReopen && (
        <button
          type="button"
          className="btn-quiet"
          disabled={ctx.isPending}
          onClick={() => ctx.go(() => stepBulletin(ctx.id, "reopen", {}))}
        >
          Reopen as draft
        </button>
      )}
    </>
  );
}

// A region's assessment for one forecast day: measurements, live guidance, finals with reasons.
import { zodResolver } from "@hookform/resolvers/zod";
import { QueryClientProvider, useQuery } from "@tanstack/react-query";
import { useMemo, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import type { ProbabilityGrid } from "@/lib/domain/flare-levels";
import { cellsNeedingReason, finalsOrderErrors } from "@/lib/domain/finals";
import { isBeyondLimbThreshold, angularDistanceFromDiskCentreDeg, parseLocation } from "@/lib/domain/location";
import { plausibilityWarnings } from "@/lib/domain/metrics";
import { assessmentInputSchema, type AssessmentInputValues } from "@/lib/schemas/assessment";
import { getQueryClient } from "@/lib/query/client";
import { ApiError, fetchJson } from "@/lib/query/fetch-json";
import { guidanceQuery } from "@/lib/query/forecast";
import { fromPercentGrid, isPercentGridEmpty, toPercentGrid, type PercentGrid } from "@/lib/ui/grid-format";
import { useDebounced } from "@/lib/ui/use-debounced";
import { FormAlert } from "@/components/ui/FormAlert";
import { FinalsGrid } from "./FinalsGrid";
import { GuidancePanel } from "./GuidancePanel";
import { RegionFields } from "./RegionFields";

type Values = AssessmentInputValues & { notes?: string };

export interface EditorProps {
  day: string;
  assessmentId: number | null;
  initial: Values;
  initialFinals: ProbabilityGrid | null;
  initialReasons: Record<string, string>;
  marginPoints: number;
  startedFrom: string | null;
}

function Editor({ day, assessmentId, initial, initialFinals, initialReasons, marginPoints, startedFrom }: EditorProps) {
  const form = useForm<Values>({ resolver: zodResolver(assessmentInputSchema) as never, defaultValues: initial, mode: "onBlur" });
  const { register, handleSubmit, formState, setError, control } = form;
  const [finals, setFinals] = useState<PercentGrid>(toPercentGrid(initialFinals));
  const [reasons, setReasons] = useState<Record<string, string>>(initialReasons);
  const [serverErrors, setServerErrors] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<{ tone: "success" | "error"; text: string } | null>(null);

  const watched = useWatch({ control }) as Values;
  const settled = useDebounced(watched, 400);
  const parsed = useMemo(() => assessmentInputSchema.safeParse(settled), [settled]);
  const guidance = useQuery({ ...guidanceQuery(parsed.success ? parsed.data : ({} as never)), enabled: parsed.success });
  const blended = guidance.data?.blended ?? null;

  const loc = parseLocation(String(watched.location ?? ""));
  const limbNote = loc.ok && isBeyondLimbThreshold(loc.location) ? `${Math.round(angularDistanceFromDiskCentreDeg(loc.location))}° from disk centre: magnetic metrics suffer projection effects.` : null;
  const warnings = Object.fromEntries(plausibilityWarnings(toNumbers(watched)).map((w) => [w.field, w.message]));
  const finalsGrid = fromPercentGrid(finals);
  const needsReason = new Set<string>(finalsGrid ? cellsNeedingReason(finalsGrid, blended, marginPoints) : []);
  const orderErrors = finalsGrid ? finalsOrderErrors(finalsGrid) : {};
  const finalsErrors = { ...orderErrors, ...serverErrors };

  const onSubmit = handleSubmit(async (values) => {
    setStatus(null);
    setServerErrors({});
    if (!isPercentGridEmpty(finals) && !finalsGrid) {
      setStatus({ tone: "error", text: "Fill every final probability with a number from 0 to 100, or leave them all empty." });
      return;
    }
    const body = { ...values, finals: finalsGrid, finalReasons: Object.fromEntries([...needsReason].map((k) => [k, reasons[k] ?? ""])) };
    try {
      if (assessmentId) {
        const { region: _r, ...patch } = body;
        await fetchJson(`/api/assessments/${assessmentId}`, { method: "PATCH", json: patch });
        setStatus({ tone: "success", text: "Saved. Guidance and finals are stored side by side." });
      } else {
        await fetchJson("/api/assessments", { method: "POST", json: { ...body, forecastDay: day } });
        window.location.href = `/days/${day}?saved=${encodeURIComponent(String(values.region).toUpperCase())}`;
      }
    } catch (err) {
      const fields = err instanceof ApiError ? err.fields : {};
      const grid: Record<string, string> = {};
      for (const [f, m] of Object.entries(fields)) {
        if (f.startsWith("finals") || f.startsWith("finalReasons")) grid[f] = m;
        else setError(f as keyof Values, { message: m });
      }
      setServerErrors(grid);
      setStatus({ tone: "error", text: (err as Error).message });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Region assessment" className="grid gap-6 xl:grid-cols-[minmax(0,0.85fr)_minmax(0,1.35fr)]">
      <div className="space-y-6">
        {startedFrom && <FormAlert tone="info">Started from this region's assessment of {startedFrom}. Check every value.</FormAlert>}
        <RegionFields register={register} errors={formState.errors} warnings={warnings} isRegionLocked={!!assessmentId} limbNote={limbNote} />
        <div className="card">
          <label className="field-label" htmlFor="notes">Notes</label>
          <textarea id="notes" rows={3} className="field-input" {...register("notes")} />
        </div>
      </div>
      <div className="space-y-6 xl:sticky xl:top-4 xl:self-start">
        <GuidancePanel data={guidance.data} isFetching={guidance.isFetching} error={guidance.error?.message ?? null} isInputComplete={parsed.success} />
        <FinalsGrid values={finals} reasons={reasons} blended={blended} needsReason={needsReason} errors={finalsErrors}
          onValue={(l, w, v) => setFinals((g) => ({ ...g, [l]: { ...g[l as keyof PercentGrid], [w]: v } }))}
          onReason={(k, v) => setReasons((r) => ({ ...r, [k]: v }))}
          onCopyGuidance={() => blended && setFinals(toPercentGrid(blended))} />
        {status && <FormAlert tone={status.tone}>{status.text}</FormAlert>}
        <div className="flex gap-3">
          <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>{formState.isSubmitting ? "Saving…" : assessmentId ? "Save changes" : "Save assessment"}</button>
          <a href={`/days/${day}`} className="btn-quiet">Back to the day</a>
        </div>
      </div>
    </form>
  );
}

function toNumbers(v: Values) {
  const n = (x: unknown) => (x === "" || x === null || x === undefined ? null : Number(x));
  return { areaMsh: n(v.areaMsh), spotCount: n(v.spotCount), unsignedFluxMx: n(v.unsignedFluxMx), pilLengthMm: n(v.pilLengthMm), logR: n(v.logR), meanShearDeg: n(v.meanShearDeg), freeEnergyProxy: n(v.freeEnergyProxy) };
}

export function AssessmentEditor(props: EditorProps) {
  return <QueryClientProvider client={getQueryClient()}><Editor {...props} /></QueryClientProvider>;
}

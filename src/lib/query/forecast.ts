// Query option factories and API shapes for the forecast islands.
import { queryOptions } from "@tanstack/react-query";
import type { ProbabilityGrid } from "@/lib/domain/flare-levels";
import type { AssessmentInputData } from "@/lib/schemas/assessment";
import { fetchJson } from "./fetch-json";

export interface GuidanceModelAnswer {
  key: string;
  name: string;
  version: string;
  provenance: string;
  probabilities: ProbabilityGrid | null;
  missingInputs: string[];
  flags: string[];
  reason: string | null;
}

export interface GuidanceResponse {
  models: GuidanceModelAnswer[];
  blended: ProbabilityGrid | null;
  spread: ProbabilityGrid | null;
  flags: string[];
}

export const forecastKeys = {
  guidance: (input: AssessmentInputData) => ["guidance", input] as const,
  day: (day: string) => ["day", day] as const,
  fullDisk: (day: string) => ["full-disk", day] as const,
};

export function guidanceQuery(input: AssessmentInputData) {
  return queryOptions({
    queryKey: forecastKeys.guidance(input),
    queryFn: ({ signal }) => fetchJson<GuidanceResponse>("/api/guidance", { method: "POST", json: input, signal }),
    staleTime: 60_000,
    placeholderData: (prev) => prev,
  });
}

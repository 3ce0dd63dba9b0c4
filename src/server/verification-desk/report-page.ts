// Reads a report page's query string: the filters (defaults where a value is refused, with its
// message) and the reference chosen by default, then builds the report.
import type { SourceOption, VerificationReport } from "@/lib/query/verification";
import { searchParamsObject } from "@/lib/schemas/paging";
import {
  reportQuerySchema,
  reportSearchParams,
  type ReportQuery,
} from "@/lib/schemas/verification-report";
import { zodFieldErrors } from "@/server/http/body";
import { listSources } from "./records.db";
import { buildReport } from "./report.service";

export interface ReportPage {
  sources: SourceOption[];
  query: ReportQuery;
  queryString: string;
  errors: Record<string, string>;
  report: VerificationReport;
}

/** Without a "reference" in the address, the first model is the reference (forecaster vs model). */
export async function loadReportPage(url: URL): Promise<ReportPage> {
  const sources = await listSources();
  const raw = searchParamsObject(url.searchParams);
  if (!url.searchParams.has("reference")) {
    const model = sources.find((s) => s.kind === "model" && s.id !== (raw.source ?? "forecaster"));
    if (model) raw.reference = model.id;
  }
  const parsed = reportQuerySchema.safeParse(raw);
  const errors = parsed.success ? {} : zodFieldErrors(parsed.error.issues);
  const kept = parsed.success
    ? null
    : reportQuerySchema.safeParse(
        Object.fromEntries(Object.entries(raw).filter(([k]) => !(k in errors))),
      );
  const query = parsed.success
    ? parsed.data
    : kept?.success
      ? kept.data
      : reportQuerySchema.parse({});
  return {
    sources,
    query,
    queryString: reportSearchParams(query),
    errors,
    report: await buildReport(query, sources),
  };
}

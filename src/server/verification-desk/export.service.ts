// CSV exports of a report: the matched forecast–observation pairs, and the score table.
import Papa from "papaparse";
import {
  CONTINGENCY_KEYS,
  SCORE_KEYS,
  type ScoreJson,
  type VerificationReport,
} from "@/lib/query/verification";
import type { ReportQuery } from "@/lib/schemas/verification-report";
import { buildReport, loadCases } from "./report.service";

/** A cell starting with = + - @ is quoted so a spreadsheet does not run it as a formula
 * (series names are typed by people; OWASP CSV injection guidance). */
const UNPARSE = { escapeFormulae: true } as const;

export interface CsvFile {
  filename: string;
  text: string;
}

function fileStem(q: ReportQuery): string {
  const period = `${q.from ?? "start"}_${q.to ?? "end"}`;
  return `facula-${q.source.replace(/[^\w.-]+/g, "-")}-${q.level.replace("+", "plus")}-${q.window}h-${q.scope}-${period}`;
}

export async function exportPairs(q: ReportQuery): Promise<CsvFile> {
  const { cases } = await loadCases(q);
  const rows = Array.from(cases.p, (p, i) => {
    const ref = cases.pRef[i] as number;
    return {
      issue_time_utc: new Date(cases.issueTimeMs[i] as number).toISOString(),
      region: cases.regionNumber[i] ?? "full disk",
      level: q.level,
      window_hours: q.window,
      source: q.source,
      probability: p,
      reference: q.reference ?? "",
      reference_probability: Number.isNaN(ref) ? "" : ref,
      observed: cases.o[i] as number,
      flux_convention: q.convention,
    };
  });
  const fields = [
    "issue_time_utc",
    "region",
    "level",
    "window_hours",
    "source",
    "probability",
    "reference",
    "reference_probability",
    "observed",
    "flux_convention",
  ];
  return {
    filename: `${fileStem(q)}-pairs.csv`,
    text: Papa.unparse(
      {
        fields,
        data: rows.map((r) => fields.map((f) => r[f as keyof typeof r])),
      },
      UNPARSE,
    ),
  };
}

const cell = (s: ScoreJson) => (s.value === null ? ["undefined", s.reason] : [s.value, ""]);

/** One row per score: section, name, value (or "undefined") and the reason when undefined. */
export function scoreTableRows(r: VerificationReport): (string | number)[][] {
  const rows: (string | number)[][] = [
    ["sample", "source", r.source.label, ""],
    ["sample", "reference", r.reference?.label ?? "none", ""],
    ["sample", "level", r.level, ""],
    ["sample", "window_hours", r.windowHours, ""],
    ["sample", "scope", r.scope, ""],
    ["sample", "flux_convention", r.convention, ""],
    ["sample", "period", `${r.period.from ?? "start"} to ${r.period.to ?? "end"}`, ""],
    ["sample", "cases", r.sample.n, ""],
    ["sample", "events", r.sample.events, ""],
    ["sample", "demo_data", r.isDemo ? "yes (demo — invented for the scenario)" : "no", ""],
  ];
  for (const key of SCORE_KEYS) rows.push(["scores", key, ...cell(r.scores[key])]);
  const t = r.contingency.table;
  rows.push(
    ["contingency", "threshold", r.contingency.threshold, ""],
    ["contingency", "hits", t.hits, ""],
    ["contingency", "false_alarms", t.falseAlarms, ""],
    ["contingency", "misses", t.misses, ""],
    ["contingency", "correct_negatives", t.correctNegatives, ""],
  );
  for (const key of CONTINGENCY_KEYS)
    rows.push(["contingency", key, ...cell(r.contingency.scores[key])]);
  if (r.comparison) {
    for (const [side, scores] of [
      ["source", r.comparison.source],
      ["reference", r.comparison.reference],
    ] as const) {
      for (const [key, score] of Object.entries(scores))
        rows.push([`shared_cases_${side}`, key, ...cell(score)]);
    }
  }
  return rows;
}

export async function exportScores(q: ReportQuery): Promise<CsvFile> {
  const report = await buildReport(q);
  return {
    filename: `${fileStem(q)}-scores.csv`,
    text: Papa.unparse(
      {
        fields: ["section", "score", "value", "undefined_reason"],
        data: scoreTableRows(report),
      },
      UNPARSE,
    ),
  };
}

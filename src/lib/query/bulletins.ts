// API shapes of the bulletin endpoints and the islands' query keys and calls (isomorphic).
import { queryOptions } from "@tanstack/react-query";
import type { BulletinAction, BulletinState } from "@/lib/domain/bulletin-states";
import type { ProbabilityGrid } from "@/lib/domain/flare-levels";
import type {
  ApproveBulletinData,
  EditBulletinData,
  ReturnBulletinData,
  WithdrawBulletinData,
} from "@/lib/schemas/bulletins";
import { fetchJson } from "./fetch-json";

/** A region row as sent: finals, or blended guidance where the forecaster set none. */
export interface BulletinRegionJson {
  region: string;
  location: string;
  isLimbFlagged: boolean;
  areaMsh: number | null;
  mcintosh: string | null;
  mountWilson: string | null;
  probabilities: ProbabilityGrid;
  probabilitySource?: "final" | "guidance";
}

/** The bulletin's content on the wire and in the `content` column (times as ISO 8601 UTC). */
// A type alias, not an interface, so it fits the jsonb column's Record<string, unknown>.
export type BulletinContentJson = {
  id: number;
  forecastDay: string;
  version: number;
  issueTime: string;
  officeName: string;
  contactLine: string;
  fullDisk: ProbabilityGrid;
  regions: BulletinRegionJson[];
  discussion: string;
  cautions: string[];
  supersedesVersion: number | null;
  isDemo: boolean;
};

export interface BulletinSummary {
  id: number;
  forecastDay: string;
  version: number;
  status: BulletinState;
  authorId: number;
  authorName: string;
  approverName: string | null;
  issueTime: string | null;
  submittedAt: string | null;
  updatedAt: string;
  supersedesId: number | null;
  isDemo: boolean;
  revision: number;
}

export interface BulletinListResponse {
  bulletins: BulletinSummary[];
  total: number;
  page: number;
  pageSize: number;
}

export interface BulletinDetail extends BulletinSummary {
  discussion: string;
  withdrawnReason: string | null;
  /** Frozen content once issued; live content (issue time = now) while open; null if incomplete. */
  content: BulletinContentJson | null;
  /** What stops an open bulletin from being submitted or issued; empty when nothing does. */
  problems: string[];
  /** Fingerprint of the live content; send it back when approving. */
  contentHash: string | null;
  comments: { authorName: string; body: string; createdAt: string }[];
  /** What the signed-in user may do next. */
  actions: BulletinAction[];
}

export const bulletinKeys = {
  all: ["bulletins"] as const,
  detail: (id: number) => ["bulletins", id] as const,
};

export function bulletinQuery(id: number) {
  return queryOptions({
    queryKey: bulletinKeys.detail(id),
    queryFn: () => fetchJson<BulletinDetail>(`/api/bulletins/${id}`),
  });
}

export function createBulletin(forecastDay: string): Promise<BulletinDetail> {
  return fetchJson<BulletinDetail>("/api/bulletins", { method: "POST", json: { forecastDay } });
}

export function editBulletin(id: number, body: EditBulletinData): Promise<BulletinDetail> {
  return fetchJson<BulletinDetail>(`/api/bulletins/${id}`, { method: "PATCH", json: body });
}

type StepBody = {
  submit: Record<string, never>;
  return: ReturnBulletinData;
  approve: ApproveBulletinData;
  withdraw: WithdrawBulletinData;
  reopen: Record<string, never>;
};

export function stepBulletin<S extends keyof StepBody>(
  id: number,
  step: S,
  body: StepBody[S],
): Promise<BulletinDetail> {
  return fetchJson<BulletinDetail>(`/api/bulletins/${id}/${step}`, { method: "POST", json: body });
}

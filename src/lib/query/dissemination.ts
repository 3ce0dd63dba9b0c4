// Query option factories and API shapes for the contacts, deliveries, alerts and portal islands.
// Dates arrive as ISO strings (JSON).
import { queryOptions } from "@tanstack/react-query";
import type { AlertState } from "@/lib/schemas/subscriptions";
import { fetchJson } from "./fetch-json";

export interface ThresholdItem {
  id: number;
  level: string;
  windowHours: number;
  probability: number;
}

export interface ContactItem {
  id: number;
  organisationId: number;
  organisationName: string;
  name: string;
  email: string;
  wantsBulletins: boolean;
  unsubscribedAt: string | null;
  userId: number | null;
  isDemo: boolean;
  thresholds: ThresholdItem[];
}

export interface AlertItem {
  id: number;
  reference: string;
  bulletinId: number;
  bulletinVersion: number;
  forecastDay: string;
  issueTime: string | null;
  contactId: number;
  contactName: string;
  organisationName: string;
  level: string;
  windowHours: number;
  probability: number;
  thresholdProbability: number;
  raisedAt: string;
  windowEndsAt: string | null;
  acknowledgedAt: string | null;
  acknowledgedVia: string | null;
  remindedAt: string | null;
  escalatedAt: string | null;
}

export interface BoardAlert extends AlertItem {
  state: AlertState;
  contactEmail: string;
  mailStatus: string | null;
}

export interface AlertBoard {
  alerts: BoardAlert[];
  chase: BoardAlert[];
  counts: Record<AlertState, number>;
  bulletins: {
    id: number;
    forecastDay: string;
    version: number;
    issueTime: string | null;
    alertCount: number;
  }[];
  isTruncated: boolean;
  generatedAt: string;
}

export interface StatusCounts {
  queued: number;
  sending: number;
  sent: number;
  failed: number;
  total: number;
}

export interface DeliveryRow {
  id: number;
  kind: string;
  toEmail: string;
  attempts: number;
  lastError: string | null;
  nextAttemptAt: string;
}

export interface DeliveryProgress {
  bulletin: {
    id: number;
    forecastDay: string;
    version: number;
    status: string;
    issueTime: string | null;
  };
  counts: StatusCounts;
  byKind: Record<string, StatusCounts>;
  failures: DeliveryRow[];
  retrying: DeliveryRow[];
  generatedAt: string;
}

export interface OwnSubscription {
  contact: ContactItem;
  openAlerts: AlertItem[];
  recentAlerts: AlertItem[];
}

export interface ContactFilter {
  q?: string;
  organisationId?: number;
  page: number;
}

export const disseminationKeys = {
  contacts: ["contacts"] as const,
  organisations: ["contacts", "organisations"] as const,
  delivery: (bulletinId: number) => ["deliveries", bulletinId] as const,
  board: ["alert-board"] as const,
  own: ["subscription"] as const,
};

/** How often live pages poll: a duty officer watching a delivery sees it move every 1.5 s. */
export const LIVE_INTERVAL_MS = 1500;

export function contactsQuery(filter: ContactFilter) {
  const params = new URLSearchParams({ page: String(filter.page) });
  if (filter.q) params.set("q", filter.q);
  if (filter.organisationId) params.set("organisationId", String(filter.organisationId));
  return queryOptions({
    queryKey: [...disseminationKeys.contacts, filter],
    queryFn: () =>
      fetchJson<{ contacts: ContactItem[]; total: number; page: number; pageSize: number }>(
        `/api/contacts?${params}`,
      ),
    placeholderData: (prev) => prev,
  });
}

export function contactOrganisationsQuery() {
  return queryOptions({
    queryKey: disseminationKeys.organisations,
    queryFn: () =>
      fetchJson<{ organisations: { id: number; name: string; sector: string }[] }>(
        "/api/contacts/organisations",
      ),
    staleTime: 5 * 60_000,
  });
}

export function deliveryProgressQuery(bulletinId: number) {
  return queryOptions({
    queryKey: disseminationKeys.delivery(bulletinId),
    queryFn: () => fetchJson<DeliveryProgress>(`/api/deliveries?bulletin=${bulletinId}`),
    refetchInterval: LIVE_INTERVAL_MS,
    staleTime: 0,
  });
}

export function alertBoardQuery(filter: { bulletin?: number; state?: AlertState }) {
  const params = new URLSearchParams();
  if (filter.bulletin) params.set("bulletin", String(filter.bulletin));
  if (filter.state) params.set("state", filter.state);
  return queryOptions({
    queryKey: [...disseminationKeys.board, filter],
    queryFn: () => fetchJson<AlertBoard>(`/api/alerts?${params}`),
    refetchInterval: LIVE_INTERVAL_MS,
    staleTime: 0,
    placeholderData: (prev) => prev,
  });
}

export function ownSubscriptionQuery() {
  return queryOptions({
    queryKey: disseminationKeys.own,
    queryFn: () => fetchJson<{ subscription: OwnSubscription | null }>("/api/subscriptions"),
    refetchInterval: 10_000,
  });
}

// Query option factories for the administration islands.
import { queryOptions } from "@tanstack/react-query";
import type { Role } from "@/lib/auth/roles";
import { fetchJson } from "./fetch-json";

export interface UserListItem {
  id: number;
  email: string;
  name: string;
  role: Role;
  organisationId: number | null;
  organisationName: string | null;
  isActive: boolean;
  hasPassword: boolean;
  isDemo: boolean;
}

export interface UserListFilter {
  q?: string;
  role?: Role | "";
  status?: "" | "active" | "inactive" | "invited";
  page: number;
}

export interface OrganisationItem {
  id: number;
  name: string;
  sector: string;
  isDemo: boolean;
  memberCount: number;
}

export const adminKeys = {
  users: ["admin", "users"] as const,
  organisations: ["admin", "organisations"] as const,
};

export function usersQuery(filter: UserListFilter) {
  const params = new URLSearchParams({ page: String(filter.page), pageSize: "20" });
  if (filter.q) params.set("q", filter.q);
  if (filter.role) params.set("role", filter.role);
  if (filter.status) params.set("status", filter.status);
  return queryOptions({
    queryKey: [...adminKeys.users, filter],
    queryFn: () => fetchJson<{ users: UserListItem[]; total: number; page: number; pageSize: number }>(`/api/admin/users?${params}`),
    placeholderData: (prev) => prev,
  });
}

export function organisationsQuery() {
  return queryOptions({
    queryKey: adminKeys.organisations,
    queryFn: () => fetchJson<{ organisations: OrganisationItem[] }>("/api/admin/organisations"),
  });
}

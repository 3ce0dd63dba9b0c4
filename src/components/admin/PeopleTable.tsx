// People list with filters and pages; change a role, deactivate or reactivate, resend an invitation.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { ROLE_LABELS, ROLES, type Role } from "@/lib/auth/roles";
import { adminKeys, usersQuery, type UserListFilter, type UserListItem } from "@/lib/query/admin";
import { fetchJson } from "@/lib/query/fetch-json";
import { FormAlert } from "@/components/ui/FormAlert";
import { Pager } from "@/components/ui/Pager";

export function PeopleTable({ currentUserId }: { currentUserId: number }) {
  const [filter, setFilter] = useState<UserListFilter>({ page: 1, q: "", role: "", status: "" });
  const [message, setMessage] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const queryClient = useQueryClient();
  const list = useQuery(usersQuery(filter));
  const change = useMutation({
    mutationFn: ({ id, body }: { id: number; body: Record<string, unknown>; label: string }) =>
      fetchJson<void>(`/api/admin/users/${id}`, { method: "PATCH", json: body }),
    onSuccess: (_r, v) => { setMessage({ tone: "success", text: v.label }); void queryClient.invalidateQueries({ queryKey: adminKeys.users }); },
    onError: (err) => setMessage({ tone: "error", text: err.message }),
  });
  const resend = useMutation({
    mutationFn: (u: UserListItem) => fetchJson<{ emailSent: boolean; emailError?: string }>(`/api/admin/users/${u.id}/invitation`, { method: "POST" }),
    onSuccess: (r, u) => setMessage(r.emailSent ? { tone: "success", text: `A new invitation went to ${u.email}; older links no longer work.` } : { tone: "error", text: `The e-mail failed: ${r.emailError}` }),
    onError: (err) => setMessage({ tone: "error", text: err.message }),
  });
  const update = (patch: Partial<UserListFilter>) => setFilter((f) => ({ ...f, page: 1, ...patch }));

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end gap-3" role="search">
        <label className="text-sm">Search<input type="search" className="field-input mt-1 w-56" placeholder="Name or e-mail" value={filter.q} onChange={(e) => update({ q: e.target.value })} /></label>
        <label className="text-sm">Role<select className="field-input mt-1" value={filter.role} onChange={(e) => update({ role: e.target.value as Role | "" })}><option value="">All roles</option>{ROLES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r]}</option>)}</select></label>
        <label className="text-sm">Status<select className="field-input mt-1" value={filter.status} onChange={(e) => update({ status: e.target.value as UserListFilter["status"] })}><option value="">Any</option><option value="active">Active</option><option value="invited">Invited, no password yet</option><option value="inactive">Deactivated</option></select></label>
      </div>
      {message && <FormAlert tone={message.tone}>{message.text}</FormAlert>}
      {list.isError && <FormAlert tone="error">{list.error.message}</FormAlert>}
      <div className="overflow-x-auto">
        <table className="data-table">
          <thead><tr><th>Name</th><th>E-mail</th><th>Role</th><th>Status</th><th><span className="sr-only">Actions</span></th></tr></thead>
          <tbody>
            {list.data?.users.map((u) => (
              <tr key={u.id} data-testid={`user-${u.email}`}>
                <td>{u.name}{u.isDemo && <span className="chip ml-2 border-gold-500/50 text-gold-600">demo</span>}{u.organisationName && <div className="text-xs text-ink-700">{u.organisationName}</div>}</td>
                <td className="break-all">{u.email}</td>
                <td>
                  <label className="sr-only" htmlFor={`role-${u.id}`}>Role of {u.name}</label>
                  <select id={`role-${u.id}`} className="field-input py-1" value={u.role} disabled={u.id === currentUserId || change.isPending}
                    onChange={(e) => change.mutate({ id: u.id, body: { role: e.target.value }, label: `${u.name} is now ${ROLE_LABELS[e.target.value as Role].toLowerCase()}.` })}>
                    {ROLES.map((r) => <option key={r} value={r} disabled={r === "subscriber" && !u.organisationId}>{ROLE_LABELS[r]}</option>)}
                  </select>
                </td>
                <td>{!u.isActive ? <span className="chip border-warn-700/40 text-warn-700">deactivated</span> : u.hasPassword ? <span className="chip border-calm-600/40 text-calm-600">active</span> : <span className="chip text-ink-700">invited</span>}</td>
                <td className="space-x-2 whitespace-nowrap text-right">
                  {!u.hasPassword && u.isActive && <button type="button" className="btn-quiet px-2 py-1" onClick={() => resend.mutate(u)}>Resend invitation</button>}
                  {u.id !== currentUserId && (u.isActive
                    ? <button type="button" className="btn-quiet px-2 py-1 text-warn-700" onClick={() => { if (confirm(`Deactivate ${u.name}? They are signed out on their next request.`)) change.mutate({ id: u.id, body: { isActive: false }, label: `${u.name} is deactivated.` }); }}>Deactivate</button>
                    : <button type="button" className="btn-quiet px-2 py-1" onClick={() => change.mutate({ id: u.id, body: { isActive: true }, label: `${u.name} is active again.` })}>Reactivate</button>)}
                </td>
              </tr>
            ))}
            {list.data && list.data.users.length === 0 && <tr><td colSpan={5} className="py-6 text-center text-ink-700">Nobody matches these filters.</td></tr>}
          </tbody>
        </table>
      </div>
      {list.data && <Pager page={filter.page} pageSize={list.data.pageSize} total={list.data.total} onPage={(page) => setFilter((f) => ({ ...f, page }))} />}
    </div>
  );
}

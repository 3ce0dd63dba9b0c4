// The desk's contact list: filter by organisation or text, open a contact to edit it, add one.
import { QueryClientProvider, useQuery } from "@tanstack/react-query";
import { Fragment, useState } from "react";
import { getQueryClient } from "@/lib/query/client";
import {
  contactOrganisationsQuery,
  contactsQuery,
  type ContactFilter,
} from "@/lib/query/dissemination";
import { describeThreshold } from "@/lib/schemas/subscriptions";
import { FormAlert } from "@/components/ui/FormAlert";
import { Pager } from "@/components/ui/Pager";
import { ContactDetails } from "./ContactDetails";
import { ContactForm } from "./ContactForm";

function ContactsList() {
  const [filter, setFilter] = useState<ContactFilter>({ page: 1, q: "" });
  const [openId, setOpenId] = useState<number | null>(null);
  const list = useQuery(contactsQuery(filter));
  const orgs = useQuery(contactOrganisationsQuery());
  const update = (patch: Partial<ContactFilter>) => setFilter((f) => ({ ...f, page: 1, ...patch }));
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end gap-3" role="search">
        <label className="text-sm">
          Search
          <input
            type="search"
            className="field-input mt-1 w-56"
            placeholder="Name or e-mail"
            value={filter.q}
            onChange={(e) => update({ q: e.target.value })}
          />
        </label>
        <label className="text-sm">
          Organisation
          <select
            className="field-input mt-1"
            value={filter.organisationId ?? ""}
            onChange={(e) =>
              update({ organisationId: e.target.value ? Number(e.target.value) : undefined })
            }
          >
            <option value="">All</option>
            {orgs.data?.organisations.map((o) => (
              <option key={o.id} value={o.id}>
                {o.name}
              </option>
            ))}
          </select>
        </label>
      </div>
      {list.isError && <FormAlert tone="error">{list.error.message}</FormAlert>}
      <div className="overflow-x-auto">
        <table className="data-table">
          <thead>
            <tr>
              <th>Contact</th>
              <th>Organisation</th>
              <th>Receives</th>
              <th>Alert thresholds</th>
              <th>
                <span className="sr-only">Open</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {list.data?.contacts.map((c) => (
              <Fragment key={c.id}>
                <tr data-testid={`contact-${c.email}`}>
                  <td>
                    {c.name}
                    {c.isDemo && (
                      <span className="chip ml-2 border-gold-500/50 text-gold-600">demo</span>
                    )}
                    <div className="text-xs break-all text-ink-700">
                      {c.email}
                      {c.userId && " · has an account"}
                    </div>
                  </td>
                  <td>{c.organisationName}</td>
                  <td>
                    {c.unsubscribedAt ? (
                      <span className="chip border-warn-700/40 text-warn-700">unsubscribed</span>
                    ) : c.wantsBulletins ? (
                      "Bulletins and alerts"
                    ) : (
                      "Alerts only"
                    )}
                  </td>
                  <td className="text-xs">
                    {c.thresholds.map((t) => (
                      <div key={t.id}>
                        {describeThreshold(t.level, t.windowHours, t.probability)}
                      </div>
                    ))}
                  </td>
                  <td>
                    <button
                      type="button"
                      className="btn-quiet px-3 py-1"
                      aria-expanded={openId === c.id}
                      onClick={() => setOpenId(openId === c.id ? null : c.id)}
                    >
                      {openId === c.id ? "Close" : "Open"}
                    </button>
                  </td>
                </tr>
                {openId === c.id && (
                  <tr>
                    <td colSpan={5} className="p-0">
                      <ContactDetails contact={c} onClose={() => setOpenId(null)} />
                    </td>
                  </tr>
                )}
              </Fragment>
            ))}
          </tbody>
        </table>
        {list.data?.contacts.length === 0 && (
          <p className="py-4 text-sm text-ink-700">No contacts match.</p>
        )}
      </div>
      {list.data && (
        <Pager
          page={list.data.page}
          pageSize={list.data.pageSize}
          total={list.data.total}
          onPage={(page) => setFilter((f) => ({ ...f, page }))}
        />
      )}
    </div>
  );
}

export function ContactsDesk() {
  return (
    <QueryClientProvider client={getQueryClient()}>
      <div className="grid gap-6 lg:grid-cols-[1fr_2.4fr]">
        <section className="card self-start">
          <h2 className="mb-4">Add a contact</h2>
          <ContactForm />
        </section>
        <section className="card">
          <h2 className="mb-4">Contacts</h2>
          <ContactsList />
        </section>
      </div>
    </QueryClientProvider>
  );
}

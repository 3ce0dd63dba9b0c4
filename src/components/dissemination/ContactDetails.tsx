// One contact opened from the list: change details, unsubscribe or resubscribe on their behalf,
// edit thresholds, or remove a contact that has no history.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { disseminationKeys, type ContactItem } from "@/lib/query/dissemination";
import { fetchJson } from "@/lib/query/fetch-json";
import { formatUtc } from "@/lib/ui/format";
import { FormAlert } from "@/components/ui/FormAlert";
import { ThresholdEditor } from "./ThresholdEditor";

export function ContactDetails({
  contact,
  onClose,
}: {
  contact: ContactItem;
  onClose: () => void;
}) {
  const queryClient = useQueryClient();
  const [name, setName] = useState(contact.name);
  const [email, setEmail] = useState(contact.email);
  const [message, setMessage] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const refresh = () =>
    void queryClient.invalidateQueries({ queryKey: disseminationKeys.contacts });
  const patch = useMutation({
    mutationFn: (body: Record<string, unknown>) =>
      fetchJson<ContactItem>(`/api/contacts/${contact.id}`, { method: "PATCH", json: body }),
    onSuccess: () => {
      setMessage({ tone: "success", text: "Saved." });
      refresh();
    },
    onError: (e) => setMessage({ tone: "error", text: e.message }),
  });
  const remove = useMutation({
    mutationFn: () => fetchJson(`/api/contacts/${contact.id}`, { method: "DELETE" }),
    onSuccess: () => {
      refresh();
      onClose();
    },
    onError: (e) => setMessage({ tone: "error", text: e.message }),
  });
  const idp = `contact-${contact.id}`;
  return (
    <div className="space-y-4 bg-paper-2/60 p-4">
      {message && <FormAlert tone={message.tone}>{message.text}</FormAlert>}
      <div className="flex flex-wrap items-end gap-3">
        <label className="text-sm" htmlFor={`${idp}-name`}>
          Name
          <input
            id={`${idp}-name`}
            className="field-input mt-1 w-56"
            value={name}
            onChange={(e) => setName(e.target.value)}
          />
        </label>
        <label className="text-sm" htmlFor={`${idp}-email`}>
          E-mail
          <input
            id={`${idp}-email`}
            type="email"
            className="field-input mt-1 w-72"
            value={email}
            onChange={(e) => setEmail(e.target.value)}
          />
        </label>
        <button
          type="button"
          className="btn-quiet"
          disabled={patch.isPending}
          onClick={() => patch.mutate({ name, email })}
        >
          Save details
        </button>
      </div>
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <label className="flex items-center gap-2">
          <input
            type="checkbox"
            checked={contact.wantsBulletins}
            onChange={(e) => patch.mutate({ wantsBulletins: e.target.checked })}
          />{" "}
          Every bulletin
        </label>
        {contact.unsubscribedAt ? (
          <>
            <span className="chip border-warn-700/40 text-warn-700">
              Unsubscribed {formatUtc(contact.unsubscribedAt)}
            </span>
            <button
              type="button"
              className="btn-quiet px-3 py-1"
              onClick={() => patch.mutate({ isSubscribed: true })}
            >
              Resubscribe (the contact asked for it)
            </button>
          </>
        ) : (
          <button
            type="button"
            className="btn-quiet px-3 py-1"
            onClick={() => patch.mutate({ isSubscribed: false })}
          >
            Unsubscribe now
          </button>
        )}
      </div>
      <section aria-label={`Alert thresholds of ${contact.name}`}>
        <h3 className="mb-2 text-sm font-semibold">Alert thresholds</h3>
        <ThresholdEditor
          baseUrl={`/api/contacts/${contact.id}/thresholds`}
          thresholds={contact.thresholds}
          idPrefix={idp}
          onChanged={refresh}
        />
      </section>
      <div className="flex justify-between">
        <button type="button" className="btn-quiet" onClick={onClose}>
          Close
        </button>
        <button
          type="button"
          className="btn-quiet text-warn-700"
          disabled={remove.isPending}
          onClick={() => remove.mutate()}
        >
          Remove contact
        </button>
      </div>
    </div>
  );
}

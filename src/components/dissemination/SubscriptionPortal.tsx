// The subscriber's own page: bulletin choice, subscription, alert thresholds and alerts. Every
// request goes to /api/subscriptions, which acts on the caller's own contact only.
import { QueryClientProvider, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { getQueryClient } from "@/lib/query/client";
import {
  disseminationKeys,
  ownSubscriptionQuery,
  type OwnSubscription,
} from "@/lib/query/dissemination";
import { fetchJson } from "@/lib/query/fetch-json";
import { formatUtc } from "@/lib/ui/format";
import { FormAlert } from "@/components/ui/FormAlert";
import { OpenAlerts, RecentAlerts } from "./OwnAlerts";
import { ThresholdEditor } from "./ThresholdEditor";

function Portal({ initial }: { initial: OwnSubscription | null }) {
  const queryClient = useQueryClient();
  const own = useQuery({ ...ownSubscriptionQuery(), initialData: { subscription: initial } });
  const refresh = () => void queryClient.invalidateQueries({ queryKey: disseminationKeys.own });
  const prefs = useMutation({
    mutationFn: (body: { wantsBulletins?: boolean; isSubscribed?: boolean }) =>
      fetchJson("/api/subscriptions", { method: "PATCH", json: body }),
    onSuccess: refresh,
  });
  const sub = own.data.subscription;
  if (!sub)
    return (
      <FormAlert tone="info">
        Your account is not on the distribution list yet. Ask the duty desk to add you as a contact
        of your organisation.
      </FormAlert>
    );
  const { contact } = sub;
  return (
    <div className="space-y-6">
      <section className="card">
        <h2 className="mb-3">Alerts waiting for you</h2>
        <OpenAlerts alerts={sub.openAlerts} />
      </section>
      <section className="card space-y-3">
        <h2>What you receive</h2>
        <p className="text-sm text-ink-700">
          {contact.name} · {contact.email} · {contact.organisationName}
        </p>
        {prefs.isError && <FormAlert tone="error">{prefs.error.message}</FormAlert>}
        {contact.unsubscribedAt ? (
          <div className="flex flex-wrap items-center gap-3">
            <FormAlert tone="info">
              You unsubscribed at {formatUtc(contact.unsubscribedAt)}: no bulletins or alerts are
              sent to you.
            </FormAlert>
            <button
              type="button"
              className="btn-primary"
              disabled={prefs.isPending}
              onClick={() => prefs.mutate({ isSubscribed: true })}
            >
              Subscribe again
            </button>
          </div>
        ) : (
          <div className="flex flex-wrap items-center justify-between gap-3">
            <label className="flex items-center gap-2 text-sm">
              <input
                type="checkbox"
                checked={contact.wantsBulletins}
                disabled={prefs.isPending}
                onChange={(e) => prefs.mutate({ wantsBulletins: e.target.checked })}
              />{" "}
              Send me every bulletin (alerts come either way)
            </label>
            <button
              type="button"
              className="btn-quiet"
              disabled={prefs.isPending}
              onClick={() => prefs.mutate({ isSubscribed: false })}
            >
              Unsubscribe from all e-mails
            </button>
          </div>
        )}
      </section>
      <section className="card">
        <h2 className="mb-1">Your alert thresholds</h2>
        <p className="mb-3 text-sm text-ink-700">
          You get an alert when an issued bulletin's full-disk probability reaches a threshold — and
          again only after it dipped below, or once the earlier alert's window has ended.
        </p>
        <ThresholdEditor
          baseUrl="/api/subscriptions/thresholds"
          thresholds={contact.thresholds}
          idPrefix="own"
          onChanged={refresh}
        />
      </section>
      <section className="card">
        <h2 className="mb-3">Earlier alerts</h2>
        <RecentAlerts alerts={sub.recentAlerts} />
      </section>
    </div>
  );
}

export function SubscriptionPortal({ initial }: { initial: OwnSubscription | null }) {
  return (
    <QueryClientProvider client={getQueryClient()}>
      <Portal initial={initial} />
    </QueryClientProvider>
  );
}

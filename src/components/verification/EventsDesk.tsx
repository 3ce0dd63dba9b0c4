// The observed-events island: upload and hand entry for verifiers, the filtered list for everyone.
import { QueryClientProvider } from "@tanstack/react-query";
import { useState } from "react";
import type { EventView } from "@/lib/query/verification";
import { getQueryClient } from "@/lib/query/client";
import { EventForm } from "./EventForm";
import { EventTable } from "./EventTable";
import { EventUpload } from "./EventUpload";

export function EventsDesk({ canManage }: { canManage: boolean }) {
  const [correcting, setCorrecting] = useState<EventView | null>(null);
  return (
    <QueryClientProvider client={getQueryClient()}>
      {canManage && (
        <section className="card" aria-labelledby="upload-heading">
          <h2 id="upload-heading" className="mb-4">
            Upload an event list
          </h2>
          <EventUpload />
        </section>
      )}
      {canManage && (
        <section className="card mt-6">
          {correcting ? (
            <EventForm
              key={`correct-${correcting.id}`}
              event={correcting}
              onDone={() => setCorrecting(null)}
            />
          ) : (
            <EventForm key="new" event={null} onDone={() => undefined} />
          )}
        </section>
      )}
      <section className="card mt-6" aria-labelledby="events-heading">
        <h2 id="events-heading" className="mb-4">
          Stored events
        </h2>
        <EventTable
          canManage={canManage}
          onCorrect={(e) => {
            setCorrecting(e);
            window.scrollTo({ top: 0, behavior: "smooth" });
          }}
        />
      </section>
    </QueryClientProvider>
  );
}

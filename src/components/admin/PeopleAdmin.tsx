// The people administration island: invitation form above the filtered list.
import { QueryClientProvider } from "@tanstack/react-query";
import { getQueryClient } from "@/lib/query/client";
import { InviteForm } from "./InviteForm";
import { PeopleTable } from "./PeopleTable";

export function PeopleAdmin({ currentUserId }: { currentUserId: number }) {
  return (
    <QueryClientProvider client={getQueryClient()}>
      <section className="card">
        <h2 className="mb-4">Invite a person</h2>
        <InviteForm />
      </section>
      <section className="card mt-6">
        <h2 className="mb-4">People</h2>
        <PeopleTable currentUserId={currentUserId} />
      </section>
    </QueryClientProvider>
  );
}

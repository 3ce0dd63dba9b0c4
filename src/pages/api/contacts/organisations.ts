import { guardApi } from "@/server/auth/guards";
import { json, withApi } from "@/server/http/handler";
import { listOrganisations } from "@/server/users/users.db";

// Duty officers add contacts to organisations; the organisations themselves are the admin's.
export const GET = withApi(async (ctx) => {
  guardApi(ctx, "manageContacts");
  const organisations = (await listOrganisations()).map(({ id, name, sector, isDemo }) => ({
    id,
    name,
    sector,
    isDemo,
  }));
  return json({ organisations });
});

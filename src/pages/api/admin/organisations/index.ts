import { organisationSchema } from "@/lib/schemas/users";
import { guardApi } from "@/server/auth/guards";
import { readJsonWith } from "@/server/http/body";
import { json, withApi } from "@/server/http/handler";
import { listOrganisations } from "@/server/users/users.db";
import { createOrganisation } from "@/server/users/users.service";

export const GET = withApi(async (ctx) => {
  guardApi(ctx, "manageUsers");
  return json({ organisations: await listOrganisations() });
});

export const POST = withApi(async (ctx) => {
  const actor = guardApi(ctx, "manageUsers");
  return json(await createOrganisation(await readJsonWith(ctx.request, organisationSchema), actor), 201);
});

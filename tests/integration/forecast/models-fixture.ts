// Shared requests and invented tables of the model registry tests.
import type { CurrentUser } from "@/lib/auth/roles";
import { POST } from "@/pages/api/admin/models/index";
import { PATCH } from "@/pages/api/admin/models/[id]";
import { DEMO_MODELS } from "@/server/scoring/demo-models";
import { callRoute } from "./api-call";

export const PROVENANCE = "Invented for this test; not a published table.";

export const importModel = (body: Record<string, unknown>, user: CurrentUser) =>
  callRoute(POST, "/api/admin/models", { method: "POST", user, body });

export const activate = (id: number, isActive: boolean, user: CurrentUser) =>
  callRoute(PATCH, `/api/admin/models/${id}`, {
    method: "PATCH",
    user,
    params: { id: String(id) },
    body: { isActive },
  });

export const demoRateParams = () =>
  structuredClone(DEMO_MODELS.find((m) => m.key === "mcintosh-poisson")!.params) as {
    rates: Record<string, { C: number; M: number; X: number }>;
  };

// Invented rates (flares/day): one row per Zurich class as fallback, plus one McIntosh class.
export const RATE_CSV = [
  "class,C,M,X",
  "A,0.01,0,0",
  "B,0.02,0.001,0",
  "C,0.1,0.01,0.001",
  "D,0.3,0.05,0.005",
  "E,0.5,0.1,0.01",
  "F,0.8,0.2,0.04",
  "H,0.05,0.005,0",
  "Dkc,0.9,0.2,0.05",
].join("\n");

// The answer every route owes every caller: one entry per route file under src/pages, and per
// route an integration injects. route-matrix.test.ts fails when a route has no entry here.
// Allowed callers get a harmless probe (a dummy id such as 999999, an empty JSON body), so the
// status beside them is the route's validation answer: 400 for the body, 404 for the id.
import { ROLES, type Role } from "@/lib/auth/roles";
import {
  CALLERS,
  apiRoute,
  locationFor,
  openApi,
  openPage,
  pageRoute,
  statuses,
} from "../support/route-probes";
import type { RouteEntry } from "../support/route-probes";

// Who may do what, after the product brief's table of roles (DESIGN.md).
const ALL: readonly Role[] = ROLES;
const ADMIN: readonly Role[] = ["admin"];
const STAFF: readonly Role[] = ["forecaster", "duty_officer", "verifier", "admin"];
const DRAFTERS: readonly Role[] = ["forecaster", "duty_officer"];
const DUTY: readonly Role[] = ["duty_officer"];
const DESK_WATCH: readonly Role[] = ["duty_officer", "admin"];
const VERIFIER: readonly Role[] = ["verifier"];
const SUBSCRIBER: readonly Role[] = ["subscriber"];

const DAY = "2026-05-04";
const NO_ID = "999999";

const foundation: Record<string, RouteEntry> = {
  "/": pageRoute("/", ALL),
  "/403": openPage("/403", 403, CALLERS),
  "/404": openPage("/404", 404),
  "/500": openPage("/500", 500),
  "/sign-in": {
    kind: "page",
    methods: {
      GET: {
        path: "/sign-in",
        status: statuses(ALL, 303, 303, 200),
        location: locationFor(ALL, "/"),
      },
    },
  },
  // Any token that is not a live invitation: the page explains, with 410 Gone.
  "/invitations/accept": openPage("/invitations/accept?token=not-a-real-token", 410),
  "/admin/audit": pageRoute("/admin/audit", ADMIN),
  "/admin/mailbox": pageRoute("/admin/mailbox", ADMIN),
  "/admin/models": pageRoute("/admin/models", ADMIN),
  "/admin/organisations": pageRoute("/admin/organisations", ADMIN),
  "/admin/settings": pageRoute("/admin/settings", ADMIN),
  "/admin/users": pageRoute("/admin/users", ADMIN),
  "/admin/mailbox/[id].html": apiRoute("/admin/mailbox/no-such-message.html", {
    GET: [ADMIN, 404],
  }),
  "/api/admin/audit": apiRoute("/api/admin/audit", { GET: [ADMIN, 200] }),
  "/api/admin/mailbox": apiRoute("/api/admin/mailbox", { GET: [ADMIN, 200] }),
  "/api/admin/mailbox/[id]": apiRoute("/api/admin/mailbox/no-such-message", { GET: [ADMIN, 404] }),
  "/api/admin/models": apiRoute("/api/admin/models", { GET: [ADMIN, 200], POST: [ADMIN, 400] }),
  "/api/admin/models/[id]": apiRoute(`/api/admin/models/${NO_ID}`, { PATCH: [ADMIN, 400] }),
  "/api/admin/organisations": apiRoute("/api/admin/organisations", {
    GET: [ADMIN, 200],
    POST: [ADMIN, 400],
  }),
  "/api/admin/settings": apiRoute("/api/admin/settings", { GET: [ADMIN, 200], PUT: [ADMIN, 400] }),
  "/api/admin/users": apiRoute("/api/admin/users", { GET: [ADMIN, 200], POST: [ADMIN, 400] }),
  "/api/admin/users/[id]": apiRoute(`/api/admin/users/${NO_ID}`, { PATCH: [ADMIN, 400] }),
  // No body is read here: the dummy id is what keeps the probe from sending an invitation.
  "/api/admin/users/[id]/invitation": apiRoute(`/api/admin/users/${NO_ID}/invitation`, {
    POST: [ADMIN, 404],
  }),
  "/api/health": { kind: "api", methods: { GET: openApi("/api/health", "GET", 200) } },
  "/api/invitations/accept": {
    kind: "api",
    methods: { POST: openApi("/api/invitations/accept", "POST", 400) },
  },
};

const forecast: Record<string, RouteEntry> = {
  // Without ?day= or ?region=&before= the list is a 400.
  "/api/assessments": apiRoute("/api/assessments", { GET: [STAFF, 400], POST: [DRAFTERS, 400] }),
  "/api/assessments/[id]": apiRoute(`/api/assessments/${NO_ID}`, {
    GET: [STAFF, 404],
    PATCH: [DRAFTERS, 404],
  }),
  "/api/assessments/import": apiRoute("/api/assessments/import", { POST: [DRAFTERS, 400] }),
  "/api/assessments/import-mapping": apiRoute("/api/assessments/import-mapping", {
    GET: [DRAFTERS, 200],
    PUT: [DRAFTERS, 400],
  }),
  "/api/days/[day]/full-disk": apiRoute(`/api/days/${DAY}/full-disk`, {
    GET: [STAFF, 200],
    PUT: [DRAFTERS, 400],
  }),
  "/api/guidance": apiRoute("/api/guidance", { POST: [DRAFTERS, 400] }),
  "/assessments/[id]": pageRoute(`/assessments/${NO_ID}`, DRAFTERS, 404),
  "/days": pageRoute("/days", STAFF),
  "/days/[day]": pageRoute(`/days/${DAY}`, STAFF),
  "/days/[day]/assess": pageRoute(`/days/${DAY}/assess`, DRAFTERS),
  "/days/[day]/import": pageRoute(`/days/${DAY}/import`, DRAFTERS),
  // The "open a day" form's target: an endpoint that answers like a page, JSON for a wrong role.
  "/days/go": {
    kind: "api",
    methods: {
      GET: {
        path: `/days/go?day=${DAY}`,
        status: statuses(STAFF, 303, 403, 303),
        refused: ["subscriber"],
        location: { anonymous: "/sign-in?next=/days", ...locationFor(STAFF, `/days/${DAY}`) },
      },
    },
  },
  "/regions": pageRoute("/regions", STAFF),

  "/regions/[number]": pageRoute("/regions/HR-9999", STAFF, 404),
};

const bulletins: Record<string, RouteEntry> = {
  "/bulletins": pageRoute("/bulletins", ALL),
  "/bulletins/[id]": pageRoute(`/bulletins/${NO_ID}`, ALL, 404),
  "/bulletins/review": pageRoute("/bulletins/review", DUTY),
  // The demo office publishes its bulletins, so these are open to everybody.
  "/public/bulletins": openPage("/public/bulletins", 200),
  "/public/bulletins/[id]": openPage(`/public/bulletins/${NO_ID}`, 404),
  "/api/feed/bulletins": {
    kind: "api",
    methods: { GET: openApi("/api/feed/bulletins", "GET", 200) },
  },
  "/api/bulletins": apiRoute("/api/bulletins", { GET: [ALL, 200], POST: [DRAFTERS, 400] }),
  "/api/bulletins/[id]": apiRoute(`/api/bulletins/${NO_ID}`, {
    GET: [ALL, 404],
    PATCH: [DRAFTERS, 400],
  }),
  "/api/bulletins/[id]/email.html": apiRoute(`/api/bulletins/${NO_ID}/email.html`, {
    GET: [ALL, 404],
  }),
  "/api/bulletins/[id]/submit": apiRoute(`/api/bulletins/${NO_ID}/submit`, {
    POST: [DRAFTERS, 404],
  }),
  "/api/bulletins/[id]/reopen": apiRoute(`/api/bulletins/${NO_ID}/reopen`, {
    POST: [DRAFTERS, 404],
  }),
  "/api/bulletins/[id]/approve": apiRoute(`/api/bulletins/${NO_ID}/approve`, { POST: [DUTY, 404] }),
  "/api/bulletins/[id]/return": apiRoute(`/api/bulletins/${NO_ID}/return`, { POST: [DUTY, 400] }),
  "/api/bulletins/[id]/withdraw": apiRoute(`/api/bulletins/${NO_ID}/withdraw`, {
    POST: [DUTY, 400],
  }),
};

const dissemination: Record<string, RouteEntry> = {
  "/api/alerts": apiRoute("/api/alerts", { GET: [DESK_WATCH, 200] }),
  "/api/alerts/[id]/ack": apiRoute(`/api/alerts/${NO_ID}/ack`, { POST: [DESK_WATCH, 400] }),
  "/api/deliveries": apiRoute("/api/deliveries", { GET: [DESK_WATCH, 200] }),
  "/api/deliveries/retry": apiRoute("/api/deliveries/retry", { POST: [DESK_WATCH, 400] }),
  "/api/contacts": apiRoute("/api/contacts", { GET: [DESK_WATCH, 200], POST: [DESK_WATCH, 400] }),
  "/api/contacts/[id]": apiRoute(`/api/contacts/${NO_ID}`, {
    GET: [DESK_WATCH, 404],
    PATCH: [DESK_WATCH, 400],
    DELETE: [DESK_WATCH, 404],
  }),
  "/api/contacts/[id]/thresholds": apiRoute(`/api/contacts/${NO_ID}/thresholds`, {
    POST: [DESK_WATCH, 400],
  }),
  "/api/contacts/[id]/thresholds/[thresholdId]": apiRoute(
    `/api/contacts/${NO_ID}/thresholds/${NO_ID}`,
    {
      PUT: [DESK_WATCH, 400],
      DELETE: [DESK_WATCH, 404],
    },
  ),
  "/api/contacts/import": apiRoute("/api/contacts/import", { POST: [DESK_WATCH, 400] }),
  "/api/contacts/organisations": apiRoute("/api/contacts/organisations", {
    GET: [DESK_WATCH, 200],
  }),
  "/api/subscriptions": apiRoute("/api/subscriptions", {
    GET: [SUBSCRIBER, 200],
    PATCH: [SUBSCRIBER, 400],
  }),
  "/api/subscriptions/alerts/[id]/ack": apiRoute(`/api/subscriptions/alerts/${NO_ID}/ack`, {
    POST: [SUBSCRIBER, 404],
  }),
  "/api/subscriptions/thresholds": apiRoute("/api/subscriptions/thresholds", {
    POST: [SUBSCRIBER, 400],
  }),
  // The demo subscriber is not yet a contact on the distribution list: the route itself says 403.
  "/api/subscriptions/thresholds/[id]": apiRoute(`/api/subscriptions/thresholds/${NO_ID}`, {
    PUT: [SUBSCRIBER, 400],
    DELETE: [SUBSCRIBER, 404],
  }),
};

// Signed e-mail links: GET only shows (a malformed token is a 400), the page's own form POSTs;
// JSON is not that form.
const linkPage = (path: string, shown: number): RouteEntry => ({
  kind: "page",
  methods: { GET: openPage(path, shown).methods.GET, POST: openApi(path, "POST", 400) },
});

const desk: Record<string, RouteEntry> = {
  "/alerts": pageRoute("/alerts", DESK_WATCH),
  "/contacts": pageRoute("/contacts", DESK_WATCH),
  "/contacts/import": pageRoute("/contacts/import", DESK_WATCH),
  "/deliveries": pageRoute("/deliveries", DESK_WATCH),
  "/subscriptions": pageRoute("/subscriptions", SUBSCRIBER),
  "/ack": linkPage("/ack?token=not-a-real-token", 400),
  "/unsubscribe": linkPage("/unsubscribe?token=not-a-real-token", 400),
};

const verification: Record<string, RouteEntry> = {
  "/verification": pageRoute("/verification", STAFF),
  "/verification/events": pageRoute("/verification/events", STAFF),
  "/verification/external": pageRoute("/verification/external", STAFF),
  "/verification/recalibration": pageRoute("/verification/recalibration", STAFF),
  "/verification/report": pageRoute("/verification/report", STAFF),
  "/api/events": apiRoute("/api/events", { GET: [STAFF, 200], POST: [VERIFIER, 400] }),
  "/api/events/[id]": apiRoute(`/api/events/${NO_ID}`, {
    GET: [STAFF, 404],
    PATCH: [VERIFIER, 400],
  }),
  "/api/events/uploads": apiRoute("/api/events/uploads", { POST: [VERIFIER, 400] }),
  // Without a model and a period the export is a 400.
  "/api/verification/export": apiRoute("/api/verification/export", { GET: [STAFF, 400] }),
  "/api/verification/external": apiRoute("/api/verification/external", {
    GET: [STAFF, 200],
    POST: [VERIFIER, 400],
  }),
  "/api/verification/intervals": apiRoute("/api/verification/intervals", { GET: [STAFF, 200] }),
  "/api/verification/report": apiRoute("/api/verification/report", { GET: [STAFF, 200] }),
  "/api/verification/sources": apiRoute("/api/verification/sources", { GET: [STAFF, 200] }),
  "/api/verification/recalibration/fits": apiRoute("/api/verification/recalibration/fits", {
    POST: [VERIFIER, 400],
  }),
  // Fit ids are not numbers: a numeric dummy is refused as malformed.
  "/api/verification/recalibration/fits/[id]": apiRoute(
    `/api/verification/recalibration/fits/${NO_ID}`,
    {
      GET: [VERIFIER, 400],
    },
  ),
  "/api/verification/recalibration/proposals": apiRoute(
    "/api/verification/recalibration/proposals",
    {
      GET: [STAFF, 200],
      POST: [VERIFIER, 400],
    },
  ),
  "/api/verification/recalibration/proposals/[id]/activate": apiRoute(
    `/api/verification/recalibration/proposals/${NO_ID}/activate`,
    { POST: [ADMIN, 404] },
  ),
  "/api/verification/recalibration/proposals/[id]/reject": apiRoute(
    `/api/verification/recalibration/proposals/${NO_ID}/reject`,
    { POST: [ADMIN, 400] },
  ),
};

const injected: Record<string, RouteEntry> = {
  "/api/auth/[...auth]": {
    kind: "api",
    injectedBy: "auth-astro",
    methods: {
      GET: openApi("/api/auth/session", "GET", 200),
      // The sign-in callback wants form data; JSON is refused before Auth.js sees it.
      POST: openApi("/api/auth/callback/credentials", "POST", 400),
    },
  },
  "/_image": {
    kind: "api",
    injectedBy: "astro (image endpoint)",
    methods: { GET: openApi("/_image", "GET", 400) },
  },
  "/_server-islands/[name]": {
    kind: "api",
    injectedBy: "astro (server islands)",
    methods: { GET: openApi("/_server-islands/none", "GET", 400) },
  },
};

export const ROUTE_TABLE: Record<string, RouteEntry> = {
  ...foundation,
  ...forecast,
  ...bulletins,
  ...dissemination,
  ...desk,
  ...verification,
  ...injected,
};

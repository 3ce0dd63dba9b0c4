// Owns the demo office's distribution list: the three demo subscriber accounts as contacts with
// thresholds, plus a few more invented contacts (demo — invented for the scenario).
import { sql } from "drizzle-orm";
import type { Db, Tx } from "@/db/client";
import { alertThresholds, contacts, organisations, users } from "@/db/schema";
import { DEMO_ORGANISATIONS, DEMO_PEOPLE } from "@/server/demo/people";

type OrgKey = (typeof DEMO_ORGANISATIONS)[number]["key"];

interface DemoContact {
  organisation: OrgKey;
  name: string;
  email: string;
  wantsBulletins: boolean;
  /** [level, window hours, probability] — invented values for the demo. */
  thresholds: [string, number, number][];
}

const subscriberThresholds: Record<string, DemoContact["thresholds"]> = {
  "dana.whitlock@northmarch.example": [
    ["M+", 48, 0.3],
    ["X", 72, 0.1],
  ],
  "rui.castell@skylark-hf.example": [
    ["M+", 24, 0.4],
    ["X", 24, 0.1],
  ],
  "mina.sato@little-auk.example": [
    ["M+", 24, 0.25],
    ["C+", 24, 0.9],
  ],
};

const MORE_CONTACTS: DemoContact[] = [
  {
    organisation: "grid",
    name: "Northmarch control room (demo)",
    email: "control-room@northmarch.example",
    wantsBulletins: true,
    thresholds: [["M+", 24, 0.5]],
  },
  {
    organisation: "grid",
    name: "Edda Strand (demo)",
    email: "edda.strand@northmarch.example",
    wantsBulletins: true,
    thresholds: [],
  },
  {
    organisation: "hf",
    name: "Skylark night dispatcher (demo)",
    email: "night-dispatch@skylark-hf.example",
    wantsBulletins: false,
    thresholds: [
      ["X", 24, 0.05],
      ["M+", 24, 0.6],
    ],
  },
  {
    organisation: "sat",
    name: "Little Auk flight dynamics (demo)",
    email: "flight-dynamics@little-auk.example",
    wantsBulletins: true,
    thresholds: [["X", 48, 0.15]],
  },
];

/** Adds the demo contacts that are missing (by e-mail); safe to call on every start. */
export async function seedDemoContacts(
  tx: Db | Tx,
): Promise<{ contacts: number; thresholds: number }> {
  const orgRows = await tx
    .select({ id: organisations.id, name: organisations.name })
    .from(organisations);
  const orgId = (key: OrgKey) =>
    orgRows.find((o) => o.name === DEMO_ORGANISATIONS.find((d) => d.key === key)?.name)?.id;
  const accounts = await tx
    .select({ id: users.id, email: users.email, name: users.name })
    .from(users)
    .where(sql`${users.role} = 'subscriber'`);
  const existing = new Set(
    (await tx.select({ email: contacts.email }).from(contacts)).map((c) => c.email.toLowerCase()),
  );
  const fromPeople: DemoContact[] = DEMO_PEOPLE.filter(
    (p) => p.role === "subscriber" && p.organisation,
  ).map((p) => ({
    organisation: p.organisation as OrgKey,
    name: p.name,
    email: p.email,
    wantsBulletins: true,
    thresholds: subscriberThresholds[p.email] ?? [],
  }));
  let added = 0;
  let thresholdCount = 0;
  for (const demo of [...fromPeople, ...MORE_CONTACTS]) {
    const organisationId = orgId(demo.organisation);
    if (!organisationId || existing.has(demo.email.toLowerCase())) continue;
    const userId =
      accounts.find((a) => a.email.toLowerCase() === demo.email.toLowerCase())?.id ?? null;
    const [row] = await tx
      .insert(contacts)
      .values({
        organisationId,
        userId,
        name: demo.name,
        email: demo.email,
        wantsBulletins: demo.wantsBulletins,
        isDemo: true,
      })
      .returning({ id: contacts.id });
    if (!row) continue;
    added += 1;
    if (demo.thresholds.length) {
      await tx
        .insert(alertThresholds)
        .values(
          demo.thresholds.map(([level, windowHours, probability]) => ({
            contactId: row.id,
            level,
            windowHours,
            probability,
          })),
        );
      thresholdCount += demo.thresholds.length;
    }
  }
  return { contacts: added, thresholds: thresholdCount };
}

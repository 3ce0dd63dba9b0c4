// Drizzle access for users, organisations and invitations; returns domain shapes.
import { and, asc, eq, ilike, or, sql, type SQL } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db/client";
import { organisations, users } from "@/db/schema";
import type { Role } from "@/lib/auth/roles";

export interface UserRow {
  id: number;
  email: string;
  name: string;
  role: Role;
  organisationId: number | null;
  organisationName: string | null;
  isActive: boolean;
  hasPassword: boolean;
  isDemo: boolean;
  createdAt: Date;
}

const userColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  organisationId: users.organisationId,
  organisationName: organisations.name,
  isActive: users.isActive,
  hasPassword: sql<boolean>`${users.passwordHash} is not null`,
  isDemo: users.isDemo,
  createdAt: users.createdAt,
};

export async function findUserByEmail(email: string, tx: Db | Tx = getDb()) {
  const [row] = await tx
    .select()
    .from(users)
    .where(sql`lower(${users.email}) = ${email.trim().toLowerCase()}`);
  return row ?? null;
}

export async function findUserById(id: number, tx: Db | Tx = getDb()) {
  const [row] = await tx.select().from(users).where(eq(users.id, id));
  return row ?? null;
}

export interface UserFilter {
  q?: string;
  role?: Role;
  status?: "active" | "inactive" | "invited";
  page: number;
  pageSize: number;
}

export async function listUsers(filter: UserFilter): Promise<{ rows: UserRow[]; total: number }> {
  const db = getDb();
  const conditions: SQL[] = [];
  if (filter.q) {
    const match = or(ilike(users.email, `%${filter.q}%`), ilike(users.name, `%${filter.q}%`));
    if (match) conditions.push(match);
  }
  if (filter.role) conditions.push(eq(users.role, filter.role));
  if (filter.status === "active") conditions.push(sql`${users.isActive} and ${users.passwordHash} is not null`);
  if (filter.status === "inactive") conditions.push(eq(users.isActive, false));
  if (filter.status === "invited") conditions.push(sql`${users.isActive} and ${users.passwordHash} is null`);
  const where = conditions.length ? and(...conditions) : undefined;
  const rows = await db
    .select(userColumns)
    .from(users)
    .leftJoin(organisations, eq(users.organisationId, organisations.id))
    .where(where)
    .orderBy(asc(users.role), asc(users.name))
    .limit(filter.pageSize)
    .offset((filter.page - 1) * filter.pageSize);
  const [count] = await db.select({ n: sql<number>`count(*)::int` }).from(users).where(where);
  return { rows, total: count?.n ?? 0 };
}

export interface OrganisationRow {
  id: number;
  name: string;
  sector: string;
  isDemo: boolean;
  memberCount: number;
}

export async function listOrganisations(): Promise<OrganisationRow[]> {
  return getDb()
    .select({
      id: organisations.id,
      name: organisations.name,
      sector: organisations.sector,
      isDemo: organisations.isDemo,
      memberCount: sql<number>`(select count(*)::int from ${users} where ${users.organisationId} = ${organisations.id})`,
    })
    .from(organisations)
    .orderBy(asc(organisations.name));
}

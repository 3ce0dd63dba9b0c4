// Picks invented demo accounts by role for end-to-end tests (the seed's own list, not copies).
import type { Role } from "@/lib/auth/roles";
import { DEMO_PEOPLE, type DemoPerson } from "@/server/demo/people";

/** The nth demo person with this role (0 = first in the seed list). */
export function demoAccount(role: Role, nth = 0): DemoPerson {
  const person = DEMO_PEOPLE.filter((p) => p.role === role)[nth];
  if (!person) throw new Error(`the demo office has no ${role} number ${nth + 1}`);
  return person;
}

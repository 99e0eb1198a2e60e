/** The invented demo shop's people: one per role. Passwords are documented in the README. */
import bcrypt from "bcryptjs";
import type { Db } from "../client";
import { users, type Role } from "../schema";

export const DEMO_DOMAIN = "harbourline.invalid";

export const DEMO_USERS: Array<{ email: string; name: string; role: Role; password: string }> = [
  { email: `porter@${DEMO_DOMAIN}`, name: "Wren Castellane", role: "porter", password: "porter-portolan" },
  { email: `machinist@${DEMO_DOMAIN}`, name: "Tobin Okonkwo-Hale", role: "machinist", password: "machinist-portolan" },
  { email: `lead@${DEMO_DOMAIN}`, name: "Maren Lisgaard", role: "lead", password: "lead-portolan" },
  { email: `auditor@${DEMO_DOMAIN}`, name: "Ines Varro", role: "auditor", password: "auditor-portolan" },
  { email: `admin@${DEMO_DOMAIN}`, name: "Casimir Undry", role: "admin", password: "admin-portolan" },
];

export function seedPeople(db: Db): Record<Role, number> {
  const ids = {} as Record<Role, number>;
  for (const u of DEMO_USERS) {
    // Lower bcrypt cost than production hashes: the seed runs on every fresh demo start.
    const passwordHash = bcrypt.hashSync(u.password, 10);
    const row = db.insert(users).values({ email: u.email, name: u.name, role: u.role, passwordHash }).returning({ id: users.id }).get();
    ids[u.role] = row.id;
  }
  return ids;
}

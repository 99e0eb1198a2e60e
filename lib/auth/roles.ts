import { ROLES, type Role } from "@/db/enums";

export { ROLES, type Role };

/** Who may do what, by name, so every guard reads the same lists. Admin can do all a lead can. */
export const EVERYONE: readonly Role[] = ROLES;
export const SHOP_FLOOR: readonly Role[] = ["porter", "machinist", "lead", "admin"];
export const PORTERS: readonly Role[] = ["porter", "lead", "admin"];
export const MACHINISTS: readonly Role[] = ["machinist", "lead", "admin"];
export const LEADS: readonly Role[] = ["lead", "admin"];
export const ADMINS: readonly Role[] = ["admin"];

export const ROLE_LABEL: Record<Role, string> = {
  porter: "Porter",
  machinist: "Machinist",
  lead: "Shop lead",
  auditor: "Auditor",
  admin: "Administrator",
};

/**
 * The navigation, by role. Add an entry when a page lands; the page itself still checks the
 * role on the server (this list only decides what is shown).
 */
import type { Role } from "@/db/enums";

export type NavItem = { href: string; label: string; roles: readonly Role[] };
export type NavGroup = { label: string; items: NavItem[] };

const ALL: readonly Role[] = ["porter", "machinist", "lead", "auditor", "admin"];

export const NAV: NavGroup[] = [
  {
    label: "Shop",
    items: [
      { href: "/", label: "Overview", roles: ALL },
      { href: "/handoff", label: "Handoff", roles: ALL },
      { href: "/jobs", label: "Jobs", roles: ALL },
      { href: "/schedule", label: "Schedule", roles: ALL },
      { href: "/heads", label: "Heads", roles: ALL },
      { href: "/customers", label: "Customers", roles: ALL },
    ],
  },
  {
    label: "Library",
    items: [
      { href: "/head-types", label: "Head types", roles: ALL },
      { href: "/masters", label: "Master heads", roles: ALL },
      { href: "/plates", label: "Fixture plates", roles: ALL },
      { href: "/machines", label: "Machines", roles: ALL },
      { href: "/scans", label: "Scans", roles: ALL },
      { href: "/programs", label: "Programs", roles: ALL },
      { href: "/view", label: "3D views", roles: ALL },
    ],
  },
  {
    label: "Records",
    items: [
      { href: "/flow-tests", label: "Flow tests", roles: ALL },
      { href: "/trace", label: "Trace and recall", roles: ALL },
      { href: "/audit", label: "Audit log", roles: ["auditor", "admin", "lead"] },
    ],
  },
  {
    label: "Administration",
    items: [
      { href: "/admin/users", label: "Users and invitations", roles: ["admin"] },
      { href: "/admin/machine-tokens", label: "Machine tokens", roles: ["admin"] },
    ],
  },
];

export function navFor(role: Role): NavGroup[] {
  return NAV.map((g) => ({ ...g, items: g.items.filter((i) => i.roles.includes(role)) })).filter((g) => g.items.length > 0);
}

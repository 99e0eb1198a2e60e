import { AppShell } from "@/components/shell/AppShell";
import { EVERYONE } from "@/lib/auth/roles";
import { requirePageRole } from "../_server/session";

export const dynamic = "force-dynamic";

export default async function ShopLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageRole(EVERYONE);
  return <AppShell actor={actor}>{children}</AppShell>;
}

import { AppShell } from "@/app/ui/app-shell";
import { requireRole } from "@/lib/auth/session";

export default async function PlanningLayout({ children }: { children: React.ReactNode }) {
  const user = await requireRole("scheduler", "admin");
  return <AppShell user={user}>{children}</AppShell>;
}

import { AppShell } from "@/app/ui/app-shell";
import { requireRole } from "@/lib/auth/session";

export default async function CrewLayout({ children }: { children: React.ReactNode }) {
  const user = await requireRole("crew");
  return <AppShell user={user} nav={[{ href: "/trips", label: "Trips" }, { href: "/bid", label: "My bid" }, { href: "/line", label: "My line" }]}>{children}</AppShell>;
}

import Link from "next/link";
import type { SessionUser } from "@/lib/db/users";
import { SignOutButton } from "./sign-out-button";

const ROLE_LABEL = { crew: "Crew", scheduler: "Planning", admin: "Administration" } as const;

/** The frame around every signed-in page: product name, who is signed in, sign-out. */
export function AppShell({ user, nav, children }: { user: SessionUser; nav?: { href: string; label: string }[]; children: React.ReactNode }) {
  return (
    <div className="mx-auto flex min-h-dvh max-w-5xl flex-col">
      <header className="sticky top-0 z-10 flex items-center gap-3 border-b border-slate-200 bg-white/95 px-4 py-3 backdrop-blur">
        <Link href="/" className="text-lg font-semibold tracking-tight text-sky-900">
          Bidwright
        </Link>
        <span className="rounded bg-sky-50 px-2 py-0.5 text-xs font-medium text-sky-800">{ROLE_LABEL[user.role]}</span>
        <span className="ml-auto truncate text-sm text-slate-600" title={user.email}>
          {user.name}
        </span>
        <SignOutButton />
      </header>
      {nav ? (
        <nav aria-label="Main" className="flex gap-1 border-b border-slate-200 bg-white px-2">
          {nav.map((n) => (
            <Link key={n.href} href={n.href} className="inline-flex min-h-11 items-center px-3 text-base font-medium text-sky-900 underline-offset-4 hover:underline">
              {n.label}
            </Link>
          ))}
        </nav>
      ) : null}
      <main className="flex-1 px-4 py-5">{children}</main>
    </div>
  );
}

import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { currentUser } from "@/lib/auth/session";
import { env } from "@/lib/env";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage() {
  if (await currentUser()) redirect("/");
  // The demo command names its accounts so a first visitor can get in.
  const demoHint = env().BIDWRIGHT_DEMO_ACCOUNTS;
  return (
    <main className="mx-auto flex min-h-dvh max-w-sm flex-col justify-center px-5 py-10">
      <h1 className="text-2xl font-semibold tracking-tight text-sky-900">Bidwright</h1>
      <p className="mt-1 text-sm text-slate-600">Bid for next month&apos;s trips, see your line and why.</p>
      <SignInForm />
      {demoHint ? (
        <section className="mt-8 rounded-lg border border-dashed border-slate-300 bg-white p-4 text-sm text-slate-700">
          <h2 className="font-medium">Demo accounts</h2>
          <pre className="mt-2 whitespace-pre-wrap font-mono text-xs leading-5">{demoHint}</pre>
        </section>
      ) : null}
    </main>
  );
}

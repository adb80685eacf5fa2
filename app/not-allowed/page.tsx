import Link from "next/link";

export const metadata = { title: "Not allowed" };

export default function NotAllowed() {
  return (
    <main className="mx-auto flex min-h-dvh max-w-sm flex-col justify-center px-5">
      <h1 className="text-xl font-semibold">This page is not open to your account</h1>
      <p className="mt-2 text-sm text-slate-600">
        Your role does not include it. If you need it, ask an administrator to change your role.
      </p>
      <Link href="/" className="mt-6 text-sm font-medium text-sky-800 underline">
        Back to your home page
      </Link>
    </main>
  );
}

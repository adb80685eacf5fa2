"use client";

import { useActionState } from "react";
import { addTripToBid } from "./actions";

/** The trip page's primary action, at the bottom of the screen where a thumb reaches. */
export function AddToBid({ code, inBid, open }: { code: string; inBid: boolean; open: boolean }) {
  const [error, action, pending] = useActionState(addTripToBid, null);
  return (
    <form action={action} className="sticky bottom-0 -mx-4 mt-6 border-t border-slate-300 bg-white/95 px-4 py-3 backdrop-blur">
      <input type="hidden" name="code" value={code} />
      {error ? (
        <p role="alert" className="mb-2 rounded-md bg-red-50 px-3 py-2 text-sm text-red-900">
          {error}
        </p>
      ) : null}
      {inBid ? <p className="mb-2 text-sm text-slate-700">This trip is already named in your bid.</p> : null}
      <button
        type="submit"
        disabled={pending || !open}
        className="min-h-12 w-full rounded-md bg-sky-800 px-4 text-base font-semibold text-white hover:bg-sky-900 disabled:opacity-60"
      >
        {pending ? "Adding…" : inBid ? "Add to my bid again" : "Add to my bid"}
      </button>
    </form>
  );
}

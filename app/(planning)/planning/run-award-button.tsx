"use client";

import { useActionState } from "react";
import { useFormStatus } from "react-dom";
import { runAwardAction } from "./actions";
import { ActionMessage } from "./action-message";

function Submit({ label }: { label: string }) {
  const { pending } = useFormStatus();
  return (
    <button type="submit" disabled={pending} className="rounded-md bg-slate-900 px-4 py-2 text-sm font-semibold text-white hover:bg-slate-700 disabled:opacity-60">
      {pending ? "Queuing…" : label}
    </button>
  );
}

/** "Run award" for one award group; a refusal is shown beside the button. */
export function RunAwardButton({ groupId, label, preview = false }: { groupId: string; label: string; preview?: boolean }) {
  const [outcome, action] = useActionState(runAwardAction, undefined);
  return (
    <form action={action} className="flex flex-wrap items-center gap-3">
      <input type="hidden" name="groupId" value={groupId} />
      {preview ? <input type="hidden" name="preview" value="yes" /> : null}
      <Submit label={label} />
      <ActionMessage state={outcome} />
    </form>
  );
}

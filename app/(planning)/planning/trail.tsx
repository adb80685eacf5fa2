import Link from "next/link";
import { Fragment } from "react";

/** Where a planning page sits: "Bid periods / January 2027 / Import", each step but the last a link. */
export function Trail({ steps }: { steps: Array<{ label: string; href?: string }> }) {
  return (
    <p className="text-sm text-slate-500">
      {steps.map((s, k) => (
        <Fragment key={k}>
          {k > 0 ? " / " : null}
          {s.href ? (
            <Link href={s.href} className="underline">
              {s.label}
            </Link>
          ) : (
            s.label
          )}
        </Fragment>
      ))}
    </p>
  );
}

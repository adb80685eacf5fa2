import { wishSentence, type Wish } from "@/lib/domain/index";
import { zonedDateTime } from "@/app/ui/format";

/** The latest preview's verdict on the crew member's own submitted wishes (never anyone else's). */
export function PreviewVerdict({ verdict, zone }: { verdict: { at: string; kind: string; wishes: { rank: number; wish: Wish; granted: boolean }[] }; zone: string }) {
  const granted = verdict.wishes.filter((w) => w.granted).length;
  return (
    <section aria-label="Preview of the award" className="mt-4 rounded-lg border border-violet-200 bg-violet-50 p-3 text-sm text-violet-950">
      <h2 className="font-semibold">Preview of the award</h2>
      <p className="mt-1">
        A preview on the bids submitted by {zonedDateTime(verdict.at, zone)} {verdict.kind === "reserve" ? "gave you a reserve line" : `granted ${granted} of your ${verdict.wishes.length} submitted wishes`}. It is not
        the award: bids still change until the deadline.
      </p>
      {verdict.wishes.length ? (
        <ol className="mt-2 space-y-1">
          {verdict.wishes.map((w) => (
            <li key={w.rank} className="flex gap-2">
              <span aria-hidden="true">{w.granted ? "✓" : "·"}</span>
              <span>
                {w.rank + 1}. {wishSentence(w.wish)} — <strong className="font-medium">{w.granted ? "granted" : "not granted in full"}</strong>
              </span>
            </li>
          ))}
        </ol>
      ) : null}
    </section>
  );
}

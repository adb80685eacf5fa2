/** The caution every screen that shows legality carries (README, DEVELOPERS.md "Caution"). */
export function LegalityCaution() {
  return (
    <p className="rounded-md border border-amber-200 bg-amber-50 px-3 py-2 text-sm text-amber-950" role="note">
      The legality checks aid planning; they are not a certified compliance system. The applicable regulations, the operator&apos;s approved scheme and
      the collective agreement govern, and a qualified person reviews what is published.
    </p>
  );
}

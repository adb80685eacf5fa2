/** What a planning form's action answered: a refusal as an alert, anything else as a status. */
export function ActionMessage({ state }: { state: { status: string; message: string } | undefined }) {
  if (!state) return null;
  const refused = state.status === "refused";
  return (
    <p role={refused ? "alert" : "status"} className={`text-sm ${refused ? "text-red-700" : "text-emerald-800"}`}>
      {state.message}
    </p>
  );
}

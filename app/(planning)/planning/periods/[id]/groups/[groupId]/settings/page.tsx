import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requireRole } from "@/lib/auth/session";
import { groupSettings } from "@/lib/db/group-settings";
import { isAppError } from "@/lib/domain/index";
import { POSITION_LABEL } from "../../../../../run-labels";
import { SettingsForm } from "./settings-form";
import { Trail } from "../../../../../trail";

export const metadata: Metadata = { title: "Rule set and settings" };

/** One award group's rule set (a preset, its rules and their figures) and award settings. */
export default async function GroupSettingsPage({ params }: { params: Promise<{ id: string; groupId: string }> }) {
  await requireRole("scheduler", "admin");
  const { id, groupId } = await params;
  const view = await groupSettings(groupId).catch((e: unknown) => {
    if (isAppError(e, "not_found")) notFound();
    throw e;
  });
  if (view.period.id !== id) notFound();
  const group = POSITION_LABEL[view.group.position] ?? view.group.position;
  return (
    <section className="space-y-5">
      <div>
        <Trail steps={[{ label: "Bid periods", href: "/planning" }, { label: view.period.name, href: `/planning/periods/${view.period.id}` }, { label: "Rule set and settings" }]} />
        <h1 className="text-xl font-semibold">Rule set and settings · {group}</h1>
        <p className="text-sm text-slate-600">
          {view.period.name} at {view.period.baseCode} · state: {view.period.state}
        </p>
      </div>
      <div className="space-y-1 rounded-lg border border-slate-200 bg-white p-4 text-sm text-slate-700">
        <p>
          Rule set in use: <strong>{view.ruleSet.name}</strong>
        </p>
        {view.ruleSet.sharedWith.length > 0 ? (
          <p>
            Also used by {view.ruleSet.sharedWith.join("; ")}. Saving changed rules gives {group.toLowerCase()} a rule set of their own; the others keep theirs.
          </p>
        ) : null}
        <p>Runs already made keep the rules and settings they were made with. After a change, run the award again: a run made before it cannot be published.</p>
        {view.settingsProblem ? <p className="text-amber-800">The stored settings could not be read ({view.settingsProblem}); the form shows the defaults.</p> : null}
      </div>
      <SettingsForm
        groupId={view.group.id}
        editable={view.editable}
        presets={view.presets}
        stored={{ preset: view.ruleSet.document.preset, presetName: view.ruleSet.document.name, rules: view.ruleSet.rules, settings: view.settings }}
      />
    </section>
  );
}

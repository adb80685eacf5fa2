/** GET: a bid period as the engine's JSON bundle (one instance per award group), as a download; schedulers and admins only. */
import { NextResponse } from "next/server";
import { currentUser } from "@/lib/auth/session";
import { db } from "@/lib/db/client";
import { exportPeriod } from "@/lib/db/period-export";
import { isAppError } from "@/lib/domain/index";
import { errorMessage } from "@/app/ui/error-message";

export const dynamic = "force-dynamic";

export async function GET(_request: Request, context: { params: Promise<{ id: string }> }) {
  const user = await currentUser();
  if (!user) return NextResponse.json({ error: "sign in first" }, { status: 401 });
  if (user.role !== "scheduler" && user.role !== "admin") return NextResponse.json({ error: "for schedulers only" }, { status: 403 });
  const id = (await context.params).id;
  try {
    const bundle = await exportPeriod(db(), id);
    const name = `${bundle.period.name}-${bundle.instances[0]?.group.base ?? "period"}`.toLowerCase().replace(/[^a-z0-9]+/g, "-");
    return new NextResponse(`${JSON.stringify(bundle, null, 2)}\n`, {
      headers: { "content-type": "application/json; charset=utf-8", "content-disposition": `attachment; filename="${name}.json"`, "cache-control": "no-store" },
    });
  } catch (error) {
    if (isAppError(error, "not_found")) return NextResponse.json({ error: "no such bid period" }, { status: 404 });
    return NextResponse.json({ error: errorMessage(error) }, { status: isAppError(error, "invalid") ? 422 : 500 });
  }
}

/** GET: a run's state and progress, polled by the run page's progress bar (schedulers and admins only). */
import { NextResponse } from "next/server";
import { currentUser } from "@/lib/auth/session";
import { runStatus } from "@/lib/db/award-runs";
import { isAppError } from "@/lib/domain/index";

export const dynamic = "force-dynamic";

export async function GET(_request: Request, context: { params: Promise<{ id: string }> }) {
  const user = await currentUser();
  if (!user) return NextResponse.json({ error: "sign in first" }, { status: 401 });
  if (user.role !== "scheduler" && user.role !== "admin") return NextResponse.json({ error: "for schedulers only" }, { status: 403 });
  try {
    return NextResponse.json(await runStatus((await context.params).id), { headers: { "cache-control": "no-store" } });
  } catch (error) {
    if (isAppError(error, "not_found")) return NextResponse.json({ error: "no such award run" }, { status: 404 });
    throw error;
  }
}

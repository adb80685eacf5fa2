import { redirect } from "next/navigation";
import { currentUser } from "@/lib/auth/session";

/** The front door sends each role to its own home. */
export default async function Home() {
  const user = await currentUser();
  if (!user) redirect("/sign-in");
  redirect(user.role === "crew" ? "/trips" : "/planning");
}

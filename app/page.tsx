import { redirect } from "next/navigation";
import { getCurrentUser } from "@/lib/auth/guard";
import { homeFor } from "@/lib/auth/roles";

/** Each role lands on its own home. */
export default async function Home() {
  const user = await getCurrentUser();
  redirect(user ? homeFor(user.role) : "/sign-in");
}

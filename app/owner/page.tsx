import { redirect } from "next/navigation";
import { requirePageUser } from "@/lib/auth/guard";

export default async function OwnerHome() {
  await requirePageUser("/owner", "owner");
  redirect("/owner/people");
}

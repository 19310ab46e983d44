import { redirect } from "next/navigation";
import { requireRole } from "@/lib/auth/guard";
import { ROLE_HOME } from "@/lib/auth/permissions";

export default async function Home() {
  const user = await requireRole("signed-in", "/");
  redirect(ROLE_HOME[user.role]);
}

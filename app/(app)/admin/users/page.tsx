import type { Metadata } from "next";
import { requireRole } from "@/lib/auth/guard";
import { PageHeader } from "@/components/PageHeader";
import { UsersAdmin } from "@/components/users/UsersAdmin";

export const metadata: Metadata = { title: "Users" };

export default async function UsersPage() {
  const me = await requireRole("users.manage", "/admin/users");
  return (
    <>
      <PageHeader
        title="Users"
        lead="Who may sign in at this site and what each person may do. Changing someone's role or disabling them signs them out everywhere at once."
      />
      <UsersAdmin myId={me.id} />
    </>
  );
}

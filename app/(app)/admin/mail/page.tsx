import type { Metadata } from "next";
import { requireRole } from "@/lib/auth/guard";
import { PageHeader } from "@/components/PageHeader";
import { MailInbox } from "@/components/mail/MailInbox";

export const metadata: Metadata = { title: "Mail" };

export default async function MailPage() {
  await requireRole("users.manage", "/admin/mail");
  return (
    <>
      <PageHeader
        title="Mail"
        lead="Everything Trailbin sent (invitations, password resets), as the local mail sink received it. On this machine nothing leaves for real mailboxes: open a message to follow its link."
      />
      <MailInbox />
    </>
  );
}

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
        lead="Everything Trailbin sent (invitations, password resets, wave mail), as the local mail sink received it; on this machine nothing leaves for real mailboxes. A set-password link is the key to its addressee's account, so it shows in full only in mail to your own address: in mail to anyone else it is hidden, as a real mail service would keep it from you."
      />
      <MailInbox />
    </>
  );
}

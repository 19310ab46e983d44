import { route } from "@/lib/http/route";
import { listSinkMessages } from "@/db/mail-sink";
import { listOutbox } from "@/db/outbox";
import { hideLinkTokens, mailAsSeenBy } from "@/lib/mail/mailbox-view";

// What the local SMTP sink received (newest first) and the state of the outbox behind it, with the
// set-password links of other people's mail hidden (lib/mail/mailbox-view.ts says why).
export const GET = route({ access: "users.manage" }, async ({ user }) => {
  const [messages, outbox] = await Promise.all([listSinkMessages(200), listOutbox(50)]);
  return Response.json({
    messages: messages.map((m) => mailAsSeenBy(m, user.email)),
    // The outbox rows are shown for their state only; the links in them are live, so no bodies here.
    outbox: outbox.map(({ text: _t, html: _h, ...rest }) => ({
      ...rest,
      subject: hideLinkTokens(rest.subject),
      lastError: hideLinkTokens(rest.lastError),
    })),
  });
});

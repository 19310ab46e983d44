import { route } from "@/lib/http/route";
import { listSinkMessages } from "@/db/mail-sink";
import { listOutbox } from "@/db/outbox";

export const dynamic = "force-dynamic";

// What the local SMTP sink received (newest first) and the state of the outbox behind it.
export const GET = route({ access: "users.manage" }, async () => {
  const [messages, outbox] = await Promise.all([listSinkMessages(200), listOutbox(50)]);
  return Response.json({
    messages,
    // The outbox rows are shown for their state only; the links in them are live, so no bodies here.
    outbox: outbox.map(({ text: _t, html: _h, ...rest }) => rest),
  });
});

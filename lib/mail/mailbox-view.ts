import type { SinkMessage } from "@/lib/contracts/mail";

// The mail page stands in for a real mail service, where an admin could not read other people's
// mail. A set-password link is the key to its addressee's account, so it is shown in full only to
// the addressee; everyone else sees that there was one.

export const HIDDEN_LINK = "[set-password link hidden: only its addressee may see it]";

const SET_PASSWORD_LINK = /https?:\/\/[^\s<>"']*\/set-password\?[^\s<>"']*/g;
// The raw token (43 base64url characters) wherever else it might stand: a quoted-printable or
// wrapped copy, a header. Nothing else we send has such a run.
const BARE_TOKEN = /(?<![A-Za-z0-9_-])[A-Za-z0-9_-]{43}(?![A-Za-z0-9_-])/g;

export function hideLinkTokens(text: string): string;
export function hideLinkTokens(text: string | null): string | null;
export function hideLinkTokens(text: string | null): string | null {
  return text === null ? null : text.replace(SET_PASSWORD_LINK, HIDDEN_LINK).replace(BARE_TOKEN, "[hidden]");
}

/** The message as `reader` may see it: whole if it was sent to them, without live links otherwise. */
export function mailAsSeenBy<M extends SinkMessage>(message: M, reader: string): M {
  const me = reader.trim().toLowerCase();
  if (message.envelopeTo.some((to) => to.trim().toLowerCase() === me)) return message;
  return {
    ...message,
    subject: hideLinkTokens(message.subject),
    text: hideLinkTokens(message.text),
    from: hideLinkTokens(message.from),
    to: hideLinkTokens(message.to),
    messageId: hideLinkTokens(message.messageId),
  };
}

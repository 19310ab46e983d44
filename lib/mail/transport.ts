import "server-only";
import { createTransport } from "nodemailer";
import type Mail from "nodemailer/lib/mailer";
import { smtpSettings } from "./config";

export type MailTransport = Pick<Mail, "sendMail" | "close">;

/**
 * Plain SMTP to the configured host. The demo and the tests talk to the loopback sink, which offers
 * no TLS (see scripts/mail-sink.ts), so STARTTLS is not attempted; a real relay would set
 * requireTLS and credentials here. Short timeouts: a dead server costs a retry, not a hung loop.
 */
export function smtpTransport(port = smtpSettings().port, host = smtpSettings().host): MailTransport {
  return createTransport({
    host,
    port,
    secure: false,
    ignoreTLS: true,
    connectionTimeout: 3000,
    greetingTimeout: 3000,
    socketTimeout: 10_000,
  });
}

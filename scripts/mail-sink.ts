// The local SMTP sink of the demo and the tests: accepts every message on 127.0.0.1 and stores it
// (raw + parsed from/to/subject/text) in the app's database, table mail_sink_messages, where the
// admin page /admin/mail shows it. Nothing is relayed anywhere.
//
//   node --conditions=react-server --import tsx scripts/mail-sink.ts
//   env: MAIL_SINK_PORT (default 2525) and the DB_* variables of the app.
//
// No TLS and no authentication: the server listens on loopback only, so the traffic never leaves this
// machine, and a certificate here would be smtp-server's built-in test one, whose private key is
// public anyway. A real relay in production must be reached over TLS with credentials instead.
import { SMTPServer } from "smtp-server";
import { simpleParser, type AddressObject } from "mailparser";
import { storeSinkMessage } from "../db/mail-sink";
import { closeDb } from "../db/knex";

const PORT = Number(process.env.MAIL_SINK_PORT || 2525);
const HOST = "127.0.0.1";
const MAX_BYTES = 5 * 1024 * 1024;

const addressText = (a: AddressObject | AddressObject[] | undefined) =>
  a === undefined
    ? null
    : [a]
        .flat()
        .map((x) => x.text)
        .join(", ");

const server = new SMTPServer({
  secure: false,
  disabledCommands: ["STARTTLS"],
  hideSTARTTLS: true,
  authOptional: true,
  size: MAX_BYTES,
  banner: "Trailbin mail sink (loopback only; nothing is delivered)",
  logger: false,
  onData(stream, session, callback) {
    const chunks: Buffer[] = [];
    stream.on("data", (c: Buffer) => chunks.push(c));
    stream.on("error", (e) => callback(e));
    stream.on("end", () => {
      if (stream.sizeExceeded)
        return callback(Object.assign(new Error("Message too large for the sink"), { responseCode: 552 }));
      const raw = Buffer.concat(chunks);
      simpleParser(raw)
        .then((parsed) =>
          storeSinkMessage({
            envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
            envelopeTo: session.envelope.rcptTo.map((r) => r.address),
            messageId: parsed.messageId ?? null,
            fromHeader: addressText(parsed.from),
            toHeader: addressText(parsed.to),
            subject: parsed.subject ?? null,
            text: parsed.text ?? null,
            raw: raw.toString("utf8"),
          }),
        )
        .then((id) => {
          console.log(`stored message ${id} for ${session.envelope.rcptTo.map((r) => r.address).join(", ")}`);
          callback(null, `Stored as ${id}`);
        })
        .catch((e: Error) => {
          console.error("could not store a message:", e.message);
          // 451: a temporary failure, so the sender keeps the message and tries again.
          callback(Object.assign(new Error("Sink could not store the message; try again"), { responseCode: 451 }));
        });
    });
  },
});

server.on("error", (e) => console.error("mail sink error:", e.message));

server.listen(PORT, HOST, () => console.log(`mail sink listening on ${HOST}:${PORT}`));

let stopping = false;
function stop() {
  if (stopping) return;
  stopping = true;
  server.close(() => {
    closeDb().finally(() => process.exit(0));
  });
  // Open connections get a few seconds, then the process goes anyway.
  setTimeout(() => process.exit(0), 5000).unref();
}
process.on("SIGTERM", stop);
process.on("SIGINT", stop);

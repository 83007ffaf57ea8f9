import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

export type CaughtMail = { to: string; from: string; subject: string; text: string; html: string | null };

/**
 * The local SMTP stand-in for development, demo and tests: accepts every message on loopback and
 * hands it to `store` (which keeps it for the development mailbox page).
 */
export async function startSmtpStandIn(options: {
  port: number;
  host?: string;
  store: (mail: CaughtMail) => Promise<void>;
}): Promise<{ port: number; close: () => Promise<void> }> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    banner: "Rigline local mail stand-in",
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const to = Array.isArray(parsed.to) ? parsed.to.map((a) => a.text).join(", ") : (parsed.to?.text ?? "");
          await options.store({
            to,
            from: parsed.from?.text ?? "",
            subject: parsed.subject ?? "(no subject)",
            text: parsed.text ?? "",
            html: typeof parsed.html === "string" ? parsed.html : null,
          });
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(options.port, options.host ?? "127.0.0.1", () => resolve());
  });
  const address = server.server.address();
  const port = typeof address === "object" && address ? address.port : options.port;
  return {
    port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

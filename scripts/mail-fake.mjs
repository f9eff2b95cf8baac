// The local mail fake: a real SMTP server on 127.0.0.1 that keeps every message it is sent as an
// .eml file instead of delivering it. `npm run demo` and the browser tests start one, so mail
// takes the same path through nodemailer and SMTP as it does with a hosted provider.
import { mkdirSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { SMTPServer } from "smtp-server";

const MAX_MESSAGE_BYTES = 5 * 1024 * 1024;

/**
 * Starts the fake. Port 0 picks a free port. Resolves with the port it listens on and a close().
 * @param {{ port?: number, dir: string }} options
 */
export function startMailFake({ port = 0, dir }) {
  mkdirSync(dir, { recursive: true });
  let count = 0;
  const server = new SMTPServer({
    // Loopback only, so no TLS and no sign-in; nothing here leaves the machine.
    disabledCommands: ["STARTTLS", "AUTH"],
    authOptional: true,
    size: MAX_MESSAGE_BYTES,
    banner: "Changewise local mail fake",
    logger: false,
    onData(stream, _session, callback) {
      const chunks = [];
      stream.on("data", (chunk) => chunks.push(chunk));
      stream.on("end", () => {
        if (stream.sizeExceeded) return callback(new Error("Message too large for the mail fake"));
        count += 1;
        const name = `${new Date().toISOString().replaceAll(":", "-")}-${process.pid}-${count}.eml`;
        writeFileSync(join(dir, name), Buffer.concat(chunks));
        callback();
      });
    },
  });
  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => {
      const address = server.server.address();
      resolve({
        port: typeof address === "object" && address ? address.port : port,
        close: () => new Promise((done) => server.close(() => done(undefined))),
      });
    });
  });
}

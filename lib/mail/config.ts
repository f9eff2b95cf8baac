/**
 * Where mail goes, from the environment: any SMTP server (a hosted provider's works unchanged),
 * or the local fake that `npm run demo` starts (MAIL_OUTBOX_DIR names the folder it writes to).
 */
export type MailConfig = {
  host: string;
  port: number;
  /** TLS from the first byte (port 465); otherwise STARTTLS when the server offers it. */
  secure: boolean;
  auth: { user: string; pass: string } | null;
  from: string;
};

/** The SMTP settings, or null when SMTP_HOST is not set (mail then waits in the outbox). */
export function mailConfig(env: NodeJS.ProcessEnv = process.env): MailConfig | null {
  const host = env.SMTP_HOST?.trim();
  if (!host) return null;
  const secure = env.SMTP_SECURE === "true" || env.SMTP_SECURE === "1";
  const port = Number(env.SMTP_PORT) || (secure ? 465 : 587);
  return {
    host,
    port,
    secure,
    auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASS ?? "" } : null,
    from: env.MAIL_FROM?.trim() || "Changewise <no-reply@changewise.invalid>",
  };
}

/** True when mail goes to the local fake on this machine (the Outbox page then reads its folder). */
export const usesLocalFake = (env: NodeJS.ProcessEnv = process.env) =>
  Boolean(env.MAIL_OUTBOX_DIR) && ["127.0.0.1", "localhost", "::1"].includes(env.SMTP_HOST?.trim() ?? "");

/** The folder the local fake writes to. */
export const outboxDir = (env: NodeJS.ProcessEnv = process.env) => env.MAIL_OUTBOX_DIR || "data/outbox";

/** The address links in mail point at (the app's own origin). */
export const appOrigin = (env: NodeJS.ProcessEnv = process.env) =>
  (env.NEXTAUTH_URL || "http://localhost:3000").replace(/\/$/, "");

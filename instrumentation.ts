/** Runs once when the server starts (Next.js instrumentation hook). */
export async function register() {
  if (process.env.NEXT_RUNTIME === "nodejs") {
    const { refuseUnsupportedMethods } = await import("@/lib/api/refuse-methods");
    refuseUnsupportedMethods();
    // Mail that waited through a restart, or through a mail server that was down, goes out now.
    const { keepSendingMail } = await import("@/lib/data/mail");
    keepSendingMail();
  }
}

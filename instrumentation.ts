/** Runs once when the server starts (Next.js instrumentation hook). */
export async function register() {
  if (process.env.NEXT_RUNTIME === "nodejs") {
    const { refuseUnsupportedMethods } = await import("@/lib/api/refuse-methods");
    refuseUnsupportedMethods();
  }
}

"use client";

export default function GlobalError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <html lang="en">
      <body style={{ fontFamily: "system-ui, sans-serif", color: "#1E2A44", padding: "4rem", textAlign: "center" }}>
        <h1>Changewise could not load</h1>
        <p>Nothing you entered was lost on the server. Try again in a moment.</p>
        <button type="button" onClick={() => reset()} style={{ marginTop: "1rem", padding: "0.5rem 1rem" }}>
          Try again
        </button>
      </body>
    </html>
  );
}

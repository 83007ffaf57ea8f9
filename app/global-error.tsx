"use client";

/** Last-resort error page when even the root layout fails. */
export default function GlobalError({ reset }: { error: Error; reset: () => void }) {
  return (
    <html lang="en-AU">
      <body style={{ fontFamily: "system-ui, sans-serif", padding: "3rem", color: "#1c2433", background: "#f6f1e7" }}>
        <h1>Rigline could not show this page</h1>
        <p>Something went wrong on our side. Nothing you entered was changed.</p>
        <button type="button" onClick={reset} style={{ padding: "0.75rem 1.25rem", fontWeight: 600 }}>
          Try again
        </button>
      </body>
    </html>
  );
}

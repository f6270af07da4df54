"use client";

export default function GlobalError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <html lang="en">
      <body style={{ fontFamily: "system-ui, sans-serif", padding: "3rem", maxWidth: "40rem", margin: "0 auto" }}>
        <h1>Greaseledger could not start this page</h1>
        <p>Something went wrong on our side. It has been logged. Try again in a moment.</p>
        <button type="button" onClick={reset} style={{ padding: "0.6rem 1rem", fontWeight: 700 }}>
          Try again
        </button>
      </body>
    </html>
  );
}

"use client";

export default function GlobalError({ reset }: { error: Error; reset: () => void }) {
  return (
    <html lang="en">
      <body style={{ fontFamily: "sans-serif", padding: "4rem", textAlign: "center" }}>
        <h1>Portolan could not start this page</h1>
        <button onClick={reset}>Try again</button>
      </body>
    </html>
  );
}

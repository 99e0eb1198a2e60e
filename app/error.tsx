"use client";

export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div role="alert" className="mx-auto max-w-lg px-6 py-20 text-center">
      <h1 className="text-2xl font-bold">This page could not be shown</h1>
      <p className="mt-2 text-ink-soft">Something failed on our side. Nothing you entered was lost by this error.</p>
      {error.digest && <p className="mt-2 font-mono text-xs text-ink-faint">Reference {error.digest}</p>}
      <button onClick={reset} className="mt-6 rounded-md bg-copper px-4 py-2 font-semibold text-white">
        Try again
      </button>
    </div>
  );
}

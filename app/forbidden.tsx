import Link from "next/link";

export default function Forbidden() {
  return (
    <div className="mx-auto max-w-lg px-6 py-20 text-center">
      <p className="font-mono text-sm font-bold text-copper">403</p>
      <h1 className="mt-2 text-2xl font-bold" data-testid="forbidden-title">
        Not open to your role
      </h1>
      <p className="mt-2 text-ink-soft">You are signed in, but this page belongs to another role. If you need it, ask your administrator.</p>
      <Link href="/" className="mt-6 inline-block font-semibold text-copper underline">
        Back to the overview
      </Link>
    </div>
  );
}

import Link from "next/link";

export default function NotFound() {
  return (
    <div className="mx-auto max-w-lg px-6 py-20 text-center">
      <p className="font-mono text-sm font-bold text-copper">404</p>
      <h1 className="mt-2 text-2xl font-bold">Nothing at this address</h1>
      <p className="mt-2 text-ink-soft">The record may have been renamed, or the link is incomplete.</p>
      <Link href="/" className="mt-6 inline-block font-semibold text-copper underline">
        Back to the overview
      </Link>
    </div>
  );
}

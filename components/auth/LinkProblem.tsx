import Link from "next/link";

export function LinkProblem({ title, message }: { title: string; message: string }) {
  return (
    <div role="alert">
      <h1 className="mb-2 text-xl font-bold">{title}</h1>
      <p className="text-sm text-ink-soft" data-testid="link-problem">
        {message}
      </p>
      <p className="mt-4 text-sm">
        <Link href="/sign-in" className="text-copper underline">
          Go to sign-in
        </Link>
      </p>
    </div>
  );
}

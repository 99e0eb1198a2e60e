import { SignInForm } from "@/components/auth/SignInForm";

export const metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const { callbackUrl, error } = await searchParams;
  // Only same-site paths: a link must not bounce a fresh session to another site.
  const next = callbackUrl && callbackUrl.startsWith("/") && !callbackUrl.startsWith("//") ? callbackUrl : "/";
  return (
    <>
      <h1 className="mb-4 text-xl font-bold">Sign in</h1>
      <SignInForm next={next} initialError={error && error !== "undefined" ? error : undefined} />
    </>
  );
}

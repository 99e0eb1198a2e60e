import { Wordmark } from "@/components/shell/AppShell";

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col items-center justify-center bg-graphite px-4 py-10">
      <div className="mb-6 text-2xl text-white">
        <Wordmark />
      </div>
      <div className="w-full max-w-md rounded-lg border border-rule bg-card p-6 shadow-lg">{children}</div>
      <p className="mt-6 max-w-md text-center text-xs text-paper/60">The shop record of port programs, masters and cuts.</p>
    </div>
  );
}

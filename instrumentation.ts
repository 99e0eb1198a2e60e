/**
 * Runs once when the server starts: a missing or malformed setting stops it here, with the
 * variable's name, instead of failing on the first request that needs it. Then analyses left
 * running by a crash are queued again and abandoned uploads swept.
 */
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { readEnv } = await import("./lib/env");
  readEnv();
  if (!process.env.NEXTAUTH_SECRET) {
    throw new Error("NEXTAUTH_SECRET is not set: sessions cannot be signed. Set it to a long random string (`npm run demo` generates one).");
  }
  try {
    const { kickAnalyses } = await import("./lib/analysis/scheduler");
    kickAnalyses();
  } catch (err) {
    // The app still serves pages; the first request that touches analyses tries again.
    console.error(`[start] could not resume analyses: ${err instanceof Error ? err.message : String(err)}`);
  }
}

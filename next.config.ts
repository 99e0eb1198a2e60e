import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // forbidden() renders app/forbidden.tsx with a 403 for signed-in users without the role.
  experimental: { authInterrupts: true },
  // Native and Node-only packages stay outside the server bundle.
  serverExternalPackages: ["better-sqlite3", "pdfkit"],
  poweredByHeader: false,
  // Several checkouts of work can build side by side (NEXT_DIST_DIR=.next-x); CI uses the default.
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  // Type errors are caught by `tsc --noEmit` as its own CI step, before the build.
  typescript: { ignoreBuildErrors: true },
};

export default nextConfig;

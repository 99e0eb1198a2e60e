import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // forbidden() renders app/forbidden.tsx with a 403 for signed-in users without the role.
  experimental: { authInterrupts: true },
  // Native and Node-only packages stay outside the server bundle.
  serverExternalPackages: ["better-sqlite3", "pdfkit"],
  poweredByHeader: false,
};

export default nextConfig;

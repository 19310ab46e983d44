/** @type {import('next').NextConfig} */
// Sent with every response. Pages also get a per-response Content-Security-Policy with a nonce from
// proxy.ts; route handlers get API_CSP below. No Strict-Transport-Security here: the app speaks plain
// HTTP on loopback, and a site that serves it over HTTPS sets HSTS where TLS ends (a year of HSTS
// pinned from here would lock people out of a server behind a self-signed certificate).
const securityHeaders = [
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "X-Frame-Options", value: "DENY" },
  { key: "Referrer-Policy", value: "same-origin" },
  { key: "Permissions-Policy", value: "camera=(self), microphone=(), geolocation=(), payment=(), usb=()" },
  { key: "Cross-Origin-Opener-Policy", value: "same-origin" },
  // Nothing of ours (pages, pictures, spreadsheets, JSON) is for other sites to embed or read.
  { key: "Cross-Origin-Resource-Policy", value: "same-origin" },
  { key: "Origin-Agent-Cluster", value: "?1" },
  { key: "X-Permitted-Cross-Domain-Policies", value: "none" },
  { key: "X-DNS-Prefetch-Control", value: "off" },
];

// Route handlers answer JSON, pictures and spreadsheets, never pages: should one be opened as a
// document anyway, nothing in it may run, load or be framed.
const API_CSP = "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

const nextConfig = {
  // knex pulls optional drivers it never loads; bundling it breaks the build.
  serverExternalPackages: ["knex", "mysql2", "@node-rs/argon2", "xlsx", "bwip-js"],
  poweredByHeader: false,
  reactStrictMode: true,
  // npm test builds into its own folder so it never disturbs a running npm start.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  // forbidden() gives pages a real 403 instead of a redirect.
  experimental: { authInterrupts: true },
  async headers() {
    return [
      { source: "/:path*", headers: securityHeaders },
      { source: "/api/:path*", headers: [{ key: "Content-Security-Policy", value: API_CSP }] },
    ];
  },
};
export default nextConfig;

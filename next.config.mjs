/** @type {import('next').NextConfig} */
const securityHeaders = [
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "X-Frame-Options", value: "DENY" },
  { key: "Referrer-Policy", value: "same-origin" },
  { key: "Permissions-Policy", value: "camera=(self), microphone=(), geolocation=()" },
  { key: "Cross-Origin-Opener-Policy", value: "same-origin" },
];

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
    return [{ source: "/:path*", headers: securityHeaders }];
  },
};
export default nextConfig;

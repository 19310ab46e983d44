/** @type {import('next').NextConfig} */
const nextConfig = {
  // knex pulls optional drivers it never loads; bundling it breaks the build.
  serverExternalPackages: ["knex", "mysql2", "@node-rs/argon2", "xlsx"],
  poweredByHeader: false,
  reactStrictMode: true,
};
export default nextConfig;

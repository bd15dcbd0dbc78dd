/** @type {import('next').NextConfig} */
const nextConfig = {
  serverExternalPackages: ["knex", "better-sqlite3", "pg", "sharp", "smtp-server", "mailparser"],
  poweredByHeader: false,
  typedRoutes: false,
  experimental: { authInterrupts: true },
};

export default nextConfig;

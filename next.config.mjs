/** @type {import('next').NextConfig} */
const nextConfig = {
  serverExternalPackages: ["knex", "better-sqlite3", "pg", "sharp", "smtp-server", "mailparser"],
  poweredByHeader: false,
  typedRoutes: false,
  experimental: { authInterrupts: true },
  // proxy.ts sends pages asked for on another host name to APP_URL's (lib/security/canonical.ts).
  // Next.js otherwise rewrites a Location on "the same host" to a bare path, and it counts
  // 127.0.0.1 and localhost as one host, which would turn that redirect into a loop. The
  // setting only touches the Pages Router's data URLs otherwise, which this app has none of.
  skipProxyUrlNormalize: true,
};

export default nextConfig;

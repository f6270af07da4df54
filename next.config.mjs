import securityHeaders from "./lib/security-headers.json" with { type: "json" };

/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize and the database drivers load dialects dynamically; bundling them breaks the build.
  serverExternalPackages: ["sequelize", "mariadb", "mysql2", "@node-rs/argon2", "nodemailer", "pdfkit"],
  poweredByHeader: false,
  // Forms that carry a delivery note (PDF, at most 10 MB, checked again on the server) post through server actions.
  // The proxy reads request bodies too and silently cuts them at its own limit (10 MB by default), which turned a
  // file near the limit into an unreadable form: it gets the same room, and the upload code counts the 10 MB itself.
  experimental: { serverActions: { bodySizeLimit: "11mb" }, proxyClientMaxBodySize: "11mb" },
  reactStrictMode: true,
  // Every answer, static files included, gets the baseline headers. Pages get their CSP, with a nonce, from the
  // proxy; the API does not pass through the proxy (see proxy.ts) and gets a fixed policy under which nothing loads
  // or runs (inline style only, which the browser's own viewers of an image or JSON use).
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "X-Content-Type-Options", value: "nosniff" },
          { key: "Referrer-Policy", value: "same-origin" },
          { key: "X-Frame-Options", value: "DENY" },
        ],
      },
      {
        source: "/api/:path*",
        headers: [
          { key: "Content-Security-Policy", value: securityHeaders.nonPagePolicy },
          { key: "Permissions-Policy", value: securityHeaders.permissionsPolicy },
        ],
      },
      {
        source: "/api/:path*",
        has: [{ type: "header", key: "x-forwarded-proto", value: ".*https.*" }],
        headers: [{ key: "Strict-Transport-Security", value: securityHeaders.strictTransportSecurity }],
      },
    ];
  },
  // A fixed build id keeps two instances built from the same commit interchangeable behind a balancer.
  generateBuildId: async () => process.env.GREASELEDGER_BUILD_ID ?? "greaseledger",
};

export default nextConfig;

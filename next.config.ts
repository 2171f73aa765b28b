import type { NextConfig } from "next";
import { contentSecurityPolicy } from "./lib/security/content-security-policy";
import { securityHeaders } from "./lib/security/headers";

// Answers that are not pages (the API) carry a policy under which no script runs; pages get
// theirs, with a nonce, from proxy.ts. Read when the app is built.
const nonPagePolicy = contentSecurityPolicy({ storageEndpoint: process.env.S3_ENDPOINT ?? "http://127.0.0.1:4569", development: process.env.NODE_ENV === "development" });

const nextConfig: NextConfig = {
  // Sequelize loads its dialect at run time; bundling it breaks that look-up.
  serverExternalPackages: ["sequelize", "pg", "pg-hstore", "bcrypt", "nodemailer", "s3rver", "pdfkit", "svg-to-pdfkit"],
  // Tests build into their own folder so `npm test` never disturbs a running `npm start`.
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  poweredByHeader: false,
  // Compression belongs to the TLS-terminating proxy in front (README, Operations); in the app
  // it cost every page a gzip pass on the same cores that render pages.
  compress: false,
  typedRoutes: false,
  async headers() {
    return [
      { source: "/:path*", headers: securityHeaders() },
      { source: "/api/:path*", headers: [{ key: "Content-Security-Policy", value: nonPagePolicy }] },
    ];
  },
};

export default nextConfig;

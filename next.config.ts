import type { NextConfig } from "next";
import { securityHeaders } from "./lib/security/headers";

// Read when the app is built: build with the S3_ENDPOINT the browser will upload to.
const headers = securityHeaders({ storageEndpoint: process.env.S3_ENDPOINT ?? "http://127.0.0.1:4569", development: process.env.NODE_ENV === "development" });

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
      {
        source: "/:path*",
        headers,
      },
    ];
  },
};

export default nextConfig;

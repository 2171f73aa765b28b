import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // Sequelize loads its dialect at run time; bundling it breaks that look-up.
  serverExternalPackages: ["sequelize", "pg", "pg-hstore", "bcryptjs", "nodemailer", "s3rver", "pdfkit", "svg-to-pdfkit"],
  // Tests build into their own folder so `npm test` never disturbs a running `npm start`.
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  poweredByHeader: false,
  typedRoutes: false,
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "X-Content-Type-Options", value: "nosniff" },
          { key: "X-Frame-Options", value: "DENY" },
          { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
          { key: "Permissions-Policy", value: "camera=(self), geolocation=(self), microphone=()" },
        ],
      },
    ];
  },
};

export default nextConfig;

/** @type {import('next').NextConfig} */
const nextConfig = {
  poweredByHeader: false,
  // Native and Node-only packages stay outside the server bundle.
  serverExternalPackages: ["@libsql/client", "libsql", "smtp-server", "mailparser", "nodemailer", "exceljs", "sharp", "bcryptjs"],
  experimental: {
    // forbidden() renders app/forbidden.tsx with status 403.
    authInterrupts: true,
    serverActions: { bodySizeLimit: "25mb" },
  },
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "X-Content-Type-Options", value: "nosniff" },
          { key: "Referrer-Policy", value: "same-origin" },
          { key: "X-Frame-Options", value: "DENY" },
          { key: "Permissions-Policy", value: "camera=(self), geolocation=(self), microphone=()" },
        ],
      },
    ];
  },
};

export default nextConfig;

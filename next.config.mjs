/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  // npm test builds into its own folder so it never disturbs a running npm start.
  distDir: process.env.SAGLINE_DIST_DIR ?? ".next",
  poweredByHeader: false,
  // forbidden() renders app/forbidden.tsx with a real 403 status.
  experimental: { authInterrupts: true, serverActions: { bodySizeLimit: "1mb" } },
  serverExternalPackages: ["@node-rs/argon2", "bullmq", "ioredis"],
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
    ];
  },
};

export default nextConfig;

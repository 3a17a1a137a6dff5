/** @type {import('next').NextConfig} */
const nextConfig = {
  // `npm test` builds into its own folder so a running `npm start` keeps serving.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  poweredByHeader: false,
  serverExternalPackages: ["sharp", "@node-rs/argon2", "mysql2", "pdfjs-dist", "@napi-rs/canvas"],
  experimental: {
    authInterrupts: true,
    serverActions: { bodySizeLimit: "2mb" },
  },
};

export default nextConfig;

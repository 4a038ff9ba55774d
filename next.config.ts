import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // knex resolves dialect drivers it never uses at bundle time; keep it (and other
  // server-only native or worker-shared packages) out of the server bundle.
  serverExternalPackages: ["knex", "pg", "bullmq", "ioredis", "@node-rs/argon2", "nodemailer"],
  poweredByHeader: false,
  typedRoutes: false,
};

export default nextConfig;

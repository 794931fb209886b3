/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  serverExternalPackages: ["better-sqlite3", "bcryptjs"],
  experimental: {
    authInterrupts: true,
  },
};

export default nextConfig;

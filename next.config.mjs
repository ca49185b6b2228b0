/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize and its driver load modules dynamically; the bundler must leave them to Node.
  serverExternalPackages: ['sequelize', 'mariadb', 'sharp', 'pdf-lib', 'nodemailer'],
  // Lets a second build (tests, a helper's branch of work) live beside the demo's.
  distDir: process.env.NEXT_DIST_DIR || '.next',
  poweredByHeader: false,
  experimental: {
    authInterrupts: true,
  },
};

export default nextConfig;

// Validates the configuration once when the server starts, so a missing variable
// stops the server with a clear message instead of failing on the first request.
export async function register() {
  if (process.env.NEXT_RUNTIME === 'nodejs') {
    const { getEnv } = await import('./lib/env');
    const { refuseDemoSettings } = await import('./lib/production-check');
    refuseDemoSettings(getEnv());
    // `next build` may load this file too; the database is not the build's business.
    if (process.env.NEXT_PHASE !== 'phase-production-build') {
      const { syncCoursesAtStart } = await import('./lib/courses/start');
      await syncCoursesAtStart();
    }
  }
}

import { getSequelize } from '../db';
import { syncCourses } from './sync';

/**
 * The course check a server start runs once, so a deploy with a new course file needs no manual
 * step. A database that does not answer yet is logged, not fatal: the pages say so with a 503
 * until it is back, and the next start or `npm run db:migrate` brings the courses in.
 */
export async function syncCoursesAtStart(): Promise<void> {
  try {
    const report = await syncCourses(getSequelize());
    if (report.lines.length) console.log(`[courses] ${report.lines.join('; ')}`);
  } catch (error) {
    console.error(`[courses] could not bring the courses in line with content/courses/ at start: ${error instanceof Error ? error.message : String(error)}`);
  }
}

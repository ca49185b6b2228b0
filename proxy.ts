import { NextResponse, type NextRequest } from 'next/server';
import { lessonKind } from '@/lib/content/preview';

// Lessons share one address, /learn/<course>/<lesson>, but not one kind of page: the public
// preview lessons are static pages built ahead of time, the members-only lessons are rendered per
// request behind the enrollment check. This sends each members-only lesson to its per-request page
// (app/learn/[course]/[lesson]/members) without changing the address. Anything that is not a
// lesson (the practical page, unknown paths) passes through untouched.
export function proxy(request: NextRequest) {
  const [, , course, lesson] = request.nextUrl.pathname.split('/');
  if (!course || !lesson || lessonKind(course, lesson) !== 'members') return NextResponse.next();
  const url = request.nextUrl.clone();
  url.pathname = `/learn/${course}/${lesson}/members`;
  return NextResponse.rewrite(url);
}

export const config = {
  matcher: '/learn/:course/:lesson',
};

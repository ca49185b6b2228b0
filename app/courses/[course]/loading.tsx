export default function CourseLoading() {
  return (
    <div aria-busy="true" aria-label="Loading the course" className="space-y-4">
      <div className="h-4 w-24 animate-pulse rounded bg-paper-deep" />
      <div className="h-10 w-3/4 animate-pulse rounded bg-paper-deep" />
      <div className="h-5 w-2/3 animate-pulse rounded bg-paper-deep" />
      <div className="h-64 animate-pulse rounded-jar bg-paper-deep" />
    </div>
  );
}

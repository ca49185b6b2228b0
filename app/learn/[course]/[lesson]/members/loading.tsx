export default function LessonLoading() {
  return (
    <div aria-busy="true" aria-label="Loading the lesson" className="grid gap-10 lg:grid-cols-[minmax(0,1fr)_16rem]">
      <div className="space-y-4">
        <div className="h-4 w-40 animate-pulse rounded bg-paper-deep" />
        <div className="h-10 w-3/4 animate-pulse rounded bg-paper-deep" />
        <div className="h-28 animate-pulse rounded-jar bg-paper-deep" />
        {[0, 1, 2, 3].map((i) => (
          <div key={i} className="h-5 animate-pulse rounded bg-paper-deep" />
        ))}
      </div>
      <div className="hidden h-48 animate-pulse rounded-jar bg-paper-deep lg:block" />
    </div>
  );
}

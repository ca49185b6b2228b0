import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { QuizRunner } from '@/components/quiz/quiz-runner';
import { Card } from '@/components/ui/card';
import { isEnrolled } from '@/lib/access';
import { requirePageRole } from '@/lib/auth/guard';
import { getBank } from '@/lib/quiz/bank';

type Props = { params: Promise<{ quiz: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const bank = getBank((await params).quiz);
  return { title: bank ? `Quiz: ${bank.title}` : 'Quiz' };
}

// The page carries the quiz's title and rules only; the questions come from the attempt route
// after the learner starts, and the key never leaves the server before submission.
export default async function QuizPage({ params }: Props) {
  const { quiz } = await params;
  const user = await requirePageRole(`/quiz/${quiz}`, 'learner');
  const bank = /^[a-z0-9-]+$/.test(quiz) ? getBank(quiz) : null;
  if (!bank) notFound();
  const enrolled = await isEnrolled(user.id, bank.course);
  return (
    <div className="mx-auto max-w-3xl space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href={bank.lesson ? `/learn/${bank.course}/${bank.lesson}` : `/courses/${bank.course}`}>
          {bank.lesson ? '← Back to the lesson' : '← Back to the course'}
        </Link>
      </nav>
      <h1 className="text-3xl font-bold">{bank.title}</h1>
      {enrolled ? (
        <QuizRunner
          intro={{
            quizSlug: bank.slug,
            title: bank.title,
            description: bank.description ?? null,
            questionCount: bank.draw,
            timeLimitMinutes: bank.timeLimitMinutes,
            attemptLimit: bank.attemptLimit,
          }}
        />
      ) : (
        <Card>
          <p className="mb-3">Quizzes are for learners enrolled in this course.</p>
          <Link href={`/courses/${bank.course}`}>See the course and its workshops</Link>
        </Card>
      )}
    </div>
  );
}

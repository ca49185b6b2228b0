import { EnrollOffer } from '@/components/lessons/enroll-offer';

export default function LessonForbidden() {
  return <EnrollOffer />;
}

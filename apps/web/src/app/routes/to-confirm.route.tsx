import { useSearchParams } from 'react-router-dom';
import { ReviewQueue } from '@/features/review/components/review-queue';

/** To confirm: the engineer's queue; `?heading=<id>` keeps it to one heading (the Board's count links so). */
export function ToConfirmRoute() {
  const [params] = useSearchParams();
  return <ReviewQueue headingId={params.get('heading')} allHref="/to-confirm" />;
}

import { useSearchParams } from 'react-router-dom';
import { ReceivedList } from '@/features/handovers/components/received-list';

/** Received: the incoming supervisor's handovers, acknowledged here; `?handover=<id>` is the e-mail's link. */
export function ReceivedRoute() {
  const [params] = useSearchParams();
  return <ReceivedList highlightId={params.get('handover')} />;
}

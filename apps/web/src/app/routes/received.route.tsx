import { ReceivedList } from '@/features/handovers/components/received-list';

/** Received: the incoming supervisor's handovers, acknowledged here. */
export function ReceivedRoute() {
  return <ReceivedList />;
}

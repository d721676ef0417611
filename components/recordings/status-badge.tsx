import { Badge } from '@/components/ui/badge';
import type { RecordingStatus } from '@/lib/contracts/recordings';
import { statusLabels } from './format';

const tones = { received: 'neutral', processing: 'band', ready: 'ok', failed: 'danger' } as const;

export function StatusBadge({ status }: { status: RecordingStatus }) {
  return (
    <span data-testid="recording-status" data-status={status}>
      <Badge tone={tones[status]}>{statusLabels[status]}</Badge>
    </span>
  );
}

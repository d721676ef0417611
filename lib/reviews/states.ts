// The review's states and the only moves allowed between them. Pure. Every move goes forward:
// requested -> awaiting_payment -> paid -> in_review -> delivered; before payment a request can be cancelled,
// after payment and before delivery it can be refunded. delivered, cancelled and refunded are final.
import type { ReviewStatus } from '@/lib/contracts/reviews';

const NEXT: Record<ReviewStatus, readonly ReviewStatus[]> = {
  requested: ['awaiting_payment', 'cancelled'],
  awaiting_payment: ['paid', 'cancelled'],
  paid: ['in_review', 'refunded'],
  in_review: ['delivered', 'refunded'],
  delivered: [],
  cancelled: [],
  refunded: [],
};

export function canMove(from: ReviewStatus, to: ReviewStatus): boolean {
  return NEXT[from].includes(to);
}

/** The states in the coach's queue: paid and not yet delivered. */
export const OPEN_FOR_COACH: readonly ReviewStatus[] = ['paid', 'in_review'];

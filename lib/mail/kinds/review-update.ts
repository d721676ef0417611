import { composeMail, type MailContent } from '../compose';

export type ReviewMailStep = 'awaiting_payment' | 'paid' | 'in_review' | 'delivered' | 'cancelled' | 'refunded';

export interface ReviewUpdateMail {
  academyName: string;
  coachName: string;
  step: ReviewMailStep;
  /** formatted price, e.g. "45.00 EUR" */
  amount: string;
  /** the due date (YYYY-MM-DD), when known */
  dueDate: string | null;
  /** a drill came with the delivered review */
  withDrill: boolean;
  url: string;
}

const WORDS: Record<ReviewMailStep, { subject: string; paragraph: (m: ReviewUpdateMail) => string; action: string }> = {
  awaiting_payment: {
    subject: 'Your review request: payment next',
    paragraph: (m) => `Your request for a remote review by ${m.coachName} is saved. It starts once the payment of ${m.amount} is made.`,
    action: 'Open my request',
  },
  paid: {
    subject: 'Payment received for your review',
    paragraph: (m) => `We received your payment of ${m.amount}. ${m.coachName} will send the review${m.dueDate ? ` by ${m.dueDate}` : ''}.`,
    action: 'Open my request',
  },
  in_review: {
    subject: 'Your coach is reviewing your swing',
    paragraph: (m) => `${m.coachName} has started on your review.`,
    action: 'Open my request',
  },
  delivered: {
    subject: 'Your review is ready',
    paragraph: (m) => `${m.coachName} sent your review: a summary${m.withDrill ? ', a drill' : ''} and the notes on your swings.`,
    action: 'Read my review',
  },
  cancelled: {
    subject: 'Your review request was cancelled',
    paragraph: () => 'Your review request was cancelled before any payment. Nothing was charged.',
    action: 'Open my request',
  },
  refunded: {
    subject: 'Your review was refunded',
    paragraph: (m) => `${m.coachName} refunded your payment of ${m.amount}. Your bank may take a few days to show it.`,
    action: 'Open my request',
  },
};

export function reviewUpdateMail(m: ReviewUpdateMail): MailContent {
  const words = WORDS[m.step];
  return composeMail({
    academyName: m.academyName,
    subject: words.subject,
    greeting: 'Hello,',
    paragraphs: [words.paragraph(m)],
    action: { label: words.action, url: m.url },
    afterAction:
      m.step === 'delivered'
        ? [
            'Try any change or drill gently and warm up first. Stop if you feel pain in your back, neck or anywhere else, and see a physician or physiotherapist before you go on. Players under 18 practise with a parent’s or guardian’s consent.',
          ]
        : [],
    reason: `You received this because you asked for a remote review at ${m.academyName}.`,
  });
}

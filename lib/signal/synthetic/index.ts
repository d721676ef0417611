// The seeded generator of invented golf sessions (tests, benchmarks, demo data). Not part of the public signal API:
// import it from '@/lib/signal/synthetic'.
export { generateSession, type Session, type SessionOptions, type TruthSwing } from './session';
export { DISTRACTORS, PRE_SHOTS, type Distractor, type PreShot, type SwingKind } from './moves';
export { DISTRACTOR_ONLY, FINDER_VARIANTS, HELD_OUT_SEEDS, TUNING_SEEDS, variantOptions, type FinderVariant } from './variants';
export { quantile, scoreFinder, type FinderScore, type FoundSwing, type SwingMatch } from './score';

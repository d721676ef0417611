export * from './params';
export * from './noise';
export * from './detect';
export { findTakeaway, findStillAddress } from './address';
export { findTop } from './top';
export { findTransition, findDetectedImpact, findMarkedImpact } from './downswing';
export { findFinish } from './finish';
export { findForwardPress, type ForwardPress } from './forward-press';

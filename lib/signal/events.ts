// Swing events from the centre-of-pressure (COP) velocity, all on the stance-frame X axis (+ toward the target).
// The finders live in ./finder, one per event; this module is their public face.
export * from './finder';

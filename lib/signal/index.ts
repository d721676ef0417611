// Public API of the signal core: pure computation, typed arrays in, new arrays out.
export * from './types';
export * from './errors';
export * from './read';
export * from './regularise';
export * from './filter';
export * from './savgol';
export * from './derive';
export * from './layouts';
export * from './onset';
export * from './events';
export * from './swings';
export * from './sensor-forces';
export * from './phases';
export * from './registration';
export * from './bands';
export * from './similarity';
export * from './analyze';

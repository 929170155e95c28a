export * from './central.ts';
export * from './range.ts';

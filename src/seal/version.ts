/**
 * The engine's version, written into every seal: a verification by another version says so
 * first, since a change of method can move the last digits of a result. Kept equal to the
 * package's version by a test.
 */
export const ENGINE_VERSION = '0.1.0';

/** How a seal names the engine that wrote it. */
export const ENGINE_NAME = `furrow ${ENGINE_VERSION}`;

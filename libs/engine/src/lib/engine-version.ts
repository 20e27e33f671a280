/** The engine's version, kept equal to libs/engine/package.json "version" (a test checks it). */
export const ENGINE_VERSION = '0.2.0';

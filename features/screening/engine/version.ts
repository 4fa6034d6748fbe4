/**
 * Stored with every result so an old flag can be explained by the rules that
 * produced it. Bump the minor version when a threshold, criterion or exercise
 * changes, the major version when ids or the result shape change.
 */
export const ENGINE_VERSION = '1.5.0';

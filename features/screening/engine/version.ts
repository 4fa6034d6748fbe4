/**
 * Stored with every result so an old flag can be explained by the rules that
 * produced it. Bump the minor version when a threshold, criterion or exercise
 * changes, the major version when ids or the result shape change; the patch version when only wording
 * changes (1.5.1: after a physiotherapist's decision the pain caution says they decided, not "cleared",
 * which read as all clear beside "train with changes").
 */
export const ENGINE_VERSION = '1.5.1';

export declare const CHROMIUM_ARGS: readonly string[];

// Print rules live in print-css.web.ts; native apps do not print from here.
export function installPrintCss(): void {}

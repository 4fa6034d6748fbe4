// Printing lives in print-fit.web.ts; native apps do not print from here.
export const PRINT_FLOW_PARENT = { dataSet: { printFlowParent: 'true' } } as object;
export const PRINT_FLOW = { dataSet: { printFlow: 'true' } } as object;
export const PRINT_FULL = { dataSet: { printFull: 'true' } } as object;
export const PRINT_THIRD = { dataSet: { printThird: 'true' } } as object;
export function useFitToOnePage(): void {}
export function usePrinting(): boolean {
  return false;
}

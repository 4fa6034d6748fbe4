/** "1 athlete", "12 athletes": a count with its noun in the singular or the plural. */
export const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

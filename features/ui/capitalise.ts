/** "today" -> "Today": a phrase made to follow other words, starting a sentence or a cell. */
export const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

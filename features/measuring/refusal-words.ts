// Pure: the measuring desk's words for a refused save.

/**
 * The server's refusal in the tester's words where it names a front pair placed the wrong way round (its
 * message gives the field path and landmark ids); any other refusal as it is. Here rather than through the
 * landmark catalogue: imported by this screen too, the catalogue went into every page's first download.
 */
export function refusalWords(message: string): string {
  const pair = /landmarks\.right-(hip|asis): right-\1 must be on the image's left/.exec(message)?.[1];
  if (!pair) return message;
  const what = pair === 'hip' ? 'hip centres' : 'front hip bones (ASIS)';
  return `The right and left ${what} are the wrong way round: facing the camera, the athlete's right is on the photo's left. Drag them to their sides.`;
}

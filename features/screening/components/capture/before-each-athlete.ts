/**
 * What the capture screen shows while an athlete's assessment loads (CaptureFrame): the checks before
 * each athlete. Our wording of common practice, no source: ask about pain and warm up before movement
 * tests; stop a task that hurts and refer; photos of minors only with the family's consent.
 */
export const BEFORE_EACH_ATHLETE = {
  title: 'Before each athlete',
  text:
    'Ask whether anything hurts today, and make sure they have warmed up. Stop a task as soon as it hurts and tick ' +
    '"Pain reported": the plan then waits for a physiotherapist or doctor. Take photos only where the head of the ' +
    'screen says the family agreed.',
} as const;

/** The measuring notice of the body step, one line each so that it reads at a glance. */
export const MEASURE_FIRST = [
  'Warm up first.',
  'Shoes off. Measure twice and type the mean.',
  'Sitting height: from the seat to the top of the head.',
  'These values estimate where the athlete is in their growth spurt.',
] as const;

/**
 * Throughput benchmark: generates 100,000 assessments with a seeded PRNG,
 * evaluates them all and prints assessments per second.
 *
 *   npx tsx features/screening/engine/bench.ts [count] [seed]
 */
import { evaluateAssessment } from './index';
import { mulberry32, randomAssessment } from './random-assessment';
import type { AssessmentInput } from './types';

const count = Number(globalThis.process?.argv?.[2] ?? 100_000);
const seed = Number(globalThis.process?.argv?.[3] ?? 20_250_314);

const rand = mulberry32(seed);
const t0 = performance.now();
const inputs: AssessmentInput[] = Array.from({ length: count }, () => randomAssessment(rand));
const t1 = performance.now();

// Warm-up so the figure reflects optimised code, not the JIT's first pass.
for (let i = 0; i < Math.min(2_000, count); i += 1) {
  const input = inputs[i];
  if (input) evaluateAssessment(input);
}

let flags = 0;
let measurements = 0;
let exercises = 0;
const t2 = performance.now();
for (const input of inputs) {
  const r = evaluateAssessment(input);
  flags += r.flags.length;
  measurements += r.measurements.length;
  exercises += r.plan.exercises.length;
}
const t3 = performance.now();

const seconds = (t3 - t2) / 1000;
const perSecond = Math.round(count / seconds);
console.log(`generated ${count.toLocaleString('en')} assessments (seed ${seed}) in ${((t1 - t0) / 1000).toFixed(2)} s`);
console.log(`evaluated ${count.toLocaleString('en')} assessments in ${seconds.toFixed(2)} s`);
console.log(`${perSecond.toLocaleString('en')} assessments per second`);
console.log(
  `per assessment on average: ${(measurements / count).toFixed(1)} measurements, ${(flags / count).toFixed(1)} flags, ${(exercises / count).toFixed(1)} exercises`,
);

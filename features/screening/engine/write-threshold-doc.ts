/** Rewrites the generated threshold section of the engine README: `npm run docs:thresholds`. */
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { withThresholdTable } from './threshold-doc';

const readme = join(__dirname, 'README.md');
writeFileSync(readme, withThresholdTable(readFileSync(readme, 'utf8')));
console.log(`updated ${readme}`);

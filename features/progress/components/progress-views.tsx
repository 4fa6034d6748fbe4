// Everything that draws a chart, loaded only through `lazy-progress.tsx` (one chunk with the chart library).
export { default as AthleteProgress } from './athlete-progress';
export { default as SquadTrends } from './squad-trends';

import { Router } from 'express';
import type { Db } from '@/db/client';
import { todayIso } from '@/features/athletes/age';
import { csvRows, FILTER_KEYS, type TrendFilters } from '@/features/progress/trends';
import { filterWords } from '@/features/progress/labels';
import { PATTERN_TITLES } from '@/features/screening/engine';
import { accessGuards, callerClub, on, scopeOf, type Locals } from '@/server/access/guard';
import { badRequest } from '@/server/http/errors';
import { safeCsv } from '@/server/http/csv';
import { progressService } from './progress.service';

const ALLOWED: Record<(typeof FILTER_KEYS)[number], readonly string[]> = {
  sex: ['female', 'male'],
  ageGroup: ['U11', 'U13', 'U15', 'U17', 'U19', 'Open'],
  maturityBand: ['pre', 'circa', 'post', 'unknown'],
  flag: ['any', 'none', ...Object.keys(PATTERN_TITLES)],
};

/** The table filters from the query string; an unknown value is a 400 naming the field, not an empty table. */
function filtersOf(query: Record<string, unknown>): TrendFilters {
  const out: Record<string, string> = {};
  const fields: Record<string, string> = {};
  for (const key of FILTER_KEYS) {
    const value = query[key];
    if (value === undefined || value === '') continue;
    if (typeof value !== 'string' || !ALLOWED[key].includes(value)) {
      fields[key] = `Choose one of: ${ALLOWED[key].join(', ')}.`;
      continue;
    }
    out[key] = value;
  }
  if (Object.keys(fields).length) throw badRequest('Some filters are not recognised.', fields);
  return out as TrendFilters;
}

/**
 * An athlete's screens over time with the last two compared, and a squad's season. Staff only
 * ('progress.read', 'trends.read'): parents will get the family wording through the care-team views.
 */
export function progressRouter(db: Db) {
  const router = Router();
  const { guard } = accessGuards(db);
  const idOf = (res: { locals: object }) => (res.locals as Locals).id!;

  router.get('/athletes/:id/progress', guard('progress.read', on('athlete')), async (_req, res) => {
    res.json(await progressService(db, scopeOf(res)).athleteProgress(idOf(res), todayIso()));
  });

  // Every squad of the club in a few numbers (the head coach's home): each squad's trends table summed
  // by `watchOf`, so they are the trends page's own numbers.
  router.get('/trends/watch', guard('trends.read', callerClub), async (_req, res) => {
    res.json({ squads: await progressService(db, scopeOf(res)).squadsWatch(todayIso()) });
  });

  router.get('/squads/:id/trends', guard('trends.read', on('squad')), async (req, res) => {
    const format = req.query.format ?? 'json';
    if (format !== 'json' && format !== 'csv') throw badRequest('Unknown format.', { format: 'Choose json or csv.' });
    const filters = filtersOf(req.query);
    const trends = await progressService(db, scopeOf(res)).squadTrends(idOf(res), todayIso(), filters);
    if (format === 'csv') {
      const safe = (s: string) => s.replace(/[^A-Za-z0-9-]+/g, '-').replace(/^-|-$/g, '');
      const name = safe(trends.squad.name) || 'squad';
      // A filtered table says so in its name, and does not replace the whole squad's file (our choice).
      const narrowed = filterWords(filters).map(safe);
      res.setHeader('Content-Type', 'text/csv; charset=utf-8');
      res.setHeader('Content-Disposition', `attachment; filename="${name}-trends-${trends.today}${narrowed.length ? `-only-${narrowed.join('-')}` : ''}.csv"`);
      res.send(safeCsv(csvRows(trends.athletes, trends)));
      return;
    }
    res.json(trends);
  });

  return router;
}

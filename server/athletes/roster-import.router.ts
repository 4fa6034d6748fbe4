import { Router, type Request, type Response } from 'express';
import multer, { MulterError } from 'multer';
import type { Db } from '@/db/client';
import { AppError, badRequest } from '@/server/http/errors';
import { MAX_IMPORT_BYTES, readRosterCsv, rosterImport } from './roster-import';
import { accessGuards, callerClub, scopeOf } from '@/server/access/guard';

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_IMPORT_BYTES, files: 1, fields: 5, parts: 6 },
}).single('file');

/** Runs multer after the access check, turning its errors into messages about a roster file. */
function receiveFile(req: Request, res: Response): Promise<void> {
  return new Promise((resolve, reject) => {
    upload(req, res, (error: unknown) => {
      if (!error) return resolve();
      if (error instanceof MulterError) {
        if (error.code === 'LIMIT_FILE_SIZE') {
          return reject(new AppError(413, 'too_large', 'The file is larger than 1 MB. Split the roster into several files.'));
        }
        if (error.code === 'LIMIT_UNEXPECTED_FILE') return reject(badRequest('Send one CSV file, in the “file” field.'));
      }
      reject(badRequest('The upload could not be read. Choose the file again.'));
    });
  });
}

export function rosterImportRouter(db: Db) {
  const router = Router();
  const { guard } = accessGuards(db);

  /**
   * `?commit=false` (default): the per-row report, nothing written.
   * `?commit=true`: every line in one transaction when no line has an error; otherwise 400 with the report.
   */
  router.post('/athletes/import', guard('roster.manage', callerClub), async (req, res) => {
    const commit = req.query.commit ?? 'false';
    if (commit !== 'true' && commit !== 'false') throw badRequest('commit must be true or false.');
    await receiveFile(req, res);
    if (!req.file || req.file.size === 0) throw badRequest('Choose a CSV file to import.', { file: 'Choose a CSV file to import.' });
    const raw = readRosterCsv(req.file.buffer);
    const roster = rosterImport(db, scopeOf(res));
    if (commit === 'false') {
      res.json(await roster.check(raw));
      return;
    }
    const { report, created, updated } = await roster.commit(raw);
    if (report.errorCount > 0) {
      const n = report.errorCount;
      res.status(400).json({
        error: { code: 'import_has_errors', message: `${n} line${n === 1 ? '' : 's'} need${n === 1 ? 's' : ''} attention; nothing was imported.` },
        ...report,
      });
      return;
    }
    res.status(201).json({ ...report, created: created.length, updated: updated.length });
  });

  return router;
}
